// What the full-throttle operating point of one build on one supply yields, whichever way the
// motor is loaded, and the pieces the ground and propeller points share.

import type { BuildInputs } from './build-inputs';
import { lacking, missingOf, type Known } from './known';
import { motorParams, type MotorParams } from './motor';
import type { SupplyModel } from './supply';

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

/** Everything a result lacks, so a technician can fill in all of it at once. */
export function lackingAll(base: readonly Known<unknown>[], extra: readonly Known<unknown>[]): Known {
  return lacking(...missingOf(...base, ...extra));
}

export const anyMissing = (ks: readonly Known<unknown>[]): boolean => ks.some((k) => k.value === null);

/** One value for every result the kind has; `na` for those it does not. */
export function allOf(k: Known, na: Known, ground: boolean): Operation {
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

/** What every operating point needs besides the load: the kind, the supply and the motor. */
export function baseNeeds(inp: BuildInputs, supply: Known<SupplyModel>): Known<unknown>[] {
  return [inp.kind, supply, inp.kv, inp.motorResistanceOhm, inp.noLoadCurrentA, inp.motorCount];
}

/**
 * One motor as its supply drives it: the winding, its controller and the pack drop of all
 * motors together sit in series with the motor's back-EMF, so they add to its resistance in
 * the first-order model. Null where an input is missing.
 */
export function motorInLoop(inp: BuildInputs, supply: SupplyModel): MotorParams | null {
  const { kv, motorResistanceOhm: rm, noLoadCurrentA: i0, motorCount } = inp;
  if (kv.value === null || rm.value === null || i0.value === null || motorCount.value === null) return null;
  const loopR = rm.value + inp.controllerResistanceOhm + motorCount.value * supply.modelResistanceOhm;
  return motorParams(kv.value, loopR, i0.value);
}
