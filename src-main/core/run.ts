// A full-throttle run of a car or truck from standstill, time-stepped with the same motor model
// and road load as the steady figures. The vehicle accelerates as
//   m·dv/dt = F_ground − (½ρC_dA·v² + C_rr·m·g),
// with F_ground the motor force through the gearing and its losses, held to the traction limit
// μ·(share of weight on the driven wheels)·m·g while the tyres would spin (the straight-line
// acceleration model of vehicle-dynamics texts, e.g. T. D. Gillespie, "Fundamentals of Vehicle
// Dynamics", SAE 1992, ch. 2: traction-limited then power-limited acceleration). While traction
// limits, the motor current is what the tyres can take; then it is the motor's current at the
// speed the wheels turn. The inertia of wheels, gears and rotor is not modelled (the sheet says
// so). The RMS current over the run is what heats packs, wires and controllers.

import { currentAt, stallCurrent, type MotorParams } from './motor';
import type { Driveline, RoadVehicle } from './ground-load';
import { roadLoad } from './road-load';

/** Steps per run: enough that halving the step moves the RMS by well under 0.5 %. */
export const RUN_STEPS = 240;

export interface RunModel {
  m: MotorParams;
  voltageV: number;
  d: Driveline;
  road: RoadVehicle;
  /** μ·share·m·g, N; null where the traction is unknown (no wheelspin limit: the high-current side). */
  tractionForceN: number | null;
}

export interface RunResult {
  /** Per motor. */
  rmsCurrentA: number;
  averageCurrentA: number;
  endSpeedMps: number;
  /** Sample times, speeds and per-motor currents, RUN_STEPS + 1 of each, for charts. */
  timeS: number[];
  speedMps: number[];
  currentA: number[];
}

interface Point {
  accel: number;
  current: number;
}

function pointAt(r: RunModel, radiusM: number, speedMps: number, out: Point): Point {
  const { m, voltageV, d, road } = r;
  const omega = (speedMps / radiusM) * d.finalDrive;
  // The current cannot pass the stall current (the motor turning no slower than standstill).
  let current = Math.min(currentAt(m, voltageV, omega), stallCurrent(m, voltageV));
  let force = (d.motorCount * ((current - m.noLoadCurrentA) / m.kvRad) * d.finalDrive * d.efficiency) / radiusM;
  if (r.tractionForceN !== null && force > r.tractionForceN) {
    force = r.tractionForceN;
    // The tyres take only this much: the motor torque (and so its current) is held to it.
    current = ((force * radiusM) / d.finalDrive / d.efficiency / d.motorCount) * m.kvRad + m.noLoadCurrentA;
  }
  const resist = roadLoad(road.airDensity, road.dragAreaM2, road.rollingCoefficient, road.massKg, speedMps);
  let accel = (force - resist) / road.massKg;
  // Standing still, rolling resistance holds the vehicle rather than pushing it backwards.
  if (speedMps <= 0 && accel < 0) accel = 0;
  out.accel = accel;
  out.current = current;
  return out;
}

/** Time-steps the run (Heun's method) and integrates I and I² by the trapezoid rule. */
export function fullThrottleRun(r: RunModel, runLengthS: number, samples = false): RunResult {
  const radiusM = r.d.tireDiameterMm / 2000;
  const dt = runLengthS / RUN_STEPS;
  const a: Point = { accel: 0, current: 0 };
  const b: Point = { accel: 0, current: 0 };
  const timeS: number[] = [];
  const speedMps: number[] = [];
  const currentA: number[] = [];
  let v = 0;
  pointAt(r, radiusM, v, a);
  let sum = 0;
  let sumSq = 0;
  if (samples) {
    timeS.push(0);
    speedMps.push(0);
    currentA.push(a.current);
  }
  for (let k = 0; k < RUN_STEPS; k++) {
    const i0 = a.current;
    const acc0 = a.accel;
    pointAt(r, radiusM, Math.max(0, v + acc0 * dt), b);
    v = Math.max(0, v + 0.5 * (acc0 + b.accel) * dt);
    pointAt(r, radiusM, v, a);
    const i1 = a.current;
    sum += 0.5 * (i0 + i1) * dt;
    sumSq += 0.5 * (i0 * i0 + i1 * i1) * dt;
    if (samples) {
      timeS.push((k + 1) * dt);
      speedMps.push(v);
      currentA.push(i1);
    }
  }
  return { rmsCurrentA: Math.sqrt(sumSq / runLengthS), averageCurrentA: sum / runLengthS, endSpeedMps: v, timeS, speedMps, currentA };
}
