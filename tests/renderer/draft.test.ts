import { describe, expect, it } from 'vitest';
import { unit } from 'mathjs';
import { draftChanges, draftToRecord, errorFieldKey, fieldLabel, fromDraftValue, messageForField, toDraft, toDraftValue } from '../../src-renderer/lib/forms/draft';
import { PART_FIELDS, fieldOf } from '../../src-renderer/lib/parts/part-fields';

const mass = fieldOf('vehicles', 'massKg')!;
const diameter = fieldOf('propellers', 'diameterMm')!;
const resistance = fieldOf('batteries', 'cellResistanceOhm')!;
const capacity = fieldOf('batteries', 'capacityMah')!;

describe('form drafts', () => {
  it('names the unit in every number label, following the unit system', () => {
    expect(fieldLabel(capacity, 'metric')).toBe('Capacity (mAh)');
    expect(fieldLabel(mass, 'metric')).toBe('Mass (kg)');
    expect(fieldLabel(mass, 'imperial')).toBe('Mass (lb)');
    expect(fieldLabel(diameter, 'imperial')).toBe('Diameter (in)');
    for (const fields of Object.values(PART_FIELDS)) {
      for (const f of fields) if (f.type === 'number') expect(fieldLabel(f, 'metric'), f.key).toMatch(/\(.+\)$/);
    }
  });

  it('shows stored metric values in imperial units, as mathjs converts them', () => {
    // Reference: mathjs unit conversion (pound = 0.45359237 kg, inch = 25.4 mm exactly, NIST SP 811).
    expect(Number(toDraftValue(mass, 3.2, 'imperial'))).toBeCloseTo(unit(3.2, 'kg').toNumber('lb'), 4);
    expect(Number(toDraftValue(diameter, 129.5, 'imperial'))).toBeCloseTo(unit(129.5, 'mm').toNumber('inch'), 4);
    expect(toDraftValue(mass, 3.2, 'metric')).toBe('3.2');
  });

  it('stores typed imperial values back in metric, as mathjs converts them', () => {
    expect(fromDraftValue(mass, '10', 'imperial')).toBeCloseTo(unit(10, 'lb').toNumber('kg'), 9);
    expect(fromDraftValue(diameter, '5.1', 'imperial')).toBeCloseTo(unit(5.1, 'inch').toNumber('mm'), 9);
  });

  it('shows ohm as milliohm and stores it back without float noise', () => {
    expect(toDraftValue(resistance, 0.0021, 'metric')).toBe('2.1');
    expect(fromDraftValue(resistance, '2.1', 'metric')).toBe(0.0021);
  });

  it('reads an empty optional number as not known, a comma as a decimal point, and passes nonsense on for the service to name', () => {
    expect(fromDraftValue(resistance, '  ', 'metric')).toBeNull();
    expect(fromDraftValue(capacity, '5000,5', 'metric')).toBe(5000.5);
    expect(fromDraftValue(capacity, 'lots', 'metric')).toBe('lots');
  });

  it('sends only the fields the user changed, so untouched values are never rewritten by rounding', () => {
    const fields = PART_FIELDS.vehicles;
    const record = { name: 'Truck', kind: 'truck', massKg: 3.2, dragAreaM2: 0.045, rollingCoefficient: 0.04, tractionCoefficient: 0.9, owner: '', className: '', notes: '' };
    const base = toDraft(fields, record, 'imperial');
    const draft = { ...base, owner: 'Dana' };
    expect(draftChanges(fields, draft, base, 'imperial')).toEqual({ owner: 'Dana' });
    const all = draftToRecord(fields, base, 'imperial');
    expect(all.massKg).toBeCloseTo(3.2, 5);
  });

  it('places service errors on the field they name', () => {
    expect(errorFieldKey('changes.capacityMah')).toBe('capacityMah');
    expect(errorFieldKey('part.changes.kv')).toBe('kv');
    expect(errorFieldKey('changes.gearing.pinionTeeth')).toBe('gearing.pinionTeeth');
    expect(errorFieldKey(undefined)).toBeNull();
    expect(messageForField('capacityMah: must be greater than 0', 'capacityMah')).toBe('must be greater than 0');
    expect(messageForField('Something else', 'capacityMah')).toBe('Something else');
  });
});
