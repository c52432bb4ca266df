import pg from 'pg';
import { Kysely, PostgresDialect, sql, type MigrationProvider } from 'kysely';
import type { Db } from './schema';
import { migrateToLatest, pendingMigrations } from './open-database';
import { redactUrl, withoutSecret } from './store-location';
import { readPasswordFile } from './password-file';

export interface OpenedPostgresStore {
  db: Kysely<Db>;
  /** The connection string as given (it may hold a password: never show it, show `label`). */
  url: string;
  /** The connection string with any password masked: what messages and logs name. */
  label: string;
  /** The schema the store's tables live in (the first of the connection's search path). */
  schema: string;
}

export interface PostgresOpenOptions {
  migrate?: boolean;
  provider?: MigrationProvider;
  /** Connections kept by this process (each shell or command is one process). */
  maxConnections?: number;
}

// The driver returns 64-bit integers and numerics as strings, since they may not fit a JS
// number. The store's counts and ids are far below 2^53, and the repositories expect numbers,
// as better-sqlite3 gives them.
const INT8_OID = 20;
const NUMERIC_OID = 1700;
const types = {
  getTypeParser: ((oid: number, format?: 'text' | 'binary') => (oid === INT8_OID || oid === NUMERIC_OID ? (value: string) => Number(value) : pg.types.getTypeParser(oid, format ?? 'text'))) as typeof pg.types.getTypeParser,
};

/** What the driver said, without the password and with the store named by its masked URL. */
export function postgresProblem(error: unknown, url: string): string {
  const text = error instanceof Error ? error.message : String(error);
  const code = (error as { code?: unknown } | null)?.code;
  return withoutSecret(`the PostgreSQL store ${redactUrl(url)} could not be opened: ${text}${typeof code === 'string' ? ` (${code})` : ''}`, url);
}

/** The driver's configuration for a URL, with the password taken from a file when the URL names one. */
export function poolConfig(url: string, maxConnections = 10): pg.PoolConfig {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    // A string the driver reads but a URL parser does not (libpq's empty host, `postgres:///db`).
    return { connectionString: url, types, max: maxConnections };
  }
  const passwordFile = parsed.searchParams.get('passwordfile');
  // The driver would pass an unknown parameter on to the server as a setting; it is ours.
  parsed.searchParams.delete('passwordfile');
  return {
    connectionString: parsed.toString(),
    types,
    max: maxConnections,
    ...(passwordFile ? { password: () => readPasswordFile(passwordFile) } : {}),
  };
}

/** Opens a PostgreSQL store and migrates it: the same schema and migrations as a SQLite file. */
export async function openPostgresStore(url: string, options: PostgresOpenOptions = {}): Promise<OpenedPostgresStore> {
  let pool: pg.Pool;
  try {
    pool = new pg.Pool(poolConfig(url, options.maxConnections));
  } catch (error) {
    throw new Error(postgresProblem(error, url));
  }
  // An idle connection dropped by the server must not bring the process down; the next query
  // takes a fresh one and reports its own failure.
  pool.on('error', (error) => process.stderr.write(`Rigbook: ${withoutSecret(`a PostgreSQL connection was lost: ${error.message}`, url)}\n`));
  const db = new Kysely<Db>({ dialect: new PostgresDialect({ pool }) });
  let schema: string;
  try {
    const rows = await sql<{ schema: string | null }>`select current_schema() as schema`.execute(db);
    const first = rows.rows[0]?.schema;
    // Null when no schema on the search path exists: the tables would have nowhere to go.
    if (!first) throw new Error('the search path names no schema that exists in this database');
    schema = first;
  } catch (error) {
    await db.destroy();
    throw new Error(postgresProblem(error, url));
  }
  try {
    if (options.migrate !== false) {
      // No copy is taken before migrating here: the engine's own dump is the backup of a
      // PostgreSQL store (see docs/store-and-backup.md).
      const pending = await pendingMigrations(db, options.provider, schema);
      if (pending.length > 0) await migrateToLatest(db, options.provider, schema);
    }
  } catch (error) {
    await db.destroy();
    throw new Error(withoutSecret(error instanceof Error ? error.message : String(error), url));
  }
  return { db, url, label: redactUrl(url), schema };
}
