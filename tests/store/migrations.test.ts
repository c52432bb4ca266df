import Database from 'better-sqlite3';
import { existsSync } from 'node:fs';
import { Migrator, sql, type Kysely, type Migration } from 'kysely';
import { afterEach, describe, expect, it } from 'vitest';
import { openStore } from '../../src-main/store/open-database';
import { MIGRATIONS, staticMigrationProvider } from '../../src-main/store/migration-provider';
import { tempDir } from '../helpers/temp-dir';

const temps: ReturnType<typeof tempDir>[] = [];
function fresh() {
  const t = tempDir();
  temps.push(t);
  return t;
}
afterEach(() => temps.splice(0).forEach((t) => t.remove()));

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- any database: the names are read from sqlite_master
async function tableNames(db: Kysely<any>): Promise<string[]> {
  const rows = await sql<{ name: string }>`select name from sqlite_master where type = 'table' and name not like 'sqlite_%' and name not like 'kysely_%' order by name`.execute(db);
  return rows.rows.map((r) => r.name);
}

describe('migrations', () => {
  it('creates every table the domain needs, with the pragmas a shop relies on', async () => {
    const t = fresh();
    const store = await openStore(t.file('a.sqlite'));
    expect(await tableNames(store.db)).toEqual(
      [
        'batteries',
        'builds',
        'classes',
        'classRules',
        'controllers',
        'customers',
        'history',
        'historyBuilds',
        'historySelectors',
        'motors',
        'packEvents',
        'propellers',
        'runLogs',
        'settings',
        'supplies',
        'supplyPacks',
        'vehicles',
        'verdicts',
        'workOrderSteps',
        'workOrders',
      ].sort(),
    );
    expect(store.raw.pragma('journal_mode', { simple: true })).toBe('wal');
    expect(store.raw.pragma('foreign_keys', { simple: true })).toBe(1);
    // 2 = FULL in SQLite's numbering.
    expect(store.raw.pragma('synchronous', { simple: true })).toBe(2);
    expect(store.raw.pragma('busy_timeout', { simple: true })).toBe(5000);
    await store.db.destroy();
  });

  it('runs every migration down and up again (round trip)', async () => {
    const t = fresh();
    const store = await openStore(t.file('b.sqlite'));
    const migrator = new Migrator({ db: store.db, provider: staticMigrationProvider });
    for (let i = 0; i < Object.keys(MIGRATIONS).length; i++) {
      const { error } = await migrator.migrateDown();
      expect(error).toBeUndefined();
    }
    expect(await tableNames(store.db)).toEqual([]);
    const { error } = await migrator.migrateToLatest();
    expect(error).toBeUndefined();
    expect(await tableNames(store.db)).toContain('builds');
    await store.db.destroy();
  });

  it('takes a backup with the old data before running a pending migration', async () => {
    const t = fresh();
    const file = t.file('c.sqlite');
    const first = await openStore(file);
    await first.db
      .insertInto('batteries')
      .values({ id: 'p1', name: 'Shelf 4S', chemistry: 'lipo', cellsSeries: 4, cellsParallel: 1, capacityMah: 5000, cycleCount: 0, retired: 0, version: 1, notes: '', createdAt: 'x', updatedAt: 'x' })
      .execute();
    expect(first.preMigrationBackup).toBeNull();
    await first.db.destroy();

    // A later release adds a column: opening the store must copy it first.
    const later: Migration = {
      up: async (db) => {
        await db.schema.alterTable('batteries').addColumn('chargeNote', 'text').execute();
      },
      down: async (db) => {
        await db.schema.alterTable('batteries').dropColumn('chargeNote').execute();
      },
    };
    const second = await openStore(file, { provider: { getMigrations: async () => ({ ...MIGRATIONS, '20991231-9999-later': later }) } });
    expect(second.preMigrationBackup).not.toBeNull();
    const backup = second.preMigrationBackup!;
    expect(existsSync(backup)).toBe(true);
    await second.db.destroy();

    const copy = new Database(backup, { readonly: true });
    const row = copy.prepare('select name from batteries where id = ?').get('p1') as { name: string };
    expect(row.name).toBe('Shelf 4S');
    const columns = (copy.prepare('pragma table_info(batteries)').all() as { name: string }[]).map((c) => c.name);
    expect(columns).not.toContain('chargeNote');
    expect(copy.pragma('integrity_check', { simple: true })).toBe('ok');
    copy.close();
  });

  it('a migration that fails leaves the store as it was', async () => {
    const t = fresh();
    const file = t.file('d.sqlite');
    const first = await openStore(file);
    await first.db.destroy();
    const broken: Migration = {
      up: async (db) => {
        await db.transaction().execute(async (trx) => {
          await trx.schema.createTable('halfDone').addColumn('x', 'text').execute();
          throw new Error('boom');
        });
      },
    };
    await expect(openStore(file, { provider: { getMigrations: async () => ({ ...MIGRATIONS, '20991231-9999-broken': broken }) } })).rejects.toThrow(/broken failed: boom/);
    const reopened = await openStore(file);
    expect(await tableNames(reopened.db)).not.toContain('halfDone');
    await reopened.db.destroy();
  });
});
