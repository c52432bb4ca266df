import { evaluate } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { AIR_DENSITY, FRESH_WATER_DENSITY } from '../../../src-main/core/constants';
import { motorParams, torqueAt } from '../../../src-main/core/motor';
import { propPower, propThrust, propTorque, staticPropPoint, tipSpeed } from '../../../src-main/core/propeller';

describe('propeller relations', () => {
  // T = C_T·ρ·n²·D⁴ and P = C_P·ρ·n³·D⁵ (n in rev/s): the standard propeller coefficient
  // definitions, evaluated by mathjs with its own units (10 in prop at 10 000 rpm).
  it('thrust and power match a mathjs unit evaluation', () => {
    const n = 10000 / 60;
    const d = 0.254;
    expect(propThrust(0.1, 1.225, n, d)).toBeCloseTo(evaluate('0.1 * 1.225 kg/m^3 * (10000 / minute)^2 * (10 inch)^4').toNumber('N'), 9);
    expect(propPower(0.05, 1.225, n, d)).toBeCloseTo(evaluate('0.05 * 1.225 kg/m^3 * (10000 / minute)^3 * (10 inch)^5').toNumber('W'), 9);
    expect(propTorque(0.05, 1.225, n, d) * 2 * Math.PI * n).toBeCloseTo(propPower(0.05, 1.225, n, d), 9);
  });

  it('tip speed is π·D·n', () => {
    expect(tipSpeed(10000 / 60, 0.254)).toBeCloseTo(evaluate('pi * 10 inch * 10000 / minute').toNumber('m/s'), 9);
  });
});

describe('static operating point', () => {
  const m = motorParams(1700, 0.05 + 0.004 + 4 * 0.012, 1.2);
  const prop = { diameterM: 0.127, thrustCoefficient: 0.11, powerCoefficient: 0.05, densityKgM3: AIR_DENSITY };

  it('is where motor torque meets propeller torque', () => {
    const p = staticPropPoint(m, 16.8, prop);
    expect(torqueAt(m, 16.8, p.omegaRadS)).toBeCloseTo(propTorque(0.05, AIR_DENSITY, p.revPerS, 0.127), 9);
    expect(p.thrustN).toBeCloseTo(propThrust(0.11, AIR_DENSITY, p.revPerS, 0.127), 9);
    expect(p.currentA).toBeGreaterThan(1.2);
  });

  it('in water loads the motor far harder than in air', () => {
    const air = staticPropPoint(m, 16.8, { ...prop, diameterM: 0.04 });
    const water = staticPropPoint(m, 16.8, { ...prop, diameterM: 0.04, densityKgM3: FRESH_WATER_DENSITY });
    expect(water.currentA).toBeGreaterThan(air.currentA);
    expect(water.omegaRadS).toBeLessThan(air.omegaRadS);
    expect(torqueAt(m, 16.8, water.omegaRadS)).toBeCloseTo(propTorque(0.05, FRESH_WATER_DENSITY, water.revPerS, 0.04), 9);
  });
});
