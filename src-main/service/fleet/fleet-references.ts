// Every id a build names must resolve: to a record in the same file, or (when merging into a
// store) to one already stored. A supply id must not belong to a stored build the file leaves alone.

import { KIND_WORDS, type FleetKind, type FleetRecords } from './fleet-format';
import { placeOf, type FleetProblem } from './fleet-problems';

/** What the store already holds, for a merge; empty for a replace or a pure check. */
export interface StoredIds {
  batteries: ReadonlySet<string>;
  motors: ReadonlySet<string>;
  controllers: ReadonlySet<string>;
  propellers: ReadonlySet<string>;
  customers: ReadonlySet<string>;
  vehicles: ReadonlySet<string>;
  /** Supply id → the build that holds it. */
  supplyOwners: ReadonlyMap<string, string>;
}

export const NO_STORED_IDS: StoredIds = {
  batteries: new Set(),
  motors: new Set(),
  controllers: new Set(),
  propellers: new Set(),
  customers: new Set(),
  vehicles: new Set(),
  supplyOwners: new Map(),
};

type ReferencedKind = 'batteries' | 'motors' | 'controllers' | 'propellers' | 'customers' | 'vehicles';

export function referenceProblems(fleet: FleetRecords, fileIds: Readonly<Record<FleetKind, ReadonlySet<string>>>, stored: StoredIds, buildPlaces: readonly number[]): FleetProblem[] {
  const problems: FleetProblem[] = [];
  const where = stored === NO_STORED_IDS ? 'in this file' : 'in this file or the store';
  const check = (place: string, kind: ReferencedKind, id: string | null) => {
    if (id === null || fileIds[kind].has(id) || stored[kind].has(id)) return;
    problems.push({ place, message: `no ${KIND_WORDS[kind].one} with id "${id}" ${where}` });
  };
  fleet.vehicles.forEach((vehicle, i) => check(placeOf('vehicles', i, 'customerId'), 'customers', vehicle.customerId ?? null));
  fleet.workOrders.forEach((order, i) => {
    check(placeOf('workOrders', i, 'vehicleId'), 'vehicles', order.vehicleId);
    check(placeOf('workOrders', i, 'customerId'), 'customers', order.customerId);
    // A handed-over job carries when, and the verdicts it was handed over with.
    if (order.status === 'handed-over' && (order.handedOverAt === null || order.verdictsAtHandOver === null)) {
      problems.push({ place: placeOf('workOrders', i, 'handedOverAt'), message: 'a handed-over work order needs handedOverAt and verdictsAtHandOver' });
    }
  });
  const packNames = new Map(fleet.batteries.map((p) => [p.id, p.name]));
  fleet.builds.forEach((build, b) => {
    const at = placeOf('builds', buildPlaces[b] ?? 0);
    // One physical pack can be in one place only in a build.
    const placed = new Set<string>();
    build.supplies.forEach((supply, j) =>
      supply.batteryIds.forEach((packId, k) => {
        if (placed.has(packId)) {
          problems.push({ place: placeOf(at, 'supplies', j, 'batteryIds', k), message: `pack "${packNames.get(packId) ?? packId}" is already in this build; one physical pack can be in one place only` });
        }
        placed.add(packId);
      }),
    );
    if (build.measuredSupplyId && !build.supplies.some((s) => s.id === build.measuredSupplyId)) {
      problems.push({ place: placeOf(at, 'measuredSupplyId'), message: `the measured currents must name a supply of this build; there is no supply "${build.measuredSupplyId}"` });
    }
    check(placeOf(at, 'vehicleId'), 'vehicles', build.vehicleId);
    check(placeOf(at, 'motorId'), 'motors', build.motorId);
    check(placeOf(at, 'controllerId'), 'controllers', build.controllerId);
    check(placeOf(at, 'propellerId'), 'propellers', build.propellerId);
    build.supplies.forEach((supply, j) => {
      supply.batteryIds.forEach((packId, k) => check(placeOf(at, 'supplies', j, 'batteryIds', k), 'batteries', packId));
      const owner = stored.supplyOwners.get(supply.id);
      // A stored build that the file also rewrites gives up its supplies first.
      if (owner !== undefined && owner !== build.id && !fileIds.builds.has(owner)) {
        problems.push({ place: placeOf(at, 'supplies', j, 'id'), message: `"${supply.id}" already belongs to build "${owner}" in the store` });
      }
    });
  });
  return problems;
}
