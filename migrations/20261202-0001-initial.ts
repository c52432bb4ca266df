import type { CreateTableBuilder, Kysely } from 'kysely';
import { columnTypes, type ColumnTypes } from './support/column-types';

// A migration is a frozen snapshot: it never imports the live schema types, so later changes
// to them cannot rewrite history. SQLite DDL is not transactional under Kysely's migrator,
// so the body runs in a transaction of its own.

type Table = CreateTableBuilder<string, never>;

function withMeta(t: Table, { text, integer }: ColumnTypes): Table {
  return t
    .addColumn('id', text, (c) => c.primaryKey())
    .addColumn('version', integer, (c) => c.notNull().defaultTo(1))
    .addColumn('archivedAt', text)
    .addColumn('notes', text, (c) => c.notNull().defaultTo(''))
    .addColumn('createdAt', text, (c) => c.notNull())
    .addColumn('updatedAt', text, (c) => c.notNull());
}

const TABLES_DOWN = ['historyBuilds', 'history', 'verdicts', 'supplyPacks', 'supplies', 'builds', 'classRules', 'vehicles', 'propellers', 'controllers', 'motors', 'batteries', 'settings'];

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const s = trx.schema;
    const types = columnTypes(trx);
    const { real, text, integer } = types;
    await withMeta(s.createTable('batteries'), types)
      .addColumn('name', text, (c) => c.notNull())
      .addColumn('chemistry', text, (c) => c.notNull())
      .addColumn('cellsSeries', integer, (c) => c.notNull())
      .addColumn('cellsParallel', integer, (c) => c.notNull().defaultTo(1))
      .addColumn('capacityMah', real, (c) => c.notNull())
      .addColumn('cRatingContinuous', real)
      .addColumn('cRatingBurst', real)
      .addColumn('cellResistanceOhm', real)
      .addColumn('massKg', real)
      .addColumn('cycleCount', integer, (c) => c.notNull().defaultTo(0))
      .addColumn('retired', integer, (c) => c.notNull().defaultTo(0))
      .execute();
    await withMeta(s.createTable('motors'), types)
      .addColumn('name', text, (c) => c.notNull())
      .addColumn('kv', real, (c) => c.notNull())
      .addColumn('resistanceOhm', real)
      .addColumn('noLoadCurrentA', real)
      .addColumn('maxCurrentA', real)
      .addColumn('maxPowerW', real)
      .addColumn('maxVoltageV', real)
      .addColumn('maxRpm', real)
      .addColumn('poles', integer)
      .addColumn('massKg', real)
      .execute();
    await withMeta(s.createTable('controllers'), types)
      .addColumn('name', text, (c) => c.notNull())
      .addColumn('maxVoltageV', real)
      .addColumn('maxCells', integer)
      .addColumn('continuousCurrentA', real)
      .addColumn('burstCurrentA', real)
      .addColumn('resistanceOhm', real)
      .addColumn('massKg', real)
      .execute();
    await withMeta(s.createTable('propellers'), types)
      .addColumn('name', text, (c) => c.notNull())
      .addColumn('diameterMm', real, (c) => c.notNull())
      .addColumn('pitchMm', real)
      .addColumn('blades', integer, (c) => c.notNull().defaultTo(2))
      .addColumn('thrustCoefficient', real)
      .addColumn('powerCoefficient', real)
      .execute();
    await withMeta(s.createTable('vehicles'), types)
      .addColumn('name', text, (c) => c.notNull())
      .addColumn('kind', text, (c) => c.notNull())
      .addColumn('massKg', real)
      .addColumn('dragAreaM2', real)
      .addColumn('rollingCoefficient', real)
      .addColumn('tractionCoefficient', real)
      .addColumn('owner', text, (c) => c.notNull().defaultTo(''))
      .addColumn('className', text, (c) => c.notNull().defaultTo(''))
      .execute();
    await withMeta(s.createTable('classRules'), types)
      .addColumn('className', text, (c) => c.notNull())
      .addColumn('ruleId', text, (c) => c.notNull())
      .addColumn('figure', text, (c) => c.notNull())
      .addColumn('limit', real, (c) => c.notNull())
      .addColumn('unit', text, (c) => c.notNull().defaultTo(''))
      .addColumn('tightThreshold', real)
      .execute();
    await withMeta(s.createTable('builds'), types)
      .addColumn('name', text, (c) => c.notNull())
      .addColumn('vehicleId', text, (c) => c.notNull().references('vehicles.id'))
      .addColumn('motorId', text, (c) => c.references('motors.id'))
      .addColumn('motorCount', integer, (c) => c.notNull().defaultTo(1))
      .addColumn('controllerId', text, (c) => c.references('controllers.id'))
      .addColumn('propellerId', text, (c) => c.references('propellers.id'))
      .addColumn('pinionTeeth', integer)
      .addColumn('spurTeeth', integer)
      .addColumn('internalRatio', real, (c) => c.notNull().defaultTo(1))
      .addColumn('tireDiameterMm', real)
      .addColumn('drivetrainEfficiency', real, (c) => c.notNull().defaultTo(0.9))
      .addColumn('measuredPeakCurrentA', real)
      .addColumn('measuredAverageCurrentA', real)
      .addColumn('tightThreshold', real)
      .execute();
    await s
      .createTable('supplies')
      .addColumn('id', text, (c) => c.primaryKey())
      .addColumn('buildId', text, (c) => c.notNull().references('builds.id').onDelete('cascade'))
      .addColumn('position', integer, (c) => c.notNull())
      .addColumn('arrangement', text, (c) => c.notNull())
      .execute();
    await s
      .createTable('supplyPacks')
      .addColumn('supplyId', text, (c) => c.notNull().references('supplies.id').onDelete('cascade'))
      .addColumn('position', integer, (c) => c.notNull())
      .addColumn('batteryId', text, (c) => c.notNull().references('batteries.id'))
      .addPrimaryKeyConstraint('supplyPacksPk', ['supplyId', 'position'])
      .execute();
    await s
      .createTable('verdicts')
      .addColumn('buildId', text, (c) => c.primaryKey().references('builds.id').onDelete('cascade'))
      .addColumn('status', text, (c) => c.notNull())
      .addColumn('supplyVoltageFullV', real)
      .addColumn('theoreticalSpeedKmh', real)
      .addColumn('peakCurrentA', real)
      .addColumn('peakCurrentLimitA', real)
      .addColumn('supplyStatuses', text, (c) => c.notNull())
      .addColumn('evaluatedAt', text, (c) => c.notNull())
      .execute();
    await s
      .createTable('history')
      .addColumn('id', integer, (c) => (types.postgres ? c.primaryKey().generatedByDefaultAsIdentity() : c.primaryKey().autoIncrement()))
      .addColumn('at', text, (c) => c.notNull())
      .addColumn('actor', text, (c) => c.notNull())
      .addColumn('action', text, (c) => c.notNull())
      .addColumn('entityKind', text, (c) => c.notNull())
      .addColumn('entityId', text, (c) => c.notNull())
      .addColumn('summary', text, (c) => c.notNull())
      .addColumn('reason', text, (c) => c.notNull().defaultTo(''))
      .addColumn('before', text)
      .addColumn('after', text)
      .addColumn('verdictChanges', text, (c) => c.notNull().defaultTo('[]'))
      .execute();
    await s
      .createTable('historyBuilds')
      .addColumn('historyId', integer, (c) => c.notNull().references('history.id').onDelete('cascade'))
      .addColumn('buildId', text, (c) => c.notNull())
      .addPrimaryKeyConstraint('historyBuildsPk', ['historyId', 'buildId'])
      .execute();
    await s
      .createTable('settings')
      .addColumn('key', text, (c) => c.primaryKey())
      .addColumn('value', text, (c) => c.notNull())
      .execute();

    // The part → builds index that makes a re-check touch only the builds that use a part.
    await s.createIndex('buildsVehicleIdx').on('builds').column('vehicleId').execute();
    await s.createIndex('buildsMotorIdx').on('builds').column('motorId').execute();
    await s.createIndex('buildsControllerIdx').on('builds').column('controllerId').execute();
    await s.createIndex('buildsPropellerIdx').on('builds').column('propellerId').execute();
    await s.createIndex('suppliesBuildIdx').on('supplies').columns(['buildId', 'position']).execute();
    await s.createIndex('supplyPacksBatteryIdx').on('supplyPacks').column('batteryId').execute();
    await s.createIndex('vehiclesClassIdx').on('vehicles').column('className').execute();
    await s.createIndex('classRulesClassIdx').on('classRules').column('className').execute();
    await s.createIndex('verdictsStatusIdx').on('verdicts').column('status').execute();
    await s.createIndex('historyEntityIdx').on('history').columns(['entityKind', 'entityId', 'id']).execute();
    await s.createIndex('historyBuildsBuildIdx').on('historyBuilds').columns(['buildId', 'historyId']).execute();
  });
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    for (const table of TABLES_DOWN) await trx.schema.dropTable(table).ifExists().execute();
  });
}
