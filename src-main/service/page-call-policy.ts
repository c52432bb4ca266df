import { basename, dirname } from 'node:path';
import { existsSync } from 'node:fs';
import { backupFolderFor } from '../store/backup';
import { fileIdentity, realPathOf, sameIdentity } from '../store/file-identity';
import type { ApiError } from './contract';

/** Which shell relays a call from the page. */
export type PageShell = 'desktop' | 'loopback';

const BACKUP = 'store.backup';

/**
 * Calls the page may not make as the command line may. A page (or anything that got hold of its
 * token) must not choose where a file is written: in the desktop shell only the shell's own
 * File › Back up… dialog chooses, and the loopback shell writes backups only as new files in the
 * store's own backups folder. Null when the call may go on to the service.
 */
export function pageCallRefusal(shell: PageShell, dbPath: string, name: string, args: unknown): ApiError | null {
  if (name !== BACKUP) return null;
  if (shell === 'desktop') {
    return { kind: 'invalid', message: 'destination: a backup is written from the File menu (File › Back up…), where you choose the file; the window cannot choose it', field: 'destination' };
  }
  const destination = (args as { destination?: unknown } | null)?.destination;
  if (typeof destination !== 'string') return null;
  const folder = backupFolderFor(dbPath);
  const refusal = (why: string): ApiError => ({ kind: 'invalid', message: `destination: ${why}`, field: 'destination' });
  const inFolder = sameIdentity(fileIdentity(dirname(destination)), fileIdentity(folder)) || realPathOf(dirname(destination)) === realPathOf(folder);
  if (!inFolder) return refusal(`from the browser, a backup can only be written into the store's backups folder (${folder}); use rigbook backup FILE to write one elsewhere`);
  if (!/^[\w.-]+\.sqlite$/.test(basename(destination)) || basename(destination).startsWith('.')) return refusal('must be a file name of letters, digits, dots, dashes and underscores ending in .sqlite');
  if (existsSync(destination)) return refusal('a file of that name is already in the backups folder; choose a new name (a backup never overwrites another file from the browser)');
  return null;
}
