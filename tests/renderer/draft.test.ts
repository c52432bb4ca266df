import { describe, expect, it } from 'vitest';
import { unit } from 'mathjs';
import { draftChanges, draftToRecord, errorFieldKey, fieldLabel, fromDraftValue, messageForField, toDraft, toDraftValue } from '../../src-renderer/lib/forms/draft';
import { PART_FIELDS, fieldOf } from '../../src-renderer/lib/parts/part-fields';
import { BUILD_FIELDS } from '../../src-renderer/lib/builds/build-fields';
import { readDraftValue } from '../../src-renderer/lib/forms/draft';
import { draftProblems } from '../../src-renderer/lib/forms/draft-problems';
import { gearingSchema } from '../../src-main/service/schemas/build-schemas';
import { partSchemasByTable } from '../../src-main/service/schemas/part-schemas-by-table';

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

  it('shows stored metric values in imperial units, as mathjs converts them, rounded for people', () => {
    // Reference: mathjs unit conversion (pound = 0.45359237 kg, inch = 25.4 mm exactly, NIST SP 811).
    expect(toDraftValue(mass, 3.2, 'imperial')).toBe(String(Number(unit(3.2, 'kg').toNumber('lb').toFixed(2))));
    expect(toDraftValue(diameter, 129.5, 'imperial')).toBe(String(Number(unit(129.5, 'mm').toNumber('inch').toFixed(2))));
    expect(toDraftValue(diameter, 110, 'imperial')).toBe('4.33');
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
    const record = { name: 'Truck', kind: 'truck', massKg: 3.2, dragAreaM2: 0.045, rollingCoefficient: 0.04, tractionCoefficient: 0.9, customerId: null, className: '', notes: '' };
    const base = toDraft(fields, record, 'imperial');
    const draft = { ...base, className: 'Stock 2WD' };
    expect(draftChanges(fields, draft, base, 'imperial')).toEqual({ className: 'Stock 2WD' });
    const all = draftToRecord(fields, base, 'imperial');
    // The rounded imperial text (7.05 lb) only goes back when the user changes it.
    expect(all.massKg).toBeCloseTo(3.2, 2);
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

describe('number and percent fields', () => {
  const kv = fieldOf('motors', 'kv')!;
  const efficiency = BUILD_FIELDS.drivetrainEfficiency;

  it('reads thousands marks by the locale (en-US here): 2,050 is two thousand and fifty', () => {
    expect(fromDraftValue(kv, '2,050', 'metric')).toBe(2050);
    expect(readDraftValue(kv, '1e9', 'metric')).toEqual({ ok: false, message: expect.stringContaining('exponent') });
    expect(readDraftValue(kv, '0x10', 'metric').ok).toBe(false);
  });

  it('types percent fields in percent and says their bounds in percent', () => {
    expect(fromDraftValue(efficiency, '90', 'metric')).toBe(0.9);
    expect(toDraftValue(efficiency, 0.9, 'metric')).toBe('90');
    // A fraction typed by habit is refused rather than saved as 0.9 %.
    expect(readDraftValue(efficiency, '0.9', 'metric')).toEqual({ ok: false, message: 'is typed in percent: 0.9 here would mean 0.9 %; for 90 % type 90' });
    const problems = draftProblems(
      [efficiency],
      { [efficiency.key]: '150' },
      'metric',
      gearingSchema,
      (v) => ({ drivetrainEfficiency: v[efficiency.key] }),
      (p) => `gearing.${p}`,
    );
    expect(problems).toEqual({ [efficiency.key]: 'must be 100 % or less' });
  });

  it('reports every bad field at once, each in its own units', () => {
    const fields = PART_FIELDS.propellers;
    const draft = toDraft(fields, null, 'imperial', { blades: 2, notes: '' });
    Object.assign(draft, { name: '', diameterMm: '1,2.3', blades: '40', thrustCoefficient: '-1' });
    const problems = draftProblems(fields, draft, 'imperial', partSchemasByTable.propellers.create);
    expect(problems).toEqual({
      name: 'is required',
      diameterMm: expect.stringContaining('does not read as one number'),
      blades: 'must be 12 or less',
      thrustCoefficient: 'must be greater than 0',
    });
    // A length bound is said in inches when imperial is chosen: 10 000 mm ÷ 25.4 = 393.701 in (NIST SP 811).
    const long = draftProblems(fields, { ...draft, name: 'x', diameterMm: '400', blades: '2', thrustCoefficient: '' }, 'imperial', partSchemasByTable.propellers.create);
    expect(long).toEqual({ diameterMm: 'must be 393.701 in or less' });
  });
});
