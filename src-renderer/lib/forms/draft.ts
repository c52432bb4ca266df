import { displayUnit, fromDisplay, toDisplay, type UnitSystem } from '$core/units';
import { parseNumberText } from '$core/number-text';
import { editable, editableRounded } from '../format/number';
import { numberLocale } from '../format/number-locale.svelte';
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
      if (!def.quantity) return editable(scaled);
      const shown = toDisplay(scaled, def.quantity, system);
      // A converted value is rounded for people (4.33 in, not 4.33071); an untouched field is
      // never sent back, so the stored value keeps its precision.
      const decimals = inputDecimals(def, system);
      return decimals === null ? editable(shown) : editableRounded(shown, decimals);
    }
    default:
      return typeof value === 'string' ? value : value === null || value === undefined ? '' : String(value);
  }
}

/** A record's field by its form key: records are plain objects of their catalogue's fields. */
export function recordValue(record: object, key: string): unknown {
  return Object.getOwnPropertyDescriptor(record, key)?.value;
}

export function toDraft(fields: readonly FieldDef[], record: object | null, system: UnitSystem, defaults: Record<string, unknown> = {}): Draft {
  const draft: Draft = {};
  for (const f of fields) draft[f.key] = toDraftValue(f, record ? recordValue(record, f.key) : defaults[f.key], system);
  return draft;
}

/** Decimals a converted quantity is shown with in an input; null keeps six significant digits. */
function inputDecimals(def: FieldDef, system: UnitSystem): number | null {
  if (system === 'metric' || !def.quantity) return null;
  return def.inputDecimals ?? 2;
}

export type FieldReading = { ok: true; value: unknown } | { ok: false; message: string };

/** What one field's text means in stored units, or why it cannot be read (as the user typed it). */
export function readDraftValue(def: FieldDef, value: DraftValue, system: UnitSystem): FieldReading {
  if (def.type === 'flag') return { ok: true, value: value === true };
  const text = typeof value === 'string' ? value : String(value);
  if (def.type === 'select' && def.nullable && text === '') return { ok: true, value: null };
  if (def.type !== 'number' && def.type !== 'integer') return { ok: true, value: text };
  const parsed = parseNumberText(text, numberLocale.marks);
  if (parsed.kind === 'empty') return { ok: true, value: null };
  if (parsed.kind === 'refused') return { ok: false, message: parsed.message };
  const n = parsed.value;
  if (def.percent && n > 0 && n <= 1) {
    return { ok: false, message: `is typed in percent: ${editable(n)} here would mean ${editable(n)} %; for ${editable(n * 100)} % type ${editable(n * 100)}` };
  }
  const unscaled = n / (def.scale ?? 1);
  const stored = def.quantity ? fromDisplay(unscaled, def.quantity, system) : unscaled;
  // Scaling can leave float noise (0.0021 → 0.0020999...); twelve digits is far below any rating's precision.
  return { ok: true, value: def.type === 'integer' ? stored : Number(stored.toPrecision(12)) };
}

/**
 * The value to send for one field. Text that cannot be read is sent as typed, so the service
 * still refuses it by name; forms check every field with `draftProblems` before sending.
 */
export function fromDraftValue(def: FieldDef, value: DraftValue, system: UnitSystem): unknown {
  if (def.type === 'flag') return value === true;
  const text = typeof value === 'string' ? value : String(value);
  if (def.type === 'select' && def.nullable && text === '') return null;
  if (def.type === 'number' || def.type === 'integer') {
    const reading = readDraftValue(def, value, system);
    return reading.ok ? reading.value : text;
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

/** The unit a bound is said in: "%", "mm" or "in", "mΩ"; nothing for counts and plain ratios. */
function boundUnit(def: FieldDef, system: UnitSystem): string {
  if (def.percent) return ' %';
  const unit = fieldUnit(def, system);
  return unit === '' || unit === 'count' || unit === 'no unit' || unit === ':1' || unit === 'teeth' || unit === 'S' || unit === 'P' ? '' : ` ${unit}`;
}

/** A stored-unit bound in the units the field is typed in. */
function boundText(def: FieldDef, stored: number, system: UnitSystem): string {
  const scaled = stored * (def.scale ?? 1);
  const shown = def.quantity ? toDisplay(scaled, def.quantity, system) : scaled;
  return `${editable(shown)}${boundUnit(def, system)}`;
}

/** A schema issue, told in the field's own units: "must be 100 % or less", never "1 or less". */
export interface BoundIssue {
  type: string;
  message: string;
  requirement?: unknown;
  input?: unknown;
}

export function issueMessage(def: FieldDef, issue: BoundIssue, system: UnitSystem): string {
  const bound = typeof issue.requirement === 'number' ? boundText(def, issue.requirement, system) : null;
  if (bound !== null && issue.type === 'max_value') return `must be ${bound} or less`;
  if (bound !== null && issue.type === 'min_value') return `must be ${bound} or more`;
  if (bound !== null && issue.type === 'gt_value') return `must be greater than ${bound}`;
  if ((def.type === 'number' || def.type === 'integer') && (issue.input === null || issue.input === undefined)) return 'is required';
  return issue.message;
}

/** "Kv (rpm/V): must be …" for one field; "2 fields need attention: Kv (rpm/V), Drivetrain efficiency (%)." for more. */
export function problemSummary(problems: Readonly<Record<string, string>>, fields: readonly FieldDef[], system: UnitSystem, extra: Readonly<Record<string, string>> = {}): string {
  const names = Object.keys(problems).map((key) => {
    const def = fields.find((f) => f.key === key);
    return def ? fieldLabel(def, system) : (extra[key] ?? key);
  });
  const only = Object.values(problems);
  if (names.length === 1) return `${names[0]}: ${only[0]}`;
  return `${names.length} fields need attention: ${names.join(', ')}.`;
}
