import { describe, expect, it } from 'vitest';
import { EMPTY_FILTER, countByStatus, filterKey, filterSummaries, haystackOf, customersOf, matchingPositions, narrows, peakShare, RuleFlags, ruleOptions, SHOP_OWN, sortSummaries } from '../../src-renderer/lib/builds/build-filter';
import { RULE_IDS } from '../../src-main/core/catalogue/rules';
import type { BuildSummary } from '../../src-renderer/lib/builds/build-summary';

function summary(over: Partial<BuildSummary> & { id: string; name: string }): BuildSummary {
  return {
    version: 1,
    archivedAt: null,
    vehicleId: 'veh-1',
    vehicleName: 'Buggy',
    kind: 'car',
    customerId: null,
    customerName: '',
    className: '',
    motorId: null,
    motorName: null,
    controllerId: null,
    controllerName: null,
    propellerId: null,
    supplyLabels: [],
    batteryIds: [],
    status: 'clear',
    supplyVoltageFullV: null,
    theoreticalSpeedKmh: null,
    peakCurrentA: null,
    peakCurrentLimitA: null,
    currentRule: null,
    currentSource: null,
    ruleStatuses: '',
    updatedAt: '2026-01-01T00:00:00Z',
    ...over,
  };
}

const rows = [
  summary({ id: 'a', name: 'Amber 4S', customerId: 'cust-dana', customerName: 'Dana', status: 'over', batteryIds: ['pack-1'], supplyLabels: ['Shop 4S #1'], supplyVoltageFullV: 16.8, peakCurrentA: 96, peakCurrentLimitA: 120 }),
  summary({ id: 'b', name: 'blue 2S', customerId: 'cust-ravi', customerName: 'Ravi', status: 'clear', kind: 'truck', motorId: 'mot-1', motorName: 'Wendleby 2200', supplyVoltageFullV: 8.4, peakCurrentA: 30, peakCurrentLimitA: 120 }),
  summary({ id: 'c', name: 'Coral boat', customerId: 'cust-dana', customerName: 'Dana', status: 'tight', kind: 'boat', propellerId: 'prop-1' }),
  summary({ id: 'd', name: 'Dove-grey buggy', status: null }),
];
const hay = new Map(rows.map((r) => [r.id, haystackOf(r)]));
const ids = (list: BuildSummary[]) => list.map((r) => r.id);

describe('builds list filter', () => {
  it('keeps everything with an empty filter', () => {
    expect(ids(filterSummaries(rows, EMPTY_FILTER, hay))).toEqual(['a', 'b', 'c', 'd']);
  });

  it('needs every typed word to match somewhere, case-insensitive', () => {
    expect(ids(filterSummaries(rows, { ...EMPTY_FILTER, text: 'dana 4s' }, hay))).toEqual(['a']);
    expect(ids(filterSummaries(rows, { ...EMPTY_FILTER, text: 'WENDLEBY' }, hay))).toEqual(['b']);
    expect(ids(filterSummaries(rows, { ...EMPTY_FILTER, text: 'shop #1' }, hay))).toEqual(['a']);
    expect(ids(filterSummaries(rows, { ...EMPTY_FILTER, text: 'nothing-like-this' }, hay))).toEqual([]);
  });

  it('filters by verdict, kind, customer and part together', () => {
    expect(ids(filterSummaries(rows, { ...EMPTY_FILTER, statuses: ['over', 'tight'] }, hay))).toEqual(['a', 'c']);
    expect(ids(filterSummaries(rows, { ...EMPTY_FILTER, kinds: ['truck', 'boat'], customer: 'cust-dana' }, hay))).toEqual(['c']);
    expect(ids(filterSummaries(rows, { ...EMPTY_FILTER, customer: SHOP_OWN }, hay))).toEqual(['d']);
    expect(ids(filterSummaries(rows, { ...EMPTY_FILTER, partId: 'pack-1' }, hay))).toEqual(['a']);
    expect(ids(filterSummaries(rows, { ...EMPTY_FILTER, partId: 'mot-1' }, hay))).toEqual(['b']);
    expect(ids(filterSummaries(rows, { ...EMPTY_FILTER, partId: 'prop-1' }, hay))).toEqual(['c']);
  });
});

describe('builds list filter keys', () => {
  it('gives one key to filters that let the same rows through, and another to any that differ', () => {
    expect(filterKey({ ...EMPTY_FILTER, text: '  Amber   4s ' })).toBe(filterKey({ ...EMPTY_FILTER, text: 'amber 4S' }));
    const base = filterKey({ ...EMPTY_FILTER, text: 'a' });
    for (const other of [
      { ...EMPTY_FILTER, text: 'ab' },
      { ...EMPTY_FILTER, text: 'a', statuses: ['over' as const] },
      { ...EMPTY_FILTER, text: 'a', kinds: ['boat' as const] },
      { ...EMPTY_FILTER, text: 'a', customer: SHOP_OWN },
      { ...EMPTY_FILTER, text: 'a', partId: 'pack-1' },
      { ...EMPTY_FILTER, text: 'a', rule: 'motor-heat' },
    ])
      expect(filterKey(other)).not.toBe(base);
    // Words are kept apart: "a b" is not "ab".
    expect(filterKey({ ...EMPTY_FILTER, text: 'a b' })).not.toBe(filterKey({ ...EMPTY_FILTER, text: 'ab' }));
  });
});

describe('builds list sort', () => {
  it('sorts verdicts worst first, unchecked last, and reverses', () => {
    expect(ids(sortSummaries(rows, 'status', 1))).toEqual(['a', 'c', 'b', 'd']);
    expect(ids(sortSummaries(rows, 'status', -1))).toEqual(['d', 'b', 'c', 'a']);
  });

  it('sorts names without regard to case', () => {
    expect(ids(sortSummaries(rows, 'name', 1))).toEqual(['a', 'b', 'c', 'd']);
  });

  it('keeps missing figures last in both directions', () => {
    expect(ids(sortSummaries(rows, 'voltage', 1))).toEqual(['b', 'a', 'c', 'd']);
    expect(ids(sortSummaries(rows, 'voltage', -1))).toEqual(['a', 'b', 'c', 'd']);
  });

  it('sorts the peak column by the share of the limit used', () => {
    expect(peakShare(rows[0]!)).toBeCloseTo(0.8, 12);
    expect(ids(sortSummaries(rows, 'peak', -1)).slice(0, 2)).toEqual(['a', 'b']);
  });

  it('does not reorder the array it was given', () => {
    const copy = [...rows];
    sortSummaries(rows, 'name', -1);
    expect(rows).toEqual(copy);
  });
});

describe('builds list helpers', () => {
  it("lists customers once, by name, without the shop's own", () => {
    expect(customersOf(rows)).toEqual([
      { id: 'cust-dana', name: 'Dana' },
      { id: 'cust-ravi', name: 'Ravi' },
    ]);
  });

  it('counts builds by verdict', () => {
    expect(countByStatus(rows)).toEqual({ over: 1, tight: 1, incomplete: 0, clear: 1 });
  });
});

describe('builds list check filter', () => {
  // Stored checks as the verdict row keeps them: `rule=status` by rule id, clear ones left out.
  const flagged = [
    summary({ id: 'p', name: 'Pump', status: 'over', ruleStatuses: 'battery-continuous=over,controller-continuous=tight' }),
    summary({ id: 'q', name: 'Quill', status: 'over', ruleStatuses: 'controller-continuous=over' }),
    summary({ id: 'r', name: 'Reed', status: 'incomplete', ruleStatuses: 'class-max-kv=incomplete,controller-continuous-x=over' }),
    summary({ id: 's', name: 'Sedge', status: 'clear', ruleStatuses: '' }),
    summary({ id: 't', name: 'Tern', status: 'tight', ruleStatuses: 'battery-continuous=over,controller-continuous=tight' }),
  ];
  const hayF = new Map(flagged.map((r) => [r.id, haystackOf(r)]));
  const pick = (filter: Partial<typeof EMPTY_FILTER>) => ids(filterSummaries(flagged, { ...EMPTY_FILTER, ...filter }, hayF));

  it('keeps the builds where the check is not clear, never a longer rule id that starts the same', () => {
    expect(pick({ rule: 'controller-continuous' })).toEqual(['p', 'q', 't']);
    expect(pick({ rule: 'class-max-kv' })).toEqual(['r']);
    expect(pick({ rule: 'motor-heat' })).toEqual([]);
  });

  it("reads the verdict filter as the check's own status, not the build's", () => {
    // Pump is over as a whole, but its controller check is only tight.
    expect(pick({ rule: 'controller-continuous', statuses: ['over'] })).toEqual(['q']);
    expect(pick({ rule: 'controller-continuous', statuses: ['tight'] })).toEqual(['p', 't']);
    expect(pick({ rule: 'battery-continuous', statuses: ['over'], text: 'tern' })).toEqual(['t']);
    expect(pick({ rule: 'battery-continuous', statuses: ['clear'] })).toEqual([]);
  });

  it('looks statuses up by position from one decoding per distinct text', () => {
    const flags = new RuleFlags();
    expect(flags.of(flagged[0]!)).toBe(flags.of(flagged[4]!));
    const byPosition = flags.statusesOf(flagged, 'controller-continuous');
    expect(byPosition).toEqual(['tight', 'over', undefined, undefined, 'tight']);
    // The precomputed statuses are what the filter goes by (here deliberately different from the rows).
    expect(matchingPositions(flagged, { ...EMPTY_FILTER, rule: 'controller-continuous' }, () => '', undefined, [undefined, undefined, undefined, 'over', undefined])).toEqual([3]);
    expect(countByStatus(flagged, byPosition)).toEqual({ over: 1, tight: 2, incomplete: 0, clear: 0 });
  });

  it('does not reuse the last result when the check changes', () => {
    expect(narrows({ ...EMPTY_FILTER, rule: 'motor-heat' }, { ...EMPTY_FILTER, rule: 'motor-heat', text: 'p' })).toBe(true);
    expect(narrows({ ...EMPTY_FILTER, rule: 'motor-heat' }, { ...EMPTY_FILTER, rule: 'motor-current' })).toBe(false);
  });

  it('offers every rule of the catalogue by its short name, then the class checks the list flags', () => {
    const flags = new RuleFlags();
    const options = ruleOptions(flags.classRules(flagged), '');
    expect(options.builtIn.map((o) => o.id)).toEqual([...RULE_IDS]);
    expect(options.builtIn.find((o) => o.id === 'controller-continuous')?.name).toBe('Controller continuous current');
    expect(options.classes).toEqual([{ id: 'class-max-kv', name: 'Class: max kv' }]);
    // A check named by the address that no row flags still shows as chosen.
    expect(ruleOptions([], 'class-pinion').classes).toEqual([{ id: 'class-pinion', name: 'Class: pinion' }]);
  });
});
