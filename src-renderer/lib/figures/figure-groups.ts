import type { Figures, VehicleKind } from '$core/domain';
import type { DisplayQuantity, UnitSystem } from '$core/units';
import { MISSING, fixed } from '../format/number';
import { displayUnit, toDisplay } from '$core/units';
import { thrustAsMass } from '../format/units';

export interface FigureDef {
  key: string;
  label: string;
  /** A unit that reads the same in both systems (V, A, W, rpm). */
  unit?: string;
  /** A quantity shown in the user's system (km/h or mph, mm or in). */
  quantity?: DisplayQuantity;
  decimals: number;
  /** Decimals in imperial units where they differ (a rollout of 1.30 in, not 1.3). */
  imperialDecimals?: number;
  /** Stored value × scale is shown (ohm → milliohm). */
  scale?: number;
  hint?: string;
  /** Shown only where the figure has a value (it belongs to some builds only). */
  optional?: true;
  /** A second reading beside the figure: thrust as the mass it lifts (g or oz). */
  alt?: 'thrustMass';
}

export interface FigureGroup {
  id: 'supply' | 'motor' | 'drivetrain' | 'propeller';
  title: string;
  figures: readonly FigureDef[];
}

export const SUPPLY_FIGURES: FigureGroup = {
  id: 'supply',
  title: 'Supply',
  figures: [
    { key: 'packVoltageNominalV', label: 'Nominal voltage', unit: 'V', decimals: 1 },
    { key: 'packVoltageFullV', label: 'Full-charge voltage', unit: 'V', decimals: 2 },
    { key: 'packVoltageCutoffV', label: 'Cut-off voltage', unit: 'V', decimals: 1 },
    { key: 'capacityMah', label: 'Capacity', unit: 'mAh', decimals: 0 },
    { key: 'packResistanceOhm', label: 'Pack resistance', unit: 'mΩ', scale: 1000, decimals: 1 },
    { key: 'loadedVoltageV', label: 'Voltage at peak current, full charge', unit: 'V', decimals: 2 },
    { key: 'peakCurrentA', label: 'Peak current, full charge', unit: 'A', decimals: 1, hint: 'model at full charge, or as measured' },
    { key: 'continuousCurrentA', label: 'Continuous current, full charge', unit: 'A', decimals: 1, hint: 'model at full charge, or as measured; cars and trucks: the larger of the run RMS and the steady current' },
    { key: 'runRmsCurrentA', label: 'RMS current over the run, full charge', unit: 'A', decimals: 1, optional: true },
    { key: 'runAverageCurrentA', label: 'Average current over the run, full charge', unit: 'A', decimals: 1, optional: true },
    { key: 'steadyCurrentA', label: 'Steady current at top speed, full charge', unit: 'A', decimals: 1, optional: true },
    { key: 'peakPowerW', label: 'Peak power, full charge', unit: 'W', decimals: 0, optional: true },
    { key: 'peakPowerNoSagW', label: 'Peak power, full charge, assuming no sag', unit: 'W', decimals: 0, hint: 'pack resistance not measured', optional: true },
  ],
};

export const MOTOR_FIGURES: FigureGroup = {
  id: 'motor',
  title: 'Motor',
  figures: [
    { key: 'noLoadRpm', label: 'No-load speed, nominal', unit: 'rpm', decimals: 0, hint: 'Kv × nominal supply voltage' },
    { key: 'noLoadRpmFull', label: 'No-load speed, full charge', unit: 'rpm', decimals: 0 },
    { key: 'loadedRpm', label: 'Loaded speed, nominal', unit: 'rpm', decimals: 0, hint: 'at the loaded top speed on nominal voltage' },
    { key: 'torqueConstantNmPerA', label: 'Torque constant Kt', unit: 'N·m/A', decimals: 4, hint: '60 ÷ (2π · Kv)' },
    { key: 'motorPeakCurrentA', label: 'Peak current per motor, full charge', unit: 'A', decimals: 1 },
    { key: 'motorContinuousCurrentA', label: 'Continuous current per motor, full charge', unit: 'A', decimals: 1 },
    { key: 'motorPeakPowerW', label: 'Peak power per motor, full charge', unit: 'W', decimals: 0 },
  ],
};

export const DRIVETRAIN_FIGURES: FigureGroup = {
  id: 'drivetrain',
  title: 'Drivetrain',
  figures: [
    { key: 'finalDriveRatio', label: 'Final drive ratio', unit: ':1', decimals: 2, hint: 'spur ÷ pinion × internal ratio' },
    { key: 'rolloutMm', label: 'Rollout', quantity: 'lengthMm', decimals: 1, imperialDecimals: 2, hint: 'distance per motor turn' },
    { key: 'theoreticalSpeedKmh', label: 'Theoretical speed, nominal', quantity: 'speedKmh', decimals: 1, hint: 'at nominal no-load speed, no slip' },
    { key: 'loadedTopSpeedKmh', label: 'Loaded top speed, nominal', quantity: 'speedKmh', decimals: 1, hint: 'where motor torque meets road load' },
    { key: 'runLengthS', label: 'Run length', unit: 's', decimals: 1, hint: 'full throttle from standstill', optional: true },
    { key: 'drivenWeightShare', label: 'Weight on driven wheels', unit: '%', scale: 100, decimals: 0, optional: true },
  ],
};

export const PROPELLER_FIGURES: FigureGroup = {
  id: 'propeller',
  title: 'Propeller',
  figures: [
    { key: 'finalDriveRatio', label: 'Gear ratio', unit: ':1', decimals: 2, hint: 'motor turns per propeller turn' },
    { key: 'pitchSpeedKmh', label: 'Pitch speed, nominal', quantity: 'speedKmh', decimals: 1, hint: 'pitch × propeller rev/s at nominal no-load speed', optional: true },
    { key: 'thrustN', label: 'Static thrust, full charge', quantity: 'forceN', decimals: 1, alt: 'thrustMass', hint: 'all motors together; in brackets the mass it holds up' },
    { key: 'propellerRpmStatic', label: 'Propeller speed, static, full charge', unit: 'rpm', decimals: 0, optional: true },
    { key: 'propellerRpmUnloaded', label: 'Propeller speed, unloaded, full charge', unit: 'rpm', decimals: 0, hint: 'the highest it can reach, as it unloads on the move', optional: true },
    { key: 'tipSpeedStaticMps', label: 'Tip speed, static, full charge', quantity: 'speedMps', decimals: 0, optional: true },
    { key: 'tipSpeedMps', label: 'Tip speed, unloaded, full charge', quantity: 'speedMps', decimals: 0, hint: 'the highest rpm the propeller reaches; judged against the limit' },
    { key: 'tipSpeedLimitMps', label: 'Tip speed limit', quantity: 'speedMps', decimals: 0, optional: true },
    { key: 'fluidDensityKgM3', label: 'Water or air density', unit: 'kg/m³', decimals: 1, optional: true },
  ],
};

const GROUND: readonly VehicleKind[] = ['car', 'truck'];

/** Supply, motor, then drivetrain for cars and trucks or propeller for the rest. */
export function figureGroupsFor(kind: VehicleKind | null): FigureGroup[] {
  const third = kind === null ? null : GROUND.includes(kind) ? DRIVETRAIN_FIGURES : PROPELLER_FIGURES;
  return third ? [SUPPLY_FIGURES, MOTOR_FIGURES, third] : [SUPPLY_FIGURES, MOTOR_FIGURES, DRIVETRAIN_FIGURES, PROPELLER_FIGURES];
}

export function figureUnit(def: FigureDef, system: UnitSystem): string {
  return def.quantity ? displayUnit(def.quantity, system) : (def.unit ?? '');
}

/** The figure's number alone, in display units; an en dash where the figure is missing. */
export function figureNumber(def: FigureDef, figures: Figures | null | undefined, system: UnitSystem): string {
  const raw = figures?.[def.key];
  if (typeof raw !== 'number' || !Number.isFinite(raw)) return MISSING;
  const scaled = raw * (def.scale ?? 1);
  const shown = def.quantity ? toDisplay(scaled, def.quantity, system) : scaled;
  return fixed(shown, system === 'imperial' ? (def.imperialDecimals ?? def.decimals) : def.decimals);
}

/** The second reading of a figure ("1 254 g" beside the thrust in newtons), or null. */
export function figureAlt(def: FigureDef, figures: Figures | null | undefined, system: UnitSystem): string | null {
  const raw = figures?.[def.key];
  if (def.alt !== 'thrustMass' || typeof raw !== 'number' || !Number.isFinite(raw)) return null;
  return thrustAsMass(raw, system);
}

export function figureText(def: FigureDef, figures: Figures | null | undefined, system: UnitSystem): string {
  const n = figureNumber(def, figures, system);
  if (n === MISSING) return n;
  const unit = figureUnit(def, system);
  const alt = figureAlt(def, figures, system);
  return unit === ':1' ? `${n}:1` : `${n} ${unit}${alt ? ` (${alt})` : ''}`;
}
