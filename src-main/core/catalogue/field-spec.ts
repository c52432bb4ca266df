import type { Supply } from '../domain';
import type { DisplayQuantity } from '../units';

// What one field of a record is, said once: the domain types, the service's schemas, the CSV
// columns, the forms, the missing-input words, the history names and the import guard are all
// read from these entries, so a field added here reaches every one of them (and the compiler
// points at whatever still has to be written by hand: the migration, the store's table type).

export type FieldType =
  /** Free text; `maxLength` bounds it. */
  | 'text'
  /** A record's name: trimmed, required, at most 120 characters. */
  | 'name'
  /** Free notes, at most 4000 characters. */
  | 'notes'
  | 'number'
  | 'integer'
  /** One of `options`. */
  | 'choice'
  | 'flag'
  /** The id of another record. */
  | 'ref'
  /** A nested record of its own fields (a build's gearing). */
  | 'group'
  /** A build's supplies, edited by their own editor. */
  | 'supplies';

export interface Bounds {
  /** Lowest accepted value; `above` makes the lower bound exclusive. */
  readonly min?: number;
  readonly above?: number;
  readonly max: number;
}

/**
 * Bounds past anything a hobby part has. The engine treats a stored value outside them as
 * missing and the service refuses it with `why`, so the forms, imports and the command line agree.
 */
export interface Plausible extends Bounds {
  readonly why: string;
  /** The field's name in the refusal where the form's label says more than fits there. */
  readonly label?: string;
}

/** How a number is typed when it is typed in another scale than it is stored in (milliohm, percent). */
export interface Entry {
  readonly unit?: string;
  /** Typed value = stored value × scale. */
  readonly scale?: number;
  /** Typed and checked as a percentage of a stored fraction; a value from 0 to 1 is refused as a fraction typed by habit. */
  readonly percent?: boolean;
  /** Decimals of a converted (imperial) value in the input; 2 unless said. */
  readonly inputDecimals?: number;
  /** Placeholder of an empty optional field; "not known" unless said. */
  readonly emptyText?: string;
}

export interface FieldSpec {
  readonly type: FieldType;
  /** The field's label on forms, in the user's words. */
  readonly label: string;
  /** What an incomplete verdict asks for when the field is missing: "the motor Kv". */
  readonly need?: string;
  /** The stored unit, as the field's name says it ('' or absent for none). */
  readonly unit?: string;
  /** Shown and typed in the user's unit system (the stored unit is `unit`). */
  readonly quantity?: DisplayQuantity;
  readonly hint?: string;
  /** null is "not known". */
  readonly nullable?: boolean;
  /** The value a new record takes when the field is left out; a field without one is required. */
  readonly fallback?: string | number | boolean | null | Readonly<Record<string, never>> | readonly never[];
  /** Added after the first file version: a record read from an older file may lack it. */
  readonly optional?: boolean;
  /** Bounds against typing slips, refused at the edge; not engineering limits. */
  readonly bounds?: Bounds;
  readonly plausible?: Plausible;
  /**
   * Where every electric RC part from micro to large scale lies (common practice, from memory):
   * an import that moves a stored value outside it asks to be confirmed, as a likely slip.
   */
  readonly typical?: readonly [number, number];
  readonly options?: readonly string[];
  readonly maxLength?: number;
  readonly entry?: Entry;
  /** The fields of a `group`. */
  readonly fields?: FieldCatalogue;
}

export type FieldCatalogue = Readonly<Record<string, FieldSpec>>;

type ValueOf<F extends FieldSpec> = F extends { type: 'number' | 'integer' }
  ? number
  : F extends { type: 'flag' }
    ? boolean
    : F extends { type: 'choice'; options: readonly (infer O extends string)[] }
      ? O
      : F extends { type: 'group'; fields: infer C extends FieldCatalogue }
        ? RecordOf<C>
        : F extends { type: 'supplies' }
          ? Supply[]
          : string;

/** The value a field holds in a record. */
export type FieldValue<F extends FieldSpec> = F extends { nullable: true } ? ValueOf<F> | null : ValueOf<F>;

type RequiredKeys<C extends FieldCatalogue> = { [K in keyof C]: C[K] extends { optional: true } ? never : K }[keyof C];
type OptionalKeys<C extends FieldCatalogue> = { [K in keyof C]: C[K] extends { optional: true } ? K : never }[keyof C];

/** A record of a catalogue's fields, as the store keeps it and a fleet file carries it. */
export type RecordOf<C extends FieldCatalogue> = { -readonly [K in RequiredKeys<C>]: FieldValue<C[K]> } & {
  -readonly [K in OptionalKeys<C>]?: FieldValue<C[K]>;
};

/** The field's label with its stored unit, as history lists stored values: "Tyre diameter (mm)". */
export function storedLabel(spec: FieldSpec): string {
  const unit = spec.entry?.percent ? '0–1' : (spec.unit ?? '');
  return unit === '' ? spec.label : `${spec.label} (${unit})`;
}
