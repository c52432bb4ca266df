import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { describe, inject } from 'vitest';
import { tempDir } from './temp-dir';

// The test matrix: a suite written once runs on a SQLite file and on a PostgreSQL store.
// Each store is fresh and real: a file in a temp folder, or a schema of its own in the run's
// throwaway cluster (tests/setup/pg-global-setup.ts), dropped afterwards. A schema rather than a
// database: creating a database costs the server a checkpoint, close to a second on a busy
// machine, and the store is the same either way (a shop may keep several stores in one
// database the same way, one `search_path` each).

export interface FreshStore {
  /** What `--db` would be given: a file path or a connection string. */
  location: string;
  remove: () => Promise<void>;
}

export interface StoreEngine {
  name: 'SQLite' | 'PostgreSQL';
  fresh: () => Promise<FreshStore>;
}

export const SQLITE: StoreEngine = {
  name: 'SQLite',
  fresh: async () => {
    const temp = tempDir();
    return { location: temp.file('store.sqlite'), remove: async () => temp.remove() };
  },
};

/** The URL of the same database with another schema first on the search path. */
export function schemaUrl(adminUrl: string, schema: string): string {
  const url = new URL(adminUrl);
  url.searchParams.set('options', `-c search_path=${schema}`);
  return url.toString();
}

async function onAdmin<T>(adminUrl: string, work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

export function postgresEngine(adminUrl: string): StoreEngine {
  return {
    name: 'PostgreSQL',
    fresh: async () => {
      const schema = `store_${randomBytes(6).toString('hex')}`;
      await onAdmin(adminUrl, (c) => c.query(`create schema ${schema}`));
      return {
        location: schemaUrl(adminUrl, schema),
        remove: () => onAdmin(adminUrl, (c) => c.query(`drop schema if exists ${schema} cascade`)).then(() => {}),
      };
    },
  };
}

/** The PostgreSQL engine of this run, or why there is none. */
export function postgresOfThisRun(): { engine: StoreEngine; reason: null } | { engine: null; reason: string } {
  const pgRun = inject('rigbookPg');
  return pgRun.adminUrl ? { engine: postgresEngine(pgRun.adminUrl), reason: null } : { engine: null, reason: pgRun.reason };
}

/**
 * Runs `suite` once per engine, inside a `describe` named after it. Without a server the
 * PostgreSQL copy is registered as skipped, its name carrying the reason: a skip is visible in
 * every report and never counts as a pass on that engine.
 */
export function forEachEngine(suite: (engine: StoreEngine) => void): void {
  describe('on SQLite', () => suite(SQLITE));
  const pgRun = postgresOfThisRun();
  if (pgRun.engine) describe('on PostgreSQL', () => suite(pgRun.engine));
  else describe.skip(`on PostgreSQL (SKIPPED: ${pgRun.reason})`, () => suite(postgresEngine('postgresql://skipped@localhost/none')));
}
