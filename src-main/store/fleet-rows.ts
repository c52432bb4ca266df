// Bulk reads and writes for whole-fleet imports: many rows per statement, so a 10 000-build
// file is written in a few hundred statements inside the import's one transaction. Built with
// Kysely's builder like every repository, so it stays portable.

import type { Build } from '../core/domain';
import { chunks, type DbHandle } from './db-handle';
import type { PartTableName } from './schema';
import { fieldsToColumns, type PartRecords } from './repositories/part-records';

type AnyTable = 'batteries';

/** Stays under SQLite's 32 766 bound parameters per statement, whatever the column count. */
function rowsPerStatement(columns: number): number {
  return Math.max(1, Math.min(1000, Math.floor(30_000 / Math.max(1, columns))));
}

export interface StoredFleetIds {
  batteries: Set<string>;
  motors: Set<string>;
  controllers: Set<string>;
  propellers: Set<string>;
  customers: Set<string>;
  vehicles: Set<string>;
  classes: Set<string>;
  classRules: Set<string>;
  builds: Set<string>;
  /** Supply id → the build holding it. */
  supplyOwners: Map<string, string>;
}

/** Every id the store holds, archived records included: what a merge is checked against. */
export async function readFleetIds(db: DbHandle): Promise<StoredFleetIds> {
  const ids = async (table: PartTableName | 'builds') =>
    new Set(
      (
        await db
          .selectFrom(table as AnyTable)
          .select('id')
          .execute()
      ).map((r) => r.id),
    );
  const supplies = await db.selectFrom('supplies').select(['id', 'buildId']).execute();
  return {
    batteries: await ids('batteries'),
    motors: await ids('motors'),
    controllers: await ids('controllers'),
    propellers: await ids('propellers'),
    customers: await ids('customers'),
    vehicles: await ids('vehicles'),
    classes: await ids('classes'),
    classRules: await ids('classRules'),
    builds: await ids('builds'),
    supplyOwners: new Map(supplies.map((s) => [s.id, s.buildId])),
  };
}

/** Tables a replace empties, children first. History and settings stay: the history records the replace. */
const FLEET_TABLES_CHILD_FIRST = [
  'runLogs',
  'packEvents',
  'verdicts',
  'supplyPacks',
  'supplies',
  'builds',
  'classRules',
  'classes',
  'workOrderSteps',
  'workOrders',
  'vehicles',
  'customers',
  'propellers',
  'controllers',
  'motors',
  'batteries',
] as const;

export type ClearedCounts = Record<PartTableName | 'builds' | 'workOrders', number>;

export async function clearFleetTables(db: DbHandle): Promise<ClearedCounts> {
  const counts = { batteries: 0, motors: 0, controllers: 0, propellers: 0, customers: 0, vehicles: 0, classes: 0, classRules: 0, builds: 0, workOrders: 0 };
  for (const table of FLEET_TABLES_CHILD_FIRST) {
    const result = await db.deleteFrom(table).executeTakeFirst();
    if (table in counts) counts[table as keyof typeof counts] = Number(result.numDeletedRows);
  }
  return counts;
}

/** Inserts whole records, keeping their id, version and archivedAt as given. */
export async function insertPartRows<T extends PartTableName>(db: DbHandle, table: T, records: readonly PartRecords[T][], now: string, onRow?: (n: number) => void): Promise<void> {
  if (records.length === 0) return;
  const rows = records.map((r) => ({ ...fieldsToColumns(table, r), createdAt: now, updatedAt: now }));
  const columns = Object.keys(rows[0] ?? {}).length;
  let done = 0;
  for (const part of chunks(rows, rowsPerStatement(columns))) {
    await db
      .insertInto(table as AnyTable)
      .values(part as never)
      .execute();
    done += part.length;
    onRow?.(done);
  }
}

function buildColumns(b: Build): Record<string, unknown> {
  return {
    id: b.id,
    version: b.version,
    archivedAt: b.archivedAt,
    notes: b.notes,
    name: b.name,
    vehicleId: b.vehicleId,
    motorId: b.motorId,
    motorCount: b.motorCount,
    controllerId: b.controllerId,
    propellerId: b.propellerId,
    pinionTeeth: b.gearing.pinionTeeth,
    spurTeeth: b.gearing.spurTeeth,
    internalRatio: b.gearing.internalRatio,
    tireDiameterMm: b.gearing.tireDiameterMm,
    drivetrainEfficiency: b.gearing.drivetrainEfficiency,
    measuredPeakCurrentA: b.measuredPeakCurrentA,
    measuredAverageCurrentA: b.measuredAverageCurrentA,
    measuredSupplyId: b.measuredSupplyId ?? null,
    runLengthS: b.runLengthS ?? null,
    fieldAltitudeM: b.fieldAltitudeM ?? null,
    airTemperatureC: b.airTemperatureC ?? null,
    depthOfDischarge: b.depthOfDischarge ?? null,
    becLoadA: b.becLoadA ?? null,
    tightThreshold: b.tightThreshold,
  };
}

/** Inserts whole builds with their supplies. */
export async function insertBuildRows(db: DbHandle, builds: readonly Build[], now: string, onRow?: (n: number) => void): Promise<void> {
  if (builds.length === 0) return;
  const rows = builds.map((b) => ({ ...buildColumns(b), createdAt: now, updatedAt: now }));
  const size = rowsPerStatement(Object.keys(rows[0] ?? {}).length);
  let done = 0;
  for (const part of chunks(rows, size)) {
    await db
      .insertInto('builds')
      .values(part as never)
      .execute();
    done += part.length;
    onRow?.(done);
  }
  await insertSupplyRows(db, builds);
}

/** Writes the supplies of builds whose old supplies are already gone. */
export async function insertSupplyRows(db: DbHandle, builds: readonly Build[]): Promise<void> {
  const supplies = builds.flatMap((b) => b.supplies.map((s, position) => ({ id: s.id, buildId: b.id, position, arrangement: s.arrangement })));
  for (const part of chunks(supplies, rowsPerStatement(4))) await db.insertInto('supplies').values(part).execute();
  const packs = builds.flatMap((b) => b.supplies.flatMap((s) => s.batteryIds.map((batteryId, position) => ({ supplyId: s.id, position, batteryId }))));
  for (const part of chunks(packs, rowsPerStatement(3))) await db.insertInto('supplyPacks').values(part).execute();
}

/** Removes the supplies of builds about to be rewritten (their pack lists go with them). */
export async function deleteSuppliesOf(db: DbHandle, buildIds: readonly string[]): Promise<void> {
  for (const part of chunks(buildIds)) {
    await db
      .deleteFrom('supplyPacks')
      .where('supplyId', 'in', db.selectFrom('supplies').select('id').where('buildId', 'in', part))
      .execute();
    await db.deleteFrom('supplies').where('buildId', 'in', part).execute();
  }
}

export interface PartsInUse {
  batteries: readonly string[];
  motors: readonly string[];
  controllers: readonly string[];
  propellers: readonly string[];
  vehicles: readonly string[];
}

/** Builds (archived or not) that use any of the parts, or belong to a vehicle in any of the classes. */
export async function buildIdsUsingAny(db: DbHandle, parts: PartsInUse, classNames: readonly string[]): Promise<string[]> {
  const out = new Set<string>();
  for (const part of chunks(parts.batteries)) {
    const rows = await db.selectFrom('supplyPacks').innerJoin('supplies', 'supplies.id', 'supplyPacks.supplyId').select('supplies.buildId').distinct().where('supplyPacks.batteryId', 'in', part).execute();
    for (const r of rows) out.add(r.buildId);
  }
  const columns = [
    ['motorId', parts.motors],
    ['controllerId', parts.controllers],
    ['propellerId', parts.propellers],
    ['vehicleId', parts.vehicles],
  ] as const;
  for (const [column, ids] of columns) {
    for (const part of chunks(ids)) {
      const rows = await db.selectFrom('builds').select('id').where(column, 'in', part).execute();
      for (const r of rows) out.add(r.id);
    }
  }
  for (const part of chunks(classNames)) {
    const rows = await db.selectFrom('builds').innerJoin('vehicles', 'vehicles.id', 'builds.vehicleId').select('builds.id').where('vehicles.className', 'in', part).execute();
    for (const r of rows) out.add(r.id);
  }
  return [...out];
}
