import { sql, type Kysely, type Transaction } from 'kysely';
import { columnTypes } from './support/column-types';

// Customers become records: each distinct owner text of a vehicle becomes one customer (the
// same text, trimmed, one customer), the vehicle points at it, and the owner column goes. A
// vehicle with no owner text is the shop's own (no customer). Work orders and their steps are
// new tables. Down writes each customer's name back as its vehicles' owner text and drops the
// new tables; a customer's contact and notes, and the work orders, have no place before this
// step and are lost by going down.
//
// customerId has an index and no foreign key: SQLite cannot drop a column that a foreign key
// names, and down must drop it. The service checks the reference on every write.
// A frozen snapshot: no imports of the live schema or repositories.

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- a migration sees the tables as they are at this step
type AnyTrx = Transaction<any>;

/** FNV-1a over the UTF-16 code units, 32 bits, as 8 hex digits: a short stable tag of the owner text. */
function textTag(text: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(16).padStart(8, '0');
}

/** The customer id an owner text becomes: readable where the text is, unique by its tag. Imports of older files derive the same id (core/customer-id.ts, a copy: migrations import nothing of ours). */
function customerIdForOwner(owner: string): string {
  const slug = owner
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 40)
    .replace(/-+$/, '');
  return `cust-${slug === '' ? '' : `${slug}-`}${textTag(owner)}`;
}

async function moveOwnerBack(t: AnyTrx): Promise<void> {
  const definition = (await sql<{ sql: string }>`select sql from sqlite_master where type = 'table' and name = 'vehicles'`.execute(t)).rows[0]?.sql ?? '';
  const owner = /,\s*("owner" [^,()]*(?:\([^)]*\)[^,()]*)*)\)\s*$/u.exec(definition);
  if (!owner || !definition.includes('"className"')) throw new Error('the vehicles table is not as this migration left it');
  const moved = definition
    .slice(0, owner.index)
    .concat(')')
    .replace('"className"', `${owner[1]}, "className"`)
    .replace(/^create table "vehicles"/iu, 'create table "vehiclesDown"');
  const columns = (await sql<{ name: string }>`select name from pragma_table_info('vehicles')`.execute(t)).rows.map((c) => `"${c.name}"`).join(', ');
  await sql.raw(moved).execute(t);
  await sql.raw(`insert into "vehiclesDown" (${columns}) select ${columns} from "vehicles"`).execute(t);
  await t.schema.dropTable('vehicles').execute();
  await sql`alter table "vehiclesDown" rename to "vehicles"`.execute(t);
  await t.schema.createIndex('vehiclesClassIdx').on('vehicles').column('className').execute();
}

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const { text, integer } = columnTypes(trx);
    const t = trx as AnyTrx;
    await trx.schema
      .createTable('customers')
      .addColumn('id', text, (c) => c.primaryKey())
      .addColumn('version', integer, (c) => c.notNull().defaultTo(1))
      .addColumn('archivedAt', text)
      .addColumn('notes', text, (c) => c.notNull().defaultTo(''))
      .addColumn('createdAt', text, (c) => c.notNull())
      .addColumn('updatedAt', text, (c) => c.notNull())
      .addColumn('name', text, (c) => c.notNull())
      .addColumn('contact', text, (c) => c.notNull().defaultTo(''))
      .execute();
    await trx.schema.alterTable('vehicles').addColumn('customerId', text).execute();
    await trx.schema.createIndex('vehiclesCustomerIdx').on('vehicles').column('customerId').execute();

    const vehicles = (await t.selectFrom('vehicles').select(['id', 'owner']).execute()) as { id: string; owner: string }[];
    const now = new Date().toISOString();
    const made = new Map<string, string>();
    for (const vehicle of vehicles) {
      const owner = vehicle.owner.trim();
      if (owner === '') continue;
      let customerId = made.get(owner);
      if (customerId === undefined) {
        customerId = customerIdForOwner(owner);
        made.set(owner, customerId);
        await t.insertInto('customers').values({ id: customerId, version: 1, archivedAt: null, notes: '', createdAt: now, updatedAt: now, name: owner, contact: '' }).execute();
      }
      await t.updateTable('vehicles').set({ customerId }).where('id', '=', vehicle.id).execute();
    }
    await trx.schema.alterTable('vehicles').dropColumn('owner').execute();

    await trx.schema
      .createTable('workOrders')
      .addColumn('id', text, (c) => c.primaryKey())
      .addColumn('version', integer, (c) => c.notNull().defaultTo(1))
      .addColumn('vehicleId', text, (c) => c.notNull().references('vehicles.id'))
      .addColumn('customerId', text)
      .addColumn('complaint', text, (c) => c.notNull())
      .addColumn('status', text, (c) => c.notNull())
      .addColumn('openedAt', text, (c) => c.notNull())
      .addColumn('handedOverAt', text)
      .addColumn('signedOffBy', text, (c) => c.notNull().defaultTo(''))
      .addColumn('verdictsAtOpening', text, (c) => c.notNull())
      .addColumn('verdictsAtHandOver', text)
      .addColumn('createdAt', text, (c) => c.notNull())
      .addColumn('updatedAt', text, (c) => c.notNull())
      .execute();
    await trx.schema.createIndex('workOrdersVehicleIdx').on('workOrders').columns(['vehicleId', 'openedAt']).execute();
    await trx.schema.createIndex('workOrdersCustomerIdx').on('workOrders').columns(['customerId', 'openedAt']).execute();
    await trx.schema
      .createTable('workOrderSteps')
      .addColumn('workOrderId', text, (c) => c.notNull().references('workOrders.id').onDelete('cascade'))
      .addColumn('position', integer, (c) => c.notNull())
      .addColumn('kind', text, (c) => c.notNull())
      .addColumn('text', text, (c) => c.notNull())
      .addColumn('reason', text, (c) => c.notNull().defaultTo(''))
      .addColumn('at', text, (c) => c.notNull())
      .addColumn('actor', text, (c) => c.notNull())
      .addColumn('historyIds', text, (c) => c.notNull().defaultTo('[]'))
      .addPrimaryKeyConstraint('workOrderStepsPk', ['workOrderId', 'position'])
      .execute();
  });
}

export async function down(db: Kysely<unknown>): Promise<void> {
  const { postgres } = columnTypes(db);
  // SQLite rebuilds the vehicles table below (to put owner back where it was); a rebuild drops the
  // table the builds point at, which foreign keys forbid. The pragma is set outside the
  // transaction (inside one it does nothing) and put back as it was.
  const keys = postgres ? 0 : Number((await sql<{ foreign_keys: number }>`pragma foreign_keys`.execute(db)).rows[0]?.foreign_keys ?? 0);
  if (keys) await sql`pragma foreign_keys = off`.execute(db);
  try {
    await downSteps(db, postgres);
  } finally {
    if (keys) await sql`pragma foreign_keys = on`.execute(db);
  }
}

async function downSteps(db: Kysely<unknown>, postgres: boolean): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const { text } = columnTypes(trx);
    const t = trx as AnyTrx;
    await trx.schema.dropTable('workOrderSteps').execute();
    await trx.schema.dropTable('workOrders').execute();
    await trx.schema
      .alterTable('vehicles')
      .addColumn('owner', text, (c) => c.notNull().defaultTo(''))
      .execute();
    const customers = (await t.selectFrom('customers').select(['id', 'name']).execute()) as { id: string; name: string }[];
    for (const customer of customers) {
      // The owner column held at most 120 characters.
      await t
        .updateTable('vehicles')
        .set({ owner: customer.name.slice(0, 120) })
        .where('customerId', '=', customer.id)
        .execute();
    }
    await trx.schema.dropIndex('vehiclesCustomerIdx').execute();
    await trx.schema.alterTable('vehicles').dropColumn('customerId').execute();
    // SQLite appends an added column; the layout before this step had owner before className.
    // The table is made again from its own definition with owner moved back, so the store is
    // exactly what the earlier migrations make (a restore compares the two).
    if (!postgres) await moveOwnerBack(t);
    await trx.schema.dropTable('customers').execute();
  });
}
