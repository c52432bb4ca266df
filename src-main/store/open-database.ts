import Database from 'better-sqlite3';
import { mkdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { Kysely, Migrator, SqliteDialect, type MigrationProvider } from 'kysely';
import type { Db } from './schema';
import { staticMigrationProvider } from './migration-provider';

export interface OpenedStore {
  db: Kysely<Db>;
  /** The raw handle, for the backup API and the benchmark's raw floor. */
  raw: Database.Database;
  path: string;
  /** The copy taken before pending migrations ran, if any. */
  preMigrationBackup: string | null;
}

export interface OpenOptions {
  /** Skip migrating (tests that build an old schema by hand). */
  migrate?: boolean;
  readonly?: boolean;
  /** Tests substitute a provider to stage a store at an older or newer schema. */
  provider?: MigrationProvider;
}

/** Pragmas for records people rely on. Set outside any transaction: inside one, foreign_keys does nothing. */
export function applyPragmas(raw: Database.Database): void {
  raw.pragma('journal_mode = WAL');
  // better-sqlite3 is built with WAL synchronous = NORMAL; a shop's records want FULL.
  raw.pragma('synchronous = FULL');
  raw.pragma('foreign_keys = ON');
  raw.pragma('busy_timeout = 5000');
}

export function wrapKysely(raw: Database.Database): Kysely<Db> {
  return new Kysely<Db>({ dialect: new SqliteDialect({ database: raw }) });
}

export function timestampForFile(date = new Date()): string {
  return date.toISOString().replace(/[:.]/g, '-');
}

/**
 * Each migration runs its body in a transaction of its own (SQLite's DDL is not transactional
 * under the migrator), so the migrator must not open one around it: on PostgreSQL it would, and
 * a transaction cannot be opened inside another.
 */
export function migratorFor(db: Kysely<Db>, provider: MigrationProvider, schema?: string): Migrator {
  // On PostgreSQL the migrator's own table is placed in the store's schema by name: left to
  // itself it would find another store's table in the same database and take it for this one's.
  return new Migrator({ db, provider, disableTransactions: true, ...(schema ? { migrationTableSchema: schema } : {}) });
}

export async function pendingMigrations(db: Kysely<Db>, provider: MigrationProvider = staticMigrationProvider, schema?: string): Promise<string[]> {
  const migrator = migratorFor(db, provider, schema);
  const all = await migrator.getMigrations();
  return all.filter((m) => m.executedAt === undefined).map((m) => m.name);
}

export async function migrateToLatest(db: Kysely<Db>, provider: MigrationProvider = staticMigrationProvider, schema?: string): Promise<void> {
  const migrator = migratorFor(db, provider, schema);
  const { error, results } = await migrator.migrateToLatest();
  if (error) {
    const failed = results?.find((r) => r.status === 'Error')?.migrationName ?? 'unknown';
    throw new Error(`Migration ${failed} failed: ${error instanceof Error ? error.message : String(error)}`);
  }
}

function hasUserTables(raw: Database.Database): boolean {
  const row = raw.prepare("select count(*) as n from sqlite_master where type = 'table' and name not like 'sqlite_%'").get() as { n: number };
  return row.n > 0;
}

/** Opens (creating if needed) the store, backs it up when migrations are pending, and migrates it. */
export async function openStore(path: string, options: OpenOptions = {}): Promise<OpenedStore> {
  if (path !== ':memory:') mkdirSync(dirname(path), { recursive: true });
  const raw = new Database(path, { readonly: options.readonly ?? false });
  let db: Kysely<Db> | undefined;
  try {
    if (!options.readonly) applyPragmas(raw);
    db = wrapKysely(raw);
    let preMigrationBackup: string | null = null;
    if (options.migrate !== false && !options.readonly) {
      const pending = await pendingMigrations(db, options.provider);
      if (pending.length > 0 && hasUserTables(raw) && path !== ':memory:') {
        preMigrationBackup = join(dirname(path), 'backups', `before-migration-${timestampForFile()}.sqlite`);
        mkdirSync(dirname(preMigrationBackup), { recursive: true });
        await raw.backup(preMigrationBackup);
      }
      if (pending.length > 0) await migrateToLatest(db, options.provider);
    }
    return { db, raw, path, preMigrationBackup };
  } catch (error) {
    if (db) await db.destroy();
    else raw.close();
    throw error;
  }
}
