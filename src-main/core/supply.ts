import { SUPPLY_MATCH_MESSAGE } from './catalogue/rules';
import { millivoltExact } from './chemistry';
import type { Battery, Supply } from './domain';
import { known, lacking, missingOf, type Known } from './known';
import { packModel, type PackModel } from './pack';

/** One pack's share of its supply's current. */
export interface ShareOfCurrent {
  /** Fraction of the supply current, 0 to 1. */
  readonly share: number;
  /** True where it is the pessimistic bound because some resistance in the supply is not measured. */
  readonly bound: boolean;
}

/** A supply (packs in series or in parallel) as one source, SI. */
export interface SupplyModel {
  readonly arrangement: 'series' | 'parallel';
  readonly packs: readonly PackModel[];
  /** Per pack, in order: the share of the supply current it is judged on. */
  readonly shares: readonly ShareOfCurrent[];
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

const WHOLE: ShareOfCurrent = { share: 1, bound: false };

/** Packs in series: voltages and resistances add; every pack carries the whole current. */
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
    nominalV = millivoltExact(nominalV + p.nominalV);
    fullV = millivoltExact(fullV + p.fullV);
    cutoffV = millivoltExact(cutoffV + p.cutoffV);
    if (p.resistanceOhm === null) rKnown = false;
    else r += p.resistanceOhm;
    capacityMah = Math.min(capacityMah, p.capacityMah);
  }
  return {
    arrangement: 'series',
    packs,
    shares: packs.map(() => WHOLE),
    seriesCells,
    nominalV,
    fullV,
    cutoffV,
    resistanceOhm: rKnown ? r : null,
    modelResistanceOhm: r,
    capacityMah,
    lithium: packs.some((p) => p.lithium),
    mismatch: null,
  };
}

/**
 * How parallel packs share a current. Packs in parallel see the same voltage, so each carries
 * I·G_k/ΣG with G = 1/R (current division). Where a resistance is not measured, the split is
 * not known, so each pack is judged on the most it could carry: an unmeasured pack could be
 * the stiffest and take (nearly) all of it; a measured pack carries at most its share among
 * the measured packs (the unmeasured ones taking nothing).
 */
export function parallelShares(resistancesOhm: readonly (number | null)[]): ShareOfCurrent[] {
  let known = 0;
  let anyUnknown = false;
  for (const r of resistancesOhm) {
    if (r === null || !(r > 0)) anyUnknown = true;
    else known += 1 / r;
  }
  return resistancesOhm.map((r) => {
    if (r === null || !(r > 0)) return { share: 1, bound: true };
    return { share: 1 / r / known, bound: anyUnknown };
  });
}

/**
 * Packs in parallel: capacities add, resistances combine in parallel. Packs must have the same
 * chemistry and cell count, or the fuller pack drives current into the other; a mismatch is
 * reported, and the figures then take the highest pack voltage (the safe side for voltage
 * limits).
 */
export function combineParallel(packs: readonly PackModel[]): SupplyModel {
  let nominalV = 0;
  let fullV = 0;
  let cutoffV = 0;
  let conductance = 0;
  let rKnown = true;
  let capacityMah = 0;
  for (const p of packs) {
    nominalV = Math.max(nominalV, p.nominalV);
    fullV = Math.max(fullV, p.fullV);
    cutoffV = Math.max(cutoffV, p.cutoffV);
    if (p.resistanceOhm === null || !(p.resistanceOhm > 0)) rKnown = false;
    else conductance += 1 / p.resistanceOhm;
    capacityMah += p.capacityMah;
  }
  const r = !rKnown || conductance === 0 ? 0 : 1 / conductance;
  const first = packs[0];
  const mismatched = first !== undefined && packs.some((p) => p.cellsSeries !== first.cellsSeries || p.chemistry !== first.chemistry || p.fullV !== first.fullV);
  return {
    arrangement: 'parallel',
    packs,
    shares: parallelShares(packs.map((p) => p.resistanceOhm)),
    seriesCells: first?.cellsSeries ?? 0,
    nominalV,
    fullV,
    cutoffV,
    resistanceOhm: rKnown ? r : null,
    modelResistanceOhm: r,
    capacityMah,
    lithium: packs.some((p) => p.lithium),
    mismatch: mismatched ? SUPPLY_MATCH_MESSAGE : null,
  };
}
