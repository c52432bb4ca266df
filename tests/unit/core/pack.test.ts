import { describe, expect, it } from 'vitest';
import { CELL_VOLTAGES } from '../../../src-main/core/chemistry';
import { cRatingCurrent, loadedVoltage, packModel, packResistance } from '../../../src-main/core/pack';
import { supplyModel } from '../../../src-main/core/supply';
import { battery, controller, finding, motor, supplyOf, truckContext } from './fixtures';

describe('pack voltages by chemistry', () => {
  it("4S LiPo is 14.8 V nominal and 16.8 V full (cell makers' spec sheets: 3.7 V / 4.20 V a cell)", () => {
    const p = packModel(battery({ chemistry: 'lipo', cellsSeries: 4 })).value;
    expect(p?.nominalV).toBeCloseTo(14.8, 10);
    expect(p?.fullV).toBeCloseTo(16.8, 10);
    expect(p?.cutoffV).toBeCloseTo(12.0, 10); // 3.0 V a cell, cell makers' spec sheets
  });

  it('other chemistries follow their per-cell figures', () => {
    // LiFePO4 3.2 / 3.65 / 2.5 V and Li-ion NMC 3.6 / 4.2 V: cell makers' spec sheets.
    expect(packModel(battery({ chemistry: 'lifepo4', cellsSeries: 4 })).value?.fullV).toBeCloseTo(14.6, 10);
    expect(packModel(battery({ chemistry: 'liion', cellsSeries: 3 })).value?.nominalV).toBeCloseTo(10.8, 10);
    // LiHV 3.8 / 4.35 V and NiMH 1.2 V a cell: common practice (6S LiHV 26.1 V full, 6-cell NiMH 7.2 V).
    expect(packModel(battery({ chemistry: 'lihv', cellsSeries: 6 })).value?.fullV).toBeCloseTo(26.1, 10);
    expect(packModel(battery({ chemistry: 'nimh', cellsSeries: 6 })).value?.nominalV).toBeCloseTo(7.2, 10);
    for (const v of Object.values(CELL_VOLTAGES)) {
      expect(v.cutoffV).toBeLessThan(v.nominalV);
      expect(v.nominalV).toBeLessThan(v.fullV);
    }
  });

  it('pack resistance is series × cell resistance ÷ parallel, and sags by I·R', () => {
    expect(packResistance(0.004, 6, 2)).toBeCloseTo(0.012, 12);
    expect(packModel(battery({ cellsSeries: 3, cellsParallel: 2, cellResistanceOhm: 0.004 })).value?.resistanceOhm).toBeCloseTo(0.006, 12);
    expect(loadedVoltage(16.8, 100, 0.012)).toBeCloseTo(15.6, 10);
    expect(cRatingCurrent(50, 5000)).toBe(250);
  });

  it('names what a pack lacks instead of guessing', () => {
    const r = packModel(battery({ cellsSeries: 0, capacityMah: Number.NaN }));
    expect(r.value).toBeNull();
    expect(r.missing).toEqual(['battery.cellsSeries', 'battery.capacityMah']);
    const noC = packModel(battery({ cRatingBurst: null })).value;
    expect(noC?.burstLimitA.missing).toEqual(['battery.cRatingBurst']);
    expect(noC?.continuousLimitA.value).toBe(250);
  });
});

describe('supplies', () => {
  const a = battery({ id: 'a', cellsSeries: 4, capacityMah: 5000, cRatingContinuous: 50, cellResistanceOhm: 0.003 });
  const b = battery({ id: 'b', cellsSeries: 2, capacityMah: 4000, cRatingContinuous: 40, cellResistanceOhm: 0.003 });
  const map = new Map([a, b].map((x) => [x.id, x]));

  it('in series add voltages and resistances and take the smallest capacity and current limit', () => {
    const s = supplyModel({ id: 's', arrangement: 'series', batteryIds: ['a', 'b'] }, map).value;
    expect(s?.seriesCells).toBe(6);
    expect(s?.nominalV).toBeCloseTo(22.2, 10);
    expect(s?.fullV).toBeCloseTo(25.2, 10);
    expect(s?.resistanceOhm).toBeCloseTo(0.018, 12);
    expect(s?.capacityMah).toBe(4000);
    // Packs in series each carry the whole current.
    expect(s?.shares.map((x) => x.share)).toEqual([1, 1]);
    expect(s?.mismatch).toBeNull();
  });

  it('in parallel add capacities and combine resistances in parallel', () => {
    const c = battery({ id: 'c', cRatingContinuous: 30 });
    const s = supplyModel(
      { id: 's', arrangement: 'parallel', batteryIds: ['a', 'c'] },
      new Map([
        [a.id, a],
        [c.id, c],
      ]),
    ).value;
    expect(s?.fullV).toBeCloseTo(16.8, 10);
    expect(s?.capacityMah).toBe(10000);
    expect(s?.resistanceOhm).toBeCloseTo(0.006, 12);
    // Equal resistances: equal halves of the current (current division).
    expect(s?.shares.map((x) => x.share)).toEqual([0.5, 0.5]);
    expect(s?.mismatch).toBeNull();
  });

  it('in parallel with different cell counts is a mismatch, not a crash', () => {
    const s = supplyModel({ id: 's', arrangement: 'parallel', batteryIds: ['a', 'b'] }, map).value;
    expect(s?.mismatch).toMatch(/same chemistry and cell count/);
    expect(s?.fullV).toBeCloseTo(16.8, 10); // the higher pack, the safe side for voltage limits
  });

  it('name a pack that is not in the records', () => {
    const r = supplyModel({ id: 's', arrangement: 'series', batteryIds: ['a', 'gone'] }, map);
    expect(r.value).toBeNull();
    expect(r.missing).toEqual(['supply.batteryIds']);
    expect(supplyModel({ id: 's', arrangement: 'series', batteryIds: [] }, map).missing).toEqual(['supply.batteryIds']);
  });

  it('report resistance as unknown when any pack was never measured, but model it as zero', () => {
    const u = battery({ id: 'u', cellResistanceOhm: null });
    const s = supplyModel(
      { id: 's', arrangement: 'series', batteryIds: ['a', 'u'] },
      new Map([
        [a.id, a],
        [u.id, u],
      ]),
    ).value;
    expect(s?.resistanceOhm).toBeNull();
    expect(s?.modelResistanceOhm).toBeCloseTo(0.012, 12);
  });
});

describe('voltages at a rating', () => {
  it('a 3S LiPo at full charge is exactly 12.6 V, so a part rated 12.6 V is at its rating, not past it', () => {
    // 3 × 4.20 V (cell makers' spec sheets). In binary floating point 3 * 4.2 is 12.600000000000001.
    const p = packModel(battery({ chemistry: 'lipo', cellsSeries: 3 })).value;
    expect(p?.fullV).toBe(12.6);
    const pack = battery({ chemistry: 'lipo', cellsSeries: 3 });
    const s = supplyOf(truckContext({ batteries: new Map([[pack.id, pack]]), motor: motor({ maxVoltageV: 12.6 }), controller: controller({ maxVoltageV: null, maxCells: 3 }) }));
    expect(finding(s, 'motor-voltage')).toMatchObject({ status: 'clear', value: 12.6, limit: 12.6, margin: 0 });
    expect(finding(s, 'controller-voltage')).toMatchObject({ status: 'clear', value: 12.6, limit: 12.6 });
  });

  it('three 2S packs in series are exactly 25.2 V full, as a 6S rating of 6 × 4.2 V', () => {
    const s = supplyModel({ id: 's', arrangement: 'series', batteryIds: ['a', 'b', 'c'] }, new Map(['a', 'b', 'c'].map((id) => [id, battery({ id, chemistry: 'lipo', cellsSeries: 2 })]))).value;
    expect(s?.fullV).toBe(25.2);
  });

  it('a cell count far past anything plausible still gives a finite voltage, not Infinity', () => {
    // Number.MAX_VALUE is about 1.797e308 (IEEE 754 binary64); 1e305 cells × 4.2 V × 1000 mV/V passes it.
    const p = packModel(battery({ chemistry: 'lipo', cellsSeries: 1e305 })).value;
    expect(Number.isFinite(p?.fullV)).toBe(true);
    expect(p?.fullV).toBeCloseTo(1e305 * 4.2, -300);
  });
});
