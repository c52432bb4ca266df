// A full-throttle run of a car or truck from standstill, with the same motor model and road
// load as the steady figures. The vehicle accelerates as
//   m·dv/dt = F_ground − (C_rr·m·g + ½ρC_dA·v²),
// with F_ground the motor force through the gearing and its losses, held to the traction limit
// μ·(share of weight on the driven wheels)·m·g while the tyres would spin (the straight-line
// acceleration model of vehicle-dynamics texts, e.g. T. D. Gillespie, "Fundamentals of Vehicle
// Dynamics", SAE 1992, ch. 2: traction-limited, then power-limited acceleration; from memory).
// While traction limits, the motor current is what the tyres can take; then it is the motor's
// current at the speed the wheels turn, I = P − Q·v (first-order motor model, linear in speed).
//
// Both phases have closed forms, so the run costs a handful of operations, not a time-stepping
// loop (the re-check evaluates thousands of builds):
// - traction-limited: dv/dt = A − C·v², v = √(A/C)·tanh(√(AC)·t) (v = A·t without drag);
// - motor-limited: dv/dt = a − b·v − C·v² (a Riccati equation with constant coefficients): the
//   distance u = v* − v to the top speed v* decays logistically, u = s·u₀·e^(−λt) ÷ (s − u₀ +
//   u₀·e^(−λt)), λ = √(b² + 4aC), s = λ ÷ C (u = u₀·e^(−bt) without drag), and ∫u dt, ∫u² dt
//   follow in closed form, so do ∫I dt and ∫I² dt.
// The inertia of wheels, gears and rotor is not modelled (the sheet says so). The RMS current
// over the run is what heats packs, wires and controllers.

import type { MotorParams } from './motor';
import type { Driveline, RoadVehicle } from './ground-load';
import { STANDARD_GRAVITY } from './constants';

/** Samples per run for charts. */
export const RUN_SAMPLES = 120;

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
  /** Sample times, speeds and per-motor currents (RUN_SAMPLES + 1 of each) when asked for. */
  timeS: number[];
  speedMps: number[];
  currentA: number[];
}

/** The run's two phases as closed forms. */
interface Phases {
  /** Current while traction limits (per motor), and how long that lasts (Infinity: all run). */
  tractionA: number;
  t1: number;
  /** Traction phase: dv/dt = A − C·v². */
  A: number;
  C: number;
  /** Motor phase, from speed v1 at t1: I = P − Q·v; top speed vTop; logistic rate λ and span s. */
  v1: number;
  P: number;
  Q: number;
  vTop: number;
  lambda: number;
  /** λ ÷ C; Infinity without drag. */
  s: number;
  /** True where the vehicle cannot move at all (the motor or the tyres cannot beat rolling resistance). */
  stuck: boolean;
}

function phasesOf(r: RunModel): Phases {
  const { m, voltageV, d, road } = r;
  const radius = d.tireDiameterMm / 2000;
  const mass = road.massKg;
  const P = voltageV / m.resistanceOhm;
  const Q = d.finalDrive / (radius * m.kvRad * m.resistanceOhm);
  // Drive force per ampere above I0, all motors together.
  const K = (d.motorCount * d.finalDrive * d.efficiency) / (radius * m.kvRad);
  const rolling = road.rollingCoefficient * mass * STANDARD_GRAVITY;
  const C = (0.5 * road.airDensity * road.dragAreaM2) / mass;
  const tractionLimits = r.tractionForceN !== null && K * (P - m.noLoadCurrentA) > r.tractionForceN;
  const out: Phases = { tractionA: P, t1: 0, A: 0, C, v1: 0, P, Q, vTop: 0, lambda: 0, s: Infinity, stuck: false };
  if (tractionLimits && r.tractionForceN !== null) {
    out.tractionA = r.tractionForceN / K + m.noLoadCurrentA;
    out.A = (r.tractionForceN - rolling) / mass;
    out.v1 = (P - out.tractionA) / Q;
    if (!(out.A > 0)) {
      out.stuck = true;
      out.t1 = Infinity;
      return out;
    }
    if (C > 0) {
      const terminal = Math.sqrt(out.A / C);
      out.t1 = out.v1 >= terminal ? Infinity : Math.atanh(out.v1 / terminal) / Math.sqrt(out.A * C);
    } else out.t1 = out.v1 / out.A;
  }
  const a = (K * (P - m.noLoadCurrentA) - rolling) / mass;
  const b = (K * Q) / mass;
  if (!tractionLimits && !(a > 0)) {
    out.stuck = true;
    return out;
  }
  out.lambda = Math.sqrt(b * b + 4 * a * C);
  out.vTop = C > 0 ? (out.lambda - b) / (2 * C) : a / b;
  out.s = C > 0 ? out.lambda / C : Infinity;
  return out;
}

/** Distance to top speed τ into the motor phase, from u0 at its start. */
function uAt(p: Phases, u0: number, tau: number): number {
  const w = Math.exp(-p.lambda * tau);
  return p.s === Infinity ? u0 * w : (p.s * u0 * w) / (p.s - u0 + u0 * w);
}

/** Speed and per-motor current at time t. */
function stateAt(p: Phases, t: number): { v: number; i: number } {
  if (p.stuck && p.t1 === Infinity) return { v: 0, i: p.tractionA };
  if (p.stuck) return { v: 0, i: p.P };
  if (t <= p.t1) {
    const v = p.C > 0 ? Math.sqrt(p.A / p.C) * Math.tanh(Math.sqrt(p.A * p.C) * t) : p.A * t;
    return { v, i: p.tractionA };
  }
  const u = uAt(p, p.vTop - p.v1, t - p.t1);
  const v = p.vTop - u;
  return { v, i: p.P - p.Q * v };
}

export function fullThrottleRun(r: RunModel, runLengthS: number, samples = false): RunResult {
  const p = phasesOf(r);
  const T = runLengthS;
  let sum: number;
  let sumSq: number;
  let endSpeed: number;
  if (p.stuck) {
    const i = p.t1 === Infinity ? p.tractionA : p.P;
    sum = i * T;
    sumSq = i * i * T;
    endSpeed = 0;
  } else {
    const t1 = Math.min(p.t1, T);
    sum = p.tractionA * t1;
    sumSq = p.tractionA * p.tractionA * t1;
    const tau = T - t1;
    if (tau > 0) {
      const u0 = p.vTop - p.v1;
      const w = Math.exp(-p.lambda * tau);
      const uEnd = uAt(p, u0, tau);
      const smallDrag = p.s === Infinity || u0 / p.s < 1e-7;
      // ∫u dt and ∫u² dt over the motor phase (closed forms of the logistic decay; the plain
      // exponential where drag is negligible, which also avoids cancellation).
      const intU = smallDrag ? (u0 * (1 - w)) / p.lambda : (p.s / p.lambda) * -Math.log1p((-u0 / p.s) * (1 - w));
      const intU2 = smallDrag ? (u0 * u0 * (1 - w * w)) / (2 * p.lambda) : (uEnd - u0 + p.lambda * intU) / (p.lambda / p.s);
      const iTop = p.P - p.Q * p.vTop;
      sum += iTop * tau + p.Q * intU;
      sumSq += iTop * iTop * tau + 2 * iTop * p.Q * intU + p.Q * p.Q * intU2;
      endSpeed = p.vTop - uEnd;
    } else {
      endSpeed = stateAt(p, T).v;
    }
  }
  const timeS: number[] = [];
  const speedMps: number[] = [];
  const currentA: number[] = [];
  if (samples) {
    for (let k = 0; k <= RUN_SAMPLES; k++) {
      const t = (k / RUN_SAMPLES) * T;
      const st = stateAt(p, t);
      timeS.push(t);
      speedMps.push(st.v);
      currentA.push(st.i);
    }
  }
  return { rmsCurrentA: Math.sqrt(Math.max(0, sumSq) / T), averageCurrentA: sum / T, endSpeedMps: endSpeed, timeS, speedMps, currentA };
}
