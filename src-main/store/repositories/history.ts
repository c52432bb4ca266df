import type { Status } from '../../core/domain';
import { chunks, type DbHandle } from '../db-handle';
import type { Expression, ExpressionBuilder, Insertable, SqlBool } from 'kysely';
import type { BuildSelector } from '../build-selector';
import type { Db, HistorySelectorTable } from '../schema';

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

type SelectorRow = Omit<Insertable<HistorySelectorTable>, 'historyId'>;

/**
 * Splits a selector into what is stored as a rule (part, class, all) and what is stored as
 * named builds (ids). Rules cost one row whatever the number of builds they name.
 */
export function flattenSelector(selector: BuildSelector, rules: SelectorRow[] = [], ids: Set<string> = new Set()): { rules: SelectorRow[]; ids: Set<string> } {
  switch (selector.by) {
    case 'ids':
      for (const id of selector.ids) ids.add(id);
      break;
    case 'part':
      rules.push({ selects: 'part', partKind: selector.kind, target: selector.id });
      break;
    case 'class':
      rules.push({ selects: 'class', partKind: '', target: selector.className });
      break;
    case 'all':
      rules.push({ selects: 'all', partKind: '', target: '' });
      break;
    case 'any':
      for (const s of selector.of) flattenSelector(s, rules, ids);
      break;
  }
  return { rules, ids };
}

// 2 columns a row: well under SQLite's bound-parameter limit.
const LINKS_PER_INSERT = 5000;

/**
 * Appends the entry. What the store keeps of the re-checked builds: the selector that named
 * them, plus one link per build whose verdict changed (so the timeline of a build that later
 * leaves the part still shows the edit that changed it). An edit of a part shared by 10 000
 * builds that changes no verdict therefore writes one entry and one selector row.
 */
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
  const { rules, ids } = flattenSelector(entry.builds);
  for (const change of entry.verdictChanges) ids.add(change.buildId);
  if (rules.length > 0) {
    await db
      .insertInto('historySelectors')
      .values(rules.map((r) => ({ ...r, historyId })))
      .execute();
  }
  for (const part of chunks([...ids], LINKS_PER_INSERT)) {
    await db
      .insertInto('historyBuilds')
      .values(part.map((buildId) => ({ historyId, buildId })))
      .execute();
  }
  return historyId;
}

/** What a build is made of now: the keys its timeline matches selector rows against. */
async function buildKeys(db: DbHandle, buildId: string) {
  const build = await db
    .selectFrom('builds')
    .leftJoin('vehicles', 'vehicles.id', 'builds.vehicleId')
    .select(['builds.vehicleId', 'builds.motorId', 'builds.controllerId', 'builds.propellerId', 'builds.createdAt', 'vehicles.className'])
    .where('builds.id', '=', buildId)
    .executeTakeFirst();
  if (build === undefined) return null;
  const packs = await db.selectFrom('supplyPacks').innerJoin('supplies', 'supplies.id', 'supplyPacks.supplyId').select('supplyPacks.batteryId').distinct().where('supplies.buildId', '=', buildId).execute();
  return { ...build, batteryIds: packs.map((p) => p.batteryId) };
}

/** A selector row that names a build made of these parts. */
function selectorMatches(eb: ExpressionBuilder<Db, 'historySelectors'>, keys: NonNullable<Awaited<ReturnType<typeof buildKeys>>>): Expression<SqlBool> {
  const part = (kind: string, ids: readonly (string | null)[]) => {
    const present = ids.filter((id): id is string => id !== null);
    if (present.length === 0) return [];
    return [eb.and([eb('historySelectors.selects', '=', 'part'), eb('historySelectors.partKind', '=', kind), eb('historySelectors.target', 'in', present)])];
  };
  return eb.or([
    eb('historySelectors.selects', '=', 'all'),
    ...part('vehicles', [keys.vehicleId]),
    ...part('motors', [keys.motorId]),
    ...part('controllers', [keys.controllerId]),
    ...part('propellers', [keys.propellerId]),
    ...part('batteries', keys.batteryIds),
    ...(keys.className === null || keys.className === '' ? [] : [eb.and([eb('historySelectors.selects', '=', 'class'), eb('historySelectors.target', '=', keys.className)])]),
  ]);
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
    const keys = await buildKeys(db, buildId);
    query = query.where((eb) => {
      const own = [eb.and([eb('history.entityKind', '=', 'builds'), eb('history.entityId', '=', buildId)]), eb('history.id', 'in', eb.selectFrom('historyBuilds').select('historyId').where('historyBuilds.buildId', '=', buildId))];
      if (keys === null) return eb.or(own);
      // Selector rows are resolved against what the build is made of now, and only for entries
      // written since the build was added (a fleet-wide re-check before it existed is not its).
      return eb.or([
        ...own,
        eb.and([
          eb('history.at', '>=', keys.createdAt),
          eb(
            'history.id',
            'in',
            eb
              .selectFrom('historySelectors')
              .select('historySelectors.historyId')
              .where((hs) => selectorMatches(hs, keys)),
          ),
        ]),
      ]);
    });
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
