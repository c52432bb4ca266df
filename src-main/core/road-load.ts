import { STANDARD_GRAVITY } from './constants';

/** Aerodynamic drag ½·ρ·C_dA·v², N. */
export function aeroDrag(densityKgM3: number, dragAreaM2: number, speedMps: number): number {
  return 0.5 * densityKgM3 * dragAreaM2 * speedMps * speedMps;
}

/** Rolling resistance C_rr·m·g, N. */
export function rollingResistance(rollingCoefficient: number, massKg: number): number {
  return rollingCoefficient * massKg * STANDARD_GRAVITY;
}

/** Force needed to hold a steady speed on the flat, N. */
export function roadLoad(densityKgM3: number, dragAreaM2: number, rollingCoefficient: number, massKg: number, speedMps: number): number {
  return aeroDrag(densityKgM3, dragAreaM2, speedMps) + rollingResistance(rollingCoefficient, massKg);
}

/** Most force the tyres can put down before they spin: μ·m·g, N. */
export function tractionLimit(tractionCoefficient: number, massKg: number): number {
  return tractionCoefficient * massKg * STANDARD_GRAVITY;
}
