import { storedLabel, type FieldCatalogue } from '$core/catalogue/field-spec';
import { FIELD_CATALOGUES } from '$core/catalogue/record-kinds';

// Plain names for the fields a history entry lists, read from the field catalogues. Values in
// history are stored units, so the unit named is the stored one (mm, kg, Ω, 0–1 for a fraction),
// not the display preference.

/** Fields of the bookkeeping and the settings, which no catalogue lists. */
const OTHER: Readonly<Record<string, string>> = {
  archivedAt: 'Archived',
  units: 'Units',
  demoOffered: 'Demo offered',
};

function namesOf(catalogue: FieldCatalogue, prefix = ''): [string, string][] {
  return Object.entries(catalogue).flatMap(([key, spec]): [string, string][] => (spec.type === 'group' && spec.fields ? namesOf(spec.fields, `${prefix}${key}.`) : [[`${prefix}${key}`, storedLabel(spec)]]));
}

const BY_KIND = new Map<string, ReadonlyMap<string, string>>(Object.entries(FIELD_CATALOGUES).map(([kind, catalogue]) => [kind, new Map(namesOf(catalogue))]));

/** Kinds without a catalogue of their own (class rules) borrow the first name any catalogue gives a field. */
const ANY_KIND = new Map<string, string>([...BY_KIND.values()].reverse().flatMap((names) => [...names]));

export function historyFieldName(entityKind: string, field: string): string {
  return (BY_KIND.get(entityKind) ?? ANY_KIND).get(field) ?? OTHER[field] ?? field;
}
