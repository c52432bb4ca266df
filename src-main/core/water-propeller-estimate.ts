// Static thrust and power coefficients of a water propeller from its diameter, pitch and blade
// count, where the record gives none: the Wageningen B-series open-water polynomials
// (M. W. C. Oosterveld and P. van Oossanen, "Further computer-analyzed data of the Wageningen
// B-screw series", International Shipbuilding Progress 22, 1975; the coefficient tables as
// reprinted by M. M. Bernitsas, D. Ray and P. Kinley, "KT, KQ and efficiency curves for the
// Wageningen B-series propellers", University of Michigan, Dept. of Naval Architecture and Marine
// Engineering, report 237, 1981, table 1; Reynolds number 2·10⁶, no correction applied).
//
// K_T = Σ C·J^s·(P/D)^t·(A_E/A_0)^u·Z^v, likewise K_Q; T = K_T·ρ·n²·D⁴, Q = K_Q·ρ·n²·D⁵, so the
// engine's coefficients are C_T = K_T and C_P = 2π·K_Q (P = 2π·n·Q).
//
// The operating point taken is the bollard one, J = 0 (the boat held at full throttle, or the
// first instant of a launch): K_Q is highest there, so it draws the most current of any advance
// ratio. A boat under way runs at a higher J and draws less.
//
// Stated assumptions, for hobby propellers whose blade area and sections are not recorded:
// - Blade-area ratio: hobby racing propellers are wide-bladed, about 0.8 for a two-blade
//   propeller (common practice, from memory). Torque is taken at the ratio between 0.8 and the
//   series' top of 1.05 that gives the most, since the ratio is not known.
// - Inside the series (P/D 0.5 to 1.4, Z 2 to 7) the polynomials are used as they are. A flatter
//   propeller is taken at P/D 0.5 and one with fewer than two blades as two, both more torque than
//   the propeller has. More than seven blades are taken as seven.
// - Above P/D 1.4 (common for racing propellers), K_Q grows from its value at 1.4 with the square
//   of the pitch ratio: steeper than the series' own logarithmic slope at its top (1.4 to 2.0 over
//   the blade counts and areas used; our computation), so the extension leans to more torque.
//   K_T grows in proportion to the pitch ratio there (thrust is not used by a current check).
//
// Stated accuracy: the polynomials reproduce the series' model tests within a few per cent; a
// hobby propeller's sections, rake, cleaver trailing edge and low Reynolds number (more drag, so
// more torque) differ from the series, so the estimate is taken as about ±30 % (from memory).
// Surface-piercing and cleaver propellers run partly out of the water: a fully submerged estimate
// then overstates their load, which is the safe side for current. Figures that use these values
// are marked estimated, and a verdict resting on them reads no better than tight until the values
// are confirmed.

import type { PropellerCoefficients } from './propeller-estimate';

/** One polynomial term: [C, s (power of J), t (of P/D), u (of A_E/A_0), v (of Z)]. */
type Term = readonly [number, number, number, number, number];

/** K_T, 39 terms (Oosterveld and van Oossanen 1975; Bernitsas, Ray and Kinley 1981, table 1). */
export const B_SERIES_THRUST: readonly Term[] = [
  [0.00880496, 0, 0, 0, 0],
  [-0.204554, 1, 0, 0, 0],
  [0.166351, 0, 1, 0, 0],
  [0.158114, 0, 2, 0, 0],
  [-0.147581, 2, 0, 1, 0],
  [-0.481497, 1, 1, 1, 0],
  [0.415437, 0, 2, 1, 0],
  [0.0144043, 0, 0, 0, 1],
  [-0.0530054, 2, 0, 0, 1],
  [0.0143481, 0, 1, 0, 1],
  [0.0606826, 1, 1, 0, 1],
  [-0.0125894, 0, 0, 1, 1],
  [0.0109689, 1, 0, 1, 1],
  [-0.133698, 0, 3, 0, 0],
  [0.00638407, 0, 6, 0, 0],
  [-0.00132718, 2, 6, 0, 0],
  [0.168496, 3, 0, 1, 0],
  [-0.0507214, 0, 0, 2, 0],
  [0.0854559, 2, 0, 2, 0],
  [-0.0504475, 3, 0, 2, 0],
  [0.010465, 1, 6, 2, 0],
  [-0.00648272, 2, 6, 2, 0],
  [-0.00841728, 0, 3, 0, 1],
  [0.0168424, 1, 3, 0, 1],
  [-0.00102296, 3, 3, 0, 1],
  [-0.0317791, 0, 3, 1, 1],
  [0.018604, 1, 0, 2, 1],
  [-0.00410798, 0, 2, 2, 1],
  [-0.000606848, 0, 0, 0, 2],
  [-0.0049819, 1, 0, 0, 2],
  [0.0025983, 2, 0, 0, 2],
  [-0.000560528, 3, 0, 0, 2],
  [-0.00163652, 1, 2, 0, 2],
  [-0.000328787, 1, 6, 0, 2],
  [0.000116502, 2, 6, 0, 2],
  [0.000690904, 0, 0, 1, 2],
  [0.00421749, 0, 3, 1, 2],
  [0.0000565229, 3, 6, 1, 2],
  [-0.00146564, 0, 3, 2, 2],
];

/** K_Q, 47 terms (same sources). */
export const B_SERIES_TORQUE: readonly Term[] = [
  [0.00379368, 0, 0, 0, 0],
  [0.00886523, 2, 0, 0, 0],
  [-0.032241, 1, 1, 0, 0],
  [0.00344778, 0, 2, 0, 0],
  [-0.0408811, 0, 1, 1, 0],
  [-0.108009, 1, 1, 1, 0],
  [-0.0885381, 2, 1, 1, 0],
  [0.188561, 0, 2, 1, 0],
  [-0.00370871, 1, 0, 0, 1],
  [0.00513696, 0, 1, 0, 1],
  [0.0209449, 1, 1, 0, 1],
  [0.00474319, 2, 1, 0, 1],
  [-0.00723408, 2, 0, 1, 1],
  [0.00438388, 1, 1, 1, 1],
  [-0.0269403, 0, 2, 1, 1],
  [0.0558082, 3, 0, 1, 0],
  [0.0161886, 0, 3, 1, 0],
  [0.00318086, 1, 3, 1, 0],
  [0.015896, 0, 0, 2, 0],
  [0.0471729, 1, 0, 2, 0],
  [0.0196283, 3, 0, 2, 0],
  [-0.0502782, 0, 1, 2, 0],
  [-0.030055, 3, 1, 2, 0],
  [0.0417122, 2, 2, 2, 0],
  [-0.0397722, 0, 3, 2, 0],
  [-0.00350024, 0, 6, 2, 0],
  [-0.0106854, 3, 0, 0, 1],
  [0.00110903, 3, 3, 0, 1],
  [-0.000313912, 0, 6, 0, 1],
  [0.0035985, 3, 0, 1, 1],
  [-0.00142121, 0, 6, 1, 1],
  [-0.00383637, 1, 0, 2, 1],
  [0.0126803, 0, 2, 2, 1],
  [-0.00318278, 2, 3, 2, 1],
  [0.00334268, 0, 6, 2, 1],
  [-0.00183491, 1, 1, 0, 2],
  [0.000112451, 3, 2, 0, 2],
  [-0.0000297228, 3, 6, 0, 2],
  [0.000269551, 1, 0, 1, 2],
  [0.00083265, 2, 0, 1, 2],
  [0.00155334, 0, 2, 1, 2],
  [0.000302683, 0, 6, 1, 2],
  [-0.0001843, 0, 0, 2, 2],
  [-0.000425399, 0, 3, 2, 2],
  [0.0000869243, 3, 3, 2, 2],
  [-0.0004659, 0, 6, 2, 2],
  [0.0000554194, 1, 6, 2, 2],
];

export const WATER_ESTIMATE = {
  /** The bollard point: the advance ratio at which the coefficients are taken. */
  advanceRatio: 0,
  /** The series' range of pitch ratio, blade-area ratio and blade count. */
  pitchRatio: { min: 0.5, max: 1.4 },
  areaRatio: { min: 0.3, max: 1.05 },
  blades: { min: 2, max: 7 },
  /** Lowest blade-area ratio taken for a hobby propeller (common practice, from memory). */
  assumedAreaRatio: 0.8,
  /** Power of the pitch ratio by which K_Q grows above the series' top pitch ratio. */
  torqueExponentAbove: 2,
  /** Power of the pitch ratio by which K_T grows above it. */
  thrustExponentAbove: 1,
  /** ± share of the coefficient the estimate is stated to be within. */
  accuracy: 0.3,
} as const;

export interface OpenWater {
  /** Thrust coefficient K_T = T ÷ (ρ·n²·D⁴). */
  kt: number;
  /** Torque coefficient K_Q = Q ÷ (ρ·n²·D⁵). */
  kq: number;
}

function sum(terms: readonly Term[], j: number, pitchRatio: number, areaRatio: number, blades: number): number {
  let total = 0;
  for (const [c, s, t, u, v] of terms) total += c * j ** s * pitchRatio ** t * areaRatio ** u * blades ** v;
  return total;
}

/** K_T and K_Q of a B-series propeller from the polynomials as published (no range applied). */
export function bSeriesOpenWater(advanceRatio: number, pitchRatio: number, areaRatio: number, blades: number): OpenWater {
  return { kt: sum(B_SERIES_THRUST, advanceRatio, pitchRatio, areaRatio, blades), kq: sum(B_SERIES_TORQUE, advanceRatio, pitchRatio, areaRatio, blades) };
}

const clamp = (x: number, lo: number, hi: number): number => Math.min(hi, Math.max(lo, x));

/**
 * The blade-area ratio between the assumed one and the series' top that gives the most torque
 * at the bollard point. K_Q is a quadratic in A_E/A_0 (powers 0 to 2), so its largest value on
 * the interval is at an end or at the vertex.
 */
export function heaviestAreaRatio(pitchRatio: number, blades: number): number {
  const lo: number = WATER_ESTIMATE.assumedAreaRatio;
  const hi = WATER_ESTIMATE.areaRatio.max;
  const j = WATER_ESTIMATE.advanceRatio;
  // K_Q = a0 + a1·A + a2·A²; only a1 and a2 place the vertex.
  let a1 = 0;
  let a2 = 0;
  for (const [c, s, t, u, v] of B_SERIES_TORQUE) {
    const k = c * j ** s * pitchRatio ** t * blades ** v;
    if (u === 1) a1 += k;
    else if (u === 2) a2 += k;
  }
  const candidates: number[] = [lo, hi];
  if (a2 < 0) {
    const vertex = -a1 / (2 * a2);
    if (vertex > lo && vertex < hi) candidates.push(vertex);
  }
  let best = lo;
  for (const x of candidates) if (bSeriesOpenWater(j, pitchRatio, x, blades).kq > bSeriesOpenWater(j, pitchRatio, best, blades).kq) best = x;
  return best;
}

export interface WaterEstimate extends PropellerCoefficients {
  /** The pitch ratio of the propeller, P/D. */
  pitchRatio: number;
  /** The blade-area ratio and blade count the polynomials were evaluated at. */
  areaRatio: number;
  blades: number;
}

/** Bollard C_T and C_P of a water propeller from its geometry (see the file's head for the method). */
export function estimateWaterCoefficients(diameterM: number, pitchM: number, blades: number): WaterEstimate {
  const pitchRatio = pitchM / diameterM;
  const z = clamp(Math.round(blades), WATER_ESTIMATE.blades.min, WATER_ESTIMATE.blades.max);
  const inRange = clamp(pitchRatio, WATER_ESTIMATE.pitchRatio.min, WATER_ESTIMATE.pitchRatio.max);
  const areaRatio = heaviestAreaRatio(inRange, z);
  const at = bSeriesOpenWater(WATER_ESTIMATE.advanceRatio, inRange, areaRatio, z);
  const above = Math.max(1, pitchRatio / WATER_ESTIMATE.pitchRatio.max);
  const kt = at.kt * above ** WATER_ESTIMATE.thrustExponentAbove;
  const kq = at.kq * above ** WATER_ESTIMATE.torqueExponentAbove;
  return { thrustCoefficient: kt, powerCoefficient: 2 * Math.PI * kq, pitchRatio, areaRatio, blades: z };
}
