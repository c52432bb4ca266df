import { DEFAULT_TIGHT_THRESHOLD, type Battery, type BuildContext, type BuildVerdict, type ClassRule } from '../../core/domain';
import { evaluateBuild } from '../../core/evaluate';
import type { FleetRecords } from './fleet-format';
import { DEFAULT_PACK_HEALTH, packHealthProblems, withLoggedResistance, type HealthProblem, type PackEvent, type PackHealthThresholds } from '../../core/pack-log';

/** A file's pack logs, for the evaluation: the day the health is judged on and its thresholds. */
export interface FleetPackLogs {
  packEvents: readonly PackEvent[];
  asOf: string;
  thresholds?: PackHealthThresholds;
}

/**
 * Verdicts of a file's builds with nothing but the file: the same core evaluation the store's
 * re-check runs. Archived builds are left out (they are not in use); archived parts still count,
 * as they do in the store. Class rules that are archived do not apply.
 */
export function evaluateFleet(fleet: FleetRecords, defaultTightThreshold = DEFAULT_TIGHT_THRESHOLD, logs?: FleetPackLogs): BuildVerdict[] {
  const byId = <T extends { id: string }>(list: readonly T[]) => new Map(list.map((x) => [x.id, x]));
  const vehicles = byId(fleet.vehicles);
  const motors = byId(fleet.motors);
  const controllers = byId(fleet.controllers);
  const propellers = byId(fleet.propellers);
  // As in the store: a pack's newest logged resistance sets its sag, and its log its health.
  const eventsByPack = new Map<string, PackEvent[]>();
  for (const e of logs?.packEvents ?? []) eventsByPack.set(e.batteryId, [...(eventsByPack.get(e.batteryId) ?? []), e]);
  const packHealth = new Map<string, readonly HealthProblem[]>();
  const batteries: ReadonlyMap<string, Battery> = new Map(
    fleet.batteries.map((b) => {
      const events = eventsByPack.get(b.id);
      if (!events || !logs) return [b.id, b] as const;
      const problems = packHealthProblems(b, events, logs.thresholds ?? DEFAULT_PACK_HEALTH, logs.asOf);
      if (problems.length > 0) packHealth.set(b.id, problems);
      return [b.id, withLoggedResistance(b, events)] as const;
    }),
  );
  const rulesByClass = new Map<string, ClassRule[]>();
  for (const rule of fleet.classRules) {
    if (rule.archivedAt !== null) continue;
    const list = rulesByClass.get(rule.className) ?? [];
    list.push(rule);
    rulesByClass.set(rule.className, list);
  }
  const out: BuildVerdict[] = [];
  for (const build of fleet.builds) {
    if (build.archivedAt !== null) continue;
    const vehicle = vehicles.get(build.vehicleId) ?? null;
    const ctx: BuildContext = {
      build,
      vehicle,
      motor: build.motorId === null ? null : (motors.get(build.motorId) ?? null),
      controller: build.controllerId === null ? null : (controllers.get(build.controllerId) ?? null),
      propeller: build.propellerId === null ? null : (propellers.get(build.propellerId) ?? null),
      batteries,
      classRules: vehicle && vehicle.className !== '' ? (rulesByClass.get(vehicle.className) ?? []) : [],
      defaultTightThreshold,
      packHealth,
    };
    out.push(evaluateBuild(ctx));
  }
  return out;
}
