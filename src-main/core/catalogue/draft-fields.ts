import { BATTERY_FIELDS } from './battery-fields';
import { CONTROLLER_FIELDS } from './controller-fields';
import type { FieldCatalogue } from './field-spec';
import { MOTOR_FIELDS } from './motor-fields';
import { PROPELLER_FIELDS } from './propeller-fields';

// A draft part is one typed in on the spot to try against a build before it is owned. It asks
// only for what the checks read: the name, every field whose absence an incomplete verdict
// names (`need`), and the few the engine reads without naming them when missing. Everything
// else (notes, cycles, retired, blades) takes the catalogue's fallback, so a draft is always a
// whole record once the fallbacks are filled.

export const DRAFT_KINDS = ['batteries', 'motors', 'controllers', 'propellers'] as const;
export type DraftKind = (typeof DRAFT_KINDS)[number];

export const DRAFT_CATALOGUES = {
  batteries: BATTERY_FIELDS,
  motors: MOTOR_FIELDS,
  controllers: CONTROLLER_FIELDS,
  propellers: PROPELLER_FIELDS,
} as const satisfies Record<DraftKind, FieldCatalogue>;

/**
 * Fields the engine reads that carry no `need`: when empty they fall back to something else
 * rather than make a check incomplete (a controller's cell count stands in for its voltage;
 * a propeller's rpm limit tightens the tip-speed check only where given).
 */
const READ_WITHOUT_NEED: { readonly [K in DraftKind]: readonly (keyof (typeof DRAFT_CATALOGUES)[K] & string)[] } = {
  // A multirotor's or plane's all-up mass counts its packs: without a pack's mass thrust-to-weight reads incomplete.
  batteries: ['massKg'],
  // Without a rated heat loss, the heat check takes a rule of thumb on the motor's mass.
  motors: ['massKg'],
  controllers: ['maxCells'],
  propellers: ['maxRpm'],
};

export type DraftFieldKey<K extends DraftKind> = keyof (typeof DRAFT_CATALOGUES)[K] & string;

/** The keys of a draft part of this kind, in the catalogue's order (the name first). */
export function draftFieldKeys<K extends DraftKind>(kind: K): DraftFieldKey<K>[] {
  const catalogue: FieldCatalogue = DRAFT_CATALOGUES[kind];
  const extra: readonly string[] = READ_WITHOUT_NEED[kind];
  return Object.entries(catalogue)
    .filter(([key, spec]) => spec.type === 'name' || spec.need !== undefined || extra.includes(key))
    .map(([key]) => key as DraftFieldKey<K>);
}

export function isDraftKind(kind: string): kind is DraftKind {
  return (DRAFT_KINDS as readonly string[]).includes(kind);
}
