import type { DbHandle } from '../db-handle';

/** The part tables builds are made of. */
export type InventoryTable = 'batteries' | 'motors' | 'controllers' | 'propellers' | 'vehicles';

export interface PartUsage {
  /** Builds in use (not archived) that use the part. */
  buildCount: number;
  /**
   * The newest log touching the part; null when none: a measured current entered on one of those
   * builds (from the history), a run log imported onto one of them, or, for a pack, its own
   * newest pack log entry.
   */
  lastLogAt: string | null;
  /** Charges in a pack's log (each a cycle on top of the hand-set count); 0 for other parts. */
  loggedCharges: number;
}

const later = (a: string | null, b: string | null | undefined): string | null => (b == null ? a : a === null || b > a ? b : a);

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

/** How many builds use each part of the table, and when one of them (or a pack itself) was last logged. */
export async function partUsage(db: DbHandle, table: InventoryTable): Promise<Record<string, PartUsage>> {
  const links = await partsByBuild(db, table);
  const logs = await lastLogByBuild(db);
  for (const r of await db.selectFrom('runLogs').select(['buildId', 'importedAt']).execute()) logs.set(r.buildId, later(logs.get(r.buildId) ?? null, r.importedAt)!);
  const builds = new Map<string, Set<string>>();
  const out: Record<string, PartUsage> = {};
  for (const { buildId, partId } of links) {
    const set = builds.get(partId) ?? new Set<string>();
    set.add(buildId);
    builds.set(partId, set);
  }
  for (const [partId, set] of builds) {
    let last: string | null = null;
    for (const id of set) last = later(last, logs.get(id));
    out[partId] = { buildCount: set.size, lastLogAt: last, loggedCharges: 0 };
  }
  if (table === 'batteries') {
    for (const e of await db.selectFrom('packEvents').select(['batteryId', 'kind', 'at']).execute()) {
      const usage = (out[e.batteryId] ??= { buildCount: 0, lastLogAt: null, loggedCharges: 0 });
      usage.lastLogAt = later(usage.lastLogAt, e.at);
      if (e.kind === 'charge') usage.loggedCharges++;
    }
  }
  return out;
}
