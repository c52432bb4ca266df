import { CHEMISTRIES, DRIVE_LAYOUTS, VEHICLE_KINDS, WATER_TYPES } from '$core/domain';
import type { DisplayQuantity } from '$core/units';
import type { PartTable } from './part-kinds';

// The form fields of each record kind, in the order a technician reads a spec sheet. Every
// number field names its unit; quantities with a metric/imperial pair follow the settings.

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

const NAME: FieldDef = { key: 'name', label: 'Name', type: 'text', column: true };
// Packs, motors and controllers are weighed in grams or ounces, vehicles in kilograms or pounds.
const MASS: FieldDef = { key: 'massKg', label: 'Mass', type: 'number', quantity: 'massSmallKg', inputDecimals: 1, nullable: true };
const VEHICLE_MASS: FieldDef = { key: 'massKg', label: 'Mass', type: 'number', quantity: 'massKg', nullable: true };
const NOTES: FieldDef = { key: 'notes', label: 'Notes', type: 'notes' };

export const PART_FIELDS: Readonly<Record<PartTable, readonly FieldDef[]>> = {
  batteries: [
    NAME,
    { key: 'chemistry', label: 'Chemistry', type: 'select', options: CHEMISTRIES, optionLabels: CHEMISTRY_LABELS, column: true },
    { key: 'cellsSeries', label: 'Cells in series', unit: 'S', type: 'integer', column: true },
    { key: 'cellsParallel', label: 'Cells in parallel', unit: 'P', type: 'integer' },
    { key: 'capacityMah', label: 'Capacity', unit: 'mAh', type: 'number', column: true },
    { key: 'cRatingContinuous', label: 'Continuous C rating', unit: 'C', type: 'number', nullable: true, column: true, hint: 'as printed by the maker' },
    { key: 'cRatingBurst', label: 'Burst C rating', unit: 'C', type: 'number', nullable: true, column: true },
    { key: 'cellResistanceOhm', label: 'Cell resistance, measured', unit: 'mΩ', scale: 1000, type: 'number', nullable: true, hint: 'per cell; leave empty if never measured' },
    MASS,
    { key: 'cycleCount', label: 'Cycles', unit: 'count', type: 'integer', column: true },
    { key: 'retired', label: 'Retired (no longer used in new builds)', type: 'flag' },
    NOTES,
  ],
  motors: [
    NAME,
    { key: 'kv', label: 'Kv', unit: 'rpm/V', type: 'number', column: true, hint: 'rpm per volt, no-load' },
    { key: 'resistanceOhm', label: 'Winding resistance', unit: 'mΩ', scale: 1000, type: 'number', nullable: true, column: true, hint: 'phase to phase' },
    { key: 'noLoadCurrentA', label: 'No-load current', unit: 'A', type: 'number', nullable: true, column: true },
    { key: 'maxCurrentA', label: 'Rated current', unit: 'A', type: 'number', nullable: true, column: true },
    { key: 'maxPowerW', label: 'Rated power', unit: 'W', type: 'number', nullable: true, column: true },
    { key: 'maxVoltageV', label: 'Rated voltage', unit: 'V', type: 'number', nullable: true },
    { key: 'maxRpm', label: 'Rated speed', unit: 'rpm', type: 'number', nullable: true },
    { key: 'poles', label: 'Poles', unit: 'count', type: 'integer', nullable: true },
    MASS,
    NOTES,
  ],
  controllers: [
    NAME,
    { key: 'maxVoltageV', label: 'Maximum input voltage', unit: 'V', type: 'number', nullable: true, column: true },
    { key: 'maxCells', label: 'Maximum cells', unit: 'S', type: 'integer', nullable: true, column: true, hint: 'used at 4.2 V per cell when no voltage is given' },
    { key: 'continuousCurrentA', label: 'Continuous current', unit: 'A', type: 'number', nullable: true, column: true },
    { key: 'burstCurrentA', label: 'Burst current', unit: 'A', type: 'number', nullable: true, column: true },
    { key: 'resistanceOhm', label: 'Own resistance', unit: 'mΩ', scale: 1000, type: 'number', nullable: true },
    MASS,
    NOTES,
  ],
  propellers: [
    NAME,
    { key: 'diameterMm', label: 'Diameter', quantity: 'lengthMm', type: 'number', column: true },
    { key: 'pitchMm', label: 'Pitch', quantity: 'lengthMm', type: 'number', nullable: true, column: true },
    { key: 'blades', label: 'Blades', unit: 'count', type: 'integer', column: true },
    { key: 'thrustCoefficient', label: 'Thrust coefficient C_T', unit: 'no unit', type: 'number', nullable: true, column: true, hint: 'T = C_T·ρ·n²·D⁴ (n in rev/s). Static values of small 2-blade propellers are typically 0.08–0.15 (from memory); take it from the maker\'s data or published propeller test tables.' },
    { key: 'powerCoefficient', label: 'Power coefficient C_P', unit: 'no unit', type: 'number', nullable: true, column: true, hint: 'P = C_P·ρ·n³·D⁵ (n in rev/s). Static values are typically 0.03–0.08, higher for high-pitch propellers (from memory); from the same tables as C_T.' },
    { key: 'maxRpm', label: 'Propeller rpm limit', unit: 'rpm', type: 'number', nullable: true, hint: "the maker's limit, often printed as a constant ÷ diameter; leave empty if none" },
    NOTES,
  ],
  vehicles: [
    NAME,
    { key: 'kind', label: 'Kind', type: 'select', options: VEHICLE_KINDS, optionLabels: KIND_LABELS, column: true },
    { key: 'owner', label: 'Owner', type: 'text', column: true },
    { key: 'className', label: 'Class', type: 'text', column: true },
    { ...VEHICLE_MASS, column: true },
    {
      key: 'dragAreaM2',
      label: 'Drag area Cd·A',
      quantity: 'areaM2',
      inputDecimals: 4,
      type: 'number',
      nullable: true,
      hint: 'Drag coefficient × frontal area. A 1/10 car or truck is about 0.02–0.06 m² (0.2–0.65 ft²): Cd near 0.8–1.0 for a boxy body times its frontal area (from memory).',
    },
    {
      key: 'rollingCoefficient',
      label: 'Rolling coefficient C_rr',
      unit: 'no unit',
      type: 'number',
      nullable: true,
      hint: 'Rolling resistance ÷ weight. About 0.02–0.04 for rubber tyres on pavement or carpet, 0.05–0.1 on dirt or grass (from memory).',
    },
    {
      key: 'tractionCoefficient',
      label: 'Traction coefficient μ',
      unit: 'no unit',
      type: 'number',
      nullable: true,
      hint: 'Grip: the most drive force ÷ weight before the tyres spin. About 0.7–1.0 on pavement or carpet, 0.4–0.7 on loose dirt (from memory). It sets the launch current, so round up.',
    },
    { key: 'driveLayout', label: 'Drive', type: 'select', options: ['', ...DRIVE_LAYOUTS], optionLabels: DRIVE_LAYOUT_LABELS, nullable: true, hint: 'cars and trucks' },
    { key: 'drivenWeightShare', label: 'Weight on driven wheels', unit: '%', scale: 100, percent: true, type: 'number', nullable: true, emptyText: '4WD 100 %, 2WD 70 %', hint: 'share of the weight on the driven wheels' },
    { key: 'water', label: 'Water', type: 'select', options: ['', ...WATER_TYPES], optionLabels: WATER_LABELS, nullable: true, hint: 'boats: sea water (1025 kg/m³) loads a propeller more than fresh' },
    NOTES,
  ],
};

export function fieldOf(table: PartTable, key: string): FieldDef | undefined {
  return PART_FIELDS[table].find((f) => f.key === key);
}
