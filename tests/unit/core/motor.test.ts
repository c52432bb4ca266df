import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { currentAt, emptyOperatingPoint, motorParams, noLoadOmega, operatingPointAt, peakEfficiencyCurrent, torqueAt, torqueConstant } from '../../../src-main/core/motor';
import { motorCurve } from '../../../src-main/core/motor-curve';

describe('torque constant', () => {
  // Kt = 60/(2π·Kv) is the SI relation; 4.34 and 8.68 mN·m/A for 2200 and 1100 Kv are the
  // figures the trade quotes for those motors (common practice).
  it('is 4.34 mN·m/A at 2200 Kv and 8.68 mN·m/A at 1100 Kv', () => {
    expect(torqueConstant(2200) * 1000).toBeCloseTo(4.34, 2);
    expect(torqueConstant(1100) * 1000).toBeCloseTo(8.68, 2);
  });
});

// Relations of the first-order model, M. Drela, "First-Order DC Electric Motor Model",
// MIT Aero & Astro, 2007.
describe('first-order motor model', () => {
  const m = motorParams(1000, 0.1, 1.5);
  const v = 12;

  it('current, torque, shaft power and efficiency follow the model', () => {
    const omega = 900; // rad/s
    const op = operatingPointAt(m, v, omega, emptyOperatingPoint());
    const i = (v - omega / m.kvRad) / 0.1;
    expect(op.currentA).toBeCloseTo(i, 10);
    expect(op.torqueNm).toBeCloseTo((i - 1.5) / m.kvRad, 12);
    expect(op.shaftPowerW).toBeCloseTo((v - i * 0.1) * (i - 1.5), 9);
    expect(op.shaftPowerW).toBeCloseTo(op.torqueNm * omega, 9); // P = Q·ω
    expect(op.efficiency).toBeCloseTo((1 - (i * 0.1) / v) * (1 - 1.5 / i), 12);
    expect(op.rpm).toBeCloseTo((omega * 60) / (2 * Math.PI), 9);
  });

  it('has no torque at the no-load speed and draws I0 there', () => {
    const w0 = noLoadOmega(m, v);
    expect(torqueAt(m, v, w0)).toBeCloseTo(0, 12);
    expect(currentAt(m, v, w0)).toBeCloseTo(1.5, 10);
  });

  it('peaks in efficiency at I = √(V·I0/R), found by scanning', () => {
    const op = emptyOperatingPoint();
    let best = 0;
    let bestI = 0;
    const w0 = noLoadOmega(m, v);
    for (let k = 0; k <= 200_000; k++) {
      operatingPointAt(m, v, (w0 * k) / 200_000, op);
      if (op.efficiency > best) {
        best = op.efficiency;
        bestI = op.currentA;
      }
    }
    const expected = peakEfficiencyCurrent(m, v);
    expect(expected).toBeCloseTo(Math.sqrt((12 * 1.5) / 0.1), 12);
    expect(Math.abs(bestI - expected) / expected).toBeLessThan(0.01);
    // η_max = (1 − √(I0·R/V))², which follows from the model at that current.
    expect(best).toBeCloseTo((1 - Math.sqrt((1.5 * 0.1) / 12)) ** 2, 6);
  });

  it('never gives more shaft power than it takes in (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 10, max: 10_000, noNaN: true }),
        fc.double({ min: 0.001, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 20, noNaN: true }),
        fc.double({ min: 0.5, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (kv, r, i0, volts, share) => {
          const p = motorParams(kv, r, i0);
          // From standstill to the speed where current falls to zero.
          const op = operatingPointAt(p, volts, share * volts * p.kvRad, emptyOperatingPoint());
          expect(op.shaftPowerW).toBeLessThanOrEqual(op.inputPowerW + 1e-9 * Math.abs(op.inputPowerW));
          expect(op.efficiency).toBeGreaterThanOrEqual(0);
          expect(op.efficiency).toBeLessThanOrEqual(1);
        },
      ),
    );
  });
});

describe('motor curve', () => {
  it('runs from stall to no-load speed', () => {
    const c = motorCurve({ kv: 1000, resistanceOhm: 0.08, extraResistanceOhm: 0.02, noLoadCurrentA: 1.5, voltageV: 12, points: 101 });
    expect(c.rpm).toHaveLength(101);
    expect(c.rpm[0]).toBe(0);
    expect(c.currentA[0]).toBeCloseTo(12 / 0.1, 9); // stall: V / total R
    expect(c.currentA[100]).toBeCloseTo(1.5, 9);
    expect(c.torqueNm[100]).toBeCloseTo(0, 12);
    expect(c.rpm[100]).toBeCloseTo(1000 * (12 - 1.5 * 0.1), 6);
    // Sampled curve peaks just under the model's η_max = (1 − √(I0·R/V))².
    const etaMax = (1 - Math.sqrt((1.5 * 0.1) / 12)) ** 2;
    expect(Math.max(...c.efficiency)).toBeLessThanOrEqual(etaMax);
    expect(Math.max(...c.efficiency)).toBeGreaterThan(etaMax - 0.01);
  });

  it('gives empty arrays, not NaN, for inputs that make no curve', () => {
    const c = motorCurve({ kv: 0, resistanceOhm: 0.1, noLoadCurrentA: 1, voltageV: 12 });
    expect(c.rpm).toEqual([]);
    expect(motorCurve({ kv: 1000, resistanceOhm: Number.NaN, noLoadCurrentA: 1, voltageV: 12 }).currentA).toEqual([]);
  });
});
