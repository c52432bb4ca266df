import type { DbHandle } from '../db-handle';

/** The part tables builds are made of. */
export type InventoryTable = 'batteries' | 'motors' | 'controllers' | 'propellers' | 'vehicles';

export interface PartUsage {
  /** Builds in use (not archived) that use the part. */
  buildCount: number;
  /** When a logged current was last recorded on one of those builds (from the history); null when never. */
  lastLogAt: string | null;
}

const COLUMN = { motors: 'motorId', controllers: 'controllerId', propellers: 'propellerId', vehicles: 'vehicleId' } as const;

/** Build id → the parts of this table it uses, for the builds in use. */
async function partsByBuild(db: DbHandle, table: InventoryTable): Promise<{ buildId: string; partId: string }[]> {
  if (table === 'batteries') {
    return db
      .selectFrom('supplyPacks')
      .innerJoin('supplies', 'supplies.id', 'supplyPacks.supplyId')
      .innerJoin('builds', 'builds.id', 'supplies.buildId')
      .select(['supplies.buildId as buildId', 'supplyPacks.batteryId as partId'])
      .where('builds.archivedAt', 'is', null)
      .execute();
  }
  const rows = await db
    .selectFrom('builds')
    .select(['builds.id as buildId', `builds.${COLUMN[table]} as partId`])
    .where('builds.archivedAt', 'is', null)
    .execute();
  return rows.filter((r): r is { buildId: string; partId: string } => r.partId !== null);
}

const MEASURED = ['measuredPeakCurrentA', 'measuredAverageCurrentA'] as const;

function measuredOf(json: string | null): string {
  if (json === null) return '';
  try {
    const record = JSON.parse(json) as Record<string, unknown>;
    return MEASURED.map((k) => (typeof record[k] === 'number' ? String(record[k]) : '')).join('|');
  } catch {
    return '';
  }
}

/**
 * The last time each build had a logged current entered or changed, read from its history:
 * an entry whose record after the write carries a measured current that differs from before.
 * Builds brought in by a fleet import have no entry of their own, so they have no date here.
 */
async function lastLogByBuild(db: DbHandle): Promise<Map<string, string>> {
  const rows = await db.selectFrom('history').select(['entityId', 'at', 'before', 'after']).where('entityKind', '=', 'builds').where('after', 'like', '%"measured%CurrentA":%').orderBy('id').execute();
  const out = new Map<string, string>();
  for (const r of rows) {
    const after = measuredOf(r.after);
    if (after === '' || after === '|' || after === measuredOf(r.before)) continue;
    const seen = out.get(r.entityId);
    if (seen === undefined || r.at > seen) out.set(r.entityId, r.at);
  }
  return out;
}

/** How many builds use each part of the table, and when one of them last had a logged current. */
export async function partUsage(db: DbHandle, table: InventoryTable): Promise<Record<string, PartUsage>> {
  const links = await partsByBuild(db, table);
  const logs = await lastLogByBuild(db);
  const builds = new Map<string, Set<string>>();
  const out: Record<string, PartUsage> = {};
  for (const { buildId, partId } of links) {
    const set = builds.get(partId) ?? new Set<string>();
    set.add(buildId);
    builds.set(partId, set);
  }
  for (const [partId, set] of builds) {
    let last: string | null = null;
    for (const id of set) {
      const at = logs.get(id);
      if (at !== undefined && (last === null || at > last)) last = at;
    }
    out[partId] = { buildCount: set.size, lastLogAt: last };
  }
  return out;
}
