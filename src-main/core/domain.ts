// The domain records as the store keeps them and the rigbook-fleet file carries them.
// Units live in the field names (mAh, mm, V, A, W, kg) so that a record read from the store,
// a row of an import file and the input of the evaluation are the same shape; the physics
// converts to SI on the way in.

import type { Figures } from './catalogue/figures';

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

export interface Battery extends RecordMeta {
  name: string;
  chemistry: Chemistry;
  cellsSeries: number;
  cellsParallel: number;
  capacityMah: number;
  /** Continuous C rating as printed by the maker. */
  cRatingContinuous: number | null;
  cRatingBurst: number | null;
  /** Per-cell internal resistance as measured (ohm); null where never measured. */
  cellResistanceOhm: number | null;
  massKg: number | null;
  cycleCount: number;
  retired: boolean;
}

export interface Motor extends RecordMeta {
  name: string;
  /** rpm per volt, no-load, the trade's usual convention. */
  kv: number;
  /** Winding (phase-to-phase) resistance in ohm. */
  resistanceOhm: number | null;
  noLoadCurrentA: number | null;
  maxCurrentA: number | null;
  maxPowerW: number | null;
  maxVoltageV: number | null;
  maxRpm: number | null;
  poles: number | null;
  massKg: number | null;
}

export interface Controller extends RecordMeta {
  name: string;
  /** Maximum input voltage; where only a cell count is rated it is converted at 4.2 V per cell. */
  maxVoltageV: number | null;
  maxCells: number | null;
  continuousCurrentA: number | null;
  burstCurrentA: number | null;
  resistanceOhm: number | null;
  massKg: number | null;
}

export interface Propeller extends RecordMeta {
  name: string;
  diameterMm: number;
  pitchMm: number | null;
  blades: number;
  /** Thrust coefficient C_T in T = C_T·ρ·n²·D⁴ (n in rev/s). */
  thrustCoefficient: number | null;
  /** Power coefficient C_P in P = C_P·ρ·n³·D⁵. */
  powerCoefficient: number | null;
  /** The maker's rpm limit (often printed as a constant ÷ diameter); null where none is published. */
  maxRpm?: number | null;
}

export interface Vehicle extends RecordMeta {
  name: string;
  kind: VehicleKind;
  massKg: number | null;
  /** Drag area C_d·A in m². */
  dragAreaM2: number | null;
  rollingCoefficient: number | null;
  tractionCoefficient: number | null;
  /** Cars and trucks: 4WD or 2WD; null reads as 4WD (all the weight on driven wheels, the high-current side). */
  driveLayout?: DriveLayout | null;
  /** Share of the weight on the driven wheels, 0 to 1; null takes the layout's default. */
  drivenWeightShare?: number | null;
  /** Boats: fresh or sea water; null reads as sea water (the denser, the high-current side). */
  water?: WaterType | null;
  owner: string;
  className: string;
}

export interface Supply {
  id: string;
  arrangement: Arrangement;
  /** Packs in this supply, in order; one id for a single pack. */
  batteryIds: string[];
}

export interface Gearing {
  pinionTeeth: number | null;
  spurTeeth: number | null;
  /** Gearbox or transmission ratio after the spur; 1 where there is none. */
  internalRatio: number;
  tireDiameterMm: number | null;
  /** Drivetrain efficiency, 0 to 1. */
  drivetrainEfficiency: number;
}

export interface Build extends RecordMeta {
  name: string;
  vehicleId: string;
  motorId: string | null;
  motorCount: number;
  controllerId: string | null;
  propellerId: string | null;
  gearing: Gearing;
  supplies: Supply[];
  /** Measured currents override the model where recorded, on the supply they were measured on. */
  measuredPeakCurrentA: number | null;
  measuredAverageCurrentA: number | null;
  /**
   * The supply the measured currents were logged on; null with one supply means that one.
   * With several supplies and none named, the measurements are not used (the sheet says so).
   */
  measuredSupplyId?: string | null;
  /** Length of the full-throttle run the continuous current is judged over, s; null takes the default. */
  runLengthS?: number | null;
  /** Margin under which a rule reads `tight`; null takes the class's or the default 0.15. */
  tightThreshold: number | null;
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
  /** The pack a per-pack rule (battery-continuous, battery-burst, pack-retired) is about: the worst one. */
  batteryId?: string;
}

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
}

export interface BuildVerdict {
  buildId: string;
  status: Status;
  supplies: SupplyVerdict[];
}

export const DEFAULT_TIGHT_THRESHOLD = 0.15;
