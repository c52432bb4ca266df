import type { Kysely } from 'kysely';
import { columnTypes } from './support/column-types';

// A pack's dated log (charges, runs, storage, resistance measurements, inspections) and the
// telemetry logs attached to a build's supply. Both are records of what happened, kept apart
// from the part and build records they refer to: an entry is added or removed, never edited.
// A frozen snapshot: no imports of the live schema.

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const { real, text, integer } = columnTypes(trx);
    await trx.schema
      .createTable('packEvents')
      .addColumn('id', text, (c) => c.primaryKey())
      .addColumn('batteryId', text, (c) => c.notNull().references('batteries.id'))
      // The date (and time, where given) the entry is about, as typed: YYYY-MM-DD or an ISO time.
      .addColumn('at', text, (c) => c.notNull())
      .addColumn('kind', text, (c) => c.notNull())
      .addColumn('mah', real)
      .addColumn('voltagePerCellV', real)
      // JSON list of per-cell readings in ohms, one per series cell lead.
      .addColumn('cellResistancesOhm', text)
      .addColumn('temperatureC', real)
      .addColumn('capacityCheck', integer, (c) => c.notNull().defaultTo(0))
      .addColumn('puffed', integer, (c) => c.notNull().defaultTo(0))
      .addColumn('damaged', integer, (c) => c.notNull().defaultTo(0))
      .addColumn('note', text, (c) => c.notNull().defaultTo(''))
      .addColumn('createdAt', text, (c) => c.notNull())
      .execute();
    await trx.schema.createIndex('packEventsBatteryIdx').on('packEvents').columns(['batteryId', 'at', 'id']).execute();

    await trx.schema
      .createTable('runLogs')
      .addColumn('id', text, (c) => c.primaryKey())
      .addColumn('buildId', text, (c) => c.notNull().references('builds.id'))
      .addColumn('supplyId', text, (c) => c.notNull())
      .addColumn('name', text, (c) => c.notNull())
      .addColumn('recordedAt', text, (c) => c.notNull().defaultTo(''))
      .addColumn('importedAt', text, (c) => c.notNull())
      .addColumn('sampleCount', integer, (c) => c.notNull())
      .addColumn('durationS', real)
      .addColumn('peakCurrentA', real)
      .addColumn('averageCurrentA', real)
      .addColumn('rmsCurrentA', real)
      .addColumn('minVoltageV', real)
      .addColumn('maxTemperatureC', real)
      .addColumn('usedMah', real)
      // JSON: the kept (thinned) samples, column by column, and the column mapping used.
      .addColumn('samples', text, (c) => c.notNull())
      .addColumn('mapping', text, (c) => c.notNull())
      .addColumn('note', text, (c) => c.notNull().defaultTo(''))
      .execute();
    await trx.schema.createIndex('runLogsBuildIdx').on('runLogs').columns(['buildId', 'importedAt', 'id']).execute();
  });
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    await trx.schema.dropTable('runLogs').execute();
    await trx.schema.dropTable('packEvents').execute();
  });
}
