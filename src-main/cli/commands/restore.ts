import { resolve } from 'node:path';
import { RestoredButUnsound, restoreStore } from '../../service/restore-store';
import { RestoreRefused } from '../../store/restore-file';
import { describeStorageError } from '../../store/storage-errors';
import { CliFailure } from '../cli-io';
import { flagValue, type Command } from '../command';
import { EXIT } from '../../shell-common/exit-codes';
import { refuseUnlessFile } from '../open-store';

export const restoreCommand: Command = {
  name: 'restore',
  summary: 'replace the store with a backup file (Rigbook must be closed)',
  help: `Usage: rigbook restore FILE [--json]

Checks FILE first: it must be a SQLite file that passes SQLite's integrity check, and its
schema must be exactly what Rigbook's own migrations make for the schema version it records
(a table, column, index, trigger or view changed or added outside Rigbook is refused). The
store must not be open in Rigbook or another command.

FILE is copied beside the store, brought up to date, and every build in it is re-checked by
this Rigbook (the verdicts stored in a backup are never trusted), with a history entry. The
copy then replaces the store in one step; journal files left beside the store (-wal, -shm,
-journal) are moved aside first, so they cannot be replayed into the restored records. The
replaced store is kept beside it, renamed with the time (rigbook.replaced-<time>.sqlite);
FILE itself is left as it is.

Exits 0 when restored, 2 when FILE cannot be read or is not a SQLite file, 3 when it is
damaged or its schema is not Rigbook's (nothing is replaced), 4 when the store is in use,
the disk is full or the folder cannot be written. A PostgreSQL store (--db postgres://...) is
restored with the server's own pg_restore instead; this command refuses it (exit 4).`,
  options: {},
  positionals: { min: 1, max: 1 },
  async run({ positionals, values, io, dbPath }) {
    refuseUnlessFile(dbPath, 'rigbook restore');
    const candidate = resolve(io.cwd, positionals[0]!);
    let result;
    try {
      result = await restoreStore(candidate, dbPath, { now: io.now() });
    } catch (error) {
      if (error instanceof RestoreRefused) {
        throw new CliFailure(error.reason === 'unreadable' ? EXIT.unreadable : error.reason === 'invalid' ? EXIT.invalid : EXIT.store, error.message);
      }
      if (error instanceof RestoredButUnsound) throw new CliFailure(EXIT.store, `Restored, but ${error.message}`);
      const storage = describeStorageError(error, dbPath);
      throw new CliFailure(EXIT.store, `The store was not replaced: ${storage ? storage.message : (error as Error).message}`);
    }
    if (flagValue(values, 'json')) io.out(`${JSON.stringify({ restored: candidate, store: dbPath, keptAs: result.keptAs, setAside: result.setAside, rechecked: result.rechecked, verdictChanges: result.verdictChanges }, null, 2)}\n`);
    else {
      io.out(`Restored ${candidate}\n    into ${dbPath}\n`);
      io.out(`Every build re-checked: ${result.rechecked} build${result.rechecked === 1 ? '' : 's'}, ${result.verdictChanges} verdict${result.verdictChanges === 1 ? '' : 's'} corrected from what the file held.\n`);
      if (result.keptAs) io.out(`The replaced store was kept as ${result.keptAs}\n`);
      for (const aside of result.setAside) io.out(`A journal file left beside the store was moved aside to ${aside}\n`);
    }
    return EXIT.ok;
  },
};
