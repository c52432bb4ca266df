// The wider figures of one supply as the evaluation lists them: each known, or lacking the
// inputs it needs, or not applicable to the vehicle's kind.

import type { BuildInputs } from './build-inputs';
import { STANDARD_GRAVITY } from './constants';
import type { Battery } from './domain';
import { known, lacking, missingOf, type Known } from './known';
import { motorInLoop, NOT_APPLICABLE } from './operation';
import type { SupplyModel } from './supply';
import { electricalRpm, hoverPoint, motorLossW, packEnergyWh, runTimeMin } from './wider-figures';

export interface WiderNeeds {
  inp: BuildInputs;
  supply: Known<SupplyModel>;
  batteries: ReadonlyMap<string, Battery>;
  batteryIds: readonly string[];
  nominalV: Known;
  fullV: Known;
  capacityMah: Known;
  noLoadRpmFull: Known;
  /** Supply current, continuous (model or measured), and the measured average where there is one. */
  contA: Known;
  measuredAvgA: Known | null;
  runAverageA: Known;
  motorContA: Known;
  thrustN: Known;
}

export interface WiderEntries {
  packEnergyWh: Known;
  runTimeMin: Known;
  hoverCurrentA: Known;
  hoverMotorCurrentA: Known;
  hoverThrottle: Known;
  erpm: Known;
  motorLossW: Known;
  allUpMassKg: Known;
  thrustToWeight: Known;
}

export function widerEntries(w: WiderNeeds): WiderEntries {
  const { inp } = w;
  const kind = inp.kind.value;
  const na = lacking(NOT_APPLICABLE);
  const air = kind === 'multirotor' || kind === 'plane';
  const energy = w.nominalV.value !== null && w.capacityMah.value !== null ? known(packEnergyWh(w.nominalV.value, w.capacityMah.value)) : lacking(...missingOf(w.nominalV, w.capacityMah));

  // All-up mass: the vehicle with this supply's packs aboard.
  let allUp: Known = na;
  if (air) {
    const packMass: Known[] = w.batteryIds.map((id) => {
      const m = w.batteries.get(id)?.massKg;
      return typeof m === 'number' && m > 0 ? known(m) : lacking('battery.massKg');
    });
    const parts = [inp.vehicleMassKg, ...packMass];
    allUp = parts.every((k) => k.value !== null) ? known(parts.reduce((a, k) => a + (k.value ?? 0), 0)) : lacking(...missingOf(...parts));
  }
  const thrustToWeight = !air ? na : w.thrustN.value !== null && allUp.value !== null ? known(w.thrustN.value / (allUp.value * STANDARD_GRAVITY)) : lacking(...missingOf(w.thrustN, allUp));

  let hoverThrottle: Known = na;
  let hoverMotorA: Known = na;
  let hoverSupplyA: Known = na;
  if (kind === 'multirotor') {
    const m = w.supply.value === null ? null : motorInLoop(inp, w.supply.value);
    const needs = [w.supply, inp.kv, inp.motorResistanceOhm, inp.noLoadCurrentA, inp.motorCount, inp.propDiameterM, inp.thrustCoefficient, inp.powerCoefficient, allUp, w.nominalV];
    if (m !== null && inp.motorCount.value !== null && allUp.value !== null && inp.propDiameterM.value !== null && inp.thrustCoefficient.value !== null && inp.powerCoefficient.value !== null && w.nominalV.value !== null) {
      const h = hoverPoint({
        m,
        motorCount: inp.motorCount.value,
        allUpMassKg: allUp.value,
        diameterM: inp.propDiameterM.value,
        thrustCoefficient: inp.thrustCoefficient.value,
        powerCoefficient: inp.powerCoefficient.value,
        densityKgM3: inp.fluidDensity,
        gearRatio: inp.propGearRatio,
        gearEfficiency: inp.propGeared ? (inp.drivetrainEfficiency.value ?? 1) : 1,
        supplyV: w.nominalV.value,
      });
      hoverThrottle = known(h.throttle);
      // Above full throttle it cannot hover: there is no hover current to show.
      hoverMotorA = h.throttle <= 1 ? known(h.motorCurrentA) : na;
      hoverSupplyA = h.throttle <= 1 ? known(h.supplyCurrentA) : na;
    } else {
      hoverThrottle = hoverMotorA = hoverSupplyA = lacking(...missingOf(...needs));
    }
  }

  // Run time at the average current: a measured average, else the run's (cars and trucks), the
  // hover current (multirotors) or full throttle (the rest): the short side where unsure.
  const averageA: Known = w.measuredAvgA ?? (kind === 'car' || kind === 'truck' ? w.runAverageA : kind === 'multirotor' && hoverSupplyA.value !== null ? hoverSupplyA : w.contA);
  const runTime = w.capacityMah.value !== null && averageA.value !== null && averageA.value > 0 ? known(runTimeMin(w.capacityMah.value, inp.depthOfDischarge, averageA.value)) : lacking(...missingOf(w.capacityMah, averageA));

  const loss =
    w.motorContA.value !== null && inp.motorResistanceOhm.value !== null && inp.noLoadCurrentA.value !== null && w.fullV.value !== null
      ? known(motorLossW(w.motorContA.value, inp.motorResistanceOhm.value, inp.noLoadCurrentA.value, w.fullV.value))
      : lacking(...missingOf(w.motorContA, inp.motorResistanceOhm, inp.noLoadCurrentA, w.fullV));

  const erpm = w.noLoadRpmFull.value !== null && inp.motorPoles.value !== null ? known(electricalRpm(w.noLoadRpmFull.value, inp.motorPoles.value)) : lacking(...missingOf(w.noLoadRpmFull, inp.motorPoles));

  return {
    packEnergyWh: energy,
    runTimeMin: runTime,
    hoverCurrentA: hoverSupplyA,
    hoverMotorCurrentA: hoverMotorA,
    hoverThrottle,
    erpm,
    motorLossW: loss,
    allUpMassKg: allUp,
    thrustToWeight,
  };
}
