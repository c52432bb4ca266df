import { resolveDbPath } from '../store/data-location';

export type DbPathChoice = { ok: true; dbPath: string } | { ok: false; message: string };

/**
 * Which store the desktop shell opens: `--db PATH` (or `--db=PATH`) on the command line, then
 * RIGBOOK_DB, then the shared per-user data folder. Chromium's own switches are ignored.
 */
export function dbPathFromArgv(argv: readonly string[], env: NodeJS.ProcessEnv = process.env): DbPathChoice {
  let explicit: string | undefined;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i] ?? '';
    if (arg === '--db') {
      const next = argv[i + 1];
      if (next === undefined || next === '' || next.startsWith('--')) {
        return { ok: false, message: 'db: --db needs a file path after it, e.g. --db ./fleet.sqlite' };
      }
      explicit = next;
      i++;
    } else if (arg.startsWith('--db=')) {
      const value = arg.slice('--db='.length);
      if (value === '') return { ok: false, message: 'db: --db= needs a file path, e.g. --db=./fleet.sqlite' };
      explicit = value;
    }
  }
  return { ok: true, dbPath: resolveDbPath(explicit, env) };
}
