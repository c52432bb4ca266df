import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { compareText, textOrderKey } from '../../src-renderer/lib/builds/text-order';
import { EMPTY_FILTER, filterSummaries, haystackOf, matchingPositions, narrows, sortSummaries, type BuildFilter } from '../../src-renderer/lib/builds/build-filter';
import type { BuildSummary } from '../../src-renderer/lib/builds/build-summary';

// The reference is the platform's own ICU collation (Intl.Collator, the same settings the list
// used before the keys): the keys must order text exactly as it does, never only "close".
const reference = new Intl.Collator('en', { sensitivity: 'base', numeric: true });
const sign = (n: number) => (n < 0 ? -1 : n > 0 ? 1 : 0);

// Printable ASCII with extra digits and letters, so digit runs, leading zeros and case pairs are common.
const ASCII = [...Array.from({ length: 95 }, (_, i) => String.fromCharCode(0x20 + i)), ...'0000111999aAzZ'];
const asciiText = fc.array(fc.constantFrom(...ASCII), { maxLength: 10 }).map((chars) => chars.join(''));
const anyText = fc.string({ unit: 'binary', maxLength: 8 });

describe('text order keys', () => {
  it('order printable ASCII exactly as the collator does', () => {
    fc.assert(
      fc.property(asciiText, asciiText, (a, b) => {
        const ka = textOrderKey(a);
        const kb = textOrderKey(b);
        expect(ka).not.toBeNull();
        expect(kb).not.toBeNull();
        expect(sign(ka! < kb! ? -1 : ka! > kb! ? 1 : 0)).toBe(sign(reference.compare(a, b)));
      }),
      { numRuns: 20_000 },
    );
  });

  it('compare any text as the collator does, through the collator where there is no key', () => {
    fc.assert(
      fc.property(fc.oneof(asciiText, anyText), fc.oneof(asciiText, anyText), (a, b) => {
        expect(sign(compareText(a, textOrderKey(a), b, textOrderKey(b)))).toBe(sign(reference.compare(a, b)));
      }),
      { numRuns: 5_000 },
    );
  });

  it('read numbers by value and ignore case, as a person sorting names would', () => {
    const names = ['build 10', 'Build 9', 'BUILD 009b', 'build 9a', 'Build 100', 'build'];
    const sorted = [...names].sort((a, b) => compareText(a, textOrderKey(a), b, textOrderKey(b)));
    expect(sorted).toEqual(['build', 'Build 9', 'build 9a', 'BUILD 009b', 'build 10', 'Build 100']);
  });

  it('leave text the key cannot stand for to the collator', () => {
    expect(textOrderKey('Zoë')).toBeNull();
    expect(textOrderKey('tab\there')).toBeNull();
    expect(textOrderKey('serial 12345678901')).toBeNull();
    expect(textOrderKey('Shop 4S #1')).not.toBeNull();
  });
});

function summary(i: number, name: string, customer: string): BuildSummary {
  return {
    id: `b${i}`,
    name,
    version: 1,
    archivedAt: null,
    vehicleId: 'v',
    vehicleName: `car ${i % 7}`,
    kind: 'car',
    customerId: `c-${customer}`,
    customerName: customer,
    className: '',
    motorId: null,
    motorName: null,
    controllerId: null,
    controllerName: null,
    propellerId: null,
    supplyLabels: [`${2 + (i % 3)}S pack ${i % 11}`],
    batteryIds: [],
    status: (['over', 'tight', 'incomplete', 'clear', null] as const)[i % 5]!,
    supplyVoltageFullV: null,
    theoreticalSpeedKmh: null,
    peakCurrentA: null,
    peakCurrentLimitA: null,
    currentRule: null,
    currentSource: null,
    ruleStatuses: '',
    updatedAt: '2026-01-01T00:00:00Z',
  };
}

describe('narrowing a filter as the user types', () => {
  const rows = Array.from({ length: 300 }, (_, i) => summary(i, `Build ${(i * 37) % 300}`, `Owner ${i % 13}`));
  const hay = new Map(rows.map((r) => [r.id, haystackOf(r)]));

  it('filtering the previous answer again gives what filtering everything gives', () => {
    const text = fc.stringMatching(/^[0-9a-z ]{0,4}$/);
    fc.assert(
      fc.property(text, text, fc.boolean(), (start, more, overOnly) => {
        const before: BuildFilter = { ...EMPTY_FILTER, text: start, statuses: overOnly ? ['over'] : [] };
        const after: BuildFilter = { ...before, text: start + more };
        expect(narrows(before, after)).toBe(true);
        const at = (i: number) => haystackOf(rows[i]!);
        const again = matchingPositions(rows, after, at, matchingPositions(rows, before, at)).map((i) => rows[i]!);
        expect(again).toEqual(filterSummaries(rows, after, hay));
      }),
      { numRuns: 500 },
    );
  });

  it('does not count a deletion or another chip as narrowing', () => {
    expect(narrows({ ...EMPTY_FILTER, text: 'build 1' }, { ...EMPTY_FILTER, text: 'build ' })).toBe(false);
    expect(narrows({ ...EMPTY_FILTER, text: 'b' }, { ...EMPTY_FILTER, text: 'bu', statuses: ['over'] })).toBe(false);
    expect(narrows({ ...EMPTY_FILTER, customer: 'cust-1' }, { ...EMPTY_FILTER, customer: 'cust-2' })).toBe(false);
  });

  it('sorts 10 000 names in the same order as the collator', () => {
    const many = Array.from({ length: 10_000 }, (_, i) => summary(i, `${i % 3 === 0 ? 'build' : 'Build'} ${(i * 7919) % 10_000}${i % 10 === 0 ? '-b' : ''}`, ''));
    const expected = [...many].sort((a, b) => reference.compare(a.name, b.name) || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0)).map((s) => s.id);
    expect(sortSummaries(many, 'name', 1).map((s) => s.id)).toEqual(expected);
  });
});
