// Full-throttle operating points of a car or truck: launch (peak current) and loaded top
// speed (continuous current). Motor parameters carry the per-motor loop resistance; with
// several motors on one supply each motor sees the pack drop of all of them.

import { currentAt, noLoadOmega, stallCurrent, torqueAt, type MotorParams } from './motor';
import { roadLoad, tractionLimit } from './road-load';
import { findRoot } from './solve';

export interface Driveline {
  motorCount: number;
  finalDrive: number;
  tireDiameterMm: number;
  /** 0 to 1. */
  efficiency: number;
}

/**
 * Per-motor launch current: the smaller of the current that spins the tyres (μ·m·g on the
 * driven wheels at the tyre, back through the gearing and its losses, through Kt, plus I0) and
 * the stall current. `drivenShare` is the share of the weight on the driven wheels (1 for 4WD).
 */
export function launchCurrent(m: MotorParams, voltageV: number, d: Driveline, tractionCoefficient: number, massKg: number, drivenShare = 1): number {
  const radiusM = d.tireDiameterMm / 2000;
  const motorTorque = (tractionLimit(tractionCoefficient, massKg) * drivenShare * radiusM) / d.finalDrive / d.efficiency / d.motorCount;
  // Kt = 1/Kv in SI, so I = Q·Kv + I0.
  const tractionCurrent = motorTorque * m.kvRad + m.noLoadCurrentA;
  return Math.min(tractionCurrent, stallCurrent(m, voltageV));
}

export interface RoadVehicle {
  massKg: number;
  dragAreaM2: number;
  rollingCoefficient: number;
  airDensity: number;
}

export interface TopSpeedPoint {
  speedMps: number;
  omegaRadS: number;
  /** Per motor. */
  currentA: number;
}

interface TopSpeedCtx {
  m: MotorParams;
  voltageV: number;
  d: Driveline;
  v: RoadVehicle;
  radiusM: number;
}

function surplusForce(speedMps: number, c: TopSpeedCtx): number {
  const omega = (speedMps / c.radiusM) * c.d.finalDrive;
  const drive = (c.d.motorCount * torqueAt(c.m, c.voltageV, omega) * c.d.finalDrive * c.d.efficiency) / c.radiusM;
  return drive - roadLoad(c.v.airDensity, c.v.dragAreaM2, c.v.rollingCoefficient, c.v.massKg, speedMps);
}

/** Speed where drive force through the gearing meets road load, at full throttle. */
export function loadedTopSpeed(m: MotorParams, voltageV: number, d: Driveline, v: RoadVehicle): TopSpeedPoint {
  const radiusM = d.tireDiameterMm / 2000;
  const ctx: TopSpeedCtx = { m, voltageV, d, v, radiusM };
  const omegaMax = noLoadOmega(m, voltageV);
  // A motor that cannot overcome its own losses, or a vehicle it cannot move, stays stalled.
  if (!(omegaMax > 0) || surplusForce(0, ctx) <= 0) {
    return { speedMps: 0, omegaRadS: 0, currentA: stallCurrent(m, voltageV) };
  }
  const speedMax = (omegaMax / d.finalDrive) * radiusM;
  const speedMps = findRoot(surplusForce, ctx, 0, speedMax, 1e-9 * Math.max(1, speedMax), 100);
  const omegaRadS = (speedMps / radiusM) * d.finalDrive;
  return { speedMps, omegaRadS, currentA: currentAt(m, voltageV, omegaRadS) };
}
