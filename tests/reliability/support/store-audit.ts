import { sql } from 'kysely';
import { evaluateBuild } from '../../../src-main/core/evaluate';
import type { Build, BuildContext, BuildVerdict, Status } from '../../../src-main/core/domain';
import type { ServiceHost } from '../../../src-main/service/contract';
import type { ServiceContext } from '../../../src-main/service/service-context';
import { loadBuildContexts } from '../../../src-main/service/recheck';
import { loadBuilds } from '../../../src-main/store/repositories/builds';
import { flaggedChecks } from '../../helpers/flagged-checks';
import { canonical } from './random';

// Checks a store for the promises the write path makes: the file is sound, every record
// version has the history entry written with it, and every stored verdict is what a fresh
// evaluation of the stored records gives. Used after crashes and after fuzzing.

export const PART_KINDS = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles', 'classRules'] as const;
export const RECORD_KINDS = [...PART_KINDS, 'builds'] as const;
export type RecordKind = (typeof RECORD_KINDS)[number];

type Host = ServiceHost & { ctx: ServiceContext };

export interface HistoryRow {
  id: number;
  action: string;
  entityKind: string;
  entityId: string;
  actor: string;
  reason: string;
  before: unknown;
  after: unknown;
}

export interface StoredRecord {
  id: string;
  version: number;
  [field: string]: unknown;
}

export async function ok<T>(host: Pick<ServiceHost, 'call'>, name: string, args: unknown): Promise<T> {
  const result = await host.call(name, args);
  if (!result.ok) throw new Error(`${name} failed: ${result.error.kind}: ${result.error.message}`);
  return result.value as T;
}

/** PRAGMA integrity_check and foreign_key_check, through the host's own connection. */
export async function fileProblems(host: Host): Promise<string[]> {
  const integrity = await sql<{ integrity_check: string }>`pragma integrity_check`.execute(host.ctx.db);
  const problems = integrity.rows.map((r) => r.integrity_check).filter((r) => r !== 'ok');
  const keys = await sql<Record<string, unknown>>`pragma foreign_key_check`.execute(host.ctx.db);
  for (const row of keys.rows) problems.push(`foreign key: ${JSON.stringify(row)}`);
  return problems;
}

export async function readHistory(host: Host): Promise<HistoryRow[]> {
  const rows = await host.ctx.db.selectFrom('history').select(['id', 'action', 'entityKind', 'entityId', 'actor', 'reason', 'before', 'after']).orderBy('id').execute();
  return rows.map((r) => ({
    id: Number(r.id),
    action: r.action,
    entityKind: r.entityKind,
    entityId: r.entityId,
    actor: r.actor,
    reason: r.reason,
    before: r.before === null ? null : (JSON.parse(r.before) as unknown),
    after: r.after === null ? null : (JSON.parse(r.after) as unknown),
  }));
}

export interface StoredVerdict {
  status: Status;
  supplies: Array<{ supplyId: string; status: Status }>;
  /** The checks that are not clear, as stored (`rule=status` pairs by rule id). */
  rules: string;
}

export type StoreRecords = Record<RecordKind, StoredRecord[]> & { verdicts: Map<string, StoredVerdict>; contexts: BuildContext[] };

/**
 * Every record of every kind, archived or not: parts as the list handlers return them, builds
 * as the builds repository loads them, with the stored verdicts and the evaluation contexts.
 */
export async function readRecords(host: Host): Promise<StoreRecords> {
  const out = { verdicts: new Map() } as StoreRecords;
  for (const kind of PART_KINDS) out[kind] = await ok<StoredRecord[]>(host, `${kind}.list`, { includeArchived: true });
  const settings = await ok<{ tightThreshold: number }>(host, 'settings.get', {});
  out.contexts = await loadBuildContexts(host.ctx.db, { by: 'all' }, settings.tightThreshold);
  // The evaluation loads builds lean (no name, notes or version); records come whole from the repository `builds.get` reads.
  out.builds = (await loadBuilds(host.ctx.db, { by: 'all' })) as unknown as StoredRecord[];
  const rows = await host.ctx.db.selectFrom('verdicts').select(['buildId', 'status', 'supplyStatuses', 'ruleStatuses']).execute();
  for (const row of rows) {
    // Stored as `supplyId=status` pairs joined by commas (store/schema.ts).
    const supplies = row.supplyStatuses === '' ? [] : row.supplyStatuses.split(',').map((pair) => ({ supplyId: pair.slice(0, pair.lastIndexOf('=')), status: pair.slice(pair.lastIndexOf('=') + 1) as Status }));
    out.verdicts.set(row.buildId, { status: row.status as Status, supplies, rules: row.ruleStatuses });
  }
  return out;
}

export const versionKey = (kind: string, id: string, version: number): string => `${kind}:${id}:${version}`;

/** History entries by the record version they wrote. */
export function historyByVersion(history: readonly HistoryRow[]): Map<string, HistoryRow> {
  const out = new Map<string, HistoryRow>();
  for (const entry of history) {
    const after = entry.after as { version?: unknown } | null;
    if (after && typeof after.version === 'number') out.set(versionKey(entry.entityKind, entry.entityId, after.version), entry);
  }
  return out;
}

/**
 * Every version of every record has its history entry, the first one a create, and the
 * stored record is exactly the `after` of the entry for its version: a record row written
 * without its history (or the other way round) shows up here. A fleet import writes one
 * entry for all the records it touched, so a version with no entry of its own is accepted
 * only when an import was logged after the record's previous entry.
 */
export function historyChainProblems(records: Record<RecordKind, StoredRecord[]>, byVersion: ReadonlyMap<string, HistoryRow>, history: readonly HistoryRow[] = []): string[] {
  const problems: string[] = [];
  const imports = history.filter((h) => h.action === 'import').map((h) => h.id);
  const lastImport = imports.length === 0 ? 0 : Math.max(...imports);
  for (const kind of RECORD_KINDS) {
    for (const record of records[kind]) {
      let previous = 0;
      for (let v = 1; v <= record.version; v++) {
        const entry = byVersion.get(versionKey(kind, record.id, v));
        if (entry) {
          if (v === 1 && entry.action !== 'create' && entry.action !== 'import') problems.push(`${kind} ${record.id}: version 1 was written by "${entry.action}", not create`);
          previous = entry.id;
        } else if (lastImport <= previous) {
          problems.push(`${kind} ${record.id}: version ${v} has no history entry`);
        }
      }
      const last = byVersion.get(versionKey(kind, record.id, record.version));
      // A replace import writes records at the versions its file gives, over older entries.
      if (last && last.id > lastImport && canonical(last.after) !== canonical(record)) {
        problems.push(`${kind} ${record.id}: stored record differs from the history entry of its version ${record.version}`);
      }
    }
  }
  return problems;
}

export interface VerdictAudit {
  problems: string[];
  buildsEvaluated: number;
}

/** Every build's stored verdict (overall, per supply and per flagged check) against core evaluateBuild on the stored records. */
export function verdictProblems(records: StoreRecords): VerdictAudit {
  const problems: string[] = [];
  if (records.contexts.length !== records.verdicts.size) problems.push(`${records.contexts.length} builds, ${records.verdicts.size} stored verdicts`);
  for (const ctx of records.contexts) {
    const fresh: BuildVerdict = evaluateBuild(ctx);
    const verdict = records.verdicts.get(ctx.build.id);
    if (!verdict) {
      problems.push(`build ${ctx.build.id}: no stored verdict`);
      continue;
    }
    const stored = [verdict.status, ...verdict.supplies.map((s) => `${s.supplyId}=${s.status}`)].join(' ');
    const expected = [fresh.status, ...fresh.supplies.map((s) => `${s.supplyId}=${s.status}`)].join(' ');
    if (stored !== expected) problems.push(`build ${ctx.build.id}: stored verdict "${stored}", fresh evaluation "${expected}"`);
    const rules = flaggedChecks(fresh.supplies.flatMap((x) => x.findings));
    if (verdict.rules !== rules) problems.push(`build ${ctx.build.id}: stored checks "${verdict.rules}", fresh evaluation "${rules}"`);
  }
  return { problems, buildsEvaluated: records.contexts.length };
}

/** Builds a part edit reaches: the ones using the part, or for a class rule the builds of vehicles in its class. */
export function buildsUsing(records: Record<RecordKind, StoredRecord[]>, kind: string, partId: string): string[] {
  const builds = records.builds as unknown as Build[];
  if (kind === 'classRules') {
    const rule = records.classRules.find((r) => r.id === partId);
    const vehicles = new Set(records.vehicles.filter((v) => v.className === rule?.className).map((v) => v.id));
    return builds.filter((b) => vehicles.has(b.vehicleId)).map((b) => b.id);
  }
  const column = ({ motors: 'motorId', controllers: 'controllerId', propellers: 'propellerId', vehicles: 'vehicleId' } as const)[kind as 'motors'];
  if (kind === 'batteries') return builds.filter((b) => b.supplies.some((s) => s.batteryIds.includes(partId))).map((b) => b.id);
  return column ? builds.filter((b) => b[column] === partId).map((b) => b.id) : [];
}
