import type { Build } from '../../core/domain';
import type { FleetKind } from './fleet-format';
import { FIELD_ORDER, GEARING_ORDER, SUPPLY_ORDER } from './fleet-schemas';

function pick(keys: readonly string[], from: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const key of keys) out[key] = from[key] === undefined ? null : from[key];
  return out;
}

/**
 * A record with exactly the file's fields in the file's order (bookkeeping such as createdAt
 * dropped), so an export is the same bytes whenever the records are the same.
 */
export function canonicalRecord(kind: FleetKind, record: object): Record<string, unknown> {
  const fields = pick(FIELD_ORDER[kind], record as Record<string, unknown>);
  if (kind === 'builds') {
    const build = record as Build;
    fields.gearing = pick(GEARING_ORDER, build.gearing as unknown as Record<string, unknown>);
    fields.supplies = build.supplies.map((s) => {
      const supply = pick(SUPPLY_ORDER, s as unknown as Record<string, unknown>);
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
