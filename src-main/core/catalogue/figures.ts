// The figure catalogue: every number a supply's verdict carries, what it is and how it reads.
// The Figures type, the build sheet's figure tables, class rules' sentences and the command
// line's summary all come from here, so a figure added here shows everywhere and a figure
// missing from here does not compile.

import type { DisplayQuantity } from '../units';

/** Where along the power path a figure sits, from the packs to what the vehicle does. */
export const FIGURE_STAGES = ['supply', 'controller', 'motor', 'drive', 'output'] as const;
export type FigureStage = (typeof FIGURE_STAGES)[number];

/** The physical quantity a figure measures. */
export type FigureQuantity = 'count' | 'motor-constant' | 'voltage' | 'current' | 'power' | 'resistance' | 'charge' | 'rotation' | 'torque-constant' | 'ratio' | 'length' | 'speed' | 'force' | 'density' | 'time' | 'fraction';

/** The pack state a figure is worked out at; null where the pack voltage does not enter. */
export type FigureCharge = 'nominal' | 'full' | 'cutoff' | null;

/** For currents and powers: the short peak or the sustained value; null for other figures. */
export type FigureSpan = 'peak' | 'continuous' | null;

/**
 * How the figure is obtained: arithmetic on the records alone, the first-order model, the
 * model unless a logged current replaces it, or an input the model takes as given (recorded
 * or its default).
 */
export type FigureOrigin = 'records' | 'model' | 'model-or-measured' | 'input';

/** The vehicles a figure exists for: every build, cars and trucks, or propeller builds. */
export type FigureApplies = 'all' | 'ground' | 'propeller';

export interface FigureSpec {
  /** Unit of the value as the figures carry it, and as a class rule's limit is written. */
  readonly unit: string;
  readonly quantity: FigureQuantity;
  /** Shown in the user's unit system (km/h or mph, mm or in); absent where the unit reads the same everywhere. */
  readonly display?: DisplayQuantity;
  /** Shown as value × scale in another unit (ohm as milliohm, a share as a percentage). */
  readonly shown?: { readonly unit: string; readonly scale: number };
  readonly decimals: number;
  /** Decimals in imperial units where they differ (a rollout of 1.30 in, not 1.3). */
  readonly imperialDecimals?: number;
  /** The figure in a sentence ("Peak current is 96 A ..."). */
  readonly name: string;
  /** The figure's row on the build sheet, saying what it is (nominal or full charge). */
  readonly label: string;
  readonly hint?: string;
  /** How the figure reads on a propeller build, where it means something else. */
  readonly asPropeller?: { readonly label: string; readonly hint: string };
  readonly stage: FigureStage;
  readonly applies: FigureApplies;
  readonly charge: FigureCharge;
  readonly span: FigureSpan;
  readonly origin: FigureOrigin;
  /** Listed on the sheet only where it has a value: it belongs to some builds only. */
  readonly optional?: true;
  /** Not listed on the sheet: charted instead, or an input the sheet already shows with its part. */
  readonly unlisted?: true;
  /** A second reading beside the figure: thrust as the mass it holds up. */
  readonly alt?: 'thrustMass';
}

// Order matters: the build sheet lists each stage's figures in this order.
const CATALOGUE = {
  packVoltageNominalV: {
    unit: 'V',
    quantity: 'voltage',
    decimals: 1,
    name: 'Nominal supply voltage',
    label: 'Nominal voltage',
    stage: 'supply',
    applies: 'all',
    charge: 'nominal',
    span: null,
    origin: 'records',
  },
  packVoltageFullV: {
    unit: 'V',
    quantity: 'voltage',
    decimals: 2,
    name: 'Full-charge supply voltage',
    label: 'Full-charge voltage',
    stage: 'supply',
    applies: 'all',
    charge: 'full',
    span: null,
    origin: 'records',
  },
  packVoltageCutoffV: {
    unit: 'V',
    quantity: 'voltage',
    decimals: 1,
    name: 'Cut-off supply voltage',
    label: 'Cut-off voltage',
    stage: 'supply',
    applies: 'all',
    charge: 'cutoff',
    span: null,
    origin: 'records',
  },
  capacityMah: {
    unit: 'mAh',
    quantity: 'charge',
    decimals: 0,
    name: 'Supply capacity',
    label: 'Capacity',
    stage: 'supply',
    applies: 'all',
    charge: null,
    span: null,
    origin: 'records',
  },
  // Inputs repeated as figures so a class can limit them (a 2S class, a 21.5-turn motor's Kv, a
  // spec pinion); the sheet shows them with their parts, so they are not listed again.
  seriesCells: {
    unit: 'S',
    quantity: 'count',
    decimals: 0,
    name: 'Cells in series',
    label: 'Cells in series',
    stage: 'supply',
    applies: 'all',
    charge: null,
    span: null,
    origin: 'records',
    unlisted: true,
  },
  packResistanceOhm: {
    unit: 'Ω',
    quantity: 'resistance',
    shown: { unit: 'mΩ', scale: 1000 },
    decimals: 1,
    name: 'Supply resistance',
    label: 'Pack resistance',
    stage: 'supply',
    applies: 'all',
    charge: null,
    span: null,
    origin: 'records',
  },
  loadedVoltageV: {
    unit: 'V',
    quantity: 'voltage',
    decimals: 2,
    name: 'Loaded supply voltage',
    label: 'Voltage at peak current, full charge',
    stage: 'supply',
    applies: 'all',
    charge: 'full',
    span: 'peak',
    origin: 'model-or-measured',
  },
  peakCurrentA: {
    unit: 'A',
    quantity: 'current',
    decimals: 1,
    name: 'Peak current',
    label: 'Peak current, full charge',
    hint: 'model at full charge, or as measured',
    stage: 'supply',
    applies: 'all',
    charge: 'full',
    span: 'peak',
    origin: 'model-or-measured',
  },
  continuousCurrentA: {
    unit: 'A',
    quantity: 'current',
    decimals: 1,
    name: 'Continuous current',
    label: 'Continuous current, full charge',
    hint: 'model at full charge, or as measured; cars and trucks: the larger of the run RMS and the steady current',
    stage: 'supply',
    applies: 'all',
    charge: 'full',
    span: 'continuous',
    origin: 'model-or-measured',
  },
  runRmsCurrentA: {
    unit: 'A',
    quantity: 'current',
    decimals: 1,
    optional: true,
    name: 'RMS current over the run',
    label: 'RMS current over the run, full charge',
    stage: 'supply',
    applies: 'ground',
    charge: 'full',
    span: 'continuous',
    origin: 'model',
  },
  runAverageCurrentA: {
    unit: 'A',
    quantity: 'current',
    decimals: 1,
    optional: true,
    name: 'Average current over the run',
    label: 'Average current over the run, full charge',
    stage: 'supply',
    applies: 'ground',
    charge: 'full',
    span: 'continuous',
    origin: 'model',
  },
  steadyCurrentA: {
    unit: 'A',
    quantity: 'current',
    decimals: 1,
    optional: true,
    name: 'Steady current',
    label: 'Steady current at top speed, full charge',
    stage: 'supply',
    applies: 'all',
    charge: 'full',
    span: 'continuous',
    origin: 'model',
  },
  peakPowerW: {
    unit: 'W',
    quantity: 'power',
    decimals: 0,
    optional: true,
    name: 'Peak power',
    label: 'Peak power, full charge',
    stage: 'supply',
    applies: 'all',
    charge: 'full',
    span: 'peak',
    origin: 'model-or-measured',
  },
  peakPowerNoSagW: {
    unit: 'W',
    quantity: 'power',
    decimals: 0,
    optional: true,
    name: 'Peak power assuming no sag',
    label: 'Peak power, full charge, assuming no sag',
    hint: 'pack resistance not measured',
    stage: 'supply',
    applies: 'all',
    charge: 'full',
    span: 'peak',
    origin: 'model-or-measured',
  },
  noLoadRpm: {
    unit: 'rpm',
    quantity: 'rotation',
    decimals: 0,
    name: 'No-load speed',
    label: 'No-load speed, nominal',
    hint: 'Kv × nominal supply voltage',
    stage: 'motor',
    applies: 'all',
    charge: 'nominal',
    span: null,
    origin: 'records',
  },
  noLoadRpmFull: {
    unit: 'rpm',
    quantity: 'rotation',
    decimals: 0,
    name: 'No-load speed at full charge',
    label: 'No-load speed, full charge',
    stage: 'motor',
    applies: 'all',
    charge: 'full',
    span: null,
    origin: 'records',
  },
  loadedRpm: {
    unit: 'rpm',
    quantity: 'rotation',
    decimals: 0,
    name: 'Loaded motor speed',
    label: 'Loaded speed, nominal',
    hint: 'at the loaded top speed on nominal voltage',
    asPropeller: { label: 'Loaded speed, static, full charge', hint: 'at the static full-throttle point' },
    stage: 'motor',
    applies: 'all',
    charge: 'nominal',
    span: null,
    origin: 'model',
  },
  loadedRpmFull: {
    unit: 'rpm',
    quantity: 'rotation',
    decimals: 0,
    unlisted: true,
    name: 'Loaded motor speed at full charge',
    label: 'Loaded speed, full charge',
    stage: 'motor',
    applies: 'all',
    charge: 'full',
    span: null,
    origin: 'model',
  },
  torqueConstantNmPerA: {
    unit: 'N·m/A',
    quantity: 'torque-constant',
    decimals: 4,
    name: 'Torque constant',
    label: 'Torque constant Kt',
    hint: '60 ÷ (2π · Kv)',
    stage: 'motor',
    applies: 'all',
    charge: null,
    span: null,
    origin: 'records',
  },
  motorKv: {
    unit: 'rpm/V',
    quantity: 'motor-constant',
    decimals: 0,
    name: 'Motor Kv',
    label: 'Motor Kv',
    stage: 'motor',
    applies: 'all',
    charge: null,
    span: null,
    origin: 'records',
    unlisted: true,
  },
  motorPeakCurrentA: {
    unit: 'A',
    quantity: 'current',
    decimals: 1,
    name: 'Peak current per motor',
    label: 'Peak current per motor, full charge',
    stage: 'motor',
    applies: 'all',
    charge: 'full',
    span: 'peak',
    origin: 'model-or-measured',
  },
  motorContinuousCurrentA: {
    unit: 'A',
    quantity: 'current',
    decimals: 1,
    name: 'Continuous current per motor',
    label: 'Continuous current per motor, full charge',
    stage: 'motor',
    applies: 'all',
    charge: 'full',
    span: 'continuous',
    origin: 'model-or-measured',
  },
  motorPeakPowerW: {
    unit: 'W',
    quantity: 'power',
    decimals: 0,
    name: 'Peak power per motor',
    label: 'Peak power per motor, full charge',
    stage: 'motor',
    applies: 'all',
    charge: 'full',
    span: 'peak',
    origin: 'model-or-measured',
  },
  finalDriveRatio: {
    unit: ':1',
    quantity: 'ratio',
    decimals: 2,
    name: 'Final drive ratio',
    label: 'Final drive ratio',
    hint: 'spur ÷ pinion × internal ratio',
    asPropeller: { label: 'Gear ratio', hint: 'motor turns per propeller turn' },
    stage: 'drive',
    applies: 'all',
    charge: null,
    span: null,
    origin: 'records',
  },
  pinionTeeth: {
    unit: 'teeth',
    quantity: 'count',
    decimals: 0,
    name: 'Pinion',
    label: 'Pinion',
    stage: 'drive',
    applies: 'all',
    charge: null,
    span: null,
    origin: 'records',
    unlisted: true,
  },
  rolloutMm: {
    unit: 'mm',
    quantity: 'length',
    display: 'lengthMm',
    decimals: 1,
    imperialDecimals: 2,
    name: 'Rollout',
    label: 'Rollout',
    hint: 'distance per motor turn',
    stage: 'drive',
    applies: 'ground',
    charge: null,
    span: null,
    origin: 'records',
  },
  theoreticalSpeedKmh: {
    unit: 'km/h',
    quantity: 'speed',
    display: 'speedKmh',
    decimals: 1,
    name: 'Theoretical speed',
    label: 'Theoretical speed, nominal',
    hint: 'at nominal no-load speed, no slip',
    stage: 'output',
    applies: 'ground',
    charge: 'nominal',
    span: null,
    origin: 'records',
  },
  loadedTopSpeedKmh: {
    unit: 'km/h',
    quantity: 'speed',
    display: 'speedKmh',
    decimals: 1,
    name: 'Loaded top speed',
    label: 'Loaded top speed, nominal',
    hint: 'where motor torque meets road load',
    stage: 'output',
    applies: 'ground',
    charge: 'nominal',
    span: null,
    origin: 'model',
  },
  runLengthS: {
    unit: 's',
    quantity: 'time',
    decimals: 1,
    optional: true,
    name: 'Run length',
    label: 'Run length',
    hint: 'full throttle from standstill',
    stage: 'output',
    applies: 'ground',
    charge: null,
    span: null,
    origin: 'input',
  },
  drivenWeightShare: {
    unit: '',
    quantity: 'fraction',
    shown: { unit: '%', scale: 100 },
    decimals: 0,
    optional: true,
    name: 'Share of the weight on the driven wheels',
    label: 'Weight on driven wheels',
    stage: 'drive',
    applies: 'ground',
    charge: null,
    span: null,
    origin: 'input',
  },
  pitchSpeedKmh: {
    unit: 'km/h',
    quantity: 'speed',
    display: 'speedKmh',
    decimals: 1,
    optional: true,
    name: 'Pitch speed',
    label: 'Pitch speed, nominal',
    hint: 'pitch × propeller rev/s at nominal no-load speed',
    stage: 'output',
    applies: 'propeller',
    charge: 'nominal',
    span: null,
    origin: 'records',
  },
  thrustN: {
    unit: 'N',
    quantity: 'force',
    display: 'forceN',
    decimals: 1,
    alt: 'thrustMass',
    name: 'Static thrust',
    label: 'Static thrust, full charge',
    hint: 'all motors together; in brackets the mass it holds up',
    stage: 'output',
    applies: 'propeller',
    charge: 'full',
    span: null,
    origin: 'model',
  },
  propellerRpmStatic: {
    unit: 'rpm',
    quantity: 'rotation',
    decimals: 0,
    optional: true,
    name: 'Static propeller speed',
    label: 'Propeller speed, static, full charge',
    stage: 'output',
    applies: 'propeller',
    charge: 'full',
    span: null,
    origin: 'model',
  },
  propellerRpmUnloaded: {
    unit: 'rpm',
    quantity: 'rotation',
    decimals: 0,
    optional: true,
    name: 'Unloaded propeller speed',
    label: 'Propeller speed, unloaded, full charge',
    hint: 'the highest it can reach, as it unloads on the move',
    stage: 'output',
    applies: 'propeller',
    charge: 'full',
    span: null,
    origin: 'model',
  },
  tipSpeedStaticMps: {
    unit: 'm/s',
    quantity: 'speed',
    display: 'speedMps',
    decimals: 0,
    optional: true,
    name: 'Propeller tip speed (static)',
    label: 'Tip speed, static, full charge',
    stage: 'output',
    applies: 'propeller',
    charge: 'full',
    span: null,
    origin: 'model',
  },
  tipSpeedMps: {
    unit: 'm/s',
    quantity: 'speed',
    display: 'speedMps',
    decimals: 0,
    name: 'Propeller tip speed (unloaded)',
    label: 'Tip speed, unloaded, full charge',
    hint: 'the highest rpm the propeller reaches; judged against the limit',
    stage: 'output',
    applies: 'propeller',
    charge: 'full',
    span: null,
    origin: 'model',
  },
  tipSpeedLimitMps: {
    unit: 'm/s',
    quantity: 'speed',
    display: 'speedMps',
    decimals: 0,
    optional: true,
    name: 'Propeller tip speed limit',
    label: 'Tip speed limit',
    stage: 'output',
    applies: 'propeller',
    charge: null,
    span: null,
    origin: 'records',
  },
  fluidDensityKgM3: {
    unit: 'kg/m³',
    quantity: 'density',
    decimals: 1,
    optional: true,
    name: 'Water or air density',
    label: 'Water or air density',
    stage: 'output',
    applies: 'propeller',
    charge: null,
    span: null,
    origin: 'input',
  },
} as const satisfies Record<string, FigureSpec>;

/** A numeric figure of a supply's verdict. */
export type FigureKey = keyof typeof CATALOGUE;

/** Every figure's spec, by key. */
export const FIGURES: Readonly<Record<FigureKey, FigureSpec>> = CATALOGUE;

export function isFigureKey(key: string): key is FigureKey {
  return Object.hasOwn(CATALOGUE, key);
}

/** Every figure key in catalogue order. */
export const FIGURE_KEYS: readonly FigureKey[] = Object.keys(CATALOGUE).filter(isFigureKey);

/** Where a current came from: the model at full charge, or a log of the real thing. */
export type CurrentSource = 'model' | 'measured';

/** Figures that say where the currents came from rather than being a number. */
export const SOURCE_FIGURES = {
  /** Measured where either current was measured. */
  currentSource: ['peakCurrentA', 'continuousCurrentA'],
  peakCurrentSource: ['peakCurrentA'],
  continuousCurrentSource: ['continuousCurrentA'],
} as const satisfies Record<string, readonly FigureKey[]>;
export type SourceFigureKey = keyof typeof SOURCE_FIGURES;

/**
 * Figures of one supply; null where an input needed for it is missing or the vehicle's kind
 * does not have it. A closed set of keys: no figure exists outside the catalogue.
 */
export type Figures = { [K in FigureKey | SourceFigureKey]: K extends SourceFigureKey ? CurrentSource | null : number | null };
