import { evaluate, unit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { AIR_DENSITY, FRESH_WATER_DENSITY, SPEED_OF_SOUND_SEA_LEVEL, STANDARD_GRAVITY } from '../../../src-main/core/constants';
import {
  DISPLAY_QUANTITIES,
  KILOGRAM_PER_POUND,
  METRE_PER_INCH,
  METRE_PER_MILE,
  NEWTON_PER_POUND_FORCE,
  UNIT_SYSTEMS,
  displayUnit,
  fromDisplay,
  inToMm,
  kgToLb,
  kmhToMph,
  kmhToMps,
  lbToKg,
  mmToIn,
  mphToKmh,
  mpsToKmh,
  mpsToMph,
  newtonToLbf,
  radPerSToRpm,
  rpmToRadPerS,
  toDisplay,
  m2ToFt2,
  mpsToFps,
} from '../../../src-main/core/units';

// Reference: mathjs's own unit definitions, an independent library.
describe('unit factors', () => {
  it('match the NIST SP 811 exact definitions as mathjs carries them', () => {
    expect(METRE_PER_INCH).toBe(unit(1, 'inch').toNumber('m'));
    expect(METRE_PER_MILE).toBe(unit(1, 'mile').toNumber('m'));
    expect(KILOGRAM_PER_POUND).toBe(unit(1, 'lbm').toNumber('kg'));
    expect(NEWTON_PER_POUND_FORCE).toBeCloseTo(unit(1, 'lbf').toNumber('N'), 12);
  });

  it('convert like mathjs', () => {
    for (const x of [0, 1, 12.5, 88.52, 1234.5]) {
      expect(kmhToMph(x)).toBeCloseTo(unit(x, 'km/h').toNumber('mi/h'), 10);
      expect(mphToKmh(x)).toBeCloseTo(unit(x, 'mi/h').toNumber('km/h'), 10);
      expect(kmhToMps(x)).toBeCloseTo(unit(x, 'km/h').toNumber('m/s'), 10);
      expect(mpsToKmh(x)).toBeCloseTo(unit(x, 'm/s').toNumber('km/h'), 10);
      expect(mpsToMph(x)).toBeCloseTo(unit(x, 'm/s').toNumber('mi/h'), 10);
      expect(mmToIn(x)).toBeCloseTo(unit(x, 'mm').toNumber('inch'), 10);
      expect(inToMm(x)).toBeCloseTo(unit(x, 'inch').toNumber('mm'), 10);
      expect(kgToLb(x)).toBeCloseTo(unit(x, 'kg').toNumber('lbm'), 10);
      expect(lbToKg(x)).toBeCloseTo(unit(x, 'lbm').toNumber('kg'), 10);
      expect(newtonToLbf(x)).toBeCloseTo(unit(x, 'N').toNumber('lbf'), 10);
      expect(mpsToFps(x)).toBeCloseTo(unit(x, 'm/s').toNumber('ft/s'), 10);
      expect(m2ToFt2(x)).toBeCloseTo(unit(x, 'm^2').toNumber('ft^2'), 10);
      expect(rpmToRadPerS(x)).toBeCloseTo(unit(x * 2 * Math.PI, 'rad/minute').toNumber('rad/s'), 10);
    }
    expect(radPerSToRpm(rpmToRadPerS(12345))).toBeCloseTo(12345, 9);
  });

  it('give display values in the preferred system and back', () => {
    expect(toDisplay(100, 'speedKmh', 'imperial')).toBeCloseTo(unit(100, 'km/h').toNumber('mi/h'), 10);
    expect(displayUnit('speedKmh', 'imperial')).toBe('mph');
    expect(toDisplay(115, 'lengthMm', 'imperial')).toBeCloseTo(unit(115, 'mm').toNumber('inch'), 10);
    expect(displayUnit('lengthMm', 'imperial')).toBe('in');
    expect(toDisplay(3.2, 'massKg', 'imperial')).toBeCloseTo(unit(3.2, 'kg').toNumber('lbm'), 10);
    expect(toDisplay(3.2, 'massKg', 'metric')).toBe(3.2);
    for (const q of DISPLAY_QUANTITIES) {
      for (const sys of UNIT_SYSTEMS) {
        expect(fromDisplay(toDisplay(42.42, q, sys), q, sys)).toBeCloseTo(42.42, 10);
        expect(displayUnit(q, sys).length).toBeGreaterThan(0);
      }
    }
  });
});

describe('physical constants', () => {
  it('standard gravity is the CGPM value mathjs carries', () => {
    expect(STANDARD_GRAVITY).toBe(evaluate('gravity').toNumber('m/s^2'));
  });

  // ISA sea level: p = 101325 Pa, T = 288.15 K, R = 287.05287 J/(kg·K), γ = 1.4
  // (ICAO standard atmosphere, from memory).
  it('air density follows from the ISA sea-level state', () => {
    expect(AIR_DENSITY).toBeCloseTo(101325 / (287.05287 * 288.15), 4);
  });

  it('speed of sound follows from √(γRT) at ISA sea level', () => {
    expect(SPEED_OF_SOUND_SEA_LEVEL).toBeCloseTo(Math.sqrt(1.4 * 287.05287 * 288.15), 2);
  });

  // Fresh water 999.97 kg/m³ at 4 °C (CRC Handbook, from memory).
  it('fresh water density is within 0.1 % of the handbook value', () => {
    expect(Math.abs(FRESH_WATER_DENSITY - 999.97) / 999.97).toBeLessThan(0.001);
  });
});
