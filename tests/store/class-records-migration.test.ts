import { Migrator, sql, type Kysely } from 'kysely';
import { afterEach, describe, expect, it } from 'vitest';
import { staticMigrationProvider } from '../../src-main/store/migration-provider';
import { openStore } from '../../src-main/store/open-database';
import { tempDir } from '../helpers/temp-dir';

const temps: ReturnType<typeof tempDir>[] = [];
afterEach(() => temps.splice(0).forEach((t) => t.remove()));

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- the tables as they are at each step
type AnyDb = Kysely<any>;

async function tables(db: AnyDb): Promise<string[]> {
  const rows = await sql<{ name: string }>`select name from sqlite_master where type = 'table'`.execute(db);
  return rows.rows.map((r) => r.name);
}

const stamps = { version: 1, notes: '', createdAt: '2026-11-01T08:00:00.000Z', updatedAt: '2026-11-01T08:00:00.000Z' };

describe('the class records migration', () => {
  it('makes one class record per class name on vehicles and limits, and its down leaves those names as they were', async () => {
    const t = tempDir();
    temps.push(t);
    const store = await openStore(t.file('classes.sqlite'));
    const db = store.db as unknown as AnyDb;
    const migrator = new Migrator({ db: store.db, provider: staticMigrationProvider });
    expect((await migrator.migrateTo('20261202-0005-history-selectors')).error).toBeUndefined();
    expect(await tables(db)).not.toContain('classes');

    // Real rows as the earlier schema held them: two vehicles share a class, one has none, and
    // one limit names a class no vehicle is in yet.
    const vehicle = { kind: 'car', owner: '', ...stamps };
    await db
      .insertInto('vehicles')
      .values([
        { ...vehicle, id: 'v1', name: 'Blue short-course truck', className: 'Stock 2WD' },
        { ...vehicle, id: 'v2', name: 'Red buggy', className: 'Stock 2WD' },
        { ...vehicle, id: 'v3', name: 'Bench mule', className: '' },
        { ...vehicle, id: 'v4', name: 'Green touring car', className: 'Modified' },
      ])
      .execute();
    const rule = { ruleId: 'class-voltage', figure: 'packVoltageFullV', unit: 'V', tightThreshold: null, ...stamps };
    await db
      .insertInto('classRules')
      .values([
        { ...rule, id: 'r1', className: 'Stock 2WD', limit: 8.4 },
        { ...rule, id: 'r2', className: 'Club boat', limit: 16.8 },
      ])
      .execute();

    expect((await migrator.migrateTo('20261203-0009-class-records')).error).toBeUndefined();
    const classes = await db.selectFrom('classes').select(['id', 'name', 'notes', 'version', 'archivedAt']).orderBy('name').execute();
    expect(classes.map((c) => c.name)).toEqual(['Club boat', 'Modified', 'Stock 2WD']);
    expect(classes.every((c) => c.notes === '' && c.version === 1 && c.archivedAt === null)).toBe(true);
    expect(new Set(classes.map((c) => c.id)).size).toBe(3);
    // One record per name: a second class of the same name is refused by the store itself.
    await expect(
      db
        .insertInto('classes')
        .values({ id: 'dup', name: 'Modified', ...stamps, archivedAt: null })
        .execute(),
    ).rejects.toThrow(/UNIQUE/);

    expect((await migrator.migrateTo('20261202-0005-history-selectors')).error).toBeUndefined();
    expect(await tables(db)).not.toContain('classes');
    const vehicles = await db.selectFrom('vehicles').select(['id', 'className']).orderBy('id').execute();
    expect(vehicles).toEqual([
      { id: 'v1', className: 'Stock 2WD' },
      { id: 'v2', className: 'Stock 2WD' },
      { id: 'v3', className: '' },
      { id: 'v4', className: 'Modified' },
    ]);
    const rules = await db.selectFrom('classRules').select(['id', 'className', 'limit']).orderBy('id').execute();
    expect(rules).toEqual([
      { id: 'r1', className: 'Stock 2WD', limit: 8.4 },
      { id: 'r2', className: 'Club boat', limit: 16.8 },
    ]);

    // Up again over the same rows gives the same classes.
    expect((await migrator.migrateToLatest()).error).toBeUndefined();
    expect((await db.selectFrom('classes').select('name').orderBy('name').execute()).map((c) => c.name)).toEqual(['Club boat', 'Modified', 'Stock 2WD']);
    await store.db.destroy();
  });
});
