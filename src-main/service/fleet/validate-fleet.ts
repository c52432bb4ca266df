// Checks a whole rigbook-fleet value and reports every problem with its place, so one pass
// over a file lists everything to fix. Pure: the store's side (references to records already
// stored) is checked by fleet-references.ts with the ids this returns.

import { FLEET_FORMAT, FLEET_KINDS, FLEET_VERSION, KIND_WORDS, type FleetKind, type FleetRecords } from './fleet-format';
import { fleetFileSchema, fleetRecordSchemas } from './fleet-schemas';
import { placeOf, schemaProblems, type FleetProblem } from './fleet-problems';
import { progressCounter, type OnProgress } from './progress';
import { validateLogs, type FleetLogs } from './fleet-logs';
import { customerIdForOwner } from '../../core/customer-id';

const MAX_ID = 64;

export interface FleetValidation {
  /** The records that passed, supply ids filled in; complete only when `problems` is empty. */
  fleet: FleetRecords;
  /** Every id the file names per kind, also of records that failed, so a reference to them is not reported twice. */
  fileIds: Record<FleetKind, Set<string>>;
  /** For each build in `fleet.builds`, its position in the file's list, for naming places. */
  buildPlaces: number[];
  problems: FleetProblem[];
  /** Customers made from vehicles' `owner` text (a file written before customers were records): a stored one of the same id is kept as it is. */
  ownerCustomerIds: Set<string>;
  /** False when the value is not a fleet file at all (no records were looked at). */
  envelopeOk: boolean;
  /** The log sections (version 2), entries that passed. */
  logs: FleetLogs;
}

function isPlainObject(x: unknown): x is Record<string, unknown> {
  return typeof x === 'object' && x !== null && !Array.isArray(x);
}

function emptyIds(): Record<FleetKind, Set<string>> {
  return { batteries: new Set(), motors: new Set(), controllers: new Set(), propellers: new Set(), customers: new Set(), vehicles: new Set(), classes: new Set(), classRules: new Set(), builds: new Set(), workOrders: new Set() };
}

function emptyRecords(): FleetRecords {
  return { batteries: [], motors: [], controllers: [], propellers: [], customers: [], vehicles: [], classes: [], classRules: [], builds: [], workOrders: [] };
}

/** The id a supply gets when a file leaves it out: stable, so reading the file twice gives the same ids. */
export function derivedSupplyId(buildId: string, index: number): string {
  return `${buildId}.s${index + 1}`;
}

function envelopeProblems(input: unknown): FleetProblem[] | null {
  if (!isPlainObject(input)) {
    return [{ place: '', message: `The file must hold one JSON object that starts with "format": "${FLEET_FORMAT}".` }];
  }
  if (input.format !== FLEET_FORMAT) {
    const found = input.format === undefined ? 'there is no "format" field' : `it says ${JSON.stringify(input.format).slice(0, 60)}`;
    return [{ place: 'format', message: `must be "${FLEET_FORMAT}" (${found}); this is not a Rigbook fleet file` }];
  }
  const version = input.version;
  if (version === undefined) return [{ place: 'version', message: `is required (this Rigbook reads version ${FLEET_VERSION})` }];
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) {
    return [{ place: 'version', message: `must be a whole number (this Rigbook reads version ${FLEET_VERSION})` }];
  }
  if (version > FLEET_VERSION) {
    return [{ place: 'version', message: `is ${version}: the file was written by a newer Rigbook; this one reads version ${FLEET_VERSION}. Update Rigbook to read it.` }];
  }
  return null;
}

export function validateFleet(input: unknown, onProgress?: OnProgress): FleetValidation {
  const fleet = emptyRecords();
  const fileIds = emptyIds();
  const early = envelopeProblems(input);
  if (early) return { fleet, fileIds, buildPlaces: [], problems: early, ownerCustomerIds: new Set(), envelopeOk: false, logs: { packEvents: [], runLogs: [] } };
  const file = input as Record<string, unknown>;
  const problems: FleetProblem[] = [];
  const known = new Set<string>(Object.keys(fleetFileSchema.entries));
  for (const key of Object.keys(file)) {
    if (!known.has(key)) problems.push({ place: key, message: `is not part of a ${FLEET_FORMAT} file (it holds: ${FLEET_KINDS.join(', ')})` });
  }
  if (file.$schema !== undefined && typeof file.$schema !== 'string') problems.push({ place: '$schema', message: 'must be text (the name of the schema the file follows)' });

  const lists: Partial<Record<FleetKind, unknown[]>> = {};
  let total = 0;
  for (const kind of FLEET_KINDS) {
    const list = file[kind];
    // A kind with nothing in it may be left out; a hand-written file then stays short.
    if (list === undefined) continue;
    if (!Array.isArray(list)) {
      problems.push({ place: kind, message: `must be a list of ${KIND_WORDS[kind].many}` });
      continue;
    }
    lists[kind] = list;
    total += list.length;
  }

  const tick = progressCounter(onProgress, 'check', total);
  const buildPlaces: number[] = [];
  const duplicateBuilds = new Set<number>();
  let done = 0;
  tick(0);
  for (const kind of FLEET_KINDS) {
    const list = lists[kind];
    if (!list) continue;
    const firstAt = new Map<string, number>();
    const schema = fleetRecordSchemas[kind];
    const knownKeys = new Set(Object.keys(schema.entries));
    const out = fleet[kind] as unknown[];
    list.forEach((raw, index) => {
      const place = placeOf(kind, index);
      const rawId = isPlainObject(raw) ? raw.id : undefined;
      if (typeof rawId === 'string' && rawId !== '') {
        fileIds[kind].add(rawId);
        const seen = firstAt.get(rawId);
        if (seen !== undefined) {
          problems.push({ place: placeOf(place, 'id'), message: `"${rawId}" is used twice in this file (also ${placeOf(kind, seen)})` });
          if (kind === 'builds') duplicateBuilds.add(index);
        } else firstAt.set(rawId, index);
      }
      const parsed = schemaProblems(schema, raw, place, knownKeys);
      if (parsed.ok) {
        out.push(parsed.output);
        if (kind === 'builds') buildPlaces.push(index);
      } else problems.push(...parsed.problems);
      tick(++done);
    });
  }

  fillSupplyIds(fleet, buildPlaces, duplicateBuilds, problems);
  const logs = validateLogs(file);
  problems.push(...logs.problems);
  const ownerCustomerIds = customersFromOwners(fleet, fileIds);
  return { fleet, fileIds, buildPlaces, problems, ownerCustomerIds, envelopeOk: true, logs: logs.logs };
}

/**
 * A vehicle of an older file names its owner as text: it becomes a customer of that name (one
 * per distinct text, the id the store's upgrade gave the same text), unless the vehicle already
 * names a customer. Returns the ids of the customers made here.
 */
function customersFromOwners(fleet: FleetRecords, fileIds: Record<FleetKind, Set<string>>): Set<string> {
  const made = new Set<string>();
  for (const vehicle of fleet.vehicles as (FleetRecords['vehicles'][number] & { owner?: string })[]) {
    const owner = (vehicle.owner ?? '').trim();
    delete vehicle.owner;
    if (owner === '' || (vehicle.customerId !== undefined && vehicle.customerId !== null)) continue;
    const customerId = customerIdForOwner(owner);
    vehicle.customerId = customerId;
    if (fileIds.customers.has(customerId)) continue;
    fileIds.customers.add(customerId);
    made.add(customerId);
    fleet.customers.push({ id: customerId, version: 1, archivedAt: null, name: owner, contact: '', notes: '' });
  }
  return made;
}

/** Gives every supply an id and reports a supply id used twice anywhere in the file. */
function fillSupplyIds(fleet: FleetRecords, buildPlaces: readonly number[], duplicateBuilds: ReadonlySet<number>, problems: FleetProblem[]): void {
  const seen = new Map<string, string>();
  fleet.builds.forEach((build, b) => {
    const index = buildPlaces[b] ?? 0;
    const buildPlace = placeOf('builds', index);
    build.supplies.forEach((supply, j) => {
      const place = placeOf(buildPlace, 'supplies', j, 'id');
      if (supply.id === undefined) {
        const derived = derivedSupplyId(build.id, j);
        if (derived.length > MAX_ID) {
          problems.push({ place, message: `is required here: none can be made from a build id this long (at most ${MAX_ID - 4} characters)` });
          return;
        }
        supply.id = derived;
      }
      const other = seen.get(supply.id);
      // A build whose own id is a duplicate is reported once, not again for the supply ids derived from it.
      if (other !== undefined && !duplicateBuilds.has(index)) problems.push({ place, message: `"${supply.id}" is used twice in this file (also ${other})` });
      else if (other === undefined) seen.set(supply.id, place.slice(0, -'.id'.length));
    });
  });
}
