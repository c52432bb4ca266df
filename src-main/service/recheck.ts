import type { Battery, BuildContext, BuildVerdict, ClassRule, Status } from '../core/domain';
import { evaluateBuild, type EvaluateOptions } from '../core/evaluate';
import type { DbHandle } from '../store/db-handle';
import { selectsNothing, type BuildSelector } from '../store/build-selector';
import { loadBuildsForEvaluation } from '../store/repositories/builds';
import { rowToRecord, type PartRecords } from '../store/repositories/part-records';
import { getParts } from '../store/repositories/parts';
import type { VerdictChange } from '../store/repositories/history';
import { packHealthProblems, withLoggedResistance, type HealthProblem } from '../core/pack-log';
import { packEventsOf } from '../store/repositories/pack-events';
import { readSettings } from '../store/repositories/settings';
import { getStoredStatuses, sameVerdictRow, verdictToRow, writeVerdicts } from '../store/repositories/verdicts';

export interface RecheckResult {
  verdicts: BuildVerdict[];
  changes: VerdictChange[];
}

type RefTable = 'vehicles' | 'motors' | 'controllers' | 'propellers' | 'batteries';

/** The distinct non-null values, for reading each referenced record once. */
function distinct(values: Iterable<string | null>): string[] {
  const out = new Set<string>();
  for (const v of values) if (v !== null) out.add(v);
  return [...out];
}

/** The records of one table with these ids, by id (read by getParts, a chunk of ids at a time). */
async function recordsById<T extends RefTable>(db: DbHandle, table: T, ids: readonly string[]): Promise<Map<string, PartRecords[T]>> {
  return new Map((await getParts(db, table, ids)).map((record) => [record.id, record]));
}

interface ReferencedPacks {
  batteries: Map<string, Battery>;
  health: Map<string, readonly HealthProblem[]>;
}

/**
 * The packs the selected builds use, as the evaluation sees them: each with its newest logged
 * resistance measurement in place of the typed one, and the health problems its log shows.
 */
async function referencedPacks(db: DbHandle, packIds: readonly string[], asOf: string): Promise<ReferencedPacks> {
  const typedPacks = await recordsById(db, 'batteries', packIds);
  const logs = await packEventsOf(db, packIds);
  const settings = await readSettings(db);
  const batteries = new Map<string, Battery>();
  const health = new Map<string, readonly HealthProblem[]>();
  for (const [id, typed] of typedPacks) {
    const events = logs.get(id);
    if (!events) {
      batteries.set(id, typed);
      continue;
    }
    batteries.set(id, withLoggedResistance(typed, events));
    const problems = packHealthProblems(typed, events, settings.packHealth, asOf);
    if (problems.length > 0) health.set(id, problems);
  }
  return { batteries, health };
}

/** Resolves every record the selected builds refer to: the builds first, then each table by the ids they name. */
export async function loadBuildContexts(db: DbHandle, selector: BuildSelector, defaultTightThreshold: number, asOf: string = new Date().toISOString()): Promise<BuildContext[]> {
  if (selectsNothing(selector)) return [];
  const builds = await loadBuildsForEvaluation(db, selector);
  const vehicles = await recordsById(db, 'vehicles', distinct(builds.map((b) => b.vehicleId)));
  const motors = await recordsById(db, 'motors', distinct(builds.map((b) => b.motorId)));
  const controllers = await recordsById(db, 'controllers', distinct(builds.map((b) => b.controllerId)));
  const propellers = await recordsById(db, 'propellers', distinct(builds.map((b) => b.propellerId)));
  const { batteries, health } = await referencedPacks(db, distinct(builds.flatMap((b) => b.supplies.flatMap((s) => s.batteryIds))), asOf);
  const classNames = distinct([...vehicles.values()].map((x) => (x.className === '' ? null : x.className)));
  const rules = classNames.length === 0 ? [] : await db.selectFrom('classRules').selectAll().where('className', 'in', classNames).where('archivedAt', 'is', null).execute();
  const rulesByClass = new Map<string, ClassRule[]>();
  for (const row of rules) {
    const rule = rowToRecord('classRules', row);
    const list = rulesByClass.get(rule.className) ?? [];
    list.push(rule);
    rulesByClass.set(rule.className, list);
  }
  return builds.map((build) => {
    const vehicle = (vehicles.get(build.vehicleId) as BuildContext['vehicle'] | undefined) ?? null;
    return {
      build,
      vehicle,
      motor: build.motorId === null ? null : ((motors.get(build.motorId) as BuildContext['motor'] | undefined) ?? null),
      controller: build.controllerId === null ? null : ((controllers.get(build.controllerId) as BuildContext['controller'] | undefined) ?? null),
      propeller: build.propellerId === null ? null : ((propellers.get(build.propellerId) as BuildContext['propeller'] | undefined) ?? null),
      batteries,
      classRules: vehicle ? (rulesByClass.get(vehicle.className) ?? []) : [],
      defaultTightThreshold,
      packHealth: health,
    } satisfies BuildContext;
  });
}

/** Status changes between what was stored and what the evaluation says now, per build and per supply. */
export function diffStatuses(verdict: BuildVerdict, stored: { status: Status; supplies: Map<string, Status> } | undefined): VerdictChange[] {
  const changes: VerdictChange[] = [];
  if (stored?.status !== verdict.status) changes.push({ buildId: verdict.buildId, supplyId: null, from: stored?.status ?? null, to: verdict.status });
  for (const s of verdict.supplies) {
    const before = stored?.supplies.get(s.supplyId) ?? null;
    if (before !== s.status) changes.push({ buildId: verdict.buildId, supplyId: s.supplyId, from: before, to: s.status });
  }
  return changes;
}

/** Evaluates the selected builds and stores their verdicts; run inside the write's transaction. */
export async function recheckBuilds(db: DbHandle, selector: BuildSelector, defaultTightThreshold: number, evaluatedAt: string, options: EvaluateOptions = { messages: false }): Promise<RecheckResult> {
  if (selectsNothing(selector)) return { verdicts: [], changes: [] };
  const [contexts, stored] = await Promise.all([loadBuildContexts(db, selector, defaultTightThreshold, evaluatedAt), getStoredStatuses(db, selector)]);
  // Statuses and list figures are all a re-check stores, so by default it skips the sentences;
  // a preview, which shows its verdicts to a person, asks for them.
  const verdicts = contexts.map((context) => evaluateBuild(context, options));
  const changes: VerdictChange[] = [];
  for (const verdict of verdicts) for (const change of diffStatuses(verdict, stored.get(verdict.buildId))) changes.push(change);
  // Only rows whose list columns differ from the stored row are written: a part edit that moves
  // no verdict (a note, a mass) rewrites nothing, and `evaluatedAt` says when the verdict last changed.
  const rows = verdicts.map((verdict) => verdictToRow(verdict, evaluatedAt)).filter((row) => !sameVerdictRow(stored.get(row.buildId), row));
  await writeVerdicts(db, rows);
  return { verdicts, changes };
}
