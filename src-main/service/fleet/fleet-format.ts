// The rigbook-fleet interchange file, version 2: the domain records as they are, grouped by
// kind, so a file can be read by a person, written by a script and checked without a store.
// Version 2 adds the logs (`packEvents`, `runLogs`: service/fleet/fleet-logs.ts); a version 1
// file, which has neither, still reads.

import type { Battery, Build, ClassRule, Controller, Customer, Motor, Propeller, Vehicle, VehicleClass } from '../../core/domain';
import type { PackEvent } from '../../core/pack-log';
import type { RunLog } from '../../store/repositories/run-logs';
import type { WorkOrder } from '../../core/work-order';

export const FLEET_FORMAT = 'rigbook-fleet';
export const FLEET_VERSION = 2;
/** Versions this Rigbook reads. */
export const FLEET_VERSIONS_READ = [1, 2] as const;
/**
 * What exported files carry as `$schema`, and the `$id` of schema/rigbook-fleet.schema.json:
 * a name for the schema, not an address to fetch (point an editor at the shipped file).
 */
export const FLEET_SCHEMA_ID = 'urn:rigbook:schema:rigbook-fleet:2';

/** Part kinds in the order a file lists them (and the order they are written: vehicles refer to customers, builds to the rest). */
export const FLEET_PART_KINDS = ['batteries', 'motors', 'controllers', 'propellers', 'customers', 'vehicles', 'classes', 'classRules'] as const;
export type FleetPartKind = (typeof FLEET_PART_KINDS)[number];
export const FLEET_KINDS = [...FLEET_PART_KINDS, 'builds', 'workOrders'] as const;
export type FleetKind = (typeof FLEET_KINDS)[number];

export interface FleetRecords {
  batteries: Battery[];
  motors: Motor[];
  controllers: Controller[];
  propellers: Propeller[];
  /** Optional in a file: one written before customers were records has none (its vehicles may carry `owner` text). */
  customers: Customer[];
  vehicles: Vehicle[];
  classes: VehicleClass[];
  classRules: ClassRule[];
  builds: Build[];
  /** Optional in a file. Steps keep the history entry numbers they link; those belong to the store they were made in. */
  workOrders: WorkOrder[];
}

/** A whole file. `classes` and `classRules` are optional on reading; an export always writes them. */
export interface FleetFile extends FleetRecords {
  /** Always written by an export; a file may leave it out. */
  $schema?: typeof FLEET_SCHEMA_ID;
  format: typeof FLEET_FORMAT;
  version: (typeof FLEET_VERSIONS_READ)[number];
  /** Version 2: each pack's log entries. */
  packEvents?: PackEvent[];
  /** Version 2: run logs with their kept samples. */
  runLogs?: RunLog[];
}

/** How problems and counts name each kind, in the trade's words. */
export const KIND_WORDS: Readonly<Record<FleetKind, { one: string; many: string }>> = {
  batteries: { one: 'pack', many: 'packs' },
  motors: { one: 'motor', many: 'motors' },
  controllers: { one: 'speed controller', many: 'speed controllers' },
  propellers: { one: 'propeller', many: 'propellers' },
  customers: { one: 'customer', many: 'customers' },
  vehicles: { one: 'vehicle', many: 'vehicles' },
  classes: { one: 'class', many: 'classes' },
  classRules: { one: 'class rule', many: 'class rules' },
  builds: { one: 'build', many: 'builds' },
  workOrders: { one: 'work order', many: 'work orders' },
};
