// What a merge changes in records already stored, field by field, and which of those changes
// look like a file damaged on its way through a spreadsheet rather than an edit: a number
// scaled by 100 or more, or moved outside the range such a part plausibly has. A spreadsheet
// set to a locale that writes the comma as the decimal mark reads 0.008 as 8 (the point groups
// thousands there), and the record would be saved a thousand times off with no word.

import { FIELD_PREFIXES, fieldAt } from '../../core/catalogue/record-kinds';
import { fieldLabel } from '../../core/field-labels';
import { canonicalRecord } from './canonical-record';
import { KIND_WORDS, type FleetKind } from './fleet-format';

export interface FieldChange {
  /** The field's path in the record: `resistanceOhm`, `gearing.pinionTeeth`. */
  field: string;
  /** The field in the user's words. */
  label: string;
  before: unknown;
  after: unknown;
  /** Why this change needs confirming, or null. */
  suspect: string | null;
}

export interface RecordChange {
  kind: FleetKind;
  id: string;
  name: string;
  fields: FieldChange[];
}

/** A change this many times larger or smaller is taken for a unit or locale slip. */
export const SUSPECT_FACTOR = 100;

/** The likely cause, said with every change that needs confirming. */
export const LIKELY_CAUSE = 'a spreadsheet set to a locale that uses the comma as the decimal mark reads 0.008 as 8 and 1.5 as 15 (the point groups thousands there), or a unit slip (mΩ for Ω, g for kg)';

/** The engine's name for one record of each kind: the prefix of its field paths. */
const SINGULAR: Readonly<Record<FleetKind, string>> = { ...FIELD_PREFIXES, classes: 'class', classRules: 'classRule', workOrders: 'workOrder' };

/** The field's path as the catalogues and the engine name it: `motor.kv`, `gearing.pinionTeeth`. */
function pathOf(kind: FleetKind, field: string): string {
  return field.startsWith('gearing.') ? field : `${SINGULAR[kind]}.${field}`;
}

function labelOf(kind: FleetKind, field: string): string {
  const key = pathOf(kind, field);
  const label = fieldLabel(key);
  return label === key ? field : `${label} (${field})`;
}

/** Flattens a canonical record one level (`gearing.pinionTeeth`); lists compare as a whole. */
function flat(kind: FleetKind, record: object): Map<string, unknown> {
  const out = new Map<string, unknown>();
  for (const [key, value] of Object.entries(canonicalRecord(kind, record))) {
    if (key === 'version') continue;
    if (value !== null && typeof value === 'object' && !Array.isArray(value)) {
      for (const [inner, v] of Object.entries(value)) out.set(`${key}.${inner}`, v);
    } else out.set(key, value);
  }
  return out;
}

function same(a: unknown, b: unknown): boolean {
  return a === b || JSON.stringify(a) === JSON.stringify(b);
}

/** Why a change of one number needs confirming, or null. */
export function suspectReason(kind: FleetKind, field: string, before: unknown, after: unknown): string | null {
  if (typeof after !== 'number' || !Number.isFinite(after)) return null;
  if (typeof before === 'number' && Number.isFinite(before) && before !== 0 && after !== 0 && Math.sign(before) === Math.sign(after)) {
    const factor = Math.max(Math.abs(after / before), Math.abs(before / after));
    if (factor >= SUSPECT_FACTOR * (1 - 1e-9)) return `${after > before ? 'grows' : 'shrinks'} by a factor of ${Number(factor.toPrecision(3))}`;
  }
  // Ranges wide enough for every electric RC part from micro to large scale, in the file's
  // units (each field's `typical` in its catalogue): outside them a value is far more likely a slip than a part.
  const range = fieldAt(pathOf(kind, field))?.typical;
  if (range && (after < range[0] || after > range[1])) {
    const inside = typeof before !== 'number' || (before >= range[0] && before <= range[1]);
    if (inside) return `is outside the range such a part plausibly has (${range[0]} to ${range[1]})`;
  }
  return null;
}

/** Every field of a stored record that the file's record changes, before → after. */
export function recordChange(kind: FleetKind, stored: object, incoming: object): RecordChange {
  const before = flat(kind, stored);
  const after = flat(kind, incoming);
  const fields: FieldChange[] = [];
  for (const [field, value] of after) {
    const old = before.get(field) ?? null;
    if (same(old, value)) continue;
    fields.push({ field, label: labelOf(kind, field), before: old, after: value, suspect: suspectReason(kind, field, old, value) });
  }
  const named = incoming as { id: string; name?: string; className?: string; ruleId?: string };
  return { kind, id: named.id, name: named.name ?? `${named.className ?? ''} ${named.ruleId ?? ''}`.trim(), fields };
}

function shown(value: unknown): string {
  if (value === null || value === undefined) return 'not known';
  return JSON.stringify(value);
}

/** `resistanceOhm: 0.008 → 8` */
export function fieldChangeText(change: FieldChange): string {
  return `${change.field}: ${shown(change.before)} → ${shown(change.after)}`;
}

/** The refusal of one suspect change: record, field, both values, and the likely cause. */
export function suspectMessage(record: RecordChange, change: FieldChange): string {
  return `${KIND_WORDS[record.kind].one} "${record.name}" [${record.id}]: ${change.label} would change from ${shown(change.before)} to ${shown(change.after)}, which ${change.suspect}. The likely cause is ${LIKELY_CAUSE}. Nothing was written; check the file, or confirm the change (--accept-changes on the command line).`;
}
