// The full-throttle operating point of a car or truck on one supply, at full charge (when the
// currents are highest, the safe side for every current rule).
//
// The motor is the first-order DC model (M. Drela, "First-Order DC Electric Motor Model",
// MIT Aero & Astro, 2007), its loop resistance taking in the controller and the pack. It drives
// the wheels through the final drive ratio and the drivetrain efficiency; the road pushes back
// with rolling resistance C_rr·m·g and aerodynamic drag ½·ρ·C_d·A·v².
// - Peak current: the launch, where the tyres' grip μ·m·g on the driven wheels caps the torque
//   (or the stall current, where that is lower), or the continuous current where drag asks for more.
// - Continuous current: the larger of the steady current at the loaded top speed (where motor
//   torque through the drivetrain meets road load) and the RMS current over a full-throttle run
//   from standstill, over the build's run length.

import type { BuildInputs } from './build-inputs';
import { AIR_DENSITY } from './constants';
import { launchCurrent, loadedTopSpeed, type Driveline, type RoadVehicle } from './ground-load';
import { known, lacking, type Known } from './known';
import type { MotorParams } from './motor';
import { allOf, anyMissing, baseNeeds, lackingAll, motorInLoop, NOT_APPLICABLE, type Operation } from './operation';
import { tractionLimit } from './road-load';
import { fullThrottleRun, type RunModel } from './run';
import type { SupplyModel } from './supply';
import { mpsToKmh, radPerSToRpm } from './units';

function runModelOf(inp: BuildInputs, m: MotorParams, voltageV: number, d: Driveline, road: RoadVehicle): RunModel {
  const { tractionCoefficient: mu, massKg } = inp;
  // Without a traction coefficient the run takes no wheelspin limit: the current reads high.
  const tractionForceN = mu.value === null || massKg.value === null ? null : tractionLimit(mu.value, massKg.value) * inp.drivenShare;
  return { m, voltageV, d, road, tractionForceN };
}

function drivelineOf(inp: BuildInputs): Driveline | null {
  const { motorCount, finalDrive, tireDiameterMm, drivetrainEfficiency } = inp;
  if (motorCount.value === null || finalDrive.value === null || tireDiameterMm.value === null || drivetrainEfficiency.value === null) return null;
  return { motorCount: motorCount.value, finalDrive: finalDrive.value, tireDiameterMm: tireDiameterMm.value, efficiency: drivetrainEfficiency.value };
}

function roadOf(inp: BuildInputs): RoadVehicle | null {
  const { massKg, dragAreaM2, rollingCoefficient } = inp;
  if (massKg.value === null || dragAreaM2.value === null || rollingCoefficient.value === null) return null;
  return { massKg: massKg.value, dragAreaM2: dragAreaM2.value, rollingCoefficient: rollingCoefficient.value, airDensity: AIR_DENSITY };
}

/**
 * The full-throttle run of a car or truck on one supply, as the continuous current is judged on
 * it (full charge, the same loop resistance); null where an input it needs is missing.
 */
export function groundRunModel(inp: BuildInputs, supply: Known<SupplyModel>): RunModel | null {
  const kind = inp.kind.value;
  if (kind !== 'car' && kind !== 'truck') return null;
  if (supply.value === null) return null;
  const m = motorInLoop(inp, supply.value);
  const d = drivelineOf(inp);
  const road = roadOf(inp);
  if (m === null || d === null || road === null) return null;
  return runModelOf(inp, m, supply.value.fullV, d, road);
}

export function groundOperatingPoint(inp: BuildInputs, supply: Known<SupplyModel>): Operation {
  const { finalDrive, tireDiameterMm, drivetrainEfficiency, massKg, tractionCoefficient, dragAreaM2, rollingCoefficient } = inp;
  const notApplicable = lacking(NOT_APPLICABLE);
  const base = baseNeeds(inp, supply);
  const peakNeeds = [finalDrive, tireDiameterMm, drivetrainEfficiency, massKg, tractionCoefficient];
  const contNeeds = [finalDrive, tireDiameterMm, drivetrainEfficiency, massKg, dragAreaM2, rollingCoefficient];
  const m = supply.value === null ? null : motorInLoop(inp, supply.value);
  const d = drivelineOf(inp);
  if (supply.value === null || m === null || d === null || (anyMissing(peakNeeds) && anyMissing(contNeeds))) {
    const op = allOf(lackingAll(base, contNeeds), notApplicable, true);
    op.peakMotorA = lackingAll(base, peakNeeds);
    return op;
  }
  const volts = supply.value.fullV;
  const op = allOf(lackingAll([], contNeeds), notApplicable, true);
  const road = roadOf(inp);
  if (road !== null) {
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
