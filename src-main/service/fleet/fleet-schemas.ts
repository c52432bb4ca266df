// Record schemas of the rigbook-fleet file, built from the service's own create schemas so a
// file can never hold what the UI would refuse. Files differ in three ways only: ids are
// required, records may carry their `version` and `archivedAt`, and a supply's id may be left
// out (it is then derived from the build's id, so re-reading a file gives the same ids).

import * as v from 'valibot';
import { GEARING_FIELDS } from '../../core/catalogue/build-fields';
import { buildCreateSchema } from '../schemas/build-schemas';
import { count, id, MAX_NAME, MAX_NOTES, newId, notes, nullable, oneOf, record, text } from '../schemas/field-builders';
import { STATUSES } from '../../core/domain';
import { WORK_ORDER_STATUSES, WORK_STEP_KINDS } from '../../core/work-order';
import { batterySchemas, classRuleSchemas, classSchemas, controllerSchemas, customerSchemas, motorSchemas, propellerSchemas, vehicleSchemas } from '../schemas/part-schemas';
import { FLEET_FORMAT, FLEET_VERSIONS_READ, type FleetKind } from './fleet-format';
import { packEventFileSchema, runLogFileSchema } from './fleet-logs';

const MAX_VERSION = 1_000_000_000;

const isoTime = () => v.pipe(v.string('must be text'), v.isoTimestamp('must be an ISO time such as 2026-12-01T08:00:00.000Z'));
const snapshotSchema = record({
  buildId: id(),
  buildName: text(MAX_NAME),
  status: nullable(oneOf(STATUSES)),
  findings: v.array(record({ rule: text(80), status: oneOf(STATUSES), message: text(MAX_NOTES), unit: text(20) }), 'must be a list of findings'),
});
/** A work order as a file carries it: the record with its steps and verdict snapshots, as the store keeps them. */
const workOrderFileEntries = {
  vehicleId: id(),
  customerId: v.optional(nullable(id()), null),
  complaint: v.pipe(notes(), v.minLength(1, 'is required')),
  status: oneOf(WORK_ORDER_STATUSES),
  openedAt: isoTime(),
  handedOverAt: v.optional(nullable(isoTime()), null),
  signedOffBy: v.optional(text(120), ''),
  verdictsAtOpening: v.array(snapshotSchema, 'must be a list of build verdicts'),
  verdictsAtHandOver: v.optional(nullable(v.array(snapshotSchema, 'must be a list of build verdicts')), null),
  steps: v.optional(
    v.array(
      record({
        position: count(1, 100_000),
        kind: oneOf(WORK_STEP_KINDS),
        text: v.pipe(notes(), v.minLength(1, 'is required')),
        reason: v.optional(text(2000), ''),
        at: isoTime(),
        actor: text(200),
        historyIds: v.optional(v.array(count(1, Number.MAX_SAFE_INTEGER), 'must be a list of history entry numbers'), []),
      }),
      'must be a list of steps',
    ),
    [],
  ),
};

const bookkeeping = {
  /** Kept for a record new to the store; an update of a stored record bumps the stored version instead. */
  version: v.optional(count(1, MAX_VERSION), 1),
  archivedAt: v.optional(nullable(v.pipe(v.string('must be text'), v.isoTimestamp('must be an ISO time such as 2026-12-01T08:00:00.000Z'))), null),
};

function fileRecord<const E extends v.ObjectEntries & { id: unknown }>(entries: E) {
  const { id: _optionalId, ...rest } = entries;
  return record({ id: newId(), ...(rest as Omit<E, 'id'>), ...bookkeeping });
}

export const fleetRecordSchemas = {
  batteries: fileRecord(batterySchemas.create.entries),
  motors: fileRecord(motorSchemas.create.entries),
  controllers: fileRecord(controllerSchemas.create.entries),
  propellers: fileRecord(propellerSchemas.create.entries),
  customers: fileRecord(customerSchemas.create.entries),
  // `owner` is the free text files carried before customers were records: validateFleet turns it
  // into a customer (core/customer-id.ts) and no record keeps it.
  vehicles: fileRecord({ ...vehicleSchemas.create.entries, owner: v.optional(text(120)) }),
  classes: fileRecord(classSchemas.create.entries),
  classRules: fileRecord(classRuleSchemas.create.entries),
  builds: fileRecord(buildCreateSchema.entries),
  workOrders: record({ id: newId(), ...workOrderFileEntries, version: bookkeeping.version }),
} as const;

/** Field order of each kind in files and CSV headers: id first, then the fields as the forms list them, then bookkeeping. */
export const FIELD_ORDER: Readonly<Record<FleetKind, readonly string[]>> = {
  batteries: Object.keys(fleetRecordSchemas.batteries.entries),
  motors: Object.keys(fleetRecordSchemas.motors.entries),
  controllers: Object.keys(fleetRecordSchemas.controllers.entries),
  propellers: Object.keys(fleetRecordSchemas.propellers.entries),
  customers: Object.keys(fleetRecordSchemas.customers.entries),
  vehicles: Object.keys(fleetRecordSchemas.vehicles.entries).filter((key) => key !== 'owner'),
  classes: Object.keys(fleetRecordSchemas.classes.entries),
  classRules: Object.keys(fleetRecordSchemas.classRules.entries),
  builds: Object.keys(fleetRecordSchemas.builds.entries),
  workOrders: Object.keys(fleetRecordSchemas.workOrders.entries),
};

export const GEARING_ORDER: readonly string[] = Object.keys(GEARING_FIELDS);
export const SUPPLY_ORDER: readonly string[] = ['id', 'arrangement', 'batteryIds'];

/**
 * The whole file, for the published JSON Schema. The importer checks the envelope itself (to
 * word a newer version's refusal) and every record with `fleetRecordSchemas` above, the same
 * schemas this one lists; the top-level keys it accepts are this schema's.
 */
export const fleetFileSchema = v.strictObject({
  $schema: v.optional(v.string('must be text')),
  format: v.literal(FLEET_FORMAT),
  version: v.picklist(FLEET_VERSIONS_READ),
  batteries: v.optional(v.array(fleetRecordSchemas.batteries)),
  motors: v.optional(v.array(fleetRecordSchemas.motors)),
  controllers: v.optional(v.array(fleetRecordSchemas.controllers)),
  propellers: v.optional(v.array(fleetRecordSchemas.propellers)),
  customers: v.optional(v.array(fleetRecordSchemas.customers)),
  vehicles: v.optional(v.array(fleetRecordSchemas.vehicles)),
  classes: v.optional(v.array(fleetRecordSchemas.classes)),
  classRules: v.optional(v.array(fleetRecordSchemas.classRules)),
  builds: v.optional(v.array(fleetRecordSchemas.builds)),
  packEvents: v.optional(v.array(packEventFileSchema)),
  runLogs: v.optional(v.array(runLogFileSchema)),
  workOrders: v.optional(v.array(fleetRecordSchemas.workOrders)),
});
