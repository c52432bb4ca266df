import type { Generated, Insertable, Selectable } from 'kysely';
import type { BATTERY_FIELDS } from '../core/catalogue/battery-fields';
import type { BUILD_FIELDS, GEARING_FIELDS } from '../core/catalogue/build-fields';
import type { CONTROLLER_FIELDS } from '../core/catalogue/controller-fields';
import type { CUSTOMER_FIELDS } from '../core/catalogue/customer-fields';
import type { FieldCatalogue, FieldSpec, FieldValue } from '../core/catalogue/field-spec';
import type { MOTOR_FIELDS } from '../core/catalogue/motor-fields';
import type { PROPELLER_FIELDS } from '../core/catalogue/propeller-fields';
import type { VEHICLE_FIELDS } from '../core/catalogue/vehicle-fields';
import type { ClassRule, RecordMeta, VehicleClass } from '../core/domain';

// Column names are camelCase, the same as the rigbook-fleet fields, so rows map to records
// without a renaming layer; Kysely quotes every identifier, which keeps this portable to
// PostgreSQL. Booleans are 0/1 integers and lists are JSON text, the common denominator.

// Part and build tables hold their kind's catalogue fields column for column (a build's gearing
// flattened into it), plus the bookkeeping; only booleans change type (0/1 integers), so the
// table types are read from the catalogues and cannot drift from them (tests/types checks the
// result, and a store test checks the migrated database against the catalogues). Enumerated text
// columns keep their union types: every write passes the service's schemas first.
interface Stamps {
  createdAt: string;
  updatedAt: string;
}

interface Meta extends RecordMeta, Stamps {}

/** The column a catalogue field is stored in: a flag as 0/1, a field added later still a column of its own. */
type ColumnOf<F extends FieldSpec> = F extends { type: 'flag' } ? (F extends { nullable: true } ? number | null : number) : FieldValue<F>;

/** The columns of a catalogue's fields; nested records and lists live in their own columns or tables. */
export type ColumnsOf<C extends FieldCatalogue> = { -readonly [K in keyof C as C[K] extends { type: 'group' | 'supplies' } ? never : K]-?: ColumnOf<C[K]> };

export interface BatteryTable extends Meta, ColumnsOf<typeof BATTERY_FIELDS> {}

export interface MotorTable extends Meta, ColumnsOf<typeof MOTOR_FIELDS> {}

export interface ControllerTable extends Meta, ColumnsOf<typeof CONTROLLER_FIELDS> {}

export interface PropellerTable extends Meta, ColumnsOf<typeof PROPELLER_FIELDS> {}

export interface VehicleTable extends Meta, ColumnsOf<typeof VEHICLE_FIELDS> {}

export interface ClassTable extends Meta, Omit<VehicleClass, keyof RecordMeta> {}
export interface CustomerTable extends Meta, ColumnsOf<typeof CUSTOMER_FIELDS> {}

export interface ClassRuleTable extends Omit<ClassRule, 'tightThreshold'>, Stamps {
  tightThreshold: number | null;
}

export interface BuildTable extends Meta, ColumnsOf<typeof BUILD_FIELDS>, ColumnsOf<typeof GEARING_FIELDS> {}

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
  /**
   * The checks that are not clear, `rule=status` pairs sorted by rule id and joined by commas
   * (`battery-continuous=over,motor-heat=tight`; '' when every check is clear). A rule judged in
   * several supplies reads its worst status. The builds list filters by check on it.
   */
  ruleStatuses: string;
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

/** One dated entry of a pack's log; flags are 0/1, the per-cell readings JSON text. */
export interface PackEventTable {
  id: string;
  batteryId: string;
  at: string;
  kind: string;
  mah: number | null;
  voltagePerCellV: number | null;
  cellResistancesOhm: string | null;
  temperatureC: number | null;
  capacityCheck: number;
  puffed: number;
  damaged: number;
  note: string;
  createdAt: string;
}

/** A telemetry log attached to one supply of a build: its summary, and its (thinned) samples as JSON. */
export interface RunLogTable {
  id: string;
  buildId: string;
  supplyId: string;
  name: string;
  recordedAt: string;
  importedAt: string;
  sampleCount: number;
  durationS: number | null;
  peakCurrentA: number | null;
  averageCurrentA: number | null;
  rmsCurrentA: number | null;
  minVoltageV: number | null;
  maxTemperatureC: number | null;
  usedMah: number | null;
  samples: string;
  mapping: string;
  note: string;
}

/** A job on one vehicle (core/work-order.ts); the verdict snapshots are JSON of VerdictSnapshot[]. */
export interface WorkOrderTable {
  id: string;
  version: number;
  vehicleId: string;
  customerId: string | null;
  complaint: string;
  status: 'open' | 'waiting-for-parts' | 'ready' | 'handed-over';
  openedAt: string;
  handedOverAt: string | null;
  signedOffBy: string;
  verdictsAtOpening: string;
  verdictsAtHandOver: string | null;
  createdAt: string;
  updatedAt: string;
}

/** One step of a work order; historyIds is JSON of the history entry ids it caused (a handful, read with the step). */
export interface WorkOrderStepTable {
  workOrderId: string;
  position: number;
  kind: 'checked' | 'part-swapped' | 're-geared' | 'tested' | 'note';
  text: string;
  reason: string;
  at: string;
  actor: string;
  historyIds: string;
}

export interface SettingTable {
  key: string;
  value: string;
}

export interface Db {
  customers: CustomerTable;
  batteries: BatteryTable;
  motors: MotorTable;
  controllers: ControllerTable;
  propellers: PropellerTable;
  vehicles: VehicleTable;
  classes: ClassTable;
  classRules: ClassRuleTable;
  builds: BuildTable;
  supplies: SupplyTable;
  supplyPacks: SupplyPackTable;
  verdicts: VerdictTable;
  history: HistoryTable;
  historyBuilds: HistoryBuildTable;
  historySelectors: HistorySelectorTable;
  settings: SettingTable;
  packEvents: PackEventTable;
  runLogs: RunLogTable;
  workOrders: WorkOrderTable;
  workOrderSteps: WorkOrderStepTable;
}

export type BuildRow = Selectable<BuildTable>;
export type NewVerdictRow = Insertable<VerdictTable>;
export type HistoryRow = Selectable<HistoryTable>;

/** The part tables that share one shape of repository. */
export type PartTableName = 'batteries' | 'motors' | 'controllers' | 'propellers' | 'vehicles' | 'classes' | 'classRules' | 'customers';
