/**
 * What `rigbook` exits with; scripts and CI rely on these, so they never change meaning.
 * `check` is the only command that exits 1: the file was read and something is over.
 */
export const EXIT = {
  /** Done; for `check`, nothing is over (tight and incomplete still exit 0). */
  ok: 0,
  /** `check`: at least one build or supply is over a rating. */
  over: 1,
  /** A file could not be read: missing, unreadable, not JSON or CSV, not a SQLite file at all. */
  unreadable: 2,
  /** The file was read but its contents are refused: validation problems, a damaged or foreign backup. */
  invalid: 3,
  /**
   * The store (or an output file) could not be used: the disk is full, the file or its folder is
   * read-only, the store is in use, an output file is the store itself, or the store refused the
   * operation (demo into a store with records).
   */
  store: 4,
  /** The command line itself is wrong: unknown command or option, missing argument. */
  usage: 5,
} as const;

export const EXIT_CODES_HELP = `Exit codes:
  0  done (check: nothing over; tight and incomplete still exit 0)
  1  check: something is over a rating
  2  a file could not be read (missing, not JSON/CSV, not a SQLite file)
  3  the file was read but refused (validation problems, damaged or foreign backup)
  4  the store or an output file could not be used: the disk is full, the file
     or its folder is read-only, the store is in use by another window or command,
     an output file is the store itself, or the store refused the operation (demo
     into a store that holds records)
  5  wrong command line (unknown command or option, missing argument)`;
