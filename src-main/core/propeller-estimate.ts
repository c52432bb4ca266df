// Static thrust and power coefficients of an air propeller from its diameter, pitch and blade
// count, where the record gives none: combined blade-element and momentum theory for a rotor
// standing still with uniform inflow (J. G. Leishman, "Principles of Helicopter Aerodynamics",
// 2nd ed., Cambridge 2006, chapter 3: C_T = (σ·a/2)·(θ/3 − λ/2) with λ = √(C_T/2), and
// C_P = κ·C_T^(3/2)/√2 + σ·C_d0/8), with the blade angle θ taken at 75 % of the radius from
// the pitch. Rotor coefficients (on ρ·A·(ΩR)²) become propeller coefficients (on ρ·n²·D⁴ and
// ρ·n³·D⁵) by C_T·π³/4 and C_P·π⁴/4.
//
// Stated correction, for hobby propellers whose chord and sections are not recorded: chord at
// 75 % radius 0.1·D, lift slope 5.7 per radian (thin section, low Reynolds number), zero-lift
// angle 3° below the flat face (cambered sections), induced-power factor κ = 1.15 and profile
// drag coefficient 0.02 (the usual rotor values; common practice, from memory).
//
// Stated accuracy: within about ±20 % of published static tests of two-blade hobby propellers
// (our own comparison, from memory). Figures that use these values are marked estimated, and a
// verdict resting on them reads no better than tight until the values are confirmed.

export const ESTIMATE = {
  chordPerDiameter: 0.1,
  liftSlopePerRad: 5.7,
  zeroLiftAngleRad: (3 * Math.PI) / 180,
  inducedPowerFactor: 1.15,
  profileDragCoefficient: 0.02,
  /** ± share of the coefficient the estimate is stated to be within. */
  accuracy: 0.2,
} as const;

export interface PropellerCoefficients {
  readonly thrustCoefficient: number;
  readonly powerCoefficient: number;
}

/** Rotor (helicopter) coefficients to propeller ones: T = C_T·ρ·n²·D⁴, P = C_P·ρ·n³·D⁵. */
const THRUST_TO_PROPELLER = Math.PI ** 3 / 4;
const POWER_TO_PROPELLER = Math.PI ** 4 / 4;

/** The blade's geometric angle at 75 % of the radius, from the pitch, rad. */
export function bladeAngleAt75(diameterM: number, pitchM: number): number {
  return Math.atan(pitchM / (Math.PI * 0.75 * diameterM));
}

/** Static C_T and C_P of an air propeller from its geometry (see the file's head for the method). */
export function estimateStaticCoefficients(diameterM: number, pitchM: number, blades: number): PropellerCoefficients {
  const sigma = (blades * ESTIMATE.chordPerDiameter * diameterM) / (Math.PI * (diameterM / 2));
  const theta = bladeAngleAt75(diameterM, pitchM) + ESTIMATE.zeroLiftAngleRad;
  const k = (sigma * ESTIMATE.liftSlopePerRad) / 2;
  // 2λ² + (k/2)·λ − k·θ/3 = 0, the positive root: the inflow the thrust sustains.
  const lambda = (-k / 2 + Math.sqrt((k * k) / 4 + (8 * k * theta) / 3)) / 4;
  const ctRotor = 2 * lambda * lambda;
  const cpRotor = (ESTIMATE.inducedPowerFactor * ctRotor ** 1.5) / Math.SQRT2 + (sigma * ESTIMATE.profileDragCoefficient) / 8;
  return { thrustCoefficient: ctRotor * THRUST_TO_PROPELLER, powerCoefficient: cpRotor * POWER_TO_PROPELLER };
}
