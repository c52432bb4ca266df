import type { Battery, Supply } from './domain';
import { known, lacking, missingOf, type Known } from './known';
import { packModel, type PackModel } from './pack';

/** A supply (packs in series or in parallel) as one source, SI. */
export interface SupplyModel {
  readonly packs: readonly PackModel[];
  readonly seriesCells: number;
  readonly nominalV: number;
  readonly fullV: number;
  readonly cutoffV: number;
  /** Measured resistance of the whole supply; null where any pack was never measured. */
  readonly resistanceOhm: number | null;
  /**
   * Resistance the model uses: unmeasured packs count as zero, which reads currents on the
   * high side, the safe side for every current rule.
   */
  readonly modelResistanceOhm: number;
  readonly capacityMah: number;
  readonly continuousLimitA: Known;
  readonly burstLimitA: Known;
  readonly lithium: boolean;
  /** Plain-language reason the packs must not be combined this way; null when they may. */
  readonly mismatch: string | null;
}

export function supplyModel(supply: Supply, batteries: ReadonlyMap<string, Battery>): Known<SupplyModel> {
  if (supply.batteryIds.length === 0) return lacking('supply.batteryIds');
  const packs: PackModel[] = [];
  const lacks: Known<unknown>[] = [];
  for (const id of supply.batteryIds) {
    const battery = batteries.get(id);
    if (!battery) {
      lacks.push(lacking('supply.batteryIds'));
      continue;
    }
    const pack = packModel(battery);
    if (pack.value === null) lacks.push(pack);
    else packs.push(pack.value);
  }
  if (lacks.length > 0) return lacking(...missingOf(...lacks));
  return known(supply.arrangement === 'parallel' ? combineParallel(packs) : combineSeries(packs));
}

/** Packs in series: voltages and resistances add; capacity and current limits are the smallest pack's. */
export function combineSeries(packs: readonly PackModel[]): SupplyModel {
  let seriesCells = 0;
  let nominalV = 0;
  let fullV = 0;
  let cutoffV = 0;
  let r = 0;
  let rKnown = true;
  let capacityMah = Infinity;
  for (const p of packs) {
    seriesCells += p.cellsSeries;
    nominalV += p.nominalV;
    fullV += p.fullV;
    cutoffV += p.cutoffV;
    if (p.resistanceOhm === null) rKnown = false;
    else r += p.resistanceOhm;
    capacityMah = Math.min(capacityMah, p.capacityMah);
  }
  return {
    packs,
    seriesCells,
    nominalV,
    fullV,
    cutoffV,
    resistanceOhm: rKnown ? r : null,
    modelResistanceOhm: r,
    capacityMah,
    // Every pack in series carries the whole current, so the weakest sets the limit.
    continuousLimitA: smallestLimit(packs.map((p) => p.continuousLimitA)),
    burstLimitA: smallestLimit(packs.map((p) => p.burstLimitA)),
    lithium: packs.some((p) => p.lithium),
    mismatch: null,
  };
}

/**
 * Packs in parallel: capacities add, resistances combine in parallel. Packs must have the same
 * cell count and chemistry, or the fuller pack drives current into the other; a mismatch is
 * reported, and the figures then take the highest pack voltage (the safe side for voltage
 * limits).
 */
export function combineParallel(packs: readonly PackModel[]): SupplyModel {
  let nominalV = 0;
  let fullV = 0;
  let cutoffV = 0;
  let conductance = 0;
  let rKnown = true;
  let anyZero = false;
  let capacityMah = 0;
  for (const p of packs) {
    nominalV = Math.max(nominalV, p.nominalV);
    fullV = Math.max(fullV, p.fullV);
    cutoffV = Math.max(cutoffV, p.cutoffV);
    if (p.resistanceOhm === null) rKnown = false;
    else if (p.resistanceOhm === 0) anyZero = true;
    else conductance += 1 / p.resistanceOhm;
    capacityMah += p.capacityMah;
  }
  const r = !rKnown || anyZero || conductance === 0 ? 0 : 1 / conductance;
  const first = packs[0];
  const mismatched =
    first !== undefined && packs.some((p) => p.cellsSeries !== first.cellsSeries || p.fullV !== first.fullV);
  return {
    packs,
    seriesCells: first?.cellsSeries ?? 0,
    nominalV,
    fullV,
    cutoffV,
    resistanceOhm: rKnown ? r : null,
    modelResistanceOhm: r,
    capacityMah,
    continuousLimitA: sharedLimit(packs, (p) => p.continuousLimitA, capacityMah),
    burstLimitA: sharedLimit(packs, (p) => p.burstLimitA, capacityMah),
    lithium: packs.some((p) => p.lithium),
    mismatch: mismatched
      ? 'Packs in parallel must have the same cell count and chemistry. Connected like this, the ' +
        'fuller pack pushes a large current into the other one at once: wires, connectors and ' +
        'lithium packs can overheat and catch fire. Use matched packs at the same charge level.'
      : null,
  };
}

function smallestLimit(limits: readonly Known[]): Known {
  let min = Infinity;
  for (const l of limits) {
    if (l.value === null) return lacking(...missingOf(...limits));
    min = Math.min(min, l.value);
  }
  return known(min);
}

/**
 * Parallel packs share current roughly by capacity, so the pack with the lowest C rating
 * reaches its rating first: the supply limit is total capacity × the lowest C rating.
 */
function sharedLimit(packs: readonly PackModel[], pick: (p: PackModel) => Known, totalMah: number): Known {
  let lowestC = Infinity;
  for (const p of packs) {
    const l = pick(p);
    if (l.value === null) return lacking(...missingOf(...packs.map(pick)));
    lowestC = Math.min(lowestC, l.value / (p.capacityMah / 1000));
  }
  return known((lowestC * totalMah) / 1000);
}
