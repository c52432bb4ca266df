import { displayUnit, fromDisplay, toDisplay, type UnitSystem } from '../../../src-main/core/units';
import { editable } from '../format/number';
import type { FieldDef } from '../parts/part-fields';

// A form's draft holds what the user typed, as text, so nothing is lost when a save fails.
// Conversions to and from the stored units happen only here.

export type DraftValue = string | boolean;
export type Draft = Record<string, DraftValue>;

export function fieldUnit(def: Pick<FieldDef, 'unit' | 'quantity'>, system: UnitSystem): string {
  if (def.quantity) return displayUnit(def.quantity, system);
  return def.unit ?? '';
}

/** "Capacity (mAh)", "Diameter (in)": every field says its unit. */
export function fieldLabel(def: Pick<FieldDef, 'label' | 'unit' | 'quantity'>, system: UnitSystem): string {
  const unit = fieldUnit(def, system);
  return unit === '' ? def.label : `${def.label} (${unit})`;
}

export function toDraftValue(def: FieldDef, value: unknown, system: UnitSystem): DraftValue {
  switch (def.type) {
    case 'flag':
      return value === true;
    case 'number':
    case 'integer': {
      if (typeof value !== 'number' || !Number.isFinite(value)) return '';
      const scaled = value * (def.scale ?? 1);
      return editable(def.quantity ? toDisplay(scaled, def.quantity, system) : scaled);
    }
    default:
      return typeof value === 'string' ? value : value === null || value === undefined ? '' : String(value);
  }
}

export function toDraft(fields: readonly FieldDef[], record: Record<string, unknown> | null, system: UnitSystem, defaults: Record<string, unknown> = {}): Draft {
  const draft: Draft = {};
  for (const f of fields) draft[f.key] = toDraftValue(f, record ? record[f.key] : defaults[f.key], system);
  return draft;
}

/**
 * The value to send for one field. Text that is not a number is sent as typed, so the service
 * names the field in its message rather than the form guessing.
 */
export function fromDraftValue(def: FieldDef, value: DraftValue, system: UnitSystem): unknown {
  if (def.type === 'flag') return value === true;
  const text = typeof value === 'string' ? value : String(value);
  if (def.type === 'select' && def.nullable && text === '') return null;
  if (def.type === 'number' || def.type === 'integer') {
    const trimmed = text.trim().replace(',', '.');
    if (trimmed === '') return null;
    const n = Number(trimmed);
    if (!Number.isFinite(n)) return text;
    const unscaled = n / (def.scale ?? 1);
    const stored = def.quantity ? fromDisplay(unscaled, def.quantity, system) : unscaled;
    // Scaling can leave float noise (0.0021 → 0.0020999...); twelve digits is far below any rating's precision.
    return def.type === 'integer' ? stored : Number(stored.toPrecision(12));
  }
  return text;
}

/** Every field, for a create. */
export function draftToRecord(fields: readonly FieldDef[], draft: Draft, system: UnitSystem): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const f of fields) out[f.key] = fromDraftValue(f, draft[f.key] ?? '', system);
  return out;
}

/** Only the fields the user changed, for an update: untouched values are never rewritten by rounding. */
export function draftChanges(fields: readonly FieldDef[], draft: Draft, base: Draft, system: UnitSystem): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const f of fields) {
    if (draft[f.key] !== base[f.key]) out[f.key] = fromDraftValue(f, draft[f.key] ?? '', system);
  }
  return out;
}

/**
 * The form field a service error names: `changes.capacityMah` and `part.changes.kv` become
 * `capacityMah` and `kv`; nested paths (`gearing.pinionTeeth`) are kept.
 */
export function errorFieldKey(field: string | undefined): string | null {
  if (field === undefined || field === '') return null;
  return field.replace(/^(build\.|part\.)?changes\./, '');
}

/** The message without its leading field path, for showing beside the field itself. */
export function messageForField(message: string, field: string | undefined): string {
  if (!field) return message;
  const prefix = `${field}: `;
  return message.startsWith(prefix) ? message.slice(prefix.length) : message;
}
