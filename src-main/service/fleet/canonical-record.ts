import type { Build } from '../../core/domain';
import type { FleetKind } from './fleet-format';
import { FIELD_ORDER, GEARING_ORDER, SUPPLY_ORDER } from './fleet-schemas';

function pick(keys: readonly string[], from: object): Record<string, unknown> {
  const values = new Map(Object.entries(from));
  const out: Record<string, unknown> = {};
  for (const key of keys) out[key] = values.get(key) ?? null;
  return out;
}

/**
 * A record with exactly the file's fields in the file's order (bookkeeping such as createdAt
 * dropped), so an export is the same bytes whenever the records are the same.
 */
export function canonicalRecord(kind: FleetKind, record: object): Record<string, unknown> {
  const fields = pick(FIELD_ORDER[kind], record);
  if (kind === 'builds') {
    const build = record as Build;
    fields.gearing = pick(GEARING_ORDER, build.gearing);
    fields.supplies = build.supplies.map((s) => {
      const supply = pick(SUPPLY_ORDER, s);
      supply.batteryIds = [...s.batteryIds];
      return supply;
    });
  }
  return fields;
}

/** Whether a record's fields differ from the stored one's; the version is the store's business. */
export function sameFields(kind: FleetKind, a: object, b: object): boolean {
  const left = canonicalRecord(kind, a);
  const right = canonicalRecord(kind, b);
  delete left.version;
  delete right.version;
  return JSON.stringify(left) === JSON.stringify(right);
}
