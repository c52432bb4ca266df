import { STANDARD_GRAVITY } from './constants';

// Unit factors and display conversions. Factors are exact by definition (NIST SP 811,
// appendix B). No formatting here: callers get numbers and unit symbols and format them
// themselves, so the renderer, the build sheet and the command line can share one API.

export const METRE_PER_INCH = 0.0254;
export const METRE_PER_FOOT = 0.3048;
export const METRE_PER_MILE = 1609.344;
export const KILOGRAM_PER_POUND = 0.45359237;
/** The avoirdupois ounce is a sixteenth of the pound, so exact too. */
export const KILOGRAM_PER_OUNCE = KILOGRAM_PER_POUND / 16;
/** Pound-force is the pound mass under standard gravity, so this is exact too. */
export const NEWTON_PER_POUND_FORCE = KILOGRAM_PER_POUND * STANDARD_GRAVITY;

export const MM_PER_INCH = 25.4;
export const SECONDS_PER_HOUR = 3600;
export const RAD_PER_S_PER_RPM = (2 * Math.PI) / 60;

export const mpsToKmh = (mps: number): number => (mps * SECONDS_PER_HOUR) / 1000;
export const kmhToMps = (kmh: number): number => (kmh * 1000) / SECONDS_PER_HOUR;
export const kmhToMph = (kmh: number): number => (kmh * 1000) / METRE_PER_MILE;
export const mphToKmh = (mph: number): number => (mph * METRE_PER_MILE) / 1000;
export const mpsToMph = (mps: number): number => (mps * SECONDS_PER_HOUR) / METRE_PER_MILE;
export const mphToMps = (mph: number): number => (mph * METRE_PER_MILE) / SECONDS_PER_HOUR;
export const mmToIn = (mm: number): number => mm / MM_PER_INCH;
export const inToMm = (inch: number): number => inch * MM_PER_INCH;
export const kgToLb = (kg: number): number => kg / KILOGRAM_PER_POUND;
export const lbToKg = (lb: number): number => lb * KILOGRAM_PER_POUND;
export const mpsToFps = (mps: number): number => mps / METRE_PER_FOOT;
export const fpsToMps = (fps: number): number => fps * METRE_PER_FOOT;
export const newtonToLbf = (n: number): number => n / NEWTON_PER_POUND_FORCE;
export const lbfToNewton = (lbf: number): number => lbf * NEWTON_PER_POUND_FORCE;
export const kgToOz = (kg: number): number => kg / KILOGRAM_PER_OUNCE;
export const ozToKg = (oz: number): number => oz * KILOGRAM_PER_OUNCE;
/** Ounce-force inch: the ounce under standard gravity times an inch. */
export const NEWTON_METRE_PER_OUNCE_INCH = KILOGRAM_PER_OUNCE * STANDARD_GRAVITY * METRE_PER_INCH;
export const nmToOzIn = (nm: number): number => nm / NEWTON_METRE_PER_OUNCE_INCH;
export const ozInToNm = (ozIn: number): number => ozIn * NEWTON_METRE_PER_OUNCE_INCH;
/** A force as the mass it holds up under standard gravity: thrust in grams or ounces. */
export const newtonToGramForce = (n: number): number => (n / STANDARD_GRAVITY) * 1000;
export const newtonToOunceForce = (n: number): number => n / STANDARD_GRAVITY / KILOGRAM_PER_OUNCE;
export const m2ToFt2 = (m2: number): number => m2 / (METRE_PER_FOOT * METRE_PER_FOOT);
export const ft2ToM2 = (ft2: number): number => ft2 * METRE_PER_FOOT * METRE_PER_FOOT;
export const rpmToRadPerS = (rpm: number): number => rpm * RAD_PER_S_PER_RPM;
export const radPerSToRpm = (radPerS: number): number => radPerS / RAD_PER_S_PER_RPM;

export const UNIT_SYSTEMS = ['metric', 'imperial'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

/**
 * Quantities as the records and figures store them (the unit is in the field name:
 * `speedKmh`, `lengthMm`, ...). Volts, amps, watts, rpm and Kv read the same in both systems
 * and are not listed.
 */
export const DISPLAY_QUANTITIES = ['speedKmh', 'speedMps', 'lengthMm', 'massKg', 'massSmallKg', 'forceN', 'areaM2', 'torqueNm'] as const;
export type DisplayQuantity = (typeof DISPLAY_QUANTITIES)[number];

interface DisplayUnit {
  readonly symbol: string;
  readonly fromStored: (value: number) => number;
  readonly toStored: (value: number) => number;
}

const same = (value: number): number => value;

const DISPLAY_UNITS: Record<DisplayQuantity, Record<UnitSystem, DisplayUnit>> = {
  speedKmh: {
    metric: { symbol: 'km/h', fromStored: same, toStored: same },
    imperial: { symbol: 'mph', fromStored: kmhToMph, toStored: mphToKmh },
  },
  speedMps: {
    metric: { symbol: 'm/s', fromStored: same, toStored: same },
    imperial: { symbol: 'ft/s', fromStored: mpsToFps, toStored: fpsToMps },
  },
  lengthMm: {
    metric: { symbol: 'mm', fromStored: same, toStored: same },
    imperial: { symbol: 'in', fromStored: mmToIn, toStored: inToMm },
  },
  massKg: {
    metric: { symbol: 'kg', fromStored: same, toStored: same },
    imperial: { symbol: 'lb', fromStored: kgToLb, toStored: lbToKg },
  },
  // Small parts (packs, motors, controllers) are weighed in grams or ounces, as the trade does;
  // the value is still stored in kilograms.
  massSmallKg: {
    metric: { symbol: 'g', fromStored: (kg) => kg * 1000, toStored: (g) => g / 1000 },
    imperial: { symbol: 'oz', fromStored: kgToOz, toStored: ozToKg },
  },
  torqueNm: {
    metric: { symbol: 'N·m', fromStored: same, toStored: same },
    imperial: { symbol: 'oz·in', fromStored: nmToOzIn, toStored: ozInToNm },
  },
  forceN: {
    metric: { symbol: 'N', fromStored: same, toStored: same },
    imperial: { symbol: 'lbf', fromStored: newtonToLbf, toStored: lbfToNewton },
  },
  areaM2: {
    metric: { symbol: 'm²', fromStored: same, toStored: same },
    imperial: { symbol: 'ft²', fromStored: m2ToFt2, toStored: ft2ToM2 },
  },
};

/** A stored value (unit in its field name) in the unit the user prefers. */
export function toDisplay(value: number, quantity: DisplayQuantity, system: UnitSystem): number {
  return DISPLAY_UNITS[quantity][system].fromStored(value);
}

/** A value typed in the preferred unit, back to the stored unit. */
export function fromDisplay(value: number, quantity: DisplayQuantity, system: UnitSystem): number {
  return DISPLAY_UNITS[quantity][system].toStored(value);
}

export function displayUnit(quantity: DisplayQuantity, system: UnitSystem): string {
  return DISPLAY_UNITS[quantity][system].symbol;
}

/** The quantity a unit symbol in a finding stands for ("km/h" → speedKmh); null for units that read the same everywhere. */
export function quantityOfUnit(symbol: string): DisplayQuantity | null {
  switch (symbol) {
    case 'km/h':
      return 'speedKmh';
    case 'm/s':
      return 'speedMps';
    case 'mm':
      return 'lengthMm';
    case 'kg':
      return 'massKg';
    case 'N':
      return 'forceN';
    case 'm²':
      return 'areaM2';
    case 'N·m':
      return 'torqueNm';
    default:
      return null;
  }
}
