import type { Generated, Insertable, Selectable } from 'kysely';
import type { Battery, ClassRule, Controller, DriveLayout, Motor, Propeller, RecordMeta, Vehicle, WaterType } from '../core/domain';

// Column names are camelCase, the same as the rigbook-fleet fields, so rows map to records
// without a renaming layer; Kysely quotes every identifier, which keeps this portable to
// PostgreSQL. Booleans are 0/1 integers and lists are JSON text, the common denominator.

// Part tables hold the domain records column for column, plus bookkeeping timestamps; only
// booleans change type (0/1 integers), so the table types are derived from the records and
// cannot drift from them. Enumerated text columns keep their union types: every write passes
// the service's schemas first.
interface Stamps {
  createdAt: string;
  updatedAt: string;
}

interface Meta extends RecordMeta, Stamps {}

export interface BatteryTable extends Omit<Battery, 'retired'>, Stamps {
  retired: number;
}

export interface MotorTable extends Motor, Stamps {}

export interface ControllerTable extends Controller, Stamps {}

export interface PropellerTable extends Omit<Propeller, 'maxRpm'>, Stamps {
  maxRpm: number | null;
}

export interface VehicleTable extends Omit<Vehicle, 'driveLayout' | 'drivenWeightShare' | 'water'>, Stamps {
  driveLayout: DriveLayout | null;
  drivenWeightShare: number | null;
  water: WaterType | null;
}

export interface ClassRuleTable extends Omit<ClassRule, 'tightThreshold'>, Stamps {
  tightThreshold: number | null;
}

export interface BuildTable extends Meta {
  name: string;
  vehicleId: string;
  motorId: string | null;
  motorCount: number;
  controllerId: string | null;
  propellerId: string | null;
  pinionTeeth: number | null;
  spurTeeth: number | null;
  internalRatio: number;
  tireDiameterMm: number | null;
  drivetrainEfficiency: number;
  measuredPeakCurrentA: number | null;
  measuredAverageCurrentA: number | null;
  measuredSupplyId: string | null;
  runLengthS: number | null;
  tightThreshold: number | null;
}

export interface SupplyTable {
  id: string;
  buildId: string;
  position: number;
  arrangement: string;
}

export interface SupplyPackTable {
  supplyId: string;
  position: number;
  batteryId: string;
}

/**
 * The stored verdict of one build: its status, each supply's status and the key figures for
 * the list. The findings themselves are evaluated afresh when a sheet is opened (the inputs
 * are the same, so they agree), which keeps a 10 000-build re-check's writes small.
 */
export interface VerdictTable {
  buildId: string;
  status: string;
  supplyVoltageFullV: number | null;
  theoreticalSpeedKmh: number | null;
  peakCurrentA: number | null;
  /** The tightest current limit the peak current is checked against, for the list. */
  peakCurrentLimitA: number | null;
  /** The rule whose check gave the list's current and limit (null: no current check had both). */
  currentRule: string | null;
  /** Whether that current came from the model or from a measured log. */
  currentSource: string | null;
  /** `supplyId=status` pairs joined by commas: cheap to compare on a re-check without parsing JSON. */
  supplyStatuses: string;
  /** When this row last changed: a re-check that finds the same verdict and figures writes nothing. */
  evaluatedAt: string;
}

export interface HistoryTable {
  id: Generated<number>;
  at: string;
  actor: string;
  action: string;
  entityKind: string;
  entityId: string;
  summary: string;
  reason: string;
  /** JSON of the record before the write; null for a create. */
  before: string | null;
  after: string | null;
  /** JSON: VerdictChange[] */
  verdictChanges: string;
}

/**
 * Builds a history entry names one by one: the builds whose verdict it changed, and the builds
 * of a write that named its builds by id. Builds merely re-checked through a part, a class or
 * the whole fleet are kept as that selector instead (historySelectors), not one row each.
 */
export interface HistoryBuildTable {
  historyId: number;
  buildId: string;
}

/**
 * The selector that named the builds a history entry re-checked, resolved when a build's
 * timeline is read: `part` (partKind = table, target = part id), `class` (target = class name)
 * or `all`. An `any` selector is stored as one row per alternative.
 */
export interface HistorySelectorTable {
  historyId: number;
  selects: 'part' | 'class' | 'all';
  /** The part table for `part`; '' otherwise. */
  partKind: string;
  /** The part id or the class name; '' for `all`. */
  target: string;
}

export interface SettingTable {
  key: string;
  value: string;
}

export interface Db {
  batteries: BatteryTable;
  motors: MotorTable;
  controllers: ControllerTable;
  propellers: PropellerTable;
  vehicles: VehicleTable;
  classRules: ClassRuleTable;
  builds: BuildTable;
  supplies: SupplyTable;
  supplyPacks: SupplyPackTable;
  verdicts: VerdictTable;
  history: HistoryTable;
  historyBuilds: HistoryBuildTable;
  historySelectors: HistorySelectorTable;
  settings: SettingTable;
}

export type BuildRow = Selectable<BuildTable>;
export type NewVerdictRow = Insertable<VerdictTable>;
export type HistoryRow = Selectable<HistoryTable>;

/** The part tables that share one shape of repository. */
export type PartTableName = 'batteries' | 'motors' | 'controllers' | 'propellers' | 'vehicles' | 'classRules';
