// The domain records as the store keeps them and the rigbook-fleet file carries them.
// Units live in the field names (mAh, mm, V, A, W, kg) so that a record read from the store,
// a row of an import file and the input of the evaluation are the same shape; the physics
// converts to SI on the way in.

import type { BATTERY_FIELDS } from './catalogue/battery-fields';
import type { CUSTOMER_FIELDS } from './catalogue/customer-fields';
import type { BUILD_FIELDS, GEARING_FIELDS } from './catalogue/build-fields';
import type { CONTROLLER_FIELDS } from './catalogue/controller-fields';
import type { RecordOf } from './catalogue/field-spec';
import type { MOTOR_FIELDS } from './catalogue/motor-fields';
import type { PROPELLER_FIELDS } from './catalogue/propeller-fields';
import type { VEHICLE_FIELDS } from './catalogue/vehicle-fields';
import type { FigureKey, Figures } from './catalogue/figures';
import type { HealthProblem } from './pack-log';

export type { Figures };

export const CHEMISTRIES = ['lipo', 'lihv', 'lifepo4', 'liion', 'nimh'] as const;
export type Chemistry = (typeof CHEMISTRIES)[number];

export const VEHICLE_KINDS = ['car', 'truck', 'boat', 'multirotor', 'plane'] as const;
export type VehicleKind = (typeof VEHICLE_KINDS)[number];

/**
 * Worst first: the order a build's overall verdict is taken in. A check that cannot be made
 * is worse news than a known small margin, so incomplete ranks above tight.
 */
export const STATUSES = ['over', 'incomplete', 'tight', 'clear'] as const;
export type Status = (typeof STATUSES)[number];

export const ARRANGEMENTS = ['series', 'parallel'] as const;

/** Which wheels are driven: all of them, or one axle. */
export const DRIVE_LAYOUTS = ['4wd', '2wd'] as const;
export type DriveLayout = (typeof DRIVE_LAYOUTS)[number];

export const WATER_TYPES = ['fresh', 'sea'] as const;
export type WaterType = (typeof WATER_TYPES)[number];

/** What a car or truck runs on: it sets the typical rolling coefficient and grip. */
export const SURFACES = ['asphalt', 'carpet', 'dirt', 'grass'] as const;
export type Surface = (typeof SURFACES)[number];
export type Arrangement = (typeof ARRANGEMENTS)[number];

/** Fields every stored, editable record carries. */
export interface RecordMeta {
  id: string;
  /** Bumped on every write; an update naming an older version is refused as a conflict. */
  version: number;
  /** ISO time; null while the record is in use. Archived records stay for history. */
  archivedAt: string | null;
  notes: string;
}

// The records of each kind are their field catalogue's fields (core/catalogue/), so a field
// added there is a field of the record everywhere; read the catalogue for units and meanings.
export interface Battery extends RecordMeta, RecordOf<typeof BATTERY_FIELDS> {}

export interface Motor extends RecordMeta, RecordOf<typeof MOTOR_FIELDS> {}

export interface Controller extends RecordMeta, RecordOf<typeof CONTROLLER_FIELDS> {}

export interface Propeller extends RecordMeta, RecordOf<typeof PROPELLER_FIELDS> {}

export interface Vehicle extends RecordMeta, RecordOf<typeof VEHICLE_FIELDS> {}

/** A customer of the shop (core/catalogue/customer-fields.ts). */
export interface Customer extends RecordMeta, RecordOf<typeof CUSTOMER_FIELDS> {}

export interface Supply {
  id: string;
  arrangement: Arrangement;
  /** Packs in this supply, in order; one id for a single pack. */
  batteryIds: string[];
}

export type Gearing = RecordOf<typeof GEARING_FIELDS>;

export interface Build extends RecordMeta, RecordOf<typeof BUILD_FIELDS> {}

/**
 * A racing class or a shop's policy: a name and notes. Vehicles of the class and the class's
 * limits (ClassRule) name it by its name, so a file or a history entry written before classes
 * were records still reads the same.
 */
export interface VehicleClass extends RecordMeta {
  name: string;
}

/** A class or shop limit of the same shape as a built-in rule: a figure that must stay at or under a limit. */
export interface ClassRule extends RecordMeta {
  className: string;
  /** Rule id shown in findings, e.g. `class-voltage`; must not clash with built-in ids. */
  ruleId: string;
  /** Key of the figure the limit applies to (a key of Figures). */
  figure: string;
  limit: number;
  unit: string;
  /** The class's tight threshold; a build's own threshold wins, the largest of the class's rules applies. */
  tightThreshold?: number | null;
}

/** Everything the evaluation needs for one build, resolved from the store or a fleet file. */
export interface BuildContext {
  build: Build;
  vehicle: Vehicle | null;
  motor: Motor | null;
  controller: Controller | null;
  propeller: Propeller | null;
  /** Packs by id, for the supplies; a missing id makes that supply incomplete. */
  batteries: ReadonlyMap<string, Battery>;
  classRules: readonly ClassRule[];
  /** The threshold to use when neither build nor class sets one. */
  defaultTightThreshold: number;
  /** Health problems read from the packs' logs, by pack id (core/pack-log.ts); none where left out. */
  packHealth?: ReadonlyMap<string, readonly HealthProblem[]>;
}

export interface Finding {
  rule: string;
  status: Status;
  value: number | null;
  limit: number | null;
  unit: string;
  /** (limit − value) ÷ limit; null when incomplete. */
  margin: number | null;
  message: string;
  /** Inputs that were missing, for `incomplete`. */
  missing?: string[];
  /** Which current was used: the model's or the measured one. */
  source?: 'model' | 'measured';
  /** Unmeasured inputs the model took as zero (pack or controller resistance): reads currents on the high side. */
  assumed?: string[];
  /** The pack a per-pack rule (battery-continuous, battery-burst, pack-retired, pack-health) is about: the worst one. */
  batteryId?: string;
  /** Typical or estimated inputs the figure rests on (field paths), while the user has not confirmed them. */
  typical?: string[];
}

/** An input the user left empty and the engine took from a table or estimated. */
export interface ValueUsed {
  /** Field path: `vehicle.dragAreaM2`, `propeller.powerCoefficient`. */
  field: string;
  value: number;
  /** Typical for the kind, estimated from geometry, or a rule of thumb standing in for a rating (a limit, not an input). */
  basis: 'typical' | 'estimated' | 'rule-of-thumb';
  /** For an estimated value, how it was estimated. */
  method?: PropellerEstimateMethod;
}

/** How a propeller's empty coefficients are estimated: an air propeller's, or a boat's at the bollard point. */
export type PropellerEstimateMethod = 'air-blade-element' | 'water-b-series';

/** One pack's part of a supply's current, as judged. */
export interface PackShare {
  batteryId: string;
  name: string;
  /** Fraction of the supply current this pack is taken to carry (1 for packs in series). */
  share: number;
  /** True where the share is the pessimistic bound because a resistance is not measured. */
  bound: boolean;
  continuousA: number | null;
  peakA: number | null;
  continuousLimitA: number | null;
  burstLimitA: number | null;
}

export interface SupplyVerdict {
  supplyId: string;
  batteryIds: string[];
  status: Status;
  figures: Figures;
  findings: Finding[];
  /** Each pack's share of the current, in supply order. */
  packShares: PackShare[];
  /** What the model assumed where it had to (plain sentences, for the sheet). */
  assumptions: string[];
  /** Inputs taken as typical or estimated values (absent where none was). */
  valuesUsed?: ValueUsed[];
  /** Figures that rest on those values, marked so on the sheet (absent where none does). */
  markedFigures?: FigureKey[];
}

export interface BuildVerdict {
  buildId: string;
  status: Status;
  supplies: SupplyVerdict[];
}

export const DEFAULT_TIGHT_THRESHOLD = 0.15;
