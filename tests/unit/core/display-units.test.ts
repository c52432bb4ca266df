import { describe, expect, it } from 'vitest';
import { unit } from 'mathjs';
import { displayUnit, fromDisplay, newtonToGramForce, newtonToOunceForce, quantityOfUnit, toDisplay } from '../../../src-main/core/units';

// Reference: mathjs unit conversion (ounce = pound / 16, pound = 0.45359237 kg, inch = 25.4 mm,
// all exact per NIST SP 811); standard gravity 9.80665 m/s² (CGPM) for the force units.
const G = 9.80665;

describe('display units added for parts, thrust and torque', () => {
  it('weighs small parts in grams or ounces, stored in kilograms', () => {
    expect(displayUnit('massSmallKg', 'metric')).toBe('g');
    expect(displayUnit('massSmallKg', 'imperial')).toBe('oz');
    expect(toDisplay(0.34, 'massSmallKg', 'metric')).toBeCloseTo(unit(0.34, 'kg').toNumber('g'), 9);
    expect(toDisplay(0.34, 'massSmallKg', 'imperial')).toBeCloseTo(unit(0.34, 'kg').toNumber('oz'), 9);
    expect(fromDisplay(12, 'massSmallKg', 'imperial')).toBeCloseTo(unit(12, 'oz').toNumber('kg'), 12);
  });

  it('shows torque in ounce-inches in imperial', () => {
    const ozIn = unit(1, 'oz').toNumber('kg') * G * unit(1, 'inch').toNumber('m');
    expect(toDisplay(1, 'torqueNm', 'imperial')).toBeCloseTo(1 / ozIn, 6);
    expect(fromDisplay(100, 'torqueNm', 'imperial')).toBeCloseTo(100 * ozIn, 12);
  });

  it('reads thrust as the mass it holds up', () => {
    // 10 N ÷ g = 1.01972 kg = 1019.72 g = 35.97 oz.
    expect(newtonToGramForce(10)).toBeCloseTo(unit(10 / G, 'kg').toNumber('g'), 9);
    expect(newtonToOunceForce(10)).toBeCloseTo(unit(10 / G, 'kg').toNumber('oz'), 9);
  });

  it('maps the unit symbols findings carry back to their quantity', () => {
    expect(quantityOfUnit('km/h')).toBe('speedKmh');
    expect(quantityOfUnit('m/s')).toBe('speedMps');
    expect(quantityOfUnit('N·m')).toBe('torqueNm');
    expect(quantityOfUnit('A')).toBeNull();
    // A class limit in km/h shows in mph: 40 km/h = 24.85 mph.
    expect(toDisplay(40, quantityOfUnit('km/h')!, 'imperial')).toBeCloseTo(unit(40, 'km/h').toNumber('mi/h'), 9);
  });
});
