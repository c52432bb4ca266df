import { join } from 'node:path';
import { resolve } from 'node:path';
import { backupFolderFor } from '../../store/backup';
import { timestampForFile } from '../../store/open-database';
import { flagValue, type Command } from '../command';
import { EXIT } from '../../shell-common/exit-codes';
import { callOrFail, refuseUnlessFile, withStore } from '../open-store';

export const backupCommand: Command = {
  name: 'backup',
  summary: 'copy the store to a file (safe while Rigbook is open)',
  help: `Usage: rigbook backup [FILE] [--json]

Writes a consistent copy of the store with SQLite's online backup; Rigbook may stay open
and keep writing meanwhile. Without FILE the copy goes to backups/rigbook-<time>.sqlite
beside the store. The copy is checked before it is put in place, so a failed backup never
replaces an older one. Restore it with: rigbook restore FILE

A PostgreSQL store (--db postgres://...) is backed up with the server's own pg_dump instead;
this command refuses it.`,
  options: {},
  positionals: { min: 0, max: 1 },
  async run({ positionals, values, io, dbPath }) {
    refuseUnlessFile(dbPath, 'rigbook backup');
    const destination = positionals[0] === undefined ? join(backupFolderFor(dbPath), `rigbook-${timestampForFile(io.now())}.sqlite`) : resolve(io.cwd, positionals[0]);
    const result = (await withStore(io, dbPath, { mustExist: true }, (host) => callOrFail(host, 'store.backup', { destination }))) as { destination: string; bytes: number };
    if (flagValue(values, 'json')) io.out(`${JSON.stringify(result, null, 2)}\n`);
    else io.out(`Backed up ${dbPath}\n      to ${result.destination} (${result.bytes} bytes)\n`);
    return EXIT.ok;
  },
};
