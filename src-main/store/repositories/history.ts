import type { Status } from '../../core/domain';
import { chunks, type DbHandle } from '../db-handle';
import { selectedBuildIds, selectsNothing, type BuildSelector } from '../build-selector';

export interface VerdictChange {
  buildId: string;
  /** Null for the build's overall status. */
  supplyId: string | null;
  from: Status | null;
  to: Status;
}

export interface HistoryEntryInput {
  at: string;
  actor: string;
  action: string;
  entityKind: string;
  entityId: string;
  summary: string;
  reason: string;
  before: unknown;
  after: unknown;
  verdictChanges: VerdictChange[];
  /** Builds this write re-checked, so their timelines show it. */
  builds: BuildSelector;
}

/** An entry as read back: its id instead of the builds it linked. */
export type HistoryEntry = Omit<HistoryEntryInput, 'builds'> & { id: number };

export async function appendHistory(db: DbHandle, entry: HistoryEntryInput): Promise<number> {
  const inserted = await db
    .insertInto('history')
    .values({
      at: entry.at,
      actor: entry.actor,
      action: entry.action,
      entityKind: entry.entityKind,
      entityId: entry.entityId,
      summary: entry.summary,
      reason: entry.reason,
      before: entry.before === null || entry.before === undefined ? null : JSON.stringify(entry.before),
      after: entry.after === null || entry.after === undefined ? null : JSON.stringify(entry.after),
      verdictChanges: JSON.stringify(entry.verdictChanges),
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  // better-sqlite3 may hand back a BigInt row id.
  const historyId = Number(inserted.id);
  if (!selectsNothing(entry.builds)) {
    // One INSERT … SELECT links the entry to every re-checked build, however many there are.
    await db
      .insertInto('historyBuilds')
      .columns(['historyId', 'buildId'])
      .expression(selectedBuildIds(db, entry.builds).clearSelect().select((eb) => [eb.val(historyId).as('historyId'), 'builds.id as buildId']))
      .execute();
  }
  return historyId;
}

export interface HistoryQuery {
  entityKind?: string;
  entityId?: string;
  /** Every entry that touched this build, its own edits and its parts'. */
  buildId?: string;
  /** Entries older than this id, for paging back. */
  beforeId?: number;
  limit: number;
}

export async function listHistory(db: DbHandle, q: HistoryQuery): Promise<HistoryEntry[]> {
  let query = db.selectFrom('history').selectAll('history').orderBy('history.id', 'desc').limit(q.limit);
  if (q.buildId !== undefined) {
    const buildId = q.buildId;
    query = query.where((eb) =>
      eb.or([
        eb.and([eb('history.entityKind', '=', 'builds'), eb('history.entityId', '=', buildId)]),
        eb('history.id', 'in', eb.selectFrom('historyBuilds').select('historyId').where('historyBuilds.buildId', '=', buildId)),
      ]),
    );
  }
  if (q.entityKind !== undefined) query = query.where('history.entityKind', '=', q.entityKind);
  if (q.entityId !== undefined) query = query.where('history.entityId', '=', q.entityId);
  if (q.beforeId !== undefined) query = query.where('history.id', '<', q.beforeId);
  const rows = await query.execute();
  return rows.map((r) => ({
    id: Number(r.id),
    at: r.at,
    actor: r.actor,
    action: r.action,
    entityKind: r.entityKind,
    entityId: r.entityId,
    summary: r.summary,
    reason: r.reason,
    before: r.before === null ? null : (JSON.parse(r.before) as unknown),
    after: r.after === null ? null : (JSON.parse(r.after) as unknown),
    verdictChanges: JSON.parse(r.verdictChanges) as VerdictChange[],
  }));
}

/** How many of an entry's re-checked builds are named: as many as a timeline shows. */
export const NAMED_BUILDS_PER_ENTRY = 200;

/**
 * The names of the builds an entry speaks of (its own build, and the builds whose verdicts it
 * changed, up to NAMED_BUILDS_PER_ENTRY), archived builds included, so a timeline never shows
 * a bare id for a build that still exists.
 */
export async function buildNamesFor(db: DbHandle, entries: readonly HistoryEntry[]): Promise<Map<string, string>> {
  const ids = new Set<string>();
  for (const e of entries) {
    if (e.entityKind === 'builds') ids.add(e.entityId);
    let named = 0;
    for (const c of e.verdictChanges) {
      if (named >= NAMED_BUILDS_PER_ENTRY) break;
      if (!ids.has(c.buildId)) named += 1;
      ids.add(c.buildId);
    }
  }
  const out = new Map<string, string>();
  for (const part of chunks([...ids], 500)) {
    const rows = await db.selectFrom('builds').select(['id', 'name']).where('id', 'in', part).execute();
    for (const r of rows) out.set(r.id, r.name);
  }
  return out;
}
