import { emptyOperatingPoint, motorParams, noLoadOmega, operatingPointAt } from './motor';
import { RAD_PER_S_PER_RPM } from './units';

export interface MotorCurveInput {
  kv: number;
  resistanceOhm: number;
  noLoadCurrentA: number;
  voltageV: number;
  /** Pack and controller resistance in the loop, ohm. */
  extraResistanceOhm?: number;
  /** Number of points from standstill to no-load speed; at least 2. */
  points?: number;
}

export interface MotorCurve {
  rpm: number[];
  currentA: number[];
  torqueNm: number[];
  shaftPowerW: number[];
  inputPowerW: number[];
  efficiency: number[];
}

/**
 * Current, torque, power and efficiency from standstill to no-load speed, for charts.
 * Inputs that cannot make a curve (no positive Kv, R, V) give empty arrays, never NaN.
 */
export function motorCurve(input: MotorCurveInput): MotorCurve {
  const curve: MotorCurve = { rpm: [], currentA: [], torqueNm: [], shaftPowerW: [], inputPowerW: [], efficiency: [] };
  const r = input.resistanceOhm + (input.extraResistanceOhm ?? 0);
  const i0 = input.noLoadCurrentA;
  const points = Math.min(1000, Math.max(2, Math.floor(input.points ?? 50)));
  if (!(input.kv > 0 && r > 0 && i0 >= 0 && input.voltageV > 0) || !Number.isFinite(input.kv * r * i0 * input.voltageV)) {
    return curve;
  }
  const m = motorParams(input.kv, r, i0);
  const top = Math.max(0, noLoadOmega(m, input.voltageV));
  const op = emptyOperatingPoint();
  for (let k = 0; k < points; k++) {
    operatingPointAt(m, input.voltageV, (top * k) / (points - 1), op);
    curve.rpm.push(op.omegaRadS / RAD_PER_S_PER_RPM);
    curve.currentA.push(op.currentA);
    curve.torqueNm.push(op.torqueNm);
    curve.shaftPowerW.push(op.shaftPowerW);
    curve.inputPowerW.push(op.inputPowerW);
    curve.efficiency.push(op.efficiency);
  }
  return curve;
}
