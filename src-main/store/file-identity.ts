import { realpathSync, statSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';

// A path string says little about which file it names: a symlinked folder, a hard link, a
// case-insensitive disk or /tmp vs /private/tmp all give one file several spellings. What
// names a file is its device and inode after links are resolved.

export interface FileIdentity {
  dev: number;
  ino: number;
}

/** The identity of the file at `path`, or null when nothing is there. */
export function fileIdentity(path: string): FileIdentity | null {
  try {
    const s = statSync(path);
    return { dev: s.dev, ino: s.ino };
  } catch {
    return null;
  }
}

export const sameIdentity = (a: FileIdentity | null, b: FileIdentity | null): boolean => a !== null && b !== null && a.dev === b.dev && a.ino === b.ino;

/** The files SQLite keeps for a store: the store itself and the files it writes beside it. */
export const STORE_SIDE_SUFFIXES = ['-wal', '-shm', '-journal'] as const;

/** The folder a path's file lives in, with links resolved, or null when it does not exist. */
function realFolder(path: string): string | null {
  try {
    return realpathSync(dirname(path));
  } catch {
    return null;
  }
}

/**
 * Why `destination` must not be written: it is the store at `storePath` or one of the files
 * SQLite keeps beside it, under any spelling. Null when it is another file. A file that does
 * not exist yet (a `-wal` between sessions) is compared by its real folder and its name, the
 * name without regard to case, which refuses a little more than needed on a case-sensitive disk.
 */
export function storeFileClash(destination: string, storePath: string): string | null {
  const target = resolve(destination);
  const targetId = fileIdentity(target);
  const names = [storePath, ...STORE_SIDE_SUFFIXES.map((s) => `${storePath}${s}`)];
  for (const name of names) {
    if (sameIdentity(targetId, fileIdentity(name))) return name === storePath ? 'is the store itself' : `is a file SQLite keeps beside the store (${basename(name)})`;
  }
  const storeFolder = realFolder(storePath);
  const targetFolder = realFolder(target);
  if (storeFolder === null || targetFolder === null) return null;
  if (!sameIdentity(fileIdentity(storeFolder), fileIdentity(targetFolder))) return null;
  const wanted = basename(target).toLowerCase();
  for (const name of names) {
    if (basename(name).toLowerCase() === wanted) return name === storePath ? 'is the store itself' : `is a file SQLite keeps beside the store (${basename(name)})`;
  }
  return null;
}

/** `path` with its folder's links resolved (the file itself may not exist yet). */
export function realPathOf(path: string): string {
  const folder = realFolder(path);
  return folder === null ? resolve(path) : join(folder, basename(path));
}

/**
 * Watches the file a running shell has open: when the store is deleted, or another file is put
 * at its path, every later write would go into a file nobody will open again.
 */
export class StoreFileWatch {
  readonly identity: FileIdentity | null;

  constructor(readonly path: string) {
    this.identity = fileIdentity(path);
  }

  /** What happened to the store file since it was opened, in words; null when it is still there. */
  problem(when: 'running' | 'opening' = 'running'): string | null {
    if (this.identity === null) return null;
    const now = fileIdentity(this.path);
    const what = now === null ? 'was deleted or moved' : !sameIdentity(now, this.identity) ? 'was replaced by another file (a restore, a copy or a sync)' : null;
    if (what === null) return null;
    if (when === 'opening') return `The store file ${this.path} ${what} while Rigbook was opening it. Start Rigbook again.`;
    return now === null
      ? `The store file ${this.path} ${what} while Rigbook was running. Nothing was saved: restart Rigbook (or put the file back) before making changes.`
      : `The store file ${this.path} ${what} while Rigbook was running. Nothing was saved: restart Rigbook to work with the file now in place.`;
  }
}
