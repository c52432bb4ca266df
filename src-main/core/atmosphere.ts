// Air density at the field, from the standard atmosphere of ISO 2533:1975 (the ICAO standard
// atmosphere, identical below 32 km): in the troposphere the standard temperature falls 6.5 K
// per kilometre of geopotential altitude from 288.15 K at sea level, and the pressure follows
// p = p₀·(T_std/T₀)^(g₀/(L·R)). The pressure is taken as standard for the altitude; the density
// then uses the air temperature actually met where one is given (ρ = p ÷ (R·T)), so a hot day
// at altitude reads the thin air a propeller really turns in.

import { STANDARD_GRAVITY } from './constants';

/** ISO 2533 sea-level pressure, Pa. */
export const ISA_SEA_LEVEL_PRESSURE_PA = 101_325;
/** ISO 2533 sea-level temperature, K. */
export const ISA_SEA_LEVEL_TEMPERATURE_K = 288.15;
/** ISO 2533 temperature gradient of the troposphere, K/m (falls with height). */
export const ISA_LAPSE_RATE_K_PER_M = -0.0065;
/** ISO 2533 specific gas constant of dry air, J/(kg·K). */
export const ISA_GAS_CONSTANT_AIR = 287.05287;
/** Top of the troposphere in ISO 2533, m (geopotential). */
export const ISA_TROPOPAUSE_M = 11_000;

const CELSIUS_ZERO_K = 273.15;

export interface FieldAir {
  /** kg/m³. */
  readonly densityKgM3: number;
  readonly pressurePa: number;
  /** The temperature the density was worked out at, °C: as given, or the standard one for the altitude. */
  readonly temperatureC: number;
  /** True where no temperature was given and the standard one was taken. */
  readonly standardTemperature: boolean;
}

/** The standard temperature at a geopotential altitude inside the troposphere, K. */
export function isaTemperatureK(altitudeM: number): number {
  return ISA_SEA_LEVEL_TEMPERATURE_K + ISA_LAPSE_RATE_K_PER_M * altitudeM;
}

/** The standard pressure at a geopotential altitude inside the troposphere, Pa. */
export function isaPressurePa(altitudeM: number): number {
  const exponent = -STANDARD_GRAVITY / (ISA_LAPSE_RATE_K_PER_M * ISA_GAS_CONSTANT_AIR);
  return ISA_SEA_LEVEL_PRESSURE_PA * (isaTemperatureK(altitudeM) / ISA_SEA_LEVEL_TEMPERATURE_K) ** exponent;
}

/**
 * Air at the field: the standard pressure for the altitude (sea level when none is given) and
 * the given temperature, or the standard one for the altitude.
 */
export function fieldAir(altitudeM: number | null, temperatureC: number | null): FieldAir {
  const h = Math.min(altitudeM ?? 0, ISA_TROPOPAUSE_M);
  const pressurePa = isaPressurePa(h);
  const standardTemperature = temperatureC === null;
  const tK = temperatureC === null ? isaTemperatureK(h) : temperatureC + CELSIUS_ZERO_K;
  return { densityKgM3: pressurePa / (ISA_GAS_CONSTANT_AIR * tK), pressurePa, temperatureC: tK - CELSIUS_ZERO_K, standardTemperature };
}
