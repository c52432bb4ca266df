// Before → after of the fields a history entry changed, as short readable pairs.
import { FIGURES, isFigureKey } from '$core/catalogue/figures';
import { localDateTime } from '../format/date';

export interface FieldChange {
  field: string;
  before: string;
  after: string;
}

const SKIP = new Set(['version', 'updatedAt', 'createdAt', 'id']);

type NameOf = (id: string) => string;

const ISO_MOMENT = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/;

function show(value: unknown, key = '', nameOf?: NameOf): string {
  if (key === 'archivedAt' && value === null) return 'not archived';
  if (value === null || value === undefined) return 'empty';
  // Moments (archivedAt) in the reader's calendar and clock, as the timeline shows its own.
  if (key.endsWith('At') && typeof value === 'string' && ISO_MOMENT.test(value)) return localDateTime(value);
  if (nameOf && typeof value === 'string' && key.endsWith('Id')) return nameOf(value);
  if (typeof value === 'string') return value === '' ? 'empty' : value;
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  return JSON.stringify(value);
}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** Fields that differ; nested objects (gearing) are opened one level so each value shows. */
export function changedFieldsOf(before: unknown, after: unknown, nameOf?: NameOf): FieldChange[] {
  if (!isPlainObject(before) || !isPlainObject(after)) return [];
  const out: FieldChange[] = [];
  const keys = new Set([...Object.keys(before), ...Object.keys(after)]);
  for (const key of keys) {
    if (SKIP.has(key)) continue;
    const b = before[key];
    const a = after[key];
    if (JSON.stringify(b) === JSON.stringify(a)) continue;
    if (isPlainObject(b) && isPlainObject(a)) {
      for (const inner of changedFieldsOf(b, a, nameOf)) out.push({ ...inner, field: `${key}.${inner.field}` });
    } else if (key === 'limits' && Array.isArray(b) && Array.isArray(a)) {
      // A class's limits, as the Classes screen lists them.
      out.push({ field: key, before: limitsText(b), after: limitsText(a) });
    } else if (key === 'supplies' && Array.isArray(b) && Array.isArray(a)) {
      const bt = suppliesText(b, nameOf);
      const at = suppliesText(a, nameOf);
      // New supply ids with the same packs are not a change a person would notice.
      if (bt !== at) out.push({ field: key, before: bt, after: at });
    } else {
      out.push({ field: key, before: show(b, key, nameOf), after: show(a, key, nameOf) });
    }
  }
  return out;
}

function limitsText(list: unknown[]): string {
  const text = list
    .filter(isPlainObject)
    .map((l) => {
      const figure = String(l.figure);
      const label = isFigureKey(figure) ? FIGURES[figure].label : figure;
      return `${label} ≤ ${String(l.limit)} ${String(l.unit ?? '')}`.trim();
    })
    .join('; ');
  return text === '' ? 'none' : text;
}

function suppliesText(list: unknown[], nameOf: NameOf = (id) => id): string {
  return (
    list
      .map((s) => {
        if (!isPlainObject(s) || !Array.isArray(s.batteryIds)) return '?';
        return s.batteryIds.map((id) => nameOf(String(id))).join(s.arrangement === 'parallel' ? ' ∥ ' : ' + ');
      })
      .join('; ') || 'none'
  );
}
