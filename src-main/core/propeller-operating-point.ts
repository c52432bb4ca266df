// The full-throttle operating point of a boat, multirotor or plane on one supply, at full
// charge (when the currents are highest, the safe side for every current rule).
//
// The motor is the first-order DC model (M. Drela, "First-Order DC Electric Motor Model",
// MIT Aero & Astro, 2007), its loop resistance taking in the controller and the pack. It turns
// the propeller directly or through a gearbox; the propeller asks for the power
// P = C_P·ρ·n³·D⁵ (n in rev/s) and gives the thrust T = C_T·ρ·n²·D⁴, in water or air.
// - Peak and continuous current: the static point, where motor torque meets the propeller's
//   P/ω. A propeller asks for the most torque standing still, so it stands for both.
// - Tip speed is judged at the highest rpm the propeller can reach: as the craft moves the
//   propeller unloads and the motor runs toward its no-load speed Kv·(V − I0·R).

import type { BuildInputs } from './build-inputs';
import { known, lacking, type Known } from './known';
import { allOf, anyMissing, baseNeeds, lackingAll, motorInLoop, NOT_APPLICABLE, type Operation } from './operation';
import { staticPropPoint, tipSpeed, unloadedPropRevPerS } from './propeller';
import type { SupplyModel } from './supply';
import { radPerSToRpm } from './units';

export function propellerOperatingPoint(inp: BuildInputs, supply: Known<SupplyModel>): Operation {
  const { propDiameterM, powerCoefficient, thrustCoefficient, drivetrainEfficiency } = inp;
  const notApplicable = lacking(NOT_APPLICABLE);
  const base = baseNeeds(inp, supply);
  // A geared propeller also needs the gearbox efficiency; direct drive does not.
  const needs = inp.propGeared ? [propDiameterM, powerCoefficient, drivetrainEfficiency] : [propDiameterM, powerCoefficient];
  const m = supply.value === null ? null : motorInLoop(inp, supply.value);
  const n = inp.motorCount.value;
  const ratio = inp.propGearRatio;

  if (supply.value === null || m === null || n === null || propDiameterM.value === null || powerCoefficient.value === null || anyMissing(needs)) {
    const peak = lackingAll(base, needs);
    const op = allOf(lackingAll(base, needs), notApplicable, false);
    op.peakMotorA = peak;
    op.thrustN = lackingAll(base, [...needs, thrustCoefficient]);
    op.tipSpeedMps = op.tipSpeedStaticMps = op.propRpmStatic = peak;
    op.propRpmUnloaded = lackingAll(base, [propDiameterM]);
    // The unloaded rpm needs no propeller coefficients, so its tip speed is judged without them.
    if (supply.value !== null && m !== null && propDiameterM.value !== null) {
      const revPerS = unloadedPropRevPerS(m, supply.value.fullV, ratio);
      op.propRpmUnloaded = known(revPerS * 60);
      op.tipSpeedMps = known(tipSpeed(revPerS, propDiameterM.value));
    }
    return op;
  }
  const volts = supply.value.fullV;
  const point = staticPropPoint(m, volts, {
    diameterM: propDiameterM.value,
    powerCoefficient: powerCoefficient.value,
    thrustCoefficient: thrustCoefficient.value,
    densityKgM3: inp.fluidDensity,
    gearRatio: ratio,
    gearEfficiency: inp.propGeared ? (drivetrainEfficiency.value ?? 1) : 1,
  });
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
