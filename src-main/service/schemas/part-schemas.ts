import * as v from 'valibot';
import { BATTERY_FIELDS } from '../../core/catalogue/battery-fields';
import { CONTROLLER_FIELDS } from '../../core/catalogue/controller-fields';
import { CUSTOMER_FIELDS } from '../../core/catalogue/customer-fields';
import type { FieldCatalogue } from '../../core/catalogue/field-spec';
import { MOTOR_FIELDS } from '../../core/catalogue/motor-fields';
import { PROPELLER_FIELDS } from '../../core/catalogue/propeller-fields';
import { VEHICLE_FIELDS } from '../../core/catalogue/vehicle-fields';
import { createEntries, fieldEntries } from './catalogue-schemas';
import { id, name, newId, notes, nullable, number, record, text } from './field-builders';

// Each kind's create schema fills its fallbacks and its patch schema makes every field
// optional. Limits are generous bounds against typing slips, not engineering limits: the
// rules engine judges the figures.

function schemasFor<const E extends v.ObjectEntries, const D extends { [K in keyof E]?: v.InferOutput<E[K]> }>(entries: E, defaults: D) {
  const createEntries = Object.fromEntries(Object.entries(entries).map(([key, schema]) => [key, key in defaults ? v.optional(schema, defaults[key as keyof D] as never) : schema])) as {
    [K in keyof E]: K extends keyof D ? v.OptionalSchema<E[K], never> : E[K];
  };
  const create = record({ id: v.optional(newId()), ...createEntries });
  const patch = v.partial(record(entries));
  return { create, patch };
}

/** The create and patch schemas of a kind, read from its field catalogue. */
function catalogueSchemas<const C extends FieldCatalogue>(catalogue: C) {
  return { create: record({ id: v.optional(newId()), ...createEntries(catalogue, {}) }), patch: v.partial(record(fieldEntries(catalogue, {}))) };
}

export const batterySchemas = catalogueSchemas(BATTERY_FIELDS);
export const motorSchemas = catalogueSchemas(MOTOR_FIELDS);
export const controllerSchemas = catalogueSchemas(CONTROLLER_FIELDS);
export const propellerSchemas = catalogueSchemas(PROPELLER_FIELDS);
export const vehicleSchemas = catalogueSchemas(VEHICLE_FIELDS);
export const customerSchemas = catalogueSchemas(CUSTOMER_FIELDS);

// A class is a name and notes; its limits are the class rules naming it.
export const classSchemas = schemasFor({ name: name(), notes: notes() }, { notes: '' });

// Class rules are a shop's own limits, not a part a user reads off a label; their fields are listed here.
export const classRuleSchemas = schemasFor(
  {
    className: name(),
    ruleId: v.pipe(id(), v.regex(/^class-/, 'must start with "class-" so it never clashes with a built-in rule')),
    figure: v.pipe(text(60), v.minLength(1, 'is required')),
    limit: number({ min: -1e9, max: 1e9 }),
    unit: text(12),
    tightThreshold: nullable(number({ min: 0, max: 0.9 })),
    notes: notes(),
  },
  { unit: '', tightThreshold: null, notes: '' },
);
