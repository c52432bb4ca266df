import { describe, expect, it } from 'vitest';
import { unit } from 'mathjs';
import { messageInUnits, thrustAsMass, valueAndLimit } from '../../src-renderer/lib/format/units';

// Reference: mathjs unit conversion (mile = 1609.344 m, foot = 0.3048 m, NIST SP 811).

describe('check rows and engine sentences in the user units', () => {
  it('converts a finding value and limit by its unit symbol', () => {
    const mph = unit(66.3, 'km/h').toNumber('mi/h');
    expect(valueAndLimit(66.3, 40, 'km/h', 'imperial')).toBe(`${mph.toFixed(1)} / ${unit(40, 'km/h').toNumber('mi/h').toFixed(1)} mph`);
    expect(valueAndLimit(42.4, 140, 'A', 'imperial')).toBe('42.4 / 140 A');
    expect(valueAndLimit(null, 140, 'A', 'metric')).toBe('– / 140 A');
  });

  it('rewrites metric figures in sentences, leaving other units alone', () => {
    const fps = Math.round(unit(250, 'm/s').toNumber('ft/s'));
    expect(messageInUnits('Tip speed is 250 m/s, inside 289 m/s; 16.8 V and 42.4 A.', 'imperial')).toBe(
      `Tip speed is ${fps.toLocaleString('en-US')} ft/s, inside ${Math.round(unit(289, 'm/s').toNumber('ft/s')).toLocaleString('en-US')} ft/s; 16.8 V and 42.4 A.`,
    );
    expect(messageInUnits('Torque 0.5 N·m at 40 km/h.', 'metric')).toBe('Torque 0.5 N·m at 40 km/h.');
  });

  it('gives thrust as grams or ounces', () => {
    expect(thrustAsMass(12.3, 'metric')).toBe(`${Math.round(unit(12.3 / 9.80665, 'kg').toNumber('g')).toLocaleString('en-US')} g`);
    expect(thrustAsMass(12.3, 'imperial')).toBe(
      `${unit(12.3 / 9.80665, 'kg')
        .toNumber('oz')
        .toFixed(1)} oz`,
    );
  });
});
