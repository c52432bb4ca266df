// Putting a backup in the store's place: the checks a candidate must pass, the staged copy,
// and the one rename that swaps it in. The service layer (service/restore-store.ts) re-checks
// the staged copy's builds between staging and swapping.

import Database from 'better-sqlite3';
import { existsSync, linkSync, copyFileSync, mkdirSync, renameSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { checkStoreFile, removeQuietly, settleCopy, syncFile, syncFolder } from './backup';
import { STORE_SIDE_SUFFIXES } from './file-identity';
import { timestampForFile } from './open-database';
import { firstSchemaDifference, readSchemaShape, referenceShape } from './schema-shape';

export class RestoreRefused extends Error {
  constructor(
    message: string,
    readonly reason: 'unreadable' | 'invalid' | 'in-use' = 'invalid',
  ) {
    super(message);
    this.name = 'RestoreRefused';
  }
}

/**
 * Whether a file may become the store: everything checkStoreFile asks, and a schema exactly the
 * one Rigbook's migrations make for the migrations it records (no table, column, index,
 * trigger or view of its own, none missing or changed). Returns the recorded migrations.
 */
export async function checkRestoreCandidate(path: string): Promise<string[]> {
  const check = checkStoreFile(path);
  if (!check.ok) throw new RestoreRefused(`The file was not restored: ${check.reason}. Nothing was replaced.`, check.unreadable ? 'unreadable' : 'invalid');
  const expected = await referenceShape(check.migrations);
  const db = new Database(path, { readonly: true, fileMustExist: true });
  let difference: string | null;
  try {
    difference = firstSchemaDifference(readSchemaShape(db), expected);
  } finally {
    db.close();
  }
  if (difference) {
    throw new RestoreRefused(`The file was not restored: its schema is not the one Rigbook makes for ${check.migrations.at(-1)}: ${difference}. A file changed outside Rigbook cannot be trusted with your records. Nothing was replaced.`);
  }
  return check.migrations;
}

/**
 * Holds an exclusive lock on the store at `target`, or says it is in use. While held, no other
 * connection (a Rigbook window, another command) can read or write it. Null when no store is there.
 */
export function lockStore(target: string): Database.Database | null {
  if (!existsSync(target)) return null;
  let db: Database.Database | undefined;
  try {
    db = new Database(target, { fileMustExist: true, timeout: 0 });
    db.pragma('locking_mode = EXCLUSIVE');
    db.exec('BEGIN EXCLUSIVE');
    db.exec('COMMIT');
    return db;
  } catch (error) {
    db?.close();
    const code = (error as { code?: string }).code ?? '';
    if (code.startsWith('SQLITE_BUSY') || code.startsWith('SQLITE_LOCKED')) {
      throw new RestoreRefused('The store is open in Rigbook or another command. Close it and run the restore again. Nothing was replaced.', 'in-use');
    }
    // A damaged store is exactly what a restore is for; it is kept aside as it is.
    return null;
  }
}

/** Copies the candidate into a file beside the target, self-contained and checked; returns its path. */
export async function stageCopy(candidate: string, target: string): Promise<string> {
  mkdirSync(dirname(target), { recursive: true });
  const staged = join(dirname(target), `.${basename(target)}.restoring-${process.pid}`);
  removeQuietly(staged);
  const source = new Database(candidate, { readonly: true, fileMustExist: true });
  try {
    await source.backup(staged);
  } catch (error) {
    removeQuietly(staged);
    throw error;
  } finally {
    source.close();
  }
  const integrity = settleCopy(staged);
  if (integrity !== 'ok') {
    removeQuietly(staged);
    throw new RestoreRefused(`The copy of the file failed its integrity check (${integrity}). Nothing was replaced.`);
  }
  return staged;
}

export interface SwapResult {
  /** Where the replaced store was kept; null when there was none. */
  keptAs: string | null;
  /** Journal files found beside the store and moved aside (they belong to the replaced store, or to none). */
  setAside: string[];
}

/**
 * Puts the staged file at `target` with one rename. Before it: the current store is locked (or
 * the restore is refused as in use), its write-ahead log folded in and the store turned into a
 * single file; every `-wal`, `-shm` or `-journal` still beside the target is moved aside, because
 * SQLite would replay it into the restored file; the current store is kept under a dated name
 * by a hard link (a copy where links are not possible), so at every instant a store is at
 * `target`. A crash anywhere leaves either the old store or the restored one there, whole.
 */
export function swapIn(staged: string, target: string, now: Date): SwapResult {
  const stamp = timestampForFile(now);
  const stem = basename(target).replace(/\.sqlite$/i, '');
  let keptAs: string | null = null;
  const setAside: string[] = [];
  const lock = lockStore(target);
  try {
    if (lock) {
      lock.pragma('wal_checkpoint(TRUNCATE)');
      // Out of WAL mode the kept store needs no file beside it (SQLite removes its -wal and -shm),
      // and closing this connection later removes nothing by name beside the restored file.
      lock.pragma('journal_mode = DELETE');
      // Taken again in the new journal mode, so the lock is certainly exclusive while the files move.
      lock.exec('BEGIN EXCLUSIVE');
      lock.exec('COMMIT');
      // The lock stays held through the rename: a shell starting meanwhile waits instead of reading.
    }
    const asideBase = existsSync(target) ? join(dirname(target), `${stem}.replaced-${stamp}.sqlite`) : join(dirname(target), `${stem}.set-aside-${stamp}.sqlite`);
    for (const suffix of STORE_SIDE_SUFFIXES) {
      if (!existsSync(target + suffix)) continue;
      renameSync(target + suffix, asideBase + suffix);
      setAside.push(asideBase + suffix);
    }
    if (existsSync(target)) {
      keptAs = asideBase;
      try {
        linkSync(target, keptAs);
      } catch {
        copyFileSync(target, keptAs);
        syncFile(keptAs);
      }
    }
    syncFile(staged);
    renameSync(staged, target);
    syncFolder(dirname(target));
  } finally {
    lock?.close();
  }
  return { keptAs, setAside };
}
