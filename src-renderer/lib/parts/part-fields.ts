import { BATTERY_FIELDS } from '$core/catalogue/battery-fields';
import { CONTROLLER_FIELDS } from '$core/catalogue/controller-fields';
import type { FieldCatalogue } from '$core/catalogue/field-spec';
import { MOTOR_FIELDS } from '$core/catalogue/motor-fields';
import { PROPELLER_FIELDS } from '$core/catalogue/propeller-fields';
import { FIELD_CATALOGUES } from '$core/catalogue/record-kinds';
import { VEHICLE_FIELDS } from '$core/catalogue/vehicle-fields';
import type { DisplayQuantity } from '$core/units';
import { formField } from '../forms/catalogue-field';
import type { PartTable } from './part-kinds';

// The form fields of each record kind, read from the core's field catalogues, in the order a
// technician reads a spec sheet. Every number field names its unit; quantities with a
// metric/imperial pair follow the settings.

export type FieldType = 'text' | 'number' | 'integer' | 'select' | 'flag' | 'notes';

export interface FieldDef {
  key: string;
  label: string;
  type: FieldType;
  /** Unit that reads the same in both systems. */
  unit?: string;
  /** Quantity shown in the user's unit system. */
  quantity?: DisplayQuantity;
  /** Shown value = stored value × scale (ohm shown as milliohm, ratio shown as percent). */
  scale?: number;
  /**
   * Typed and checked as a percentage (stored as a fraction, scale 100): bounds read "100 %",
   * and a value from 0 to 1 is refused as a fraction typed by habit.
   */
  percent?: boolean;
  /** Decimals of a converted (imperial) value in the input; 2 unless said. */
  inputDecimals?: number;
  options?: readonly string[];
  optionLabels?: Readonly<Record<string, string>>;
  hint?: string;
  /** Empty means null (not known); otherwise empty is sent and the service names the field. */
  nullable?: boolean;
  /** Placeholder of an empty optional field; "not known" unless said. */
  emptyText?: string;
  /** Shown in the parts table. */
  column?: boolean;
}

export const CHEMISTRY_LABELS: Readonly<Record<string, string>> = { lipo: 'LiPo', lihv: 'LiHV', lifepo4: 'LiFePO4', liion: 'Li-ion', nimh: 'NiMH' };
export const KIND_LABELS: Readonly<Record<string, string>> = { car: 'Car', truck: 'Truck', boat: 'Boat', multirotor: 'Multirotor', plane: 'Plane' };
export const DRIVE_LAYOUT_LABELS: Readonly<Record<string, string>> = { '': 'not recorded (taken as 4WD)', '4wd': '4WD (all wheels driven)', '2wd': '2WD (one axle driven)' };
export const WATER_LABELS: Readonly<Record<string, string>> = { '': 'not recorded (taken as sea water)', fresh: 'Fresh water', sea: 'Sea water' };
export const SURFACE_LABELS: Readonly<Record<string, string>> = { '': 'not recorded (the grippiest, dirt and grass rolling)', asphalt: 'Asphalt', carpet: 'Carpet', dirt: 'Dirt', grass: 'Grass' };

/** What the parts table shows of each kind, besides every field on the form. */
const COLUMNS: Readonly<Record<PartTable, readonly string[]>> = {
  batteries: ['name', 'chemistry', 'cellsSeries', 'cellsParallel', 'capacityMah', 'cRatingContinuous', 'cRatingBurst', 'cycleCount'],
  motors: ['name', 'kv', 'resistanceOhm', 'noLoadCurrentA', 'maxCurrentA', 'maxPowerW'],
  controllers: ['name', 'maxVoltageV', 'maxCells', 'continuousCurrentA', 'burstCurrentA'],
  propellers: ['name', 'diameterMm', 'pitchMm', 'blades', 'thrustCoefficient', 'powerCoefficient'],
  vehicles: ['name', 'kind', 'customerId', 'className', 'massKg'],
};

const OPTION_LABELS: Readonly<Record<string, Readonly<Record<string, string>>>> = {
  chemistry: CHEMISTRY_LABELS,
  kind: KIND_LABELS,
  driveLayout: DRIVE_LAYOUT_LABELS,
  water: WATER_LABELS,
  surface: SURFACE_LABELS,
};

/**
 * A vehicle's form reads who and what before the physics; the file keeps the catalogue's order.
 * Every field has its place: one missing here (or one too many) does not compile.
 */
const VEHICLE_FORM_PLACES = {
  name: 1,
  kind: 2,
  customerId: 3,
  className: 4,
  massKg: 5,
  surface: 6,
  dragAreaM2: 7,
  rollingCoefficient: 8,
  tractionCoefficient: 9,
  typicalValuesConfirmed: 10,
  driveLayout: 11,
  drivenWeightShare: 12,
  water: 13,
  notes: 14,
} as const satisfies Record<keyof typeof VEHICLE_FIELDS, number>;

const VEHICLE_FORM_ORDER = Object.entries(VEHICLE_FORM_PLACES)
  .sort(([, a], [, b]) => a - b)
  .map(([key]) => key);

function formFields(table: PartTable, order: readonly string[]): FieldDef[] {
  const catalogue: FieldCatalogue = FIELD_CATALOGUES[table];
  return order.flatMap((key) => {
    const spec = catalogue[key];
    const optionLabels = OPTION_LABELS[key];
    return spec ? [formField(key, spec, { ...(optionLabels ? { optionLabels } : {}), ...(COLUMNS[table].includes(key) ? { column: true } : {}) })] : [];
  });
}

export const PART_FIELDS: Readonly<Record<PartTable, readonly FieldDef[]>> = {
  batteries: formFields('batteries', Object.keys(BATTERY_FIELDS)),
  motors: formFields('motors', Object.keys(MOTOR_FIELDS)),
  controllers: formFields('controllers', Object.keys(CONTROLLER_FIELDS)),
  propellers: formFields('propellers', Object.keys(PROPELLER_FIELDS)),
  vehicles: formFields('vehicles', VEHICLE_FORM_ORDER),
};

export function fieldOf(table: PartTable, key: string): FieldDef | undefined {
  return PART_FIELDS[table].find((f) => f.key === key);
}
