import { describe, expect, it } from 'vitest';
import { battery, classRule, finding, motor, quadContext, supplyOf, truckContext } from './fixtures';

// A class may limit the inputs racing classes usually write their rules in: the cell count,
// the motor's Kv and the pinion. The check values are the records' own numbers (a 4S pack has
// four cells in series), so the tests need no outside constant.

const inClass = (figure: string, limit: number, unit: string, ruleId: string) => classRule({ className: 'Club Stock', figure, limit, unit, ruleId });

describe('class limits on cells, Kv and pinion', () => {
  it('a 4S pack is over a 2S class and clear of a 6S one; two 2S packs in series count as 4S', () => {
    const twoS = truckContext({ vehicle: { ...truckContext().vehicle!, className: 'Club Stock' }, classRules: [inClass('seriesCells', 2, 'S', 'class-cells')] });
    const f = finding(supplyOf(twoS), 'class-cells');
    expect(f).toMatchObject({ status: 'over', value: 4, limit: 2, unit: 'S' });
    const sixS = truckContext({ vehicle: { ...truckContext().vehicle!, className: 'Club Stock' }, classRules: [inClass('seriesCells', 6, 'S', 'class-cells')] });
    expect(finding(supplyOf(sixS), 'class-cells').status).toBe('clear');

    const a = battery({ id: 'pack-a', cellsSeries: 2 });
    const b = battery({ id: 'pack-b', cellsSeries: 2 });
    const base = truckContext();
    const stacked = truckContext({
      build: { ...base.build, supplies: [{ id: 'supply-a', arrangement: 'series', batteryIds: ['pack-a', 'pack-b'] }] },
      batteries: new Map([
        ['pack-a', a],
        ['pack-b', b],
      ]),
      vehicle: { ...base.vehicle!, className: 'Club Stock' },
      classRules: [inClass('seriesCells', 3, 'S', 'class-cells')],
    });
    expect(finding(supplyOf(stacked), 'class-cells')).toMatchObject({ status: 'over', value: 4 });
  });

  it("a motor's Kv above the class limit is over; at the limit it passes (at or under is allowed)", () => {
    const base = truckContext();
    const ctx = (kv: number) => truckContext({ motor: motor({ kv }), vehicle: { ...base.vehicle!, className: 'Club Stock' }, classRules: [inClass('motorKv', 3000, 'rpm/V', 'class-kv')] });
    expect(finding(supplyOf(ctx(3500)), 'class-kv')).toMatchObject({ status: 'over', value: 3500 });
    expect(finding(supplyOf(ctx(3000)), 'class-kv').status).not.toBe('over');
  });

  it('a pinion above the spec is over; a build with no pinion recorded reads incomplete, not clear', () => {
    const base = truckContext();
    const spec = inClass('pinionTeeth', 14, 'teeth', 'class-pinion');
    const truck = truckContext({ vehicle: { ...base.vehicle!, className: 'Club Stock' }, classRules: [spec] });
    expect(finding(supplyOf(truck), 'class-pinion')).toMatchObject({ status: 'over', value: 15, limit: 14 });
    const quad = quadContext();
    const direct = quadContext({ vehicle: { ...quad.vehicle!, className: 'Club Stock' }, classRules: [spec] });
    expect(finding(supplyOf(direct), 'class-pinion').status).toBe('incomplete');
  });
});
