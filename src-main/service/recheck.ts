import type { Battery, BuildContext, BuildVerdict, ClassRule, Status } from '../core/domain';
import { evaluateBuild } from '../core/evaluate';
import type { DbHandle } from '../store/db-handle';
import { getBuilds } from '../store/repositories/builds';
import { getParts } from '../store/repositories/parts';
import type { VerdictChange } from '../store/repositories/history';
import { getStoredStatuses, verdictToRow, writeVerdicts } from '../store/repositories/verdicts';

export interface RecheckResult {
  verdicts: BuildVerdict[];
  changes: VerdictChange[];
}

/** Resolves every record the given builds refer to, with one query per table. */
export async function loadBuildContexts(db: DbHandle, buildIds: readonly string[], defaultTightThreshold: number): Promise<BuildContext[]> {
  const builds = await getBuilds(db, buildIds);
  const ids = (pick: (b: (typeof builds)[number]) => (string | null)[]) => builds.flatMap(pick).filter((x): x is string => x !== null);
  const [vehicles, motors, controllers, propellers, batteries] = await Promise.all([
    getParts(db, 'vehicles', ids((b) => [b.vehicleId])),
    getParts(db, 'motors', ids((b) => [b.motorId])),
    getParts(db, 'controllers', ids((b) => [b.controllerId])),
    getParts(db, 'propellers', ids((b) => [b.propellerId])),
    getParts(db, 'batteries', ids((b) => b.supplies.flatMap((s) => s.batteryIds))),
  ]);
  const classNames = [...new Set(vehicles.map((x) => x.className).filter((c) => c !== ''))];
  const rules = classNames.length === 0 ? [] : await db.selectFrom('classRules').selectAll().where('className', 'in', classNames).where('archivedAt', 'is', null).execute();
  const rulesByClass = new Map<string, ClassRule[]>();
  for (const { createdAt: _c, updatedAt: _u, ...rule } of rules) {
    const list = rulesByClass.get(rule.className) ?? [];
    list.push(rule);
    rulesByClass.set(rule.className, list);
  }
  const byId = <T extends { id: string }>(list: T[]) => new Map(list.map((x) => [x.id, x]));
  const vehicleMap = byId(vehicles);
  const motorMap = byId(motors);
  const controllerMap = byId(controllers);
  const propellerMap = byId(propellers);
  const batteryMap: Map<string, Battery> = byId(batteries);
  return builds.map((build) => {
    const vehicle = vehicleMap.get(build.vehicleId) ?? null;
    return {
      build,
      vehicle,
      motor: build.motorId === null ? null : (motorMap.get(build.motorId) ?? null),
      controller: build.controllerId === null ? null : (controllerMap.get(build.controllerId) ?? null),
      propeller: build.propellerId === null ? null : (propellerMap.get(build.propellerId) ?? null),
      batteries: batteryMap,
      classRules: vehicle ? (rulesByClass.get(vehicle.className) ?? []) : [],
      defaultTightThreshold,
    } satisfies BuildContext;
  });
}

/** Status changes between what was stored and what the evaluation says now, per build and per supply. */
export function diffStatuses(
  verdict: BuildVerdict,
  stored: { status: Status; supplies: Map<string, Status> } | undefined,
): VerdictChange[] {
  const changes: VerdictChange[] = [];
  if (stored?.status !== verdict.status) changes.push({ buildId: verdict.buildId, supplyId: null, from: stored?.status ?? null, to: verdict.status });
  for (const s of verdict.supplies) {
    const before = stored?.supplies.get(s.supplyId) ?? null;
    if (before !== s.status) changes.push({ buildId: verdict.buildId, supplyId: s.supplyId, from: before, to: s.status });
  }
  return changes;
}

/** Evaluates the builds and stores their verdicts; run inside the write's transaction. */
export async function recheckBuilds(db: DbHandle, buildIds: readonly string[], defaultTightThreshold: number, evaluatedAt: string): Promise<RecheckResult> {
  if (buildIds.length === 0) return { verdicts: [], changes: [] };
  const contexts = await loadBuildContexts(db, buildIds, defaultTightThreshold);
  const stored = await getStoredStatuses(db, buildIds);
  const verdicts = contexts.map(evaluateBuild);
  const changes = verdicts.flatMap((verdict) => diffStatuses(verdict, stored.get(verdict.buildId)));
  await writeVerdicts(db, verdicts.map((verdict) => verdictToRow(verdict, evaluatedAt)));
  return { verdicts, changes };
}
