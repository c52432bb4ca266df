import { BATTERY_FIELDS } from './battery-fields';
import { BUILD_FIELDS, GEARING_FIELDS } from './build-fields';
import { CONTROLLER_FIELDS } from './controller-fields';
import { CUSTOMER_FIELDS } from './customer-fields';
import type { FieldCatalogue, FieldSpec } from './field-spec';
import { MOTOR_FIELDS } from './motor-fields';
import { PROPELLER_FIELDS } from './propeller-fields';
import { VEHICLE_FIELDS } from './vehicle-fields';

// Every kind of record with fields a user types, by its table, and the prefix the engine names
// its fields with (`motor.kv`, `gearing.pinionTeeth`).

export const FIELD_CATALOGUES = {
  batteries: BATTERY_FIELDS,
  motors: MOTOR_FIELDS,
  controllers: CONTROLLER_FIELDS,
  propellers: PROPELLER_FIELDS,
  vehicles: VEHICLE_FIELDS,
  builds: BUILD_FIELDS,
  customers: CUSTOMER_FIELDS,
} as const satisfies Record<string, FieldCatalogue>;

export type CatalogueKind = keyof typeof FIELD_CATALOGUES;

/** The engine's name for one record of each kind, the prefix of its field paths. */
export const FIELD_PREFIXES = {
  batteries: 'battery',
  motors: 'motor',
  controllers: 'controller',
  propellers: 'propeller',
  vehicles: 'vehicle',
  builds: 'build',
  customers: 'customer',
} as const satisfies Record<CatalogueKind, string>;

/** Every catalogue by the prefix its paths take, nested ones included. */
const BY_PREFIX = {
  battery: BATTERY_FIELDS,
  motor: MOTOR_FIELDS,
  controller: CONTROLLER_FIELDS,
  propeller: PROPELLER_FIELDS,
  vehicle: VEHICLE_FIELDS,
  build: BUILD_FIELDS,
  gearing: GEARING_FIELDS,
  customer: CUSTOMER_FIELDS,
} as const satisfies Record<string, FieldCatalogue>;

function collect(): Map<string, FieldSpec> {
  const out = new Map<string, FieldSpec>();
  for (const [prefix, fields] of Object.entries(BY_PREFIX)) {
    for (const [key, spec] of Object.entries<FieldSpec>(fields)) out.set(`${prefix}.${key}`, spec);
  }
  return out;
}

const BY_PATH = collect();

type Prefixes = typeof BY_PREFIX;

/** Paths of the fields whose spec has `S`: `PathWith<{ plausible: object }>` is every field with a plausible range. */
export type PathWith<S> = {
  [P in keyof Prefixes & string]: { [K in keyof Prefixes[P] & string]: Prefixes[P][K] extends S ? `${P}.${K}` : never }[keyof Prefixes[P] & string];
}[keyof Prefixes & string];

/** The field an engine path names, or undefined for a path that names no typed field. */
export function fieldAt(path: string): FieldSpec | undefined {
  return BY_PATH.get(path);
}

/** Every field by its path, in catalogue order. */
export function allFields(): ReadonlyMap<string, FieldSpec> {
  return BY_PATH;
}
