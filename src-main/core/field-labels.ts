// Plain words for the inputs a finding can lack, so an incomplete verdict tells a technician
// what to fill in. Messages carry the words only; the field paths stay in a finding's
// `missing` list, which the screens turn into links to the field itself. A typed field's words
// are its catalogue entry's `need`.

import { allFields } from './catalogue/record-kinds';

// Paths a finding can name that are not a field a user types.
const OTHER_WORDS: Readonly<Record<string, string>> = {
  'supply.batteryIds': 'packs that exist in the records',
  'classRule.limit': 'a class limit above zero',
  'classRule.figure': 'a figure Rigbook computes',
  'figure.notApplicable': 'a figure this kind of vehicle has',
};

function collect(): ReadonlyMap<string, string> {
  const out = new Map<string, string>(Object.entries(OTHER_WORDS));
  for (const [path, spec] of allFields()) if (spec.need) out.set(path, spec.need);
  return out;
}

const LABELS = collect();

export function fieldLabel(field: string): string {
  return LABELS.get(field) ?? field;
}

/** "the motor Kv and the pack capacity"; a path without words is named as "an input Rigbook needs". */
export function describeMissing(fields: readonly string[]): string {
  const parts = [...new Set(fields.map((f) => LABELS.get(f) ?? 'an input Rigbook needs'))];
  if (parts.length <= 1) return parts[0] ?? 'inputs that are out of range';
  return `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}
