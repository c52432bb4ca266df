import type { FieldSpec } from './field-spec';

// Fields several record kinds share, so they read alike on every form.

export const NAME = { type: 'name', label: 'Name' } as const satisfies FieldSpec;

export const NOTES = { type: 'notes', label: 'Notes', fallback: '' } as const satisfies FieldSpec;

/** Packs, motors and controllers are weighed in grams or ounces (vehicles in kilograms or pounds). */
export const PART_MASS = {
  type: 'number',
  label: 'Mass',
  unit: 'kg',
  quantity: 'massSmallKg',
  entry: { inputDecimals: 1 },
  nullable: true,
  fallback: null,
  bounds: { above: 0, max: 1000 },
} as const satisfies FieldSpec;
