import type { Battery, Chemistry } from './domain';
import { isPlausible } from './plausibility';
import { cellVoltages, isLithium, millivoltExact, type CellVoltages } from './chemistry';
import { count, known, lacking, missingOf, positive, type Known } from './known';

/** One pack's electrical model, SI (V, ohm, A). */
export interface PackModel {
  readonly id: string;
  readonly name: string;
  readonly lithium: boolean;
  readonly chemistry: Chemistry;
  readonly retired: boolean;
  readonly cellsSeries: number;
  readonly nominalV: number;
  readonly fullV: number;
  readonly cutoffV: number;
  /** Null where cell resistance was never measured. */
  readonly resistanceOhm: number | null;
  readonly capacityMah: number;
  /** Current the continuous / burst C rating allows; lacking where the rating is not printed. */
  readonly continuousLimitA: Known;
  readonly burstLimitA: Known;
}

/** Pack resistance: series cells add, parallel strings divide. */
export function packResistance(cellResistanceOhm: number, cellsSeries: number, cellsParallel: number): number {
  return (cellsSeries * cellResistanceOhm) / cellsParallel;
}

/** Terminal voltage under load. */
export function loadedVoltage(openVoltageV: number, currentA: number, resistanceOhm: number): number {
  return openVoltageV - currentA * resistanceOhm;
}

/** Current a C rating allows: C × capacity in Ah. */
export function cRatingCurrent(cRating: number, capacityMah: number): number {
  return (cRating * capacityMah) / 1000;
}

/** The pack's model, or the names of the fields it cannot do without. */
export function packModel(battery: Battery): Known<PackModel> {
  const cells = cellVoltages(battery.chemistry);
  const series = count(battery.cellsSeries, 'battery.cellsSeries');
  const parallel = count(battery.cellsParallel, 'battery.cellsParallel');
  const capacity = positive(battery.capacityMah, 'battery.capacityMah');
  const chemistry: Known<CellVoltages> = cells ? known(cells) : lacking('battery.chemistry');
  if (series.value === null || parallel.value === null || capacity.value === null || chemistry.value === null) {
    return lacking(...missingOf(chemistry, series, parallel, capacity));
  }
  // Zero or an implausible figure counts as never measured: the model then takes the safe side.
  const cellR = positive(battery.cellResistanceOhm, 'battery.cellResistanceOhm');
  const cellOhm = cellR.value !== null && isPlausible('battery.cellResistanceOhm', cellR.value) ? cellR.value : null;
  const cCont = positive(battery.cRatingContinuous, 'battery.cRatingContinuous');
  const cBurst = positive(battery.cRatingBurst, 'battery.cRatingBurst');
  const s = series.value;
  return known({
    id: battery.id,
    name: battery.name,
    lithium: isLithium(battery.chemistry),
    chemistry: battery.chemistry,
    retired: battery.retired === true,
    cellsSeries: s,
    nominalV: millivoltExact(s * chemistry.value.nominalV),
    fullV: millivoltExact(s * chemistry.value.fullV),
    cutoffV: millivoltExact(s * chemistry.value.cutoffV),
    resistanceOhm: cellOhm === null ? null : packResistance(cellOhm, s, parallel.value),
    capacityMah: capacity.value,
    continuousLimitA: cCont.value === null ? cCont : known(cRatingCurrent(cCont.value, capacity.value)),
    burstLimitA: cBurst.value === null ? cBurst : known(cRatingCurrent(cBurst.value, capacity.value)),
  });
}
