import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { BuildContext } from '../../../src-main/core/domain';
import { B_SERIES_THRUST, B_SERIES_TORQUE, WATER_ESTIMATE, bSeriesOpenWater, estimateWaterCoefficients, heaviestAreaRatio } from '../../../src-main/core/water-propeller-estimate';
import { controller, finding, motor, propeller, quadContext, supplyOf, vehicle } from './fixtures';

/** Stated closeness of the polynomials to the published open-water charts they were fitted to. */
const CHART_TOLERANCE = 0.05;
const near = (value: number, published: number, share = CHART_TOLERANCE): void => {
  expect(Math.abs(value / published - 1)).toBeLessThanOrEqual(share);
};

describe('Wageningen B-series open-water polynomials', () => {
  it('hold the 39 thrust and 47 torque terms of the published tables', () => {
    // Oosterveld and van Oossanen 1975, as reprinted by Bernitsas, Ray and Kinley 1981, table 1.
    expect(B_SERIES_THRUST).toHaveLength(39);
    expect(B_SERIES_TORQUE).toHaveLength(47);
    for (const [, s, t, u, v] of [...B_SERIES_THRUST, ...B_SERIES_TORQUE]) {
      expect(s).toBeLessThanOrEqual(3);
      expect([0, 1, 2, 3, 6]).toContain(t);
      expect(u).toBeLessThanOrEqual(2);
      expect(v).toBeLessThanOrEqual(2);
    }
  });

  it('B4-70, P/D 1.0, at the bollard point (J = 0): K_T about 0.45, 10·K_Q about 0.67', () => {
    // Read from the B4-70 open-water chart (W. P. A. van Lammeren, J. D. van Manen and
    // M. W. C. Oosterveld, "The Wageningen B-screw series", Trans. SNAME 77, 1969), P/D = 1.0
    // curve at J = 0; from memory, within the stated 5 %.
    const b = bSeriesOpenWater(0, 1.0, 0.7, 4);
    near(b.kt, 0.45);
    near(10 * b.kq, 0.67);
  });

  it('B4-70, P/D 1.0, at J = 0.5: K_T about 0.27, 10·K_Q about 0.43', () => {
    // Same chart, same curve, at J = 0.5; from memory, within the stated 5 %.
    const b = bSeriesOpenWater(0.5, 1.0, 0.7, 4);
    near(b.kt, 0.27);
    near(10 * b.kq, 0.43);
  });

  it('B4-70, P/D 1.0: the open-water efficiency J·K_T ÷ (2π·K_Q) peaks near 0.69 at J about 0.84', () => {
    // Same chart: the P/D 1.0 efficiency curve tops out just under 0.7 a little above J = 0.8
    // (from memory; efficiency within ±0.02, the advance ratio within ±0.05).
    let best = { eta: 0, j: 0 };
    for (let j = 0.01; j < 1.1; j += 0.001) {
      const b = bSeriesOpenWater(j, 1.0, 0.7, 4);
      if (b.kt <= 0) break;
      const eta = (j * b.kt) / (2 * Math.PI * b.kq);
      if (eta > best.eta) best = { eta, j };
    }
    expect(Math.abs(best.eta - 0.69)).toBeLessThanOrEqual(0.02);
    expect(Math.abs(best.j - 0.84)).toBeLessThanOrEqual(0.05);
  });

  it('torque is highest at the bollard point: no ahead advance ratio up to 1.0 asks for more (property)', () => {
    const range = WATER_ESTIMATE;
    fc.assert(
      fc.property(
        fc.double({ min: range.pitchRatio.min, max: range.pitchRatio.max, noNaN: true }),
        fc.double({ min: range.areaRatio.min, max: range.areaRatio.max, noNaN: true }),
        fc.integer({ min: range.blades.min, max: range.blades.max }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (pd, area, z, j) => {
          expect(bSeriesOpenWater(0, pd, area, z).kq).toBeGreaterThanOrEqual(bSeriesOpenWater(j, pd, area, z).kq);
        },
      ),
    );
  });
});

describe('water propeller coefficients from diameter, pitch and blades', () => {
  it('C_T is K_T and C_P is 2π·K_Q at J = 0, at the blade area that draws the most torque', () => {
    // T = K_T·ρ·n²·D⁴ is the engine's C_T; P = 2π·n·Q = 2π·K_Q·ρ·n³·D⁵, so C_P = 2π·K_Q (the
    // definitions of the open-water coefficients, ITTC recommended symbols).
    const est = estimateWaterCoefficients(0.04, 0.048, 2);
    const b = bSeriesOpenWater(0, 1.2, est.areaRatio, 2);
    expect(est.pitchRatio).toBeCloseTo(1.2, 12);
    expect(est.thrustCoefficient).toBeCloseTo(b.kt, 12);
    expect(est.powerCoefficient).toBeCloseTo(2 * Math.PI * b.kq, 12);
    for (let a = WATER_ESTIMATE.assumedAreaRatio; a <= WATER_ESTIMATE.areaRatio.max; a += 0.01) {
      expect(bSeriesOpenWater(0, 1.2, a, 2).kq).toBeLessThanOrEqual(b.kq + 1e-12);
    }
  });

  it('the blade area taken never draws less torque than the assumed 0.8 or the series top 1.05 (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 1.4, noNaN: true }), fc.integer({ min: 2, max: 7 }), fc.double({ min: 0.8, max: 1.05, noNaN: true }), (pd, z, other) => {
        const a = heaviestAreaRatio(pd, z);
        expect(a).toBeGreaterThanOrEqual(WATER_ESTIMATE.assumedAreaRatio);
        expect(a).toBeLessThanOrEqual(WATER_ESTIMATE.areaRatio.max);
        expect(bSeriesOpenWater(0, pd, a, z).kq).toBeGreaterThanOrEqual(bSeriesOpenWater(0, pd, other, z).kq - 1e-12);
      }),
    );
  });

  it('more pitch never lowers C_P at the same diameter and blade count (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 0.5, noNaN: true }), fc.double({ min: 0.2, max: 3, noNaN: true }), fc.double({ min: 0, max: 1.5, noNaN: true }), fc.integer({ min: 1, max: 12 }), (d, ratio, more, blades) => {
        const lo = estimateWaterCoefficients(d, d * ratio, blades);
        const hi = estimateWaterCoefficients(d, d * (ratio + more), blades);
        expect(hi.powerCoefficient).toBeGreaterThanOrEqual(lo.powerCoefficient);
      }),
    );
  });

  it('C_T and C_P are positive and finite over hobby sizes, pitches and blade counts (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 0.5, noNaN: true }), fc.double({ min: 0.2, max: 3, noNaN: true }), fc.integer({ min: 1, max: 12 }), (d, ratio, blades) => {
        const est = estimateWaterCoefficients(d, d * ratio, blades);
        expect(est.thrustCoefficient).toBeGreaterThan(0);
        expect(est.powerCoefficient).toBeGreaterThan(0);
        expect(Number.isFinite(est.thrustCoefficient) && Number.isFinite(est.powerCoefficient)).toBe(true);
      }),
    );
  });

  it('above P/D 1.4 torque grows faster than the series own slope at its top would carry it (property)', () => {
    // The series' logarithmic slope of K_Q in P/D just below 1.4, continued above it, is the
    // plainest extrapolation; the estimate must sit on or above it (the more-current side).
    fc.assert(
      fc.property(fc.double({ min: 1.4, max: 3, noNaN: true }), fc.integer({ min: 2, max: 7 }), (pd, z) => {
        const a = heaviestAreaRatio(1.4, z);
        const top = bSeriesOpenWater(0, 1.4, a, z).kq;
        const h = 1e-4;
        const slope = (Math.log(top) - Math.log(bSeriesOpenWater(0, 1.4 - h, a, z).kq)) / (Math.log(1.4) - Math.log(1.4 - h));
        const est = estimateWaterCoefficients(0.04, 0.04 * pd, z);
        expect(est.powerCoefficient / (2 * Math.PI)).toBeGreaterThanOrEqual(top * (pd / 1.4) ** slope * (1 - 1e-9));
      }),
    );
  });

  it('fewer than two blades are taken as two and a flat pitch as P/D 0.5: never less torque than the series gives there', () => {
    const one = estimateWaterCoefficients(0.04, 0.02, 1);
    expect(one.blades).toBe(2);
    expect(one.powerCoefficient).toBeCloseTo(2 * Math.PI * bSeriesOpenWater(0, 0.5, heaviestAreaRatio(0.5, 2), 2).kq, 12);
    expect(estimateWaterCoefficients(0.04, 0.012, 2).powerCoefficient).toBeCloseTo(one.powerCoefficient, 12);
  });
});

describe('a boat known by propeller diameter × pitch only', () => {
  const CURRENT_RULES = ['battery-continuous', 'battery-burst', 'controller-continuous', 'controller-burst', 'motor-current', 'motor-power'];
  /** A 2S-class boat with a 40 mm × 56 mm two-blade propeller, its coefficients left empty. */
  function plainBoat(over: Partial<BuildContext> = {}, confirmed = false): BuildContext {
    const base = quadContext();
    return {
      ...base,
      vehicle: vehicle({ id: 'boat-a', kind: 'boat', massKg: 2, water: 'fresh', dragAreaM2: null, rollingCoefficient: null, tractionCoefficient: null, typicalValuesConfirmed: confirmed }),
      build: { ...base.build, motorCount: 1 },
      motor: motor({ kv: 1000, resistanceOhm: 0.02, noLoadCurrentA: 2, maxCurrentA: 5000, maxPowerW: 1_000_000, maxRpm: 100_000 }),
      controller: controller({ continuousCurrentA: 5000, burstCurrentA: 10_000, resistanceOhm: 0.001 }),
      propeller: propeller({ diameterMm: 40, pitchMm: 56, blades: 2, thrustCoefficient: null, powerCoefficient: null }),
      ...over,
    };
  }

  it('reaches a verdict on every current check, no better than tight, marked estimated (water propeller, B-series at bollard)', () => {
    const s = supplyOf(plainBoat());
    const est = estimateWaterCoefficients(0.04, 0.056, 2);
    for (const rule of CURRENT_RULES) {
      const f = finding(s, rule);
      expect(f.status, rule).not.toBe('incomplete');
      expect(f.status, rule).not.toBe('clear');
      expect(f.typical, rule).toEqual(['propeller.thrustCoefficient', 'propeller.powerCoefficient']);
    }
    expect(s.valuesUsed).toEqual([
      { field: 'propeller.thrustCoefficient', value: est.thrustCoefficient, basis: 'estimated', method: 'water-b-series' },
      { field: 'propeller.powerCoefficient', value: est.powerCoefficient, basis: 'estimated', method: 'water-b-series' },
    ]);
    expect(s.assumptions.join(' ')).toMatch(/water propeller, B-series at bollard/);
    expect(s.markedFigures).toContain('peakCurrentA');
  });

  it('turns in water: static thrust is C_T·ρ·n²·D⁴ at 1000 kg/m³ (fresh water) with the estimated C_T', () => {
    // T = C_T·ρ·n²·D⁴ (definition of the thrust coefficient); fresh water 1000 kg/m³ (rounded).
    const s = supplyOf(plainBoat());
    const est = estimateWaterCoefficients(0.04, 0.056, 2);
    const n = (s.figures.propellerRpmStatic as number) / 60;
    expect(s.figures.fluidDensityKgM3).toBe(1000);
    expect(s.figures.thrustN as number).toBeCloseTo(est.thrustCoefficient * 1000 * n * n * 0.04 ** 4, 6);
  });

  it('reads clear once the estimated values are confirmed on the vehicle, where the parts have room', () => {
    const confirmed = supplyOf(plainBoat({}, true));
    for (const rule of CURRENT_RULES) expect(finding(confirmed, rule).status, rule).toBe('clear');
  });

  it('entered coefficients always win: both entered, nothing is estimated; one entered, only the other is', () => {
    const both = supplyOf(plainBoat({ propeller: propeller({ diameterMm: 40, pitchMm: 56, blades: 2, thrustCoefficient: 0.3, powerCoefficient: 0.4 }) }));
    expect(both.valuesUsed).toBeUndefined();
    expect(finding(both, 'controller-continuous').typical).toBeUndefined();
    const half = supplyOf(plainBoat({ propeller: propeller({ diameterMm: 40, pitchMm: 56, blades: 2, thrustCoefficient: 0.3, powerCoefficient: null }) }));
    expect(half.valuesUsed?.map((u) => u.field)).toEqual(['propeller.powerCoefficient']);
    const n = (half.figures.propellerRpmStatic as number) / 60;
    expect(half.figures.thrustN as number).toBeCloseTo(0.3 * 1000 * n * n * 0.04 ** 4, 6);
  });

  it('without a pitch the estimate cannot be made and the current checks read incomplete', () => {
    const s = supplyOf(plainBoat({ propeller: propeller({ diameterMm: 40, pitchMm: null, blades: 2, thrustCoefficient: null, powerCoefficient: null }) }));
    expect(finding(s, 'motor-current').status).toBe('incomplete');
    expect(s.valuesUsed).toBeUndefined();
  });
});
