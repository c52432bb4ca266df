// Full-throttle operating points of one build on one supply, at full charge (when currents
// are highest, the safe side for every current rule). Cars and trucks go through gearing and
// road load; boats, multirotors and planes through a propeller in water or air.

import { AIR_DENSITY, FRESH_WATER_DENSITY } from './constants';
import type { BuildInputs } from './build-inputs';
import { launchCurrent, loadedTopSpeed } from './ground-load';
import { known, lacking, missingOf, type Known } from './known';
import { motorParams } from './motor';
import { staticPropPoint } from './propeller';
import type { SupplyModel } from './supply';
import { mpsToKmh, radPerSToRpm } from './units';

export interface Operation {
  /** Per motor. */
  peakMotorA: Known;
  /** Per motor. */
  continuousMotorA: Known;
  loadedTopSpeedKmh: Known;
  /** Motor rpm at the loaded top speed on nominal voltage, beside the speed quoted to a driver. */
  loadedRpm: Known;
  /** Motor rpm at the full-charge operating point, where the currents are judged (and charted). */
  loadedRpmFull: Known;
  /** All motors together. */
  thrustN: Known;
  tipSpeedMps: Known;
}

/** Names a figure the vehicle's kind does not have (thrust of a car, top speed of a plane). */
export const NOT_APPLICABLE = 'figure.notApplicable';

const isGround = (kind: string): boolean => kind === 'car' || kind === 'truck';

/** Everything a result lacks, so a technician can fill in all of it at once. */
function lackingAll(base: readonly Known<unknown>[], extra: readonly Known<unknown>[]): Known {
  return lacking(...missingOf(...base, ...extra));
}

const anyMissing = (ks: readonly Known<unknown>[]): boolean => ks.some((k) => k.value === null);

export function operate(inp: BuildInputs, supply: Known<SupplyModel>): Operation {
  const { kind, kv, motorResistanceOhm: rm, noLoadCurrentA: i0, motorCount } = inp;
  const base: Known<unknown>[] = [kind, supply, kv, rm, i0, motorCount];
  const notApplicable = lacking(NOT_APPLICABLE);
  if (kind.value === null) {
    const none = lackingAll(base, []);
    return { peakMotorA: none, continuousMotorA: none, loadedTopSpeedKmh: none, loadedRpm: none, loadedRpmFull: none, thrustN: none, tipSpeedMps: none };
  }
  const ground = isGround(kind.value);
  const { finalDrive, tireDiameterMm, drivetrainEfficiency, massKg, tractionCoefficient, dragAreaM2, rollingCoefficient } = inp;
  const { propDiameterM, powerCoefficient, thrustCoefficient } = inp;
  const peakNeeds = ground ? [finalDrive, tireDiameterMm, drivetrainEfficiency, massKg, tractionCoefficient] : [propDiameterM, powerCoefficient];
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
    return {
      peakMotorA: peak,
      continuousMotorA: cont,
      loadedTopSpeedKmh: ground ? cont : notApplicable,
      loadedRpm: cont,
      loadedRpmFull: cont,
      thrustN: ground ? notApplicable : lackingAll(base, [...peakNeeds, thrustCoefficient]),
      tipSpeedMps: ground ? notApplicable : peak,
    };
  }
  const n = motorCount.value;
  // Each motor sees its own winding and controller, and the pack drop of all motors together.
  const loopR = rm.value + inp.controllerResistanceOhm + n * supply.value.modelResistanceOhm;
  const m = motorParams(kv.value, loopR, i0.value);
  const volts = supply.value.fullV;

  if (ground && finalDrive.value !== null && tireDiameterMm.value !== null && drivetrainEfficiency.value !== null) {
    const d = { motorCount: n, finalDrive: finalDrive.value, tireDiameterMm: tireDiameterMm.value, efficiency: drivetrainEfficiency.value };
    let continuousMotorA: Known;
    let loadedTopSpeedKmh: Known;
    let loadedRpm: Known;
    let loadedRpmFull: Known;
    if (massKg.value !== null && dragAreaM2.value !== null && rollingCoefficient.value !== null) {
      const road = { massKg: massKg.value, dragAreaM2: dragAreaM2.value, rollingCoefficient: rollingCoefficient.value, airDensity: AIR_DENSITY };
      // The current is judged at full charge (the worst case); the speed a driver sees is
      // quoted at nominal voltage, like the theoretical speed beside it.
      const top = loadedTopSpeed(m, volts, d, road);
      const cruising = loadedTopSpeed(m, supply.value.nominalV, d, road);
      continuousMotorA = known(top.currentA);
      loadedTopSpeedKmh = known(mpsToKmh(cruising.speedMps));
      loadedRpm = known(radPerSToRpm(cruising.omegaRadS));
      loadedRpmFull = known(radPerSToRpm(top.omegaRadS));
    } else {
      continuousMotorA = loadedTopSpeedKmh = loadedRpm = loadedRpmFull = lackingAll([], contNeeds);
    }
    let peakMotorA: Known;
    if (massKg.value !== null && tractionCoefficient.value !== null) {
      const launch = launchCurrent(m, volts, d, tractionCoefficient.value, massKg.value);
      // Drag can ask for more at top speed than the tyres allow at launch; the peak is the larger.
      peakMotorA = known(continuousMotorA.value === null ? launch : Math.max(launch, continuousMotorA.value));
    } else {
      peakMotorA = lackingAll([], peakNeeds);
    }
    return { peakMotorA, continuousMotorA, loadedTopSpeedKmh, loadedRpm, loadedRpmFull, thrustN: notApplicable, tipSpeedMps: notApplicable };
  }
  if (ground || propDiameterM.value === null || powerCoefficient.value === null) {
    // Unreachable in practice (the guard above covers it); kept so the types stay honest.
    const peak = lackingAll([], peakNeeds);
    return { peakMotorA: peak, continuousMotorA: peak, loadedTopSpeedKmh: peak, loadedRpm: peak, loadedRpmFull: peak, thrustN: notApplicable, tipSpeedMps: notApplicable };
  }
  const point = staticPropPoint(m, volts, {
    diameterM: propDiameterM.value,
    powerCoefficient: powerCoefficient.value,
    thrustCoefficient: thrustCoefficient.value,
    densityKgM3: kind.value === 'boat' ? FRESH_WATER_DENSITY : AIR_DENSITY,
  });
  // Static current is the highest a propeller asks for, so it stands for both peak and continuous.
  const staticRpm = known(radPerSToRpm(point.omegaRadS));
  return {
    peakMotorA: known(point.currentA),
    continuousMotorA: known(point.currentA),
    loadedTopSpeedKmh: notApplicable,
    loadedRpm: staticRpm,
    loadedRpmFull: staticRpm,
    thrustN: point.thrustN === null ? thrustCoefficient : known(n * point.thrustN),
    tipSpeedMps: known(point.tipSpeedMps),
  };
}
