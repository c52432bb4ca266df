// What the build sheet's charts draw, as plain numbers from the same core the verdict came
// from: limits are the ratings the checks used (in supply-current terms), marked points are
// the figures the sheet lists. Kept free of chart.js so it can be checked on its own.

import type { BuildContext, Finding, PackShare, SupplyVerdict } from '$core/domain';
import { buildInputs } from '$core/build-inputs';
import { groundRunModel } from '$core/ground-operating-point';
import { loadedTopSpeed } from '$core/ground-load';
import { motorParams, noLoadOmega, torqueAt, type MotorParams } from '$core/motor';
import { roadLoad } from '$core/road-load';
import type { RunModel } from '$core/run';
import { staticPropPoint, tipSpeed, type PropellerLoad } from '$core/propeller';
import { supplyModel } from '$core/supply';
import { mpsToKmh } from '$core/units';

export type LimitPart = 'pack' | 'controller' | 'motor';

/** One part's current rating as a band: from its continuous rating up to its burst rating (a line where there is one rating). */
export interface CurrentBand {
  part: LimitPart;
  label: string;
  lowA: number;
  highA: number;
}

const limitOf = (findings: readonly Finding[], rule: string): number | null => findings.find((f) => f.rule === rule)?.limit ?? null;

/** The pack whose rating the supply reaches first, as supply current: its rating ÷ its share. */
function packSupplyLimit(shares: readonly PackShare[], key: 'continuousLimitA' | 'burstLimitA'): number | null {
  let best: number | null = null;
  for (const p of shares) {
    const limit = p[key];
    if (limit === null || !(p.share > 0)) continue;
    const asSupply = limit / p.share;
    if (best === null || asSupply < best) best = asSupply;
  }
  return best;
}

/**
 * The current ratings of pack, controller and motor in terms of the supply current (all
 * motors together; the share the worst pack carries), as the checks judged them. `perMotor`
 * divides by the motor count instead: one motor's current, as a propeller chart draws it.
 */
export function currentBands(v: Pick<SupplyVerdict, 'findings' | 'packShares'>, motorCount: number, perMotor = false): CurrentBand[] {
  const n = Math.max(1, motorCount);
  // Controller and motor ratings are per motor; the pack's is for the whole supply.
  const supplyScale = perMotor ? 1 / n : 1;
  const motorScale = perMotor ? 1 : n;
  const out: CurrentBand[] = [];
  const band = (part: LimitPart, label: string, low: number | null, high: number | null) => {
    const lo = low ?? high;
    const hi = high ?? low;
    if (lo !== null && hi !== null) out.push({ part, label, lowA: Math.min(lo, hi), highA: Math.max(lo, hi) });
  };
  const packCont = packSupplyLimit(v.packShares, 'continuousLimitA') ?? limitOf(v.findings, 'battery-continuous');
  const packBurst = packSupplyLimit(v.packShares, 'burstLimitA') ?? limitOf(v.findings, 'battery-burst');
  band('pack', 'Pack', packCont === null ? null : packCont * supplyScale, packBurst === null ? null : packBurst * supplyScale);
  const cc = limitOf(v.findings, 'controller-continuous');
  const cb = limitOf(v.findings, 'controller-burst');
  band('controller', 'Speed controller', cc === null ? null : cc * motorScale, cb === null ? null : cb * motorScale);
  const mc = limitOf(v.findings, 'motor-current');
  band('motor', 'Motor', mc === null ? null : mc * motorScale, null);
  return out;
}

export interface ForceChartData {
  speedKmh: number[];
  /** Drive force at the wheels at full throttle, full charge, all motors, held to the traction limit, N. */
  driveN: number[];
  /** Road load: rolling resistance plus air drag, N. */
  roadN: number[];
  /** μ × weight on the driven wheels, N; null where the traction is not known. */
  tractionN: number | null;
  marks: { label: string; speedKmh: number; forceN: number; currentA: number }[];
}

/** Tractive force and road load against road speed for a car or truck, from its run model. */
export function forceChartData(r: RunModel, points = 60): ForceChartData | null {
  const { m, voltageV, d, road } = r;
  const radiusM = d.tireDiameterMm / 2000;
  const topOmega = noLoadOmega(m, voltageV);
  if (!(topOmega > 0)) return null;
  const vMax = (topOmega / d.finalDrive) * radiusM;
  const out: ForceChartData = { speedKmh: [], driveN: [], roadN: [], tractionN: r.tractionForceN, marks: [] };
  const drive = (v: number) => {
    const f = (d.motorCount * torqueAt(m, voltageV, (v / radiusM) * d.finalDrive) * d.finalDrive * d.efficiency) / radiusM;
    return Math.max(0, r.tractionForceN === null ? f : Math.min(f, r.tractionForceN));
  };
  for (let k = 0; k <= points; k++) {
    const v = (vMax * k) / points;
    out.speedKmh.push(mpsToKmh(v));
    out.driveN.push(drive(v));
    out.roadN.push(roadLoad(road.airDensity, road.dragAreaM2, road.rollingCoefficient, road.massKg, v));
  }
  // Launch: the force the tyres pass at standstill, and the supply current it takes.
  const launchN = drive(0);
  const launchA = d.motorCount * (((launchN * radiusM) / (d.finalDrive * d.efficiency * d.motorCount)) * m.kvRad + m.noLoadCurrentA);
  out.marks.push({ label: 'Launch', speedKmh: 0, forceN: launchN, currentA: launchA });
  const top = loadedTopSpeed(m, voltageV, d, road);
  out.marks.push({
    label: 'Loaded top speed, full charge',
    speedKmh: mpsToKmh(top.speedMps),
    forceN: roadLoad(road.airDensity, road.dragAreaM2, road.rollingCoefficient, road.massKg, top.speedMps),
    currentA: top.currentA * d.motorCount,
  });
  return out;
}

export interface PropChartData {
  /** Throttle taken as the share of the full-charge voltage the controller passes on, 0.1 to 1. */
  throttle: number[];
  propellerRpm: number[];
  /** Per motor, A. */
  currentA: number[];
  /** All motors together, N; null where the thrust coefficient is missing. */
  thrustN: (number | null)[];
  tipSpeedMps: number[];
  /** Static full throttle and unloaded (the highest rpm the propeller reaches). */
  marks: { label: string; propellerRpm: number; currentA: number; tipSpeedMps: number; thrustN: number | null }[];
}

/** Motor current, thrust and tip speed of a propeller build over the throttle range, at full charge. */
export function propChartData(m: MotorParams, fullV: number, p: PropellerLoad, motorCount: number, steps = 20): PropChartData {
  const out: PropChartData = { throttle: [], propellerRpm: [], currentA: [], thrustN: [], tipSpeedMps: [], marks: [] };
  const ratio = p.gearRatio ?? 1;
  for (let k = 1; k <= steps; k++) {
    const t = 0.1 + (0.9 * (k - 1)) / (steps - 1);
    const pt = staticPropPoint(m, fullV * t, p);
    out.throttle.push(t);
    out.propellerRpm.push(pt.revPerS * 60);
    out.currentA.push(pt.currentA);
    out.thrustN.push(pt.thrustN === null ? null : pt.thrustN * motorCount);
    out.tipSpeedMps.push(pt.tipSpeedMps);
  }
  const full = staticPropPoint(m, fullV, p);
  out.marks.push({ label: 'Static, full throttle', propellerRpm: full.revPerS * 60, currentA: full.currentA, tipSpeedMps: full.tipSpeedMps, thrustN: full.thrustN === null ? null : full.thrustN * motorCount });
  const unloadedRevPerS = Math.max(0, noLoadOmega(m, fullV)) / ratio / (2 * Math.PI);
  out.marks.push({ label: 'Unloaded', propellerRpm: unloadedRevPerS * 60, currentA: m.noLoadCurrentA, tipSpeedMps: tipSpeed(unloadedRevPerS, p.diameterM), thrustN: null });
  return out;
}

/** The run model of one supply of a car or truck, as the checks build it. */
export function groundModelOf(ctx: BuildContext, supplyId: string): RunModel | null {
  const supply = ctx.build.supplies.find((s) => s.id === supplyId);
  if (!supply) return null;
  return groundRunModel(buildInputs(ctx), supplyModel(supply, ctx.batteries));
}

/** The motor and propeller of one supply of a propeller build, with the loop resistance the checks use. */
export function propModelOf(ctx: BuildContext, supplyId: string): { m: MotorParams; fullV: number; load: PropellerLoad; motorCount: number } | null {
  const supply = ctx.build.supplies.find((s) => s.id === supplyId);
  if (!supply) return null;
  const inp = buildInputs(ctx);
  const s = supplyModel(supply, ctx.batteries).value;
  const { kv, motorResistanceOhm: rm, noLoadCurrentA: i0, motorCount, propDiameterM, powerCoefficient, thrustCoefficient } = inp;
  if (!inp.hasPropeller || s === null || kv.value === null || rm.value === null || i0.value === null || motorCount.value === null) return null;
  if (propDiameterM.value === null || powerCoefficient.value === null) return null;
  const n = motorCount.value;
  // As the checks: each motor sees its winding and controller, and the pack drop of all motors.
  const m = motorParams(kv.value, rm.value + inp.controllerResistanceOhm + n * s.modelResistanceOhm, i0.value);
  const load: PropellerLoad = {
    diameterM: propDiameterM.value,
    powerCoefficient: powerCoefficient.value,
    thrustCoefficient: thrustCoefficient.value,
    densityKgM3: inp.fluidDensity,
    gearRatio: inp.propGearRatio,
    gearEfficiency: inp.propGeared ? (inp.drivetrainEfficiency.value ?? 1) : 1,
  };
  return { m, fullV: s.fullV, load, motorCount: n };
}
