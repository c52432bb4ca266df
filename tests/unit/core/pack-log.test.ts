import { describe, expect, it } from 'vitest';
import { cellOhmEquivalent, cycleCount, DEFAULT_PACK_HEALTH, packHealthProblems, packOhmOf, withLoggedResistance, type PackEvent } from '../../../src-main/core/pack-log';
import { evaluateBuild } from '../../../src-main/core/evaluate';
import { battery, truckContext } from './fixtures';

let seq = 0;
function entry(over: Partial<PackEvent> & Pick<PackEvent, 'kind' | 'at'>): PackEvent {
  return { id: `log-${String(++seq).padStart(3, '0')}`, batteryId: 'pack-a', mah: null, voltagePerCellV: null, cellResistancesOhm: null, temperatureC: null, capacityCheck: false, puffed: false, damaged: false, note: '', ...over };
}

describe('pack log: cycles and resistance', () => {
  it('counts one cycle per logged charge on top of the hand-set starting count', () => {
    const log = [entry({ kind: 'charge', at: '2026-11-01' }), entry({ kind: 'discharge', at: '2026-11-01' }), entry({ kind: 'charge', at: '2026-11-02' }), entry({ kind: 'storage', at: '2026-11-02', voltagePerCellV: 3.85 })];
    // Plain count: two charge entries, started from 40 cycles before the log.
    expect(cycleCount(40, log)).toBe(42);
    expect(cycleCount(0, [])).toBe(0);
  });

  it('takes series readings as adding up, and gives the per-cell figure that reproduces the pack resistance', () => {
    // Series resistances add (Ohm's law); 4 readings of 3, 4, 5, 4 mΩ: 16 mΩ for the pack.
    expect(packOhmOf([0.003, 0.004, 0.005, 0.004])).toBeCloseTo(0.016, 12);
    // Pack = S × cell ÷ P, so cell = pack × P ÷ S: a 4S2P pack reading 16 mΩ over its 4 leads is 8 mΩ a cell.
    expect(cellOhmEquivalent([0.003, 0.004, 0.005, 0.004], 4, 2)).toBeCloseTo(0.008, 12);
  });

  it('the newest measurement replaces the typed resistance for the evaluation, and moves the loaded voltage', () => {
    const typed = battery({ cellResistanceOhm: 0.003 });
    const log = [entry({ kind: 'resistance', at: '2026-10-01', cellResistancesOhm: [0.003, 0.003, 0.003, 0.003] }), entry({ kind: 'resistance', at: '2026-11-20', cellResistancesOhm: [0.006, 0.006, 0.006, 0.006] })];
    expect(withLoggedResistance(typed, log).cellResistanceOhm).toBeCloseTo(0.006, 12);
    expect(typed.cellResistanceOhm).toBe(0.003);
    const ctx = truckContext();
    const before = evaluateBuild(ctx).supplies[0]!;
    const worn = evaluateBuild({ ...ctx, batteries: new Map([...ctx.batteries].map(([id, b]) => [id, withLoggedResistance(b, log)])) }).supplies[0]!;
    // Twice the cell resistance is twice the pack resistance (series cells add).
    expect(worn.figures.packResistanceOhm).toBeCloseTo(2 * before.figures.packResistanceOhm!, 12);
  });
});

describe('pack health', () => {
  const pack = battery({ capacityMah: 5000 });
  const asOf = '2026-12-03T08:00:00Z';

  it('a clean log has no problems', () => {
    const log = [
      entry({ kind: 'resistance', at: '2026-10-01', cellResistancesOhm: [0.004] }),
      entry({ kind: 'resistance', at: '2026-11-01', cellResistancesOhm: [0.005] }),
      entry({ kind: 'storage', at: '2026-11-01', voltagePerCellV: 3.85 }),
    ];
    expect(packHealthProblems(pack, log, DEFAULT_PACK_HEALTH, asOf)).toEqual([]);
  });

  it('resistance grown by more than the share over the first measurement is over; at the share it is not', () => {
    // 4 → 6.4 mΩ is +60 %, past 50 %; 4 → 6 mΩ is exactly +50 %, not past it.
    const grown = packHealthProblems(pack, [entry({ kind: 'resistance', at: '2026-10-01', cellResistancesOhm: [0.004] }), entry({ kind: 'resistance', at: '2026-11-01', cellResistancesOhm: [0.0064] })], DEFAULT_PACK_HEALTH, asOf);
    expect(grown).toMatchObject([{ kind: 'resistance', status: 'over' }]);
    expect(grown[0]!.text).toMatch(/up 60 %/);
    expect(packHealthProblems(pack, [entry({ kind: 'resistance', at: '2026-10-01', cellResistancesOhm: [0.004] }), entry({ kind: 'resistance', at: '2026-11-01', cellResistancesOhm: [0.006] })], DEFAULT_PACK_HEALTH, asOf)).toEqual([]);
  });

  it('a capacity check under the share of rated is over', () => {
    // 3900 of 5000 mAh is 78 %, under 80 %; 4000 is 80 %, not under.
    expect(packHealthProblems(pack, [entry({ kind: 'discharge', at: '2026-11-01', mah: 3900, capacityCheck: true })], DEFAULT_PACK_HEALTH, asOf)).toMatchObject([{ kind: 'capacity', status: 'over' }]);
    expect(packHealthProblems(pack, [entry({ kind: 'discharge', at: '2026-11-01', mah: 4000, capacityCheck: true })], DEFAULT_PACK_HEALTH, asOf)).toEqual([]);
    // A run that was not a capacity check says nothing about capacity.
    expect(packHealthProblems(pack, [entry({ kind: 'discharge', at: '2026-11-01', mah: 1000 })], DEFAULT_PACK_HEALTH, asOf)).toEqual([]);
  });

  it('a puffed or damaged inspection is over and stays so', () => {
    const log = [entry({ kind: 'inspection', at: '2026-11-01', puffed: true }), entry({ kind: 'inspection', at: '2026-11-05' })];
    expect(packHealthProblems(pack, log, DEFAULT_PACK_HEALTH, asOf)).toMatchObject([{ kind: 'inspection', status: 'over' }]);
  });

  it('a lithium pack left charged past the number of days is tight; at storage voltage, or a NiMH pack, is not', () => {
    const charged = [entry({ kind: 'charge', at: '2026-11-20' })];
    expect(packHealthProblems(pack, charged, DEFAULT_PACK_HEALTH, asOf)).toMatchObject([{ kind: 'storage', status: 'tight' }]);
    // Within the 7 days: 2026-11-30 to 2026-12-03 is 3 days.
    expect(packHealthProblems(pack, [entry({ kind: 'charge', at: '2026-11-30' })], DEFAULT_PACK_HEALTH, asOf)).toEqual([]);
    expect(packHealthProblems(pack, [...charged, entry({ kind: 'storage', at: '2026-11-21', voltagePerCellV: 3.85 })], DEFAULT_PACK_HEALTH, asOf)).toEqual([]);
    expect(packHealthProblems(battery({ chemistry: 'nimh' }), charged, DEFAULT_PACK_HEALTH, asOf)).toEqual([]);
  });

  it('the evaluation reports the problems as a pack-health finding on the supply, worst status first', () => {
    const ctx = truckContext();
    const id = ctx.build.supplies[0]!.batteryIds[0]!;
    const clean = evaluateBuild(ctx).supplies[0]!;
    expect(clean.findings.some((f) => f.rule === 'pack-health')).toBe(false);
    const problems = packHealthProblems(battery({ id }), [entry({ kind: 'inspection', at: '2026-11-01', damaged: true }), entry({ kind: 'charge', at: '2026-11-02' })], DEFAULT_PACK_HEALTH, asOf);
    const v = evaluateBuild({ ...ctx, packHealth: new Map([[id, problems]]) });
    const f = v.supplies[0]!.findings.find((x) => x.rule === 'pack-health');
    expect(f).toMatchObject({ status: 'over', batteryId: id });
    expect(f!.message).toMatch(/found damaged/);
    expect(f!.message).toMatch(/left at 4\.20 V a cell/);
    expect(v.status).toBe('over');
    const onlyStorage = evaluateBuild({ ...ctx, packHealth: new Map([[id, problems.filter((p) => p.kind === 'storage')]]) }).supplies[0]!;
    expect(onlyStorage.findings.find((x) => x.rule === 'pack-health')?.status).toBe('tight');
  });
});
