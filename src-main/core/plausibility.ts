// Bounds past anything a hobby part has, read from the field catalogues. Used by the engine
// (an implausible stored value counts as missing) and by the service's schemas (it is refused
// at the edge), so the command line, imports and forms agree. The bounds catch typing slips and
// unit mix-ups (ohm typed for milliohm, a percentage for a fraction); they are not engineering limits.

import { allFields, type PathWith } from './catalogue/record-kinds';
import type { FieldSpec, Plausible } from './catalogue/field-spec';

export interface PlausibleRange extends Plausible {
  /** The field's label, in the user's words. */
  readonly label: string;
  readonly unit: string;
}

export type PlausibleField = PathWith<{ plausible: Plausible }>;

/** A field's plausible range with the words its refusal needs; null for a field without one. */
export function rangeOf(spec: FieldSpec): PlausibleRange | null {
  return spec.plausible ? { ...spec.plausible, label: spec.plausible.label ?? spec.label, unit: spec.unit ?? '' } : null;
}

function collect(): ReadonlyMap<string, PlausibleRange> {
  const out = new Map<string, PlausibleRange>();
  for (const [path, spec] of allFields()) {
    const range = rangeOf(spec);
    if (range) out.set(path, range);
  }
  return out;
}

const RANGES = collect();

/** The plausible range of a field; every `PlausibleField` has one. */
export function plausibleRange(field: PlausibleField): PlausibleRange {
  const r = RANGES.get(field);
  if (!r) throw new Error(`${field} has no plausible range`);
  return r;
}

/** True where the value lies inside the field's plausible range. */
export function isPlausible(field: PlausibleField, x: number): boolean {
  const r = plausibleRange(field);
  if (!Number.isFinite(x) || x > r.max) return false;
  if (r.above !== undefined && !(x > r.above)) return false;
  if (r.min !== undefined && x < r.min) return false;
  return true;
}

/** "Kv must be from 10 to 100000 rpm/V (hobby motors lie in this range)". */
export function plausibleMessage(field: PlausibleField): string {
  return rangeMessage(plausibleRange(field));
}

/** The refusal of a value outside a plausible range, naming the field and saying why. */
export function rangeMessage(r: PlausibleRange): string {
  const unit = r.unit ? ` ${r.unit}` : '';
  const range = r.above !== undefined ? `above ${r.above}${unit} and at most ${r.max}${unit}` : `from ${r.min ?? 0} to ${r.max}${unit}`;
  return `${r.label} must be ${range} (${r.why})`;
}
