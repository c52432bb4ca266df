import { resolve } from 'node:path';
import { openStore } from '../../store/open-database';
import { restoreStore, RestoreRefused } from '../../store/backup';
import { CliFailure } from '../cli-io';
import { flagValue, type Command } from '../command';
import { EXIT } from '../exit-codes';

export const restoreCommand: Command = {
  name: 'restore',
  summary: 'replace the store with a backup file (Rigbook must be closed)',
  help: `Usage: rigbook restore FILE [--json]

Checks FILE first: it must be a SQLite file that passes SQLite's integrity check, holds
Rigbook's tables, and has a schema version this Rigbook knows. The store must not be open
in Rigbook or another command. The replaced store is kept beside it, renamed with the time
(rigbook.replaced-<time>.sqlite); FILE itself is left as it is. A backup from an older
Rigbook is brought up to date (after its own pre-migration copy).

Exits 0 when restored, 2 when FILE cannot be read or is not a SQLite file, 3 when it is
damaged or not a Rigbook store (nothing is replaced), 4 when the store is in use.`,
  options: {},
  positionals: { min: 1, max: 1 },
  async run({ positionals, values, io, dbPath }) {
    const candidate = resolve(io.cwd, positionals[0]!);
    let result;
    try {
      result = await restoreStore(candidate, dbPath, io.now());
    } catch (error) {
      if (error instanceof RestoreRefused) {
        throw new CliFailure(error.reason === 'unreadable' ? EXIT.unreadable : error.reason === 'invalid' ? EXIT.invalid : EXIT.store, error.message);
      }
      throw new CliFailure(EXIT.store, `The store was not replaced: ${(error as Error).message}`);
    }
    // Opening brings an older backup's schema up to date and proves the store opens.
    try {
      const store = await openStore(dbPath);
      await store.db.destroy();
    } catch (error) {
      throw new CliFailure(EXIT.store, `Restored, but the store does not open: ${(error as Error).message}. The replaced store is at ${result.keptAs ?? '(none)'}.`);
    }
    if (flagValue(values, 'json')) io.out(`${JSON.stringify({ restored: candidate, store: dbPath, keptAs: result.keptAs }, null, 2)}\n`);
    else io.out(`Restored ${candidate}\n    into ${dbPath}\n${result.keptAs ? `The replaced store was kept as ${result.keptAs}\n` : ''}`);
    return EXIT.ok;
  },
};
