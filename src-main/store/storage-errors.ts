// What the disk or SQLite said, in the words a person can act on. The codes are SQLite's
// (better-sqlite3 reports extended codes such as SQLITE_READONLY_DBMOVED) and Node's errno names.

export type StorageProblem = 'disk-full' | 'read-only' | 'in-use';

export interface StorageError {
  problem: StorageProblem;
  message: string;
  /** The code as reported, for the log. */
  code: string;
}

const DISK_FULL = ['SQLITE_FULL', 'ENOSPC', 'EDQUOT', 'EFBIG'];
const READ_ONLY = ['SQLITE_READONLY', 'EACCES', 'EPERM', 'EROFS'];
const IN_USE = ['SQLITE_BUSY', 'SQLITE_LOCKED', 'EBUSY'];

const matches = (code: string, list: readonly string[]): boolean => list.some((c) => code === c || code.startsWith(`${c}_`));

/** Null when the error is not one of the three a person can fix outside Rigbook. */
export function describeStorageError(error: unknown, where?: string): StorageError | null {
  const code = (error as { code?: unknown } | null)?.code;
  if (typeof code !== 'string') return null;
  const place = where ? ` (${where})` : '';
  if (matches(code, DISK_FULL)) {
    return { problem: 'disk-full', code, message: `The disk holding the records${place} is full. Nothing was saved. Free some space and try again.` };
  }
  if (matches(code, READ_ONLY)) {
    return {
      problem: 'read-only',
      code,
      message: `The store${place} cannot be written: the file or its folder is read-only (or belongs to another user). Nothing was saved. Rigbook needs to write the file and create files beside it; check the permissions, or copy the store to a folder you can write.`,
    };
  }
  if (matches(code, IN_USE)) {
    return { problem: 'in-use', code, message: `The store${place} is in use by another Rigbook window or command. Nothing was saved; try again when it is done.` };
  }
  return null;
}
