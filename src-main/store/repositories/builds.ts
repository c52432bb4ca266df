import type { Build, Supply, Arrangement } from '../../core/domain';
import { chunks, type DbHandle } from '../db-handle';
import type { BuildRow, BuildTable } from '../schema';
import { byIds, selectorCondition, type BuildSelector } from '../build-selector';

export type BuildFields = Omit<Build, 'id' | 'version' | 'archivedAt'>;

/** The build columns the evaluation reads; a re-check of thousands of builds skips the rest. */
const EVALUATION_COLUMNS = [
  'builds.id',
  'builds.vehicleId',
  'builds.motorId',
  'builds.motorCount',
  'builds.controllerId',
  'builds.propellerId',
  'builds.pinionTeeth',
  'builds.spurTeeth',
  'builds.internalRatio',
  'builds.tireDiameterMm',
  'builds.drivetrainEfficiency',
  'builds.measuredPeakCurrentA',
  'builds.measuredAverageCurrentA',
  'builds.measuredSupplyId',
  'builds.runLengthS',
  'builds.fieldAltitudeM',
  'builds.airTemperatureC',
  'builds.depthOfDischarge',
  'builds.becLoadA',
  'builds.tightThreshold',
] as const;

type EvaluationRow = Pick<BuildRow, (typeof EVALUATION_COLUMNS)[number] extends `builds.${infer C extends keyof BuildRow}` ? C : never>;
type BuildMeta = Pick<BuildRow, 'version' | 'archivedAt' | 'notes' | 'name'>;

/** What a build read for evaluation only carries in place of its name, notes and bookkeeping. */
const NO_META: BuildMeta = { version: 0, archivedAt: null, notes: '', name: '' };

/** `meta` is the row itself for a full record, NO_META for one read for evaluation. */
function rowToBuild(row: EvaluationRow, supplies: Supply[], meta: BuildMeta): Build {
  return {
    id: row.id,
    version: meta.version,
    archivedAt: meta.archivedAt,
    notes: meta.notes,
    name: meta.name,
    vehicleId: row.vehicleId,
    motorId: row.motorId,
    motorCount: row.motorCount,
    controllerId: row.controllerId,
    propellerId: row.propellerId,
    gearing: {
      pinionTeeth: row.pinionTeeth,
      spurTeeth: row.spurTeeth,
      internalRatio: row.internalRatio,
      tireDiameterMm: row.tireDiameterMm,
      drivetrainEfficiency: row.drivetrainEfficiency,
    },
    supplies,
    measuredPeakCurrentA: row.measuredPeakCurrentA,
    measuredAverageCurrentA: row.measuredAverageCurrentA,
    measuredSupplyId: row.measuredSupplyId,
    runLengthS: row.runLengthS,
    fieldAltitudeM: row.fieldAltitudeM,
    airTemperatureC: row.airTemperatureC,
    depthOfDischarge: row.depthOfDischarge,
    becLoadA: row.becLoadA,
    tightThreshold: row.tightThreshold,
  };
}

type BuildColumns = Omit<BuildTable, 'id' | 'version' | 'archivedAt' | 'createdAt' | 'updatedAt'>;

function buildToColumns(fields: Partial<BuildFields>): Partial<BuildColumns> {
  const { gearing, supplies: _supplies, ...rest } = fields;
  return { ...rest, ...(gearing ?? {}) };
}

/**
 * Reads the supplies of the selected builds with their packs, in their stored order: one query
 * (each supply's row repeated for each of its packs), folded by supply.
 */
export async function loadSupplies(db: DbHandle, selector: BuildSelector): Promise<Map<string, Supply[]>> {
  const rows = await db
    .selectFrom('builds')
    .innerJoin('supplies', 'supplies.buildId', 'builds.id')
    .leftJoin('supplyPacks', 'supplyPacks.supplyId', 'supplies.id')
    .select(['supplies.buildId', 'supplies.id as supplyId', 'supplies.arrangement', 'supplyPacks.batteryId'])
    .where((eb) => selectorCondition(db, eb, selector))
    .orderBy('supplies.buildId')
    .orderBy('supplies.position')
    .orderBy('supplyPacks.position')
    .execute();
  const byBuild = new Map<string, Supply[]>();
  let supply: Supply | undefined;
  for (const row of rows) {
    if (supply?.id !== row.supplyId) {
      supply = { id: row.supplyId, arrangement: row.arrangement as Arrangement, batteryIds: [] };
      const list = byBuild.get(row.buildId);
      if (list) list.push(supply);
      else byBuild.set(row.buildId, [supply]);
    }
    if (row.batteryId !== null) supply.batteryIds.push(row.batteryId);
  }
  return byBuild;
}

/** The selected builds with their supplies; one query per table however many there are. */
export async function loadBuilds(db: DbHandle, selector: BuildSelector): Promise<Build[]> {
  const supplies = await loadSupplies(db, selector);
  const rows = await db
    .selectFrom('builds')
    .selectAll()
    .where((eb) => selectorCondition(db, eb, selector))
    .orderBy('id')
    .execute();
  return rows.map((row) => rowToBuild(row, supplies.get(row.id) ?? [], row));
}

/**
 * The selected builds as the evaluation needs them: the builds' evaluation columns, with their
 * supplies read apart (loadSupplies). Name, notes and bookkeeping are left empty: for the
 * re-check and the sheet's verdict only, never for showing or saving a record. Not one join of
 * builds, supplies and packs: a joined row repeats the build's twenty columns for every pack,
 * and making those row objects was most of a 10 000-build re-check's reading time.
 */
export async function loadBuildsForEvaluation(db: DbHandle, selector: BuildSelector): Promise<Build[]> {
  const supplies = await loadSupplies(db, selector);
  const rows = await db
    .selectFrom('builds')
    .select(EVALUATION_COLUMNS)
    .where((eb) => selectorCondition(db, eb, selector))
    .orderBy('builds.id')
    .execute();
  return rows.map((row) => rowToBuild(row, supplies.get(row.id) ?? [], NO_META));
}

export async function getBuilds(db: DbHandle, ids: readonly string[]): Promise<Build[]> {
  const out: Build[] = [];
  for (const part of chunks([...new Set(ids)])) out.push(...(await loadBuilds(db, byIds(part))));
  return out;
}

export async function getBuild(db: DbHandle, id: string): Promise<Build | undefined> {
  return (await getBuilds(db, [id]))[0];
}

async function writeSupplies(db: DbHandle, buildId: string, supplies: readonly Supply[]): Promise<void> {
  await db.deleteFrom('supplies').where('buildId', '=', buildId).execute();
  if (supplies.length === 0) return;
  await db
    .insertInto('supplies')
    .values(supplies.map((s, position) => ({ id: s.id, buildId, position, arrangement: s.arrangement })))
    .execute();
  const packs = supplies.flatMap((s) => s.batteryIds.map((batteryId, position) => ({ supplyId: s.id, position, batteryId })));
  if (packs.length > 0) await db.insertInto('supplyPacks').values(packs).execute();
}

export async function insertBuild(db: DbHandle, id: string, fields: BuildFields, now: string): Promise<void> {
  await db
    .insertInto('builds')
    .values({ ...(buildToColumns(fields) as BuildColumns), id, version: 1, archivedAt: null, createdAt: now, updatedAt: now })
    .execute();
  await writeSupplies(db, id, fields.supplies);
}

/** Writes only at the version the caller read; 0 means a conflict or a missing build. */
export async function updateBuildAtVersion(db: DbHandle, id: string, expectedVersion: number, patch: Partial<BuildFields> & { archivedAt?: string | null }, now: string): Promise<number> {
  const result = await db
    .updateTable('builds')
    .set({ ...buildToColumns(patch), updatedAt: now })
    .set((eb) => ({ version: eb('version', '+', 1) }))
    .where('id', '=', id)
    .where('version', '=', expectedVersion)
    .executeTakeFirst();
  const written = Number(result.numUpdatedRows);
  if (written > 0 && patch.supplies) await writeSupplies(db, id, patch.supplies);
  return written;
}
