// Copies of the store as files: the online backup (consistent while the store is open and
// being written), the rolling copies taken at start, and the checks a file must pass before
// it may replace the store.

import Database from 'better-sqlite3';
import type { SqliteFileHandle } from './sqlite-file-handle';
import { closeSync, existsSync, fsyncSync, mkdirSync, openSync, readdirSync, readSync, renameSync, rmSync, statSync } from 'node:fs';
import { storeFileClash } from './file-identity';
import { basename, dirname, join } from 'node:path';
import { MIGRATIONS } from './migration-provider';
import { timestampForFile } from './open-database';

/** Tables every Rigbook store has had since its first schema. */
export const RIGBOOK_TABLES = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles', 'builds', 'supplies', 'supplyPacks', 'history', 'settings'] as const;
const MIGRATION_TABLE = 'kysely_migration';
const SQLITE_HEADER = 'SQLite format 3\u0000';

export function removeQuietly(path: string): void {
  for (const p of [path, `${path}-wal`, `${path}-shm`, `${path}-journal`]) rmSync(p, { force: true });
}

/**
 * Makes a fresh copy a single self-contained file (a copy of a WAL store is marked WAL too,
 * and would grow -wal and -shm files beside it whenever it is opened) and checks it.
 * Returns SQLite's integrity verdict: 'ok' or what is wrong.
 */
export function settleCopy(path: string): string {
  const db = new Database(path, { fileMustExist: true });
  try {
    db.pragma('journal_mode = DELETE');
    const rows = db.pragma('integrity_check') as { integrity_check: string }[];
    return rows.map((r) => r.integrity_check).join('; ');
  } finally {
    db.close();
  }
}

/**
 * Writes a consistent copy of the open store to `destination` with SQLite's online backup:
 * other writes may go on meanwhile. The copy is written beside the destination, checked, and
 * only then renamed into place, so a failed backup never leaves a half file or spoils an
 * older backup of the same name.
 */
export async function backUpStore(raw: SqliteFileHandle, destination: string, onProgress?: (done: number, total: number) => void): Promise<{ path: string; bytes: number }> {
  refuseStoreFile(destination, raw.name);
  mkdirSync(dirname(destination), { recursive: true });
  const partial = join(dirname(destination), `.${basename(destination)}.partial-${process.pid}`);
  removeQuietly(partial);
  try {
    await raw.backup(partial, {
      progress: ({ totalPages, remainingPages }) => {
        onProgress?.(totalPages - remainingPages, totalPages);
        // Pages per step (1 MB at SQLite's default page size): quick, yet other writes get in between.
        return 256;
      },
    });
    const integrity = settleCopy(partial);
    if (integrity !== 'ok') throw new Error(`the copy failed its integrity check (${integrity})`);
    syncFile(partial);
    // Checked again at the last moment: a link made while the copy ran must not send it over the store.
    refuseStoreFile(destination, raw.name);
    renameSync(partial, destination);
    syncFolder(dirname(destination));
  } catch (error) {
    removeQuietly(partial);
    throw error;
  }
  return { path: destination, bytes: statSync(destination).size };
}

/** `unreadable`: missing or not a SQLite file at all; otherwise a SQLite file refused for what it holds. */
export type StoreFileCheck = { ok: true; migrations: string[] } | { ok: false; reason: string; unreadable: boolean };

/** Thrown when a file would be written over the live store or a file SQLite keeps beside it. */
export class StoreFileClash extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'StoreFileClash';
  }
}

/** Refuses a destination that is, under any spelling, the store at `storePath` or one of its side files. */
export function refuseStoreFile(destination: string, storePath: string): void {
  if (storePath === '' || storePath === ':memory:') return;
  const clash = storeFileClash(destination, storePath);
  if (clash) throw new StoreFileClash(`${destination} ${clash}; choose another file`);
}

/** Flushes a file's bytes to the disk, so a rename that follows cannot outlive them. */
export function syncFile(path: string): void {
  const fd = openSync(path, 'r+');
  try {
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
}

/** Makes a rename in `folder` durable; some systems cannot open a folder for this, which costs only durability. */
export function syncFolder(folder: string): void {
  let fd: number | undefined;
  try {
    fd = openSync(folder, 'r');
    fsyncSync(fd);
  } catch {
    // Windows cannot open a folder as a file; its renames are journaled by NTFS.
  } finally {
    if (fd !== undefined) closeSync(fd);
  }
}

function hasSqliteHeader(path: string): boolean {
  const fd = openSync(path, 'r');
  try {
    const buf = Buffer.alloc(16);
    const n = readSync(fd, buf, 0, 16, 0);
    return n === 16 && buf.toString('latin1') === SQLITE_HEADER;
  } finally {
    closeSync(fd);
  }
}

/**
 * Whether a file may become the store: a SQLite file that passes integrity_check, holds
 * Rigbook's tables, and was migrated only by migrations this build knows (a file from a newer
 * Rigbook is refused rather than opened with a schema this one does not understand).
 */
export function checkStoreFile(path: string): StoreFileCheck {
  if (!existsSync(path)) return { ok: false, reason: `there is no file at ${path}`, unreadable: true };
  if (!statSync(path).isFile()) return { ok: false, reason: `${path} is not a file`, unreadable: true };
  if (!hasSqliteHeader(path)) return { ok: false, reason: 'it is not a SQLite file (a Rigbook backup is a SQLite file, usually ending in .sqlite)', unreadable: true };
  let db: Database.Database | undefined;
  try {
    db = new Database(path, { readonly: true, fileMustExist: true });
    const integrity = (db.pragma('integrity_check') as { integrity_check: string }[]).map((r) => r.integrity_check);
    if (integrity.length !== 1 || integrity[0] !== 'ok') {
      return { ok: false, reason: `it is damaged: SQLite's integrity check says ${integrity.slice(0, 3).join('; ')}${integrity.length > 3 ? ' …' : ''}`, unreadable: false };
    }
    const tables = new Set((db.prepare("select name from sqlite_master where type = 'table'").all() as { name: string }[]).map((r) => r.name));
    const lacking = RIGBOOK_TABLES.filter((t) => !tables.has(t));
    if (!tables.has(MIGRATION_TABLE) || lacking.length > 0) {
      return { ok: false, reason: `it is a SQLite file but not a Rigbook store (missing: ${[...(tables.has(MIGRATION_TABLE) ? [] : ['the schema version table']), ...lacking].join(', ')})`, unreadable: false };
    }
    const migrations = (db.prepare(`select name from ${MIGRATION_TABLE} order by name`).all() as { name: string }[]).map((r) => r.name);
    // Own keys only: a name such as "toString" or "constructor" is found on every object's prototype.
    const unknown = migrations.filter((m) => !Object.hasOwn(MIGRATIONS, m));
    if (unknown.length > 0) {
      return { ok: false, reason: `it was written by a newer Rigbook (schema ${unknown.at(-1)}); this one knows up to ${Object.keys(MIGRATIONS).sort().at(-1)}. Update Rigbook to restore it.`, unreadable: false };
    }
    if (migrations.length === 0) return { ok: false, reason: 'it has no schema version recorded; it is not a Rigbook store', unreadable: false };
    const known = Object.keys(MIGRATIONS).sort();
    if (migrations.some((m, i) => known[i] !== m)) {
      return { ok: false, reason: `its schema history (${migrations.join(', ')}) is not one Rigbook's migrations make: they run in order, and ${known.find((k, i) => migrations[i] !== k) ?? 'one'} is missing`, unreadable: false };
    }
    return { ok: true, migrations };
  } catch (error) {
    const code = (error as { code?: string }).code;
    if (code === 'SQLITE_NOTADB' || code === 'SQLITE_CORRUPT') return { ok: false, reason: `it is damaged or not a database (${(error as Error).message})`, unreadable: false };
    return { ok: false, reason: `it cannot be read: ${(error as Error).message}`, unreadable: false };
  } finally {
    db?.close();
  }
}

export const AUTO_BACKUP_PREFIX = 'auto-';

/** The folder rolling and manual backups go to: `backups/` beside the store. */
export function backupFolderFor(dbPath: string): string {
  return join(dirname(dbPath), 'backups');
}

/** When the newest automatic copy in the folder was taken, read from its name; null when there is none. */
export function newestRollingBackupAt(folder: string): Date | null {
  if (!existsSync(folder)) return null;
  let newest: Date | null = null;
  for (const name of readdirSync(folder)) {
    const m = /^auto-(\d{4}-\d{2}-\d{2}T\d{2})-(\d{2})-(\d{2})-(\d{3})Z\.sqlite$/.exec(name);
    if (!m) continue;
    const at = new Date(`${m[1]}:${m[2]}:${m[3]}.${m[4]}Z`);
    if (!Number.isNaN(at.getTime()) && (newest === null || at > newest)) newest = at;
  }
  return newest;
}

/** A copy at start, keeping the newest `keep` of them; older automatic copies are removed, nothing else is. */
export async function rollingBackup(raw: SqliteFileHandle, folder: string, keep: number, now = new Date()): Promise<string> {
  const path = join(folder, `${AUTO_BACKUP_PREFIX}${timestampForFile(now)}.sqlite`);
  await backUpStore(raw, path);
  const autos = readdirSync(folder)
    .filter((name) => name.startsWith(AUTO_BACKUP_PREFIX) && name.endsWith('.sqlite'))
    .sort();
  for (const old of autos.slice(0, Math.max(0, autos.length - Math.max(1, keep)))) rmSync(join(folder, old), { force: true });
  return path;
}
