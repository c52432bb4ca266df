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
  omegaRadS: number;
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

function surplusTorque(omega: number, c: PropCtx): number {
  return torqueAt(c.m, c.voltageV, omega) - propTorque(c.p.powerCoefficient, c.p.densityKgM3, omega / (2 * Math.PI), c.p.diameterM);
}

/** Full-throttle static point of one motor and propeller: motor torque meets propeller torque. */
export function staticPropPoint(m: MotorParams, voltageV: number, p: PropellerLoad): PropPoint {
  const omegaMax = noLoadOmega(m, voltageV);
  const ctx: PropCtx = { m, voltageV, p };
  const omegaRadS = omegaMax > 0 ? findRoot(surplusTorque, ctx, 0, omegaMax, 1e-9 * Math.max(1, omegaMax), 100) : 0;
  const revPerS = omegaRadS / (2 * Math.PI);
  return {
    omegaRadS,
    revPerS,
    currentA: omegaMax > 0 ? currentAt(m, voltageV, omegaRadS) : stallCurrent(m, voltageV),
    thrustN: p.thrustCoefficient === null ? null : propThrust(p.thrustCoefficient, p.densityKgM3, revPerS, p.diameterM),
    tipSpeedMps: tipSpeed(revPerS, p.diameterM),
  };
}
