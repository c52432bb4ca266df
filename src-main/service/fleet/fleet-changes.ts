// What a merge changes in records already stored, field by field, and which of those changes
// look like a file damaged on its way through a spreadsheet rather than an edit: a number
// scaled by 100 or more, or moved outside the range such a part plausibly has. A spreadsheet
// set to a locale that writes the comma as the decimal mark reads 0.008 as 8 (the point groups
// thousands there), and the record would be saved a thousand times off with no word.

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
export const LIKELY_CAUSE =
  'a spreadsheet set to a locale that uses the comma as the decimal mark reads 0.008 as 8 and 1.5 as 15 (the point groups thousands there), or a unit slip (mΩ for Ω, g for kg)';

/**
 * Ranges wide enough for every electric RC part from micro to large scale, in the file's
 * units: outside them a value is far more likely a slip than a part. From common practice,
 * from memory: pack cells measure 0.2–50 mΩ, motor windings 1 mΩ to a few Ω, controllers
 * under 50 mΩ.
 */
const PLAUSIBLE: Readonly<Partial<Record<FleetKind, Readonly<Record<string, readonly [number, number]>>>>> = {
  batteries: { capacityMah: [20, 100_000], cRatingContinuous: [0.5, 300], cRatingBurst: [0.5, 600], cellResistanceOhm: [0.0001, 0.1], massKg: [0.003, 30] },
  motors: { kv: [20, 100_000], resistanceOhm: [0.0003, 5], noLoadCurrentA: [0.01, 30], maxCurrentA: [0.5, 2000], maxPowerW: [1, 100_000], maxVoltageV: [1, 400], maxRpm: [500, 300_000], massKg: [0.001, 30] },
  controllers: { maxVoltageV: [2, 400], continuousCurrentA: [0.5, 2000], burstCurrentA: [0.5, 5000], resistanceOhm: [0, 0.05], massKg: [0.001, 10] },
  propellers: { diameterMm: [10, 3000], pitchMm: [5, 3000], thrustCoefficient: [0.005, 1], powerCoefficient: [0.002, 1] },
  vehicles: { massKg: [0.01, 500], dragAreaM2: [0.0001, 5], rollingCoefficient: [0, 0.5], tractionCoefficient: [0.05, 3] },
  builds: { measuredPeakCurrentA: [0.1, 5000], measuredAverageCurrentA: [0.1, 5000], 'gearing.tireDiameterMm': [10, 1000] },
};

const SINGULAR: Readonly<Record<FleetKind, string>> = {
  batteries: 'battery',
  motors: 'motor',
  controllers: 'controller',
  propellers: 'propeller',
  vehicles: 'vehicle',
  classRules: 'classRule',
  builds: 'build',
};

function labelOf(kind: FleetKind, field: string): string {
  const key = field.startsWith('gearing.') ? field : `${SINGULAR[kind]}.${field}`;
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
  const range = PLAUSIBLE[kind]?.[field];
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
