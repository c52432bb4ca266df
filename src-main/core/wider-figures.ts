// The wider figures of one supply: pack energy, run time, motor heat, electrical rpm and the
// hover point of a multirotor. Pure arithmetic on figures the evaluation already has.

import { STANDARD_GRAVITY } from './constants';
import type { MotorParams } from './motor';

/** Nominal voltage × capacity, Wh. */
export function packEnergyWh(nominalV: number, capacityMah: number): number {
  return (nominalV * capacityMah) / 1000;
}

/** Minutes a supply lasts at an average current, using a share of its capacity. */
export function runTimeMin(capacityMah: number, depthOfDischarge: number, averageA: number): number {
  return ((capacityMah / 1000) * depthOfDischarge * 60) / averageA;
}

/**
 * Heat a motor sheds at a current, W: copper loss I²·R plus the no-load loss I₀·V (M. Drela,
 * "First-Order DC Electric Motor Model", MIT 2007: input (V)(I) less shaft (V − IR)(I − I₀)
 * is I²R + I₀·(V − IR); taking I₀·V drops the small I₀·I·R, the high side).
 */
export function motorLossW(currentA: number, resistanceOhm: number, noLoadCurrentA: number, voltageV: number): number {
  return currentA * currentA * resistanceOhm + noLoadCurrentA * voltageV;
}

/** Electrical rpm: mechanical rpm × pole pairs (the controller switches once per pole pair per turn). */
export function electricalRpm(rpm: number, poles: number): number {
  return rpm * (poles / 2);
}

export interface HoverPoint {
  /** Share of the supply voltage the motors need, 0 to 1 (above 1: it cannot hover). */
  readonly throttle: number;
  /** Winding current of one motor. */
  readonly motorCurrentA: number;
  /** Current from the supply for all motors: motor current × throttle (a lossless controller passes power, not current). */
  readonly supplyCurrentA: number;
}

export interface HoverInput {
  readonly m: MotorParams;
  readonly motorCount: number;
  readonly allUpMassKg: number;
  readonly diameterM: number;
  readonly thrustCoefficient: number;
  readonly powerCoefficient: number;
  readonly densityKgM3: number;
  readonly gearRatio: number;
  readonly gearEfficiency: number;
  readonly supplyV: number;
}

/**
 * Each propeller holds up its share of the weight: n = √(T ÷ (C_T·ρ·D⁴)) and asks for the
 * torque C_P·ρ·n²·D⁵ ÷ 2π; the motor's current for that torque is Q·Kv + I₀ and its voltage
 * ω/Kv + I·R (the loop resistance, which takes the pack's drop at the whole motor current: the
 * high side of the throttle).
 */
export function hoverPoint(h: HoverInput): HoverPoint {
  const thrustEach = (h.allUpMassKg * STANDARD_GRAVITY) / h.motorCount;
  const revPerS = Math.sqrt(thrustEach / (h.thrustCoefficient * h.densityKgM3 * h.diameterM ** 4));
  const propTorque = (h.powerCoefficient * h.densityKgM3 * revPerS * revPerS * h.diameterM ** 5) / (2 * Math.PI);
  const motorTorque = propTorque / h.gearRatio / h.gearEfficiency;
  const motorCurrentA = motorTorque * h.m.kvRad + h.m.noLoadCurrentA;
  const omega = 2 * Math.PI * revPerS * h.gearRatio;
  const volts = omega / h.m.kvRad + motorCurrentA * h.m.resistanceOhm;
  const throttle = volts / h.supplyV;
  return { throttle, motorCurrentA, supplyCurrentA: h.motorCount * motorCurrentA * throttle };
}
