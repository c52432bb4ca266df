// Child of the restore crash test: runs a restore and dies with SIGKILL the moment it is about
// to rename anything onto the store path, which is what a power cut or a killed process at the
// worst instant does. The parent then checks a store is still at that path, whole.
//
//   node restore-crash.cjs BACKUP TARGET

import fs from 'node:fs';
import { resolve } from 'node:path';

const [backup, target] = process.argv.slice(2) as [string, string];
const rename = fs.renameSync;
fs.renameSync = ((from: fs.PathLike, to: fs.PathLike) => {
  if (resolve(String(to)) === resolve(target)) {
    process.stdout.write('renaming onto the store\n');
    process.kill(process.pid, 'SIGKILL');
  }
  rename(from, to);
}) as typeof fs.renameSync;

async function main(): Promise<void> {
  // Imported after the patch, so the restore code reads the patched function.
  const { restoreStore } = await import('../../../src-main/service/restore-store');
  await restoreStore(backup, target);
  process.stdout.write('restored without a crash\n');
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
  process.exit(2);
});
