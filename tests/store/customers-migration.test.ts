import { Migrator, sql, type Kysely } from 'kysely';
import { afterEach, describe, expect, it } from 'vitest';
import { customerIdForOwner } from '../../src-main/core/customer-id';
import { staticMigrationProvider } from '../../src-main/store/migration-provider';
import { openStore } from '../../src-main/store/open-database';
import { columns } from '../helpers/table-columns';
import { tempDir } from '../helpers/temp-dir';

const temps: ReturnType<typeof tempDir>[] = [];
afterEach(() => temps.splice(0).forEach((t) => t.remove()));

const BEFORE = '20261202-0005-history-selectors';
const STEP = '20261203-0008-customers-and-work-orders';

function vehicle(id: string, owner: string) {
  return { id, name: `Vehicle ${id}`, kind: 'car', owner, className: '', version: 1, notes: '', createdAt: 'x', updatedAt: 'x' };
}

describe('the customers and work orders migration', () => {
  it('turns each distinct owner text into one customer, and its down writes the texts back', async () => {
    const t = tempDir();
    temps.push(t);
    const store = await openStore(t.file('m.sqlite'));
    const migrator = new Migrator({ db: store.db, provider: staticMigrationProvider });
    expect((await migrator.migrateTo(BEFORE)).error).toBeUndefined();
    // Two vehicles of one owner (one with stray spaces), one of another, one of the shop's own.
    const owners = { a: 'Dana Ó Briain', b: '  Dana Ó Briain ', c: 'Ravi & Sons', d: '' };
    for (const [id, owner] of Object.entries(owners))
      await store.db
        .insertInto('vehicles')
        .values(vehicle(id, owner) as never)
        .execute();

    expect((await migrator.migrateTo(STEP)).error).toBeUndefined();
    expect(await columns(store.db, 'vehicles')).not.toContain('owner');
    const customers = await store.db.selectFrom('customers').select(['id', 'name', 'contact']).orderBy('name').execute();
    expect(customers).toEqual([
      { id: customerIdForOwner('Dana Ó Briain'), name: 'Dana Ó Briain', contact: '' },
      { id: customerIdForOwner('Ravi & Sons'), name: 'Ravi & Sons', contact: '' },
    ]);
    // The id is readable and starts with a letter (spreadsheets keep it as it is).
    expect(customers[0]!.id).toMatch(/^cust-dana-o-briain-[0-9a-f]{8}$/);
    const links = await store.db.selectFrom('vehicles').select(['id', 'customerId']).orderBy('id').execute();
    expect(links).toEqual([
      { id: 'a', customerId: customers[0]!.id },
      { id: 'b', customerId: customers[0]!.id },
      { id: 'c', customerId: customers[1]!.id },
      { id: 'd', customerId: null },
    ]);
    expect(await columns(store.db, 'workOrders')).toEqual(expect.arrayContaining(['vehicleId', 'complaint', 'status', 'verdictsAtOpening', 'verdictsAtHandOver']));

    // A customer renamed after the upgrade goes down under the new name; the trimmed text stays trimmed.
    await store.db.updateTable('customers').set({ name: 'Ravi and Sons' }).where('id', '=', customers[1]!.id).execute();
    expect((await migrator.migrateTo(BEFORE)).error).toBeUndefined();
    expect(await columns(store.db, 'vehicles')).not.toContain('customerId');
    const back = await sql<{ id: string; owner: string }>`select id, owner from vehicles order by id`.execute(store.db);
    expect(back.rows).toEqual([
      { id: 'a', owner: 'Dana Ó Briain' },
      { id: 'b', owner: 'Dana Ó Briain' },
      { id: 'c', owner: 'Ravi and Sons' },
      { id: 'd', owner: '' },
    ]);
    const tables = await sql<{ name: string }>`select name from sqlite_master where type = 'table' and name in ('customers', 'workOrders', 'workOrderSteps')`.execute(store.db);
    expect(tables.rows).toEqual([]);
    // Down leaves the vehicles table exactly as the earlier migrations make it, and the links checked.
    const fresh = await openStore(t.file('fresh.sqlite'));
    expect((await new Migrator({ db: fresh.db, provider: staticMigrationProvider }).migrateTo(BEFORE)).error).toBeUndefined();
    const definition = (db: Kysely<any>) => sql<{ sql: string }>`select sql from sqlite_master where name = 'vehicles'`.execute(db); // eslint-disable-line @typescript-eslint/no-explicit-any -- any database
    expect((await definition(store.db)).rows).toEqual((await definition(fresh.db)).rows);
    expect(store.raw.pragma('foreign_keys', { simple: true })).toBe(1);
    await fresh.db.destroy();
    await store.db.destroy();
  });

  it('derives the same customer id as the store upgrade from an owner text', () => {
    // The migration keeps a frozen copy of the derivation; both must agree for old files to meet migrated customers.
    expect(customerIdForOwner('Sam Delacroix')).toBe(customerIdForOwner(' Sam Delacroix  '));
    expect(customerIdForOwner('Sam Delacroix')).not.toBe(customerIdForOwner('Sam  Delacroix'));
    expect(customerIdForOwner('東京')).toMatch(/^cust-[0-9a-f]{8}$/);
  });
});
