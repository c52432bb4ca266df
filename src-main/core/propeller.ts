// Static propeller load: T = C_T·ρ·n²·D⁴ and P = C_P·ρ·n³·D⁵ with n in rev/s and D in m, so
// the shaft torque the propeller asks for is P/ω = C_P·ρ·n²·D⁵/(2π).

import { currentAt, noLoadOmega, stallCurrent, torqueAt, type MotorParams } from './motor';
import { findRoot } from './solve';

export interface PropellerLoad {
  diameterM: number;
  thrustCoefficient: number | null;
  powerCoefficient: number;
  /** Air or water, kg/m³. */
  densityKgM3: number;
  /** Motor turns per propeller turn; 1 (or left out) for direct drive. */
  gearRatio?: number;
  /** Gearbox efficiency, 0 to 1; 1 (or left out) for direct drive. */
  gearEfficiency?: number;
}

export function propThrust(ct: number, densityKgM3: number, revPerS: number, diameterM: number): number {
  return ct * densityKgM3 * revPerS * revPerS * diameterM ** 4;
}

export function propPower(cp: number, densityKgM3: number, revPerS: number, diameterM: number): number {
  return cp * densityKgM3 * revPerS ** 3 * diameterM ** 5;
}

export function propTorque(cp: number, densityKgM3: number, revPerS: number, diameterM: number): number {
  return (cp * densityKgM3 * revPerS * revPerS * diameterM ** 5) / (2 * Math.PI);
}

/** Blade tip speed from rotation alone (static), m/s. */
export function tipSpeed(revPerS: number, diameterM: number): number {
  return Math.PI * diameterM * revPerS;
}

export interface PropPoint {
  /** Motor speed. */
  omegaRadS: number;
  /** Propeller speed: motor speed ÷ gear ratio. */
  revPerS: number;
  /** Per motor. */
  currentA: number;
  thrustN: number | null;
  tipSpeedMps: number;
}

interface PropCtx {
  m: MotorParams;
  voltageV: number;
  p: PropellerLoad;
}

/** Propeller torque seen at the motor shaft: through the gear ratio and the gearbox losses. */
function surplusTorque(omega: number, c: PropCtx): number {
  const ratio = c.p.gearRatio ?? 1;
  const eff = c.p.gearEfficiency ?? 1;
  const propRevPerS = omega / ratio / (2 * Math.PI);
  return torqueAt(c.m, c.voltageV, omega) - propTorque(c.p.powerCoefficient, c.p.densityKgM3, propRevPerS, c.p.diameterM) / ratio / eff;
}

/**
 * Full-throttle static point of one motor and propeller: motor torque meets propeller torque
 * (through a gearbox where there is one: the propeller turns at motor speed ÷ ratio).
 */
export function staticPropPoint(m: MotorParams, voltageV: number, p: PropellerLoad): PropPoint {
  const omegaMax = noLoadOmega(m, voltageV);
  const ctx: PropCtx = { m, voltageV, p };
  const omegaRadS = omegaMax > 0 ? findRoot(surplusTorque, ctx, 0, omegaMax, 1e-9 * Math.max(1, omegaMax), 100) : 0;
  const revPerS = omegaRadS / (p.gearRatio ?? 1) / (2 * Math.PI);
  return {
    omegaRadS,
    revPerS,
    currentA: omegaMax > 0 ? currentAt(m, voltageV, omegaRadS) : stallCurrent(m, voltageV),
    thrustN: p.thrustCoefficient === null ? null : propThrust(p.thrustCoefficient, p.densityKgM3, revPerS, p.diameterM),
    tipSpeedMps: tipSpeed(revPerS, p.diameterM),
  };
}

/**
 * The highest propeller speed the build can reach, rev/s: a propeller unloads as the craft
 * moves, so the motor runs toward its no-load speed Kv·(V − I0·R) at full charge, ÷ gear ratio.
 */
export function unloadedPropRevPerS(m: MotorParams, voltageV: number, gearRatio: number): number {
  return Math.max(0, noLoadOmega(m, voltageV)) / gearRatio / (2 * Math.PI);
}

/** Pitch speed: the distance the propeller would advance per turn (its pitch) × rev/s, m/s. */
export function pitchSpeedMps(pitchM: number, revPerS: number): number {
  return pitchM * revPerS;
}
