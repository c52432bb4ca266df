import { describe, expect, it } from 'vitest';
import { EMPTY_FILTER, countByStatus, filterSummaries, haystackOf, customersOf, peakShare, SHOP_OWN, sortSummaries } from '../../src-renderer/lib/builds/build-filter';
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
