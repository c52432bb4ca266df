import { describe, expect, it } from 'vitest';
import { compareRows, decidingSupply, marginText, NOT_CHECKED, type CompareColumn } from '../../src-renderer/lib/compare/compare-rows';
import { battery, controller, quadContext, supplyOf, truckContext } from '../unit/core/fixtures';
import type { BuildContext } from '../../src-main/core/domain';

const column = (id: string, ctx: BuildContext): CompareColumn => ({ id, name: id, kind: ctx.vehicle?.kind ?? null, verdict: supplyOf(ctx) });

/** The same truck on a pack of a lower C rating: only what the pack's rating touches changes. */
function twoTrucks() {
  const base = truckContext();
  // 5 C × 5 Ah = 25 A continuous, 10 C × 5 Ah = 50 A burst (common practice: rating = C × capacity).
  const small = battery({ cRatingContinuous: 5, cRatingBurst: 10 });
  const weak = truckContext({ batteries: new Map([[small.id, small]]) });
  return { a: column('a', base), b: column('b', weak) };
}

describe('compare rows', () => {
  it('groups the rows by stage of the power path, packs first', () => {
    const { a, b } = twoTrucks();
    const groups = compareRows([a, b], 'metric');
    expect(groups.map((g) => g.stage)).toEqual(['supply', 'controller', 'motor', 'drive', 'output']);
    expect(groups[0]!.checks.map((c) => c.rule)).toEqual(expect.arrayContaining(['battery-continuous', 'battery-burst']));
    expect(groups[1]!.checks.map((c) => c.rule).sort()).toEqual(['controller-burst', 'controller-continuous', 'controller-voltage']);
  });

  it('marks a row as differing exactly where what the columns show differs', () => {
    const { a, b } = twoTrucks();
    const rows = compareRows([a, b], 'metric').flatMap((g) => [...g.checks, ...g.figures]);
    for (const row of rows) {
      const shown = row.cells.map((c) => (typeof c === 'string' ? c : `${c.finding?.status ?? ''}|${c.asked}`));
      expect(row.differs, row.label).toBe(shown[0] !== shown[1]);
    }
    // The pack's rating changed: its check differs; the motor's rating did not.
    const check = (rule: string) => rows.find((r) => 'rule' in r && r.rule === rule)!;
    expect(check('battery-continuous').differs).toBe(true);
    expect(check('motor-voltage').differs).toBe(false);
    // Two copies of one build differ nowhere.
    expect(
      compareRows([a, { ...a, id: 'a2' }], 'metric')
        .flatMap((g) => [...g.checks, ...g.figures])
        .some((r) => r.differs),
    ).toBe(false);
  });

  it('each cell carries its finding margin unchanged, and names the most and least headroom', () => {
    const { a, b } = twoTrucks();
    const row = compareRows([a, b], 'metric')[0]!.checks.find((c) => c.rule === 'battery-continuous')!;
    const fa = a.verdict!.findings.find((f) => f.rule === 'battery-continuous')!;
    const fb = b.verdict!.findings.find((f) => f.rule === 'battery-continuous')!;
    expect(row.cells[0]!.margin).toBe(fa.margin);
    expect(row.cells[1]!.margin).toBe(fb.margin);
    // The 50 C pack has more headroom than the 5 C one.
    expect(row.cells.map((c) => c.mark)).toEqual(['best', 'worst']);
    expect(row.cells[1]!.marginText).toBe(marginText(fb.margin));
    expect(row.cells[1]!.marginText).toMatch(/ % over$/u);
    // 25 A continuous is the small pack's rating.
    expect(row.cells[1]!.asked).toMatch(/ of 25 A continuous$/u);
  });

  it('a check one build lacks reads not checked, and a car beside a quad lists both kinds of figure', () => {
    const truck = column('truck', truckContext());
    const quad = column('quad', quadContext());
    const groups = compareRows([truck, quad], 'metric');
    const tip = groups.flatMap((g) => g.checks).find((c) => c.rule === 'prop-tip-speed')!;
    expect(tip.cells[0]!.asked).toBe(NOT_CHECKED);
    expect(tip.cells[0]!.mark).toBeNull();
    expect(tip.differs).toBe(true);
    const keys = groups.flatMap((g) => g.figures.map((f) => f.key));
    expect(keys).toEqual(expect.arrayContaining(['finalDriveRatio', 'thrustN']));
  });

  it('a car beside a truck reads as ground builds: gearing and wheels, no thrust rows', () => {
    const car = truckContext();
    const carCol: CompareColumn = { ...column('car', car), kind: 'car' };
    const groups = compareRows([carCol, column('truck', truckContext())], 'metric');
    expect(groups.map((g) => g.title)).toEqual(['Packs', 'Speed controller (supply current)', 'Motor', 'Gearing', 'Wheels']);
    expect(groups.flatMap((g) => g.figures.map((f) => f.key))).not.toContain('thrustN');
  });

  it('no marks where the margins are equal; a figure table row per stage figure', () => {
    const ctx = truckContext({ controller: controller() });
    const groups = compareRows([column('a', ctx), column('b', ctx)], 'metric');
    expect(groups.flatMap((g) => g.checks).every((r) => r.cells.every((c) => c.mark === null))).toBe(true);
    expect(groups.find((g) => g.stage === 'supply')!.figures[0]!.cells[0]).toMatch(/ V$/u);
  });

  it('compares a build on the supply that decides its verdict', () => {
    expect(decidingSupply([{ status: 'clear' }, { status: 'over' }, { status: 'over' }])).toBe(1);
    expect(decidingSupply([{ status: 'tight' }, { status: 'incomplete' }])).toBe(1);
    expect(decidingSupply([{ status: 'clear' }])).toBe(0);
  });
});
