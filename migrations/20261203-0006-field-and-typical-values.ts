import type { Kysely } from 'kysely';
import { columnTypes } from './support/column-types';

// Inputs of the wider checks: a build's field altitude, air temperature and depth of
// discharge; a vehicle's surface and whether its typical values were confirmed; a motor's rated
// heat loss; a controller's electrical rpm limit and minimum input voltage; a pack's lead wire
// gauge and connector rating. Every column but the confirmation is nullable, null reading as the
// stated default; the confirmation is 0 (not confirmed), so stores written before this step keep
// their verdicts on the strict side. A frozen snapshot; the body runs in a transaction of its own.

const COLUMNS = [
  ['builds', 'fieldAltitudeM', 'real'],
  ['builds', 'airTemperatureC', 'real'],
  ['builds', 'depthOfDischarge', 'real'],
  ['vehicles', 'surface', 'text'],
  ['motors', 'maxLossW', 'real'],
  ['controllers', 'maxErpm', 'real'],
  ['controllers', 'minVoltageV', 'real'],
  ['batteries', 'wireGaugeAwg', 'integer'],
  ['batteries', 'connectorRatingA', 'real'],
] as const;

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const types = columnTypes(trx);
    for (const [table, column, type] of COLUMNS) await trx.schema.alterTable(table).addColumn(column, types[type]).execute();
    await trx.schema
      .alterTable('vehicles')
      .addColumn('typicalValuesConfirmed', types.integer, (c) => c.notNull().defaultTo(0))
      .execute();
  });
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    await trx.schema.alterTable('vehicles').dropColumn('typicalValuesConfirmed').execute();
    for (const [table, column] of [...COLUMNS].reverse()) await trx.schema.alterTable(table).dropColumn(column).execute();
  });
}
