import { describe, expect, it } from 'vitest';
import { changedFieldsOf } from '../../src-renderer/lib/history/history-diff';
import { historyFieldName } from '../../src-renderer/lib/history/field-names';
import { localDateTime } from '../../src-renderer/lib/format/date';

describe('history before → after', () => {
  it('lists the changed fields only, skipping version and timestamps', () => {
    const before = { id: 'p', version: 1, name: 'Pack', cRatingContinuous: 50, notes: '' };
    const after = { id: 'p', version: 2, name: 'Pack', cRatingContinuous: 20, notes: 'puffed' };
    expect(changedFieldsOf(before, after)).toEqual([
      { field: 'cRatingContinuous', before: '50', after: '20' },
      { field: 'notes', before: 'empty', after: 'puffed' },
    ]);
  });

  it('opens nested gearing one level and names parts through the given lookup', () => {
    const names = new Map([
      ['mot-1', 'Old motor'],
      ['mot-2', 'New motor'],
      ['pack-1', 'Pack A'],
      ['pack-2', 'Pack B'],
    ]);
    const nameOf = (id: string) => names.get(id) ?? id;
    const before = { motorId: 'mot-1', gearing: { pinionTeeth: 14, spurTeeth: 50 }, supplies: [{ id: 's1', arrangement: 'series', batteryIds: ['pack-1'] }] };
    const after = { motorId: 'mot-2', gearing: { pinionTeeth: 15, spurTeeth: 50 }, supplies: [{ id: 's9', arrangement: 'series', batteryIds: ['pack-1', 'pack-2'] }] };
    expect(changedFieldsOf(before, after, nameOf)).toEqual([
      { field: 'motorId', before: 'Old motor', after: 'New motor' },
      { field: 'gearing.pinionTeeth', before: '14', after: '15' },
      { field: 'supplies', before: 'Pack A', after: 'Pack A + Pack B' },
    ]);
  });

  it('does not report new supply ids holding the same packs', () => {
    const before = { supplies: [{ id: 's1', arrangement: 'parallel', batteryIds: ['a', 'b'] }] };
    const after = { supplies: [{ id: 's2', arrangement: 'parallel', batteryIds: ['a', 'b'] }] };
    expect(changedFieldsOf(before, after)).toEqual([]);
  });

  it("reads a class's limits as the Classes screen lists them", () => {
    const limit = (value: number) => ({ id: 'rule-1', figure: 'packVoltageFullV', limit: value, unit: 'V' });
    expect(changedFieldsOf({ name: 'Club', limits: [limit(8.4)] }, { name: 'Club', limits: [limit(25.2)] })).toEqual([{ field: 'limits', before: 'Full-charge voltage ≤ 8.4 V', after: 'Full-charge voltage ≤ 25.2 V' }]);
    expect(changedFieldsOf({ limits: [] }, { limits: [limit(8.4)] })[0]?.before).toBe('none');
  });

  it('gives nothing for a creation (no before)', () => {
    expect(changedFieldsOf(null, { name: 'x' })).toEqual([]);
  });

  it('names fields in plain words with their stored units', () => {
    expect(historyFieldName('batteries', 'cRatingContinuous')).toBe('Continuous C rating (C)');
    expect(historyFieldName('batteries', 'cellResistanceOhm')).toBe('Cell resistance, measured (Ω)');
    expect(historyFieldName('builds', 'gearing.tireDiameterMm')).toBe('Tyre diameter (mm)');
    expect(historyFieldName('vehicles', 'massKg')).toBe('Mass (kg)');
  });
});

describe('moments in a change', () => {
  it('shows an archive time in local time and its absence as not archived', () => {
    const at = '2026-12-02T11:34:08.886Z';
    // The outside reference is Intl.DateTimeFormat itself (ECMA-402), through localDateTime.
    expect(changedFieldsOf({ archivedAt: null }, { archivedAt: at })).toEqual([{ field: 'archivedAt', before: 'not archived', after: localDateTime(at) }]);
    expect(localDateTime(at)).not.toContain('T11:34');
  });
});
