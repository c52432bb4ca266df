// Full-throttle operating points of one build on one supply, at full charge (when currents
// are highest, the safe side for every current rule). Cars and trucks go through gearing and
// road load; boats, multirotors and planes through a propeller in water or air.

import { AIR_DENSITY } from './constants';
import type { BuildInputs } from './build-inputs';
import { launchCurrent, loadedTopSpeed } from './ground-load';
import { known, lacking, missingOf, type Known } from './known';
import { motorParams } from './motor';
import { staticPropPoint, tipSpeed, unloadedPropRevPerS } from './propeller';
import { tractionLimit } from './road-load';
import { fullThrottleRun, type RunModel } from './run';
import type { Driveline, RoadVehicle } from './ground-load';
import type { MotorParams } from './motor';
import type { SupplyModel } from './supply';
import { mpsToKmh, radPerSToRpm } from './units';

export interface Operation {
  /** Per motor. */
  peakMotorA: Known;
  /** Per motor: the larger of the run's RMS current and the steady current. */
  continuousMotorA: Known;
  /** Per motor, at the loaded top speed (cars and trucks) or the static point (propellers). */
  steadyMotorA: Known;
  /** Per motor, over the full-throttle run (cars and trucks). */
  runRmsMotorA: Known;
  runAverageMotorA: Known;
  loadedTopSpeedKmh: Known;
  /** Motor rpm at the loaded top speed on nominal voltage, beside the speed quoted to a driver. */
  loadedRpm: Known;
  /** Motor rpm at the full-charge operating point, where the currents are judged (and charted). */
  loadedRpmFull: Known;
  /** All motors together. */
  thrustN: Known;
  /** Tip speed at the highest rpm the propeller can reach (unloaded, full charge): the one judged. */
  tipSpeedMps: Known;
  /** Tip speed at the static full-throttle point. */
  tipSpeedStaticMps: Known;
  propRpmStatic: Known;
  propRpmUnloaded: Known;
}

/** Names a figure the vehicle's kind does not have (thrust of a car, top speed of a plane). */
export const NOT_APPLICABLE = 'figure.notApplicable';

const isGround = (kind: string): boolean => kind === 'car' || kind === 'truck';

/** Everything a result lacks, so a technician can fill in all of it at once. */
function lackingAll(base: readonly Known<unknown>[], extra: readonly Known<unknown>[]): Known {
  return lacking(...missingOf(...base, ...extra));
}

const anyMissing = (ks: readonly Known<unknown>[]): boolean => ks.some((k) => k.value === null);

function allOf(k: Known, na: Known, ground: boolean): Operation {
  return {
    peakMotorA: k,
    continuousMotorA: k,
    steadyMotorA: k,
    runRmsMotorA: ground ? k : na,
    runAverageMotorA: ground ? k : na,
    loadedTopSpeedKmh: ground ? k : na,
    loadedRpm: k,
    loadedRpmFull: k,
    thrustN: ground ? na : k,
    tipSpeedMps: ground ? na : k,
    tipSpeedStaticMps: ground ? na : k,
    propRpmStatic: ground ? na : k,
    propRpmUnloaded: ground ? na : k,
  };
}

function runModelOf(inp: BuildInputs, m: MotorParams, voltageV: number, d: Driveline, road: RoadVehicle): RunModel {
  const { tractionCoefficient: mu, massKg } = inp;
  const tractionForceN = mu.value === null || massKg.value === null ? null : tractionLimit(mu.value, massKg.value) * inp.drivenShare;
  return { m, voltageV, d, road, tractionForceN };
}

/**
 * The full-throttle run of a car or truck on one supply, as the continuous current is judged on
 * it (full charge, the same loop resistance); null where an input it needs is missing.
 */
export function groundRunModel(inp: BuildInputs, supply: Known<SupplyModel>): RunModel | null {
  const { kind, kv, motorResistanceOhm: rm, noLoadCurrentA: i0, motorCount, finalDrive, tireDiameterMm, drivetrainEfficiency, massKg, dragAreaM2, rollingCoefficient } = inp;
  if (kind.value === null || !isGround(kind.value) || supply.value === null) return null;
  if (kv.value === null || rm.value === null || i0.value === null || motorCount.value === null) return null;
  if (finalDrive.value === null || tireDiameterMm.value === null || drivetrainEfficiency.value === null) return null;
  if (massKg.value === null || dragAreaM2.value === null || rollingCoefficient.value === null) return null;
  const n = motorCount.value;
  const m = motorParams(kv.value, rm.value + inp.controllerResistanceOhm + n * supply.value.modelResistanceOhm, i0.value);
  const d = { motorCount: n, finalDrive: finalDrive.value, tireDiameterMm: tireDiameterMm.value, efficiency: drivetrainEfficiency.value };
  const road = { massKg: massKg.value, dragAreaM2: dragAreaM2.value, rollingCoefficient: rollingCoefficient.value, airDensity: AIR_DENSITY };
  return runModelOf(inp, m, supply.value.fullV, d, road);
}

export function operate(inp: BuildInputs, supply: Known<SupplyModel>): Operation {
  const { kind, kv, motorResistanceOhm: rm, noLoadCurrentA: i0, motorCount } = inp;
  const base: Known<unknown>[] = [kind, supply, kv, rm, i0, motorCount];
  const notApplicable = lacking(NOT_APPLICABLE);
  if (kind.value === null) {
    const none = lackingAll(base, []);
    return allOf(none, none, true);
  }
  const ground = isGround(kind.value);
  const { finalDrive, tireDiameterMm, drivetrainEfficiency, massKg, tractionCoefficient, dragAreaM2, rollingCoefficient } = inp;
  const { propDiameterM, powerCoefficient, thrustCoefficient } = inp;
  // A geared propeller also needs the gearbox efficiency; direct drive does not.
  const propNeeds = inp.propGeared ? [propDiameterM, powerCoefficient, drivetrainEfficiency] : [propDiameterM, powerCoefficient];
  const peakNeeds = ground ? [finalDrive, tireDiameterMm, drivetrainEfficiency, massKg, tractionCoefficient] : propNeeds;
  const contNeeds = ground ? [finalDrive, tireDiameterMm, drivetrainEfficiency, massKg, dragAreaM2, rollingCoefficient] : peakNeeds;

  if (
    supply.value === null ||
    kv.value === null ||
    rm.value === null ||
    i0.value === null ||
    motorCount.value === null ||
    (anyMissing(peakNeeds) && anyMissing(contNeeds))
  ) {
    const peak = lackingAll(base, peakNeeds);
    const cont = lackingAll(base, contNeeds);
    const op = allOf(cont, notApplicable, ground);
    op.peakMotorA = peak;
    if (!ground) {
      op.thrustN = lackingAll(base, [...peakNeeds, thrustCoefficient]);
      op.tipSpeedMps = op.tipSpeedStaticMps = op.propRpmStatic = peak;
      op.propRpmUnloaded = lackingAll([kind, supply, kv, rm, i0, motorCount], [propDiameterM]);
      // The unloaded rpm needs no propeller coefficients, so its tip speed is judged without them.
      if (supply.value !== null && kv.value !== null && rm.value !== null && i0.value !== null && motorCount.value !== null && propDiameterM.value !== null) {
        const loopR = rm.value + inp.controllerResistanceOhm + motorCount.value * supply.value.modelResistanceOhm;
        const revPerS = unloadedPropRevPerS(motorParams(kv.value, loopR, i0.value), supply.value.fullV, inp.propGearRatio);
        op.propRpmUnloaded = known(revPerS * 60);
        op.tipSpeedMps = known(tipSpeed(revPerS, propDiameterM.value));
      }
    }
    return op;
  }
  const n = motorCount.value;
  // Each motor sees its own winding and controller, and the pack drop of all motors together.
  const loopR = rm.value + inp.controllerResistanceOhm + n * supply.value.modelResistanceOhm;
  const m = motorParams(kv.value, loopR, i0.value);
  const volts = supply.value.fullV;

  if (ground && finalDrive.value !== null && tireDiameterMm.value !== null && drivetrainEfficiency.value !== null) {
    const d = { motorCount: n, finalDrive: finalDrive.value, tireDiameterMm: tireDiameterMm.value, efficiency: drivetrainEfficiency.value };
    const op = allOf(lackingAll([], contNeeds), notApplicable, true);
    if (massKg.value !== null && dragAreaM2.value !== null && rollingCoefficient.value !== null) {
      const road = { massKg: massKg.value, dragAreaM2: dragAreaM2.value, rollingCoefficient: rollingCoefficient.value, airDensity: AIR_DENSITY };
      // The current is judged at full charge (the worst case); the speed a driver sees is
      // quoted at nominal voltage, like the theoretical speed beside it.
      const top = loadedTopSpeed(m, volts, d, road);
      const cruising = loadedTopSpeed(m, supply.value.nominalV, d, road);
      const run = fullThrottleRun(runModelOf(inp, m, volts, d, road), inp.runLengthS);
      op.steadyMotorA = known(top.currentA);
      op.runRmsMotorA = known(run.rmsCurrentA);
      op.runAverageMotorA = known(run.averageCurrentA);
      // What a pack and a controller carry on a real run is at least the steady current.
      op.continuousMotorA = known(Math.max(run.rmsCurrentA, top.currentA));
      op.loadedTopSpeedKmh = known(mpsToKmh(cruising.speedMps));
      op.loadedRpm = known(radPerSToRpm(cruising.omegaRadS));
      op.loadedRpmFull = known(radPerSToRpm(top.omegaRadS));
    }
    if (massKg.value !== null && tractionCoefficient.value !== null) {
      const launch = launchCurrent(m, volts, d, tractionCoefficient.value, massKg.value, inp.drivenShare);
      // Drag can ask for more at top speed than the tyres allow at launch; the peak is the larger.
      const cont = op.continuousMotorA.value;
      op.peakMotorA = known(cont === null ? launch : Math.max(launch, cont));
    } else {
      op.peakMotorA = lackingAll([], peakNeeds);
    }
    return op;
  }
  if (ground || propDiameterM.value === null || powerCoefficient.value === null) {
    // Unreachable in practice (the guard above covers it); kept so the types stay honest.
    return allOf(lackingAll([], peakNeeds), notApplicable, ground);
  }
  const ratio = inp.propGearRatio;
  const point = staticPropPoint(m, volts, {
    diameterM: propDiameterM.value,
    powerCoefficient: powerCoefficient.value,
    thrustCoefficient: thrustCoefficient.value,
    densityKgM3: inp.fluidDensity,
    gearRatio: ratio,
    gearEfficiency: inp.propGeared ? (drivetrainEfficiency.value ?? 1) : 1,
  });
  // Static current is the highest a propeller asks for, so it stands for both peak and continuous.
  const staticRpm = known(radPerSToRpm(point.omegaRadS));
  const unloadedRevPerS = unloadedPropRevPerS(m, volts, ratio);
  const current = known(point.currentA);
  return {
    peakMotorA: current,
    continuousMotorA: current,
    steadyMotorA: current,
    runRmsMotorA: notApplicable,
    runAverageMotorA: notApplicable,
    loadedTopSpeedKmh: notApplicable,
    loadedRpm: staticRpm,
    loadedRpmFull: staticRpm,
    thrustN: point.thrustN === null ? thrustCoefficient : known(n * point.thrustN),
    tipSpeedMps: known(tipSpeed(unloadedRevPerS, propDiameterM.value)),
    tipSpeedStaticMps: known(point.tipSpeedMps),
    propRpmStatic: known(point.revPerS * 60),
    propRpmUnloaded: known(unloadedRevPerS * 60),
  };
}
