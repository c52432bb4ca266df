import type { Kysely } from 'kysely';
import { columnTypes } from './support/column-types';

// Inputs the safe-side checks read: a propeller's maker rpm limit, a vehicle's drive layout,
// share of weight on the driven wheels and water type, a build's run length and the supply its
// measured currents were logged on. Every column is nullable: null reads as the stated default
// (the high-current side), so stores written before this migration keep their meaning.
// A frozen snapshot like every migration; the body runs in a transaction of its own.

const COLUMNS = [
  ['propellers', 'maxRpm', 'real'],
  ['vehicles', 'driveLayout', 'text'],
  ['vehicles', 'drivenWeightShare', 'real'],
  ['vehicles', 'water', 'text'],
  ['builds', 'runLengthS', 'real'],
  ['builds', 'measuredSupplyId', 'text'],
] as const;

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const types = columnTypes(trx);
    for (const [table, column, type] of COLUMNS) await trx.schema.alterTable(table).addColumn(column, types[type]).execute();
  });
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    for (const [table, column] of [...COLUMNS].reverse()) await trx.schema.alterTable(table).dropColumn(column).execute();
  });
}
