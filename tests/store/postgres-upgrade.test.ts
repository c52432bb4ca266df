import { createHash } from 'node:crypto';
import { sql, type Kysely, type Migration, type MigrationProvider } from 'kysely';
import { afterEach, describe, expect, it } from 'vitest';
import { MIGRATIONS } from '../../src-main/store/migration-provider';
import { openPostgresStore } from '../../src-main/store/open-postgres';
import { openServiceHost, type OpenedServiceHost } from '../../src-main/service/open-service-host';
import type { Db } from '../../src-main/store/schema';
import { postgresOfThisRun, type FreshStore } from '../helpers/store-engines';
import { fillEveryTable, type TableShape, type WrittenRows } from '../reliability/support/schema-rows';
import { seedSharedFleet } from '../reliability/support/seed-fleet';
import { seededRandom } from '../reliability/support/random';
import { ok } from '../reliability/support/store-audit';

// The PostgreSQL side of the upgrade promise (the SQLite side is in
// tests/reliability/migrations-upgrade.test.ts): a store written at every earlier schema version
// opens in this release, upgraded, with every row it held; and a migration that fails part-way
// leaves the store as it was. There is no file copy to fall back on here (the engine's own dump
// is the backup), so the second half rests on PostgreSQL rolling back DDL with the transaction.

const NAMES = Object.keys(MIGRATIONS).sort();
const providerOf = (migrations: Record<string, Migration>): MigrationProvider => ({ getMigrations: async () => migrations });
const upTo = (count: number) => providerOf(Object.fromEntries(NAMES.slice(0, count).map((n) => [n, MIGRATIONS[n]!])));

/** The store's own tables: the migrator's bookkeeping is not user data. */
async function userTables(db: Kysely<Db>): Promise<string[]> {
  const rows = await sql<{ name: string }>`
    select table_name as name from information_schema.tables
    where table_schema = current_schema() and table_type = 'BASE TABLE' and table_name not like 'kysely_%'
    order by table_name`.execute(db);
  return rows.rows.map((r) => r.name);
}

/** Every user table's columns (information_schema.columns) and single-column foreign keys (pg_constraint). */
async function shapeOf(db: Kysely<Db>): Promise<TableShape[]> {
  const columns = await sql<{ table: string; name: string; type: string; identity: string }>`
    select table_name as "table", column_name as name, data_type as type, is_identity as identity
    from information_schema.columns where table_schema = current_schema() order by table_name, ordinal_position`.execute(db);
  const keys = await sql<{ table: string; from: string; parent: string; to: string }>`
    select child.relname as "table", fromCol.attname as "from", parent.relname as parent, toCol.attname as "to"
    from pg_constraint c
    join pg_class child on child.oid = c.conrelid
    join pg_class parent on parent.oid = c.confrelid
    join pg_attribute fromCol on fromCol.attrelid = c.conrelid and fromCol.attnum = c.conkey[1]
    join pg_attribute toCol on toCol.attrelid = c.confrelid and toCol.attnum = c.confkey[1]
    where c.contype = 'f' and c.connamespace = current_schema()::regnamespace`.execute(db);
  return (await userTables(db)).map((name) => ({
    name,
    columns: columns.rows.filter((c) => c.table === name).map((c) => ({ name: c.name, type: c.type, generated: c.identity === 'YES' })),
    keys: keys.rows.filter((k) => k.table === name).map((k) => ({ from: k.from, table: k.parent, to: k.to })),
  }));
}

async function fillEveryPostgresTable(db: Kysely<Db>): Promise<WrittenRows> {
  return fillEveryTable(await shapeOf(db), async (table, row) => {
    const names = Object.keys(row);
    // Returning the row as stored hands children the ids the engine generated for their parents.
    const inserted = await sql<Record<string, unknown>>`
      insert into ${sql.table(table)} (${sql.join(names.map((n) => sql.ref(n)))})
      values (${sql.join(names.map((n) => row[n]))}) returning *`.execute(db);
    return inserted.rows[0]!;
  });
}

/**
 * Rows as they were written, looked up again column by column (columns a later migration dropped
 * are not asked for). `only` narrows a table to the columns that must survive as written.
 */
async function missingRows(db: Kysely<Db>, written: WrittenRows, only: Record<string, string[]> = {}): Promise<string[]> {
  const problems: string[] = [];
  const shape = await shapeOf(db);
  for (const [table, rows] of written) {
    const present = new Set(shape.find((t) => t.name === table)?.columns.map((c) => c.name) ?? []);
    for (const row of rows) {
      const names = Object.keys(row).filter((n) => present.has(n) && (only[table]?.includes(n) ?? true));
      const where = sql.join(
        names.map((n) => sql`${sql.ref(n)} is not distinct from ${row[n]}`),
        sql` and `,
      );
      const found = await sql<{ n: number }>`select count(*) as n from ${sql.table(table)} where ${where}`.execute(db);
      const n = Number(found.rows[0]?.n);
      if (n !== 1) problems.push(`${table}: row ${JSON.stringify(row)} is ${n === 0 ? 'gone or changed' : 'duplicated'}`);
    }
  }
  return problems;
}

async function rowCounts(db: Kysely<Db>): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  for (const table of await userTables(db)) {
    const r = await sql<{ n: number }>`select count(*) as n from ${sql.table(table)}`.execute(db);
    counts[table] = Number(r.rows[0]?.n);
  }
  return counts;
}

async function appliedMigrations(db: Kysely<Db>): Promise<string[]> {
  // The store's migrator keeps its table in the store's own schema (open-database.ts, migratorFor).
  const rows = await sql<{ name: string }>`select name from kysely_migration order by name`.execute(db);
  return rows.rows.map((r) => r.name);
}

/** The whole schema (columns, indexes, constraints) and every row of every table, the migrator's own included. */
async function fingerprint(db: Kysely<Db>): Promise<string> {
  const hash = (value: unknown) => createHash('sha1').update(JSON.stringify(value)).digest('hex');
  const columns = await sql`
    select table_name, column_name, data_type, is_nullable, column_default, collation_name
    from information_schema.columns where table_schema = current_schema() order by table_name, ordinal_position`.execute(db);
  const indexes = await sql`select indexname, indexdef from pg_indexes where schemaname = current_schema() order by indexname`.execute(db);
  const constraints = await sql`
    select conname, pg_get_constraintdef(oid) as def from pg_constraint
    where connamespace = current_schema()::regnamespace order by conname`.execute(db);
  const tables = await sql<{ name: string }>`
    select table_name as name from information_schema.tables
    where table_schema = current_schema() and table_type = 'BASE TABLE' order by table_name`.execute(db);
  const parts = [`schema:${hash([columns.rows, indexes.rows, constraints.rows])}`];
  for (const { name } of tables.rows) {
    const rows = await sql<Record<string, unknown>>`select * from ${sql.table(name)}`.execute(db);
    // No row order is promised without an ORDER BY; the sorted texts of the rows are.
    parts.push(`${name}:${rows.rows.length}:${hash(rows.rows.map((r) => JSON.stringify(r)).sort())}`);
  }
  return parts.join('|');
}

const pgRun = postgresOfThisRun();

if (!pgRun.engine) {
  describe.skip(`upgrading a PostgreSQL store (SKIPPED: ${pgRun.reason})`, () => {
    it('needs a PostgreSQL server', () => {});
  });
} else {
  const engine = pgRun.engine;
  const stores: FreshStore[] = [];
  const hosts: OpenedServiceHost[] = [];
  const dbs: Array<Kysely<Db>> = [];
  const fresh = async () => {
    const s = await engine.fresh();
    stores.push(s);
    return s.location;
  };
  const host = async (location: string, actor: string) => {
    const h = await openServiceHost({ dbPath: location, actor });
    hosts.push(h);
    return h;
  };
  const store = async (location: string, provider?: MigrationProvider) => {
    const s = await openPostgresStore(location, provider ? { provider } : {});
    dbs.push(s.db);
    return s.db;
  };
  afterEach(async () => {
    for (const h of hosts.splice(0)) await h.close();
    for (const db of dbs.splice(0)) await db.destroy();
    for (const s of stores.splice(0)) await s.remove();
  });

  // Opening re-checks every build (the rules engine of this release has not judged these rows):
  // verdicts are written again, and history, its links and the settings gain the re-check's
  // entry. Of a verdict only its build must survive; those tables may grow, the others may not.
  const REWRITTEN_BY_RECHECK = { verdicts: ['buildId'] };
  const GROWN_BY_RECHECK = new Set(['settings', 'history', 'historyBuilds', 'historySelectors']);

  describe('upgrading a PostgreSQL store written at every earlier schema version', () => {
    it.each(NAMES.map((name, i) => [i + 1, name] as const))('opens a store at migration %i (%s) with every row intact', async (count, name) => {
      const location = await fresh();
      const old = await store(location, upTo(count));
      expect(await appliedMigrations(old)).toEqual(NAMES.slice(0, count));
      const written = await fillEveryPostgresTable(old);
      const before = await rowCounts(old);
      expect(Object.keys(before).length).toBeGreaterThan(0);
      expect(
        Object.values(before).every((n) => n === 3),
        JSON.stringify(before),
      ).toBe(true);
      await old.destroy();
      dbs.splice(dbs.indexOf(old), 1);

      // The real way in: the service host migrates to the latest schema and re-checks.
      const h = await host(location, 'upgrade');
      expect(await appliedMigrations(h.ctx.db), `${name} upgraded to the latest`).toEqual(NAMES);
      expect(await missingRows(h.ctx.db, written, REWRITTEN_BY_RECHECK)).toEqual([]);
      const after = await rowCounts(h.ctx.db);
      for (const [table, n] of Object.entries(before)) {
        if (GROWN_BY_RECHECK.has(table)) expect(after[table], table).toBeGreaterThanOrEqual(n);
        else expect(after[table], table).toBe(n);
      }

      // The rows carry an archive date (every `…At` column is filled), so the list is asked for archived builds too.
      const builds = await ok<Array<{ id: string }>>(h, 'builds.list', { includeArchived: true });
      expect(builds.map((b) => b.id).sort()).toEqual(
        written
          .get('builds')!
          .map((b) => b['id'])
          .sort(),
      );
      const history = await ok<unknown[]>(h, 'history.list', {});
      expect(history.length).toBeGreaterThanOrEqual(written.get('history')!.length);
      for (const handler of ['store.info', 'batteries.list', 'motors.list', 'vehicles.list', 'classRules.list', 'settings.get']) {
        const result = await h.call(handler, {});
        expect(result.ok, `${handler}: ${JSON.stringify(result)}`).toBe(true);
      }
      // A write goes through on the upgraded store (history ids come from the identity column, as in a real store).
      const pack = await ok<{ id: string }>(h, 'batteries.create', { name: 'After upgrade', chemistry: 'lipo', cellsSeries: 2, capacityMah: 2000 });
      expect(pack.id).toBeTruthy();
    });
  });

  describe('a migration that fails on PostgreSQL', () => {
    it('leaves the schema and every row exactly as they were, and the store opens and serves its records', async () => {
      const location = await fresh();
      const seeding = await host(location, 'seed');
      await seedSharedFleet(seeding, 8, seededRandom(5));
      await seeding.close();
      hosts.splice(hosts.indexOf(seeding), 1);
      const reader = await store(location);
      const was = await fingerprint(reader);

      const broken: Migration = {
        up: async (db: Kysely<unknown>) => {
          await db.transaction().execute(async (trx) => {
            await trx.schema.createTable('halfDone').addColumn('x', 'text').execute();
            await trx.schema.alterTable('batteries').addColumn('chargeNote', 'text').execute();
            await trx.schema.createIndex('batteriesNameIdx').on('batteries').column('name').execute();
            await trx
              .updateTable('batteries' as never)
              .set({ name: 'rewritten' } as never)
              .execute();
            await trx
              .deleteFrom('history' as never)
              .where('action' as never, '=', 'create' as never)
              .execute();
            throw new Error('disk said no');
          });
        },
      };
      await expect(openPostgresStore(location, { provider: providerOf({ ...MIGRATIONS, '20991231-0002-broken': broken }) })).rejects.toThrow(/20991231-0002-broken failed: disk said no/);

      expect(await fingerprint(reader)).toBe(was);
      expect(await appliedMigrations(reader)).toEqual(NAMES);

      const h = await host(location, 'after-failure');
      expect((await ok<unknown[]>(h, 'batteries.list', {})).length).toBeGreaterThan(0);
      expect((await ok<unknown[]>(h, 'builds.list', {})).length).toBe(8);
    });
  });
}
