import type { Kysely, Transaction } from 'kysely';
import { columnTypes } from './support/column-types';

// Classes become records of their own (a name and notes) instead of a name typed on each vehicle
// and each limit. Vehicles and limits keep naming their class by its name, so every file and
// history selector written before stays readable; the class record is what the window lists,
// renames and annotates, and a class with no limit yet still exists.
//
// Up makes one class record for every class name a vehicle or a limit holds. Down drops the
// table: the names on the vehicles and the limits are untouched, so the store reads as before
// (a class's notes, and a class nothing names, go with the table).
// A frozen snapshot: no imports of the live schema or repositories.

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- a migration sees the tables as they are at this step
type AnyTrx = Transaction<any>;

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const { text, integer } = columnTypes(trx);
    await trx.schema
      .createTable('classes')
      .addColumn('id', text, (c) => c.primaryKey())
      .addColumn('version', integer, (c) => c.notNull().defaultTo(1))
      .addColumn('archivedAt', text)
      .addColumn('notes', text, (c) => c.notNull().defaultTo(''))
      .addColumn('createdAt', text, (c) => c.notNull())
      .addColumn('updatedAt', text, (c) => c.notNull())
      .addColumn('name', text, (c) => c.notNull())
      .execute();
    // One record per name: vehicles and limits find their class by it.
    await trx.schema.createIndex('classesNameIdx').on('classes').column('name').unique().execute();

    const t = trx as AnyTrx;
    const fromVehicles = (await t.selectFrom('vehicles').select('className').distinct().where('className', '<>', '').execute()) as { className: string }[];
    const fromRules = (await t.selectFrom('classRules').select('className').distinct().where('className', '<>', '').execute()) as { className: string }[];
    const names = [...new Set([...fromVehicles, ...fromRules].map((r) => r.className))].sort();
    const at = new Date().toISOString();
    for (let i = 0; i < names.length; i++) {
      await t
        .insertInto('classes')
        .values({ id: `cls-${String(i + 1).padStart(3, '0')}`, version: 1, archivedAt: null, notes: '', createdAt: at, updatedAt: at, name: names[i] })
        .execute();
    }
  });
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    await trx.schema.dropTable('classes').execute();
  });
}
