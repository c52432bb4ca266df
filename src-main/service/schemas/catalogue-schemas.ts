import * as v from 'valibot';
import type { FieldCatalogue, FieldSpec, FieldValue } from '../../core/catalogue/field-spec';
import { rangeOf } from '../../core/plausibility';
import { flag, id, name, notes, number, oneOf, plausibleNumber, record, text } from './field-builders';

// The service's schemas read from the field catalogues: a field's type, bounds and plausible
// range say what the edge accepts, its fallback what a new record takes when it is left out.
// Fields with an editor of their own (a build's gearing and supplies) bring their schema along.

/** The schema of one catalogue field: takes and gives the field's value. */
export type FieldSchema<F extends FieldSpec> = v.GenericSchema<FieldValue<F>>;

/** Schemas given for fields the catalogue cannot spell out (nested records, lists). */
type Given<C extends FieldCatalogue> = { readonly [K in keyof C]?: v.GenericSchema };

type Entry<C extends FieldCatalogue, X extends Given<C>, K extends keyof C> = K extends keyof X ? (X[K] extends v.GenericSchema ? X[K] : never) : FieldSchema<C[K]>;

/** Every field required, as a patch (made partial) lists them. */
export type FieldEntries<C extends FieldCatalogue, X extends Given<C>> = { [K in keyof C]: Entry<C, X, K> };

/** Fields with a fallback may be left out of a new record. */
export type CreateEntries<C extends FieldCatalogue, X extends Given<C>> = {
  [K in keyof C]: C[K] extends { fallback: unknown } ? v.OptionalSchema<Entry<C, X, K>, never> : Entry<C, X, K>;
};

export function fieldSchema<const F extends FieldSpec>(spec: F): FieldSchema<F>;
export function fieldSchema(spec: FieldSpec): v.GenericSchema {
  const base = bareSchema(spec);
  return spec.nullable ? v.nullable(base) : base;
}

function bareSchema(spec: FieldSpec): v.GenericSchema {
  switch (spec.type) {
    case 'name':
      return name();
    case 'notes':
      return notes();
    case 'text':
      return text(spec.maxLength ?? 4000);
    case 'flag':
      return flag();
    case 'ref':
      return id();
    case 'choice':
      return oneOf(spec.options ?? []);
    case 'number':
    case 'integer': {
      const range = rangeOf(spec);
      if (range) return plausibleNumber(range);
      if (!spec.bounds) throw new Error(`the number field "${spec.label}" has no bounds`);
      return number({ ...spec.bounds, integer: spec.type === 'integer' });
    }
    case 'group':
    case 'supplies':
      throw new Error(`the field "${spec.label}" needs its schema given`);
  }
}

export function fieldEntries<const C extends FieldCatalogue, const X extends Given<C>>(catalogue: C, given: X): FieldEntries<C, X>;
export function fieldEntries(catalogue: FieldCatalogue, given: Given<FieldCatalogue>): v.ObjectEntries {
  return Object.fromEntries(Object.entries(catalogue).map(([key, spec]) => [key, given[key] ?? fieldSchema(spec)]));
}

export function createEntries<const C extends FieldCatalogue, const X extends Given<C>>(catalogue: C, given: X): CreateEntries<C, X>;
export function createEntries(catalogue: FieldCatalogue, given: Given<FieldCatalogue>): v.ObjectEntries {
  const entries = fieldEntries(catalogue, given);
  return Object.fromEntries(
    Object.entries(catalogue).map(([key, spec]) => {
      const schema: v.GenericSchema<unknown> = entries[key] ?? fieldSchema(spec);
      return [key, spec.fallback === undefined ? schema : v.optional(schema, spec.fallback)];
    }),
  );
}

/** A nested record (a build's gearing) with its fallbacks filled: it is always written whole. */
export function groupSchema<const C extends FieldCatalogue>(catalogue: C) {
  return record(createEntries(catalogue, {}));
}
