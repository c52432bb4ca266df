import { DEFAULT_TIGHT_THRESHOLD, type Battery, type BuildContext, type BuildVerdict, type ClassRule } from '../../core/domain';
import { evaluateBuild } from '../../core/evaluate';
import type { FleetRecords } from './fleet-format';

/**
 * Verdicts of a file's builds with nothing but the file: the same core evaluation the store's
 * re-check runs. Archived builds are left out (they are not in use); archived parts still count,
 * as they do in the store. Class rules that are archived do not apply.
 */
export function evaluateFleet(fleet: FleetRecords, defaultTightThreshold = DEFAULT_TIGHT_THRESHOLD): BuildVerdict[] {
  const byId = <T extends { id: string }>(list: readonly T[]) => new Map(list.map((x) => [x.id, x]));
  const vehicles = byId(fleet.vehicles);
  const motors = byId(fleet.motors);
  const controllers = byId(fleet.controllers);
  const propellers = byId(fleet.propellers);
  const batteries: ReadonlyMap<string, Battery> = byId(fleet.batteries);
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
    };
    out.push(evaluateBuild(ctx));
  }
  return out;
}
