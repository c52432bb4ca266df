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
  loadedRpm: Known;
  /** All motors together. */
  thrustN: Known;
  tipSpeedMps: Known;
}

/** Names a figure the vehicle's kind does not have (thrust of a car, top speed of a plane). */
export const NOT_APPLICABLE = 'figure.notApplicable';

const isGround = (kind: string): boolean => kind === 'car' || kind === 'truck';

export function operate(inp: BuildInputs, supply: Known<SupplyModel>): Operation {
  const { kind, kv, motorResistanceOhm: rm, noLoadCurrentA: i0, motorCount } = inp;
  if (
    kind.value === null ||
    supply.value === null ||
    kv.value === null ||
    rm.value === null ||
    i0.value === null ||
    motorCount.value === null
  ) {
    const base = missingOf(kind, supply, kv, rm, i0, motorCount);
    const none = lacking(...base);
    return { peakMotorA: none, continuousMotorA: none, loadedTopSpeedKmh: none, loadedRpm: none, thrustN: none, tipSpeedMps: none };
  }
  const n = motorCount.value;
  // Each motor sees its own winding and controller, and the pack drop of all motors together.
  const loopR = rm.value + inp.controllerResistanceOhm + n * supply.value.modelResistanceOhm;
  const m = motorParams(kv.value, loopR, i0.value);
  const volts = supply.value.fullV;
  const notApplicable = lacking(NOT_APPLICABLE);

  if (isGround(kind.value)) {
    const { finalDrive, tireDiameterMm, drivetrainEfficiency, massKg, tractionCoefficient, dragAreaM2, rollingCoefficient } = inp;
    if (finalDrive.value === null || tireDiameterMm.value === null || drivetrainEfficiency.value === null) {
      const none = lacking(...missingOf(finalDrive, tireDiameterMm, drivetrainEfficiency));
      return {
        peakMotorA: lacking(...missingOf(none, massKg, tractionCoefficient)),
        continuousMotorA: lacking(...missingOf(none, massKg, dragAreaM2, rollingCoefficient)),
        loadedTopSpeedKmh: lacking(...missingOf(none, massKg, dragAreaM2, rollingCoefficient)),
        loadedRpm: lacking(...missingOf(none, massKg, dragAreaM2, rollingCoefficient)),
        thrustN: notApplicable,
        tipSpeedMps: notApplicable,
      };
    }
    const d = { motorCount: n, finalDrive: finalDrive.value, tireDiameterMm: tireDiameterMm.value, efficiency: drivetrainEfficiency.value };
    let continuousMotorA: Known;
    let loadedTopSpeedKmh: Known;
    let loadedRpm: Known;
    if (massKg.value !== null && dragAreaM2.value !== null && rollingCoefficient.value !== null) {
      const top = loadedTopSpeed(m, volts, d, {
        massKg: massKg.value,
        dragAreaM2: dragAreaM2.value,
        rollingCoefficient: rollingCoefficient.value,
        airDensity: AIR_DENSITY,
      });
      continuousMotorA = known(top.currentA);
      loadedTopSpeedKmh = known(mpsToKmh(top.speedMps));
      loadedRpm = known(radPerSToRpm(top.omegaRadS));
    } else {
      continuousMotorA = loadedTopSpeedKmh = loadedRpm = lacking(...missingOf(massKg, dragAreaM2, rollingCoefficient));
    }
    let peakMotorA: Known;
    if (massKg.value !== null && tractionCoefficient.value !== null) {
      const launch = launchCurrent(m, volts, d, tractionCoefficient.value, massKg.value);
      // Drag can ask for more at top speed than the tyres allow at launch; the peak is the larger.
      peakMotorA = known(continuousMotorA.value === null ? launch : Math.max(launch, continuousMotorA.value));
    } else {
      peakMotorA = lacking(...missingOf(massKg, tractionCoefficient));
    }
    return { peakMotorA, continuousMotorA, loadedTopSpeedKmh, loadedRpm, thrustN: notApplicable, tipSpeedMps: notApplicable };
  }

  const { propDiameterM, powerCoefficient, thrustCoefficient } = inp;
  if (propDiameterM.value === null || powerCoefficient.value === null) {
    const none = lacking(...missingOf(propDiameterM, powerCoefficient));
    return {
      peakMotorA: none,
      continuousMotorA: none,
      loadedTopSpeedKmh: notApplicable,
      loadedRpm: none,
      thrustN: lacking(...missingOf(none, thrustCoefficient)),
      tipSpeedMps: none,
    };
  }
  const point = staticPropPoint(m, volts, {
    diameterM: propDiameterM.value,
    powerCoefficient: powerCoefficient.value,
    thrustCoefficient: thrustCoefficient.value,
    densityKgM3: kind.value === 'boat' ? FRESH_WATER_DENSITY : AIR_DENSITY,
  });
  // Static current is the highest a propeller asks for, so it stands for both peak and continuous.
  return {
    peakMotorA: known(point.currentA),
    continuousMotorA: known(point.currentA),
    loadedTopSpeedKmh: notApplicable,
    loadedRpm: known(radPerSToRpm(point.omegaRadS)),
    thrustN: point.thrustN === null ? thrustCoefficient : known(n * point.thrustN),
    tipSpeedMps: known(point.tipSpeedMps),
  };
}
