import fc from 'fast-check';
import { evaluate } from 'mathjs';
import { describe, expect, it } from 'vitest';
import type { Battery, BuildContext } from '../../../src-main/core/domain';
import { evaluateBuild } from '../../../src-main/core/evaluate';
import { launchCurrent } from '../../../src-main/core/ground-load';
import { motorParams } from '../../../src-main/core/motor';
import { isPlausible, plausibleMessage } from '../../../src-main/core/plausibility';
import { fullThrottleRun, type RunModel } from '../../../src-main/core/run';
import { parallelShares } from '../../../src-main/core/supply';
import { battery, controller, finding, motor, propeller, quadContext, supplyOf, truckContext, vehicle } from './fixtures';

const packs = (...list: Battery[]): Map<string, Battery> => new Map(list.map((b) => [b.id, b]));

/** A 3S 2200 mAh 25C pack at 2 mΩ a cell beside a 3S 8000 mAh 25C pack at 10 mΩ a cell, 106 A logged. */
function mixedParallel(small: Partial<Battery> = {}, big: Partial<Battery> = {}): BuildContext {
  const a = battery({ id: 'small', name: 'Small 2200', cellsSeries: 3, capacityMah: 2200, cRatingContinuous: 25, cRatingBurst: 50, cellResistanceOhm: 0.002, ...small });
  const b = battery({ id: 'big', name: 'Big 8000', cellsSeries: 3, capacityMah: 8000, cRatingContinuous: 25, cRatingBurst: 50, cellResistanceOhm: 0.01, ...big });
  const base = truckContext();
  return truckContext({
    build: {
      ...base.build,
      supplies: [{ id: 'p', arrangement: 'parallel', batteryIds: ['small', 'big'] }],
      measuredPeakCurrentA: 106,
      measuredAverageCurrentA: 106,
    },
    // No model currents (mass unknown), so the logged 106 A is what is judged.
    vehicle: vehicle({ massKg: null }),
    batteries: packs(a, b),
  });
}

describe('parallel packs share current by conductance', () => {
  it('reproduces the small pack past its rating: about 88 A against 55 A', () => {
    const s = supplyOf(mixedParallel());
    const f = finding(s, 'battery-continuous');
    // Current division for two resistors in parallel, i₁ = i · R₂ ÷ (R₁ + R₂) (C. K. Alexander and
    // M. N. O. Sadiku, "Fundamentals of Electric Circuits", ch. 2, current division), with
    // R₁ = 3 × 2 mΩ = 6 mΩ and R₂ = 3 × 10 mΩ = 30 mΩ: 106 × 30 ÷ 36 = 88.33 A.
    expect(f.value).toBeCloseTo((106 * 0.03) / (0.006 + 0.03), 9);
    // 25 C × 2.2 Ah = 55 A (C rating definition, common practice).
    expect(f.limit).toBeCloseTo(55, 9);
    expect(f.status).toBe('over');
    expect(f.batteryId).toBe('small');
    expect(f.message).toMatch(/pack "Small 2200"/);
    expect(s.status).toBe('over');
    const shares = s.packShares.map((p) => p.share);
    expect(shares[0]).toBeCloseTo(30 / 36, 12);
    expect(shares[1]).toBeCloseTo(6 / 36, 12);
    expect(s.packShares.every((p) => !p.bound)).toBe(true);
    expect(s.assumptions.join(' ')).toMatch(/conductance/);
  });

  it('judges an unmeasured pack as carrying the whole current, never the capacity share', () => {
    const s = supplyOf(mixedParallel({ cellResistanceOhm: null }));
    const f = finding(s, 'battery-continuous');
    expect(f.value).toBeCloseTo(106, 9);
    expect(f.batteryId).toBe('small');
    expect(f.status).toBe('over');
    expect(s.packShares.map((p) => p.bound)).toEqual([true, true]);
    expect(s.assumptions.join(' ')).toMatch(/most pessimistic split/);
  });

  it('judges a measured pack on its share among the measured packs only when another is unmeasured', () => {
    const s = supplyOf(mixedParallel({}, { cellResistanceOhm: null }));
    // The small pack is the only measured one: it may carry all 106 A; the big one too.
    expect(s.packShares[0]?.share).toBe(1);
    expect(s.packShares[1]?.share).toBe(1);
    expect(finding(s, 'battery-continuous').status).toBe('over');
  });

  it('property: adding a pack in parallel never raises any pack share above what it carried before', () => {
    const resistance = fc.option(fc.double({ min: 1e-4, max: 1, noNaN: true }), { nil: null });
    fc.assert(
      fc.property(fc.array(resistance, { minLength: 1, maxLength: 6 }), resistance, (rs, extra) => {
        const before = parallelShares(rs);
        const after = parallelShares([...rs, extra]);
        before.forEach((b, k) => expect(after[k]!.share).toBeLessThanOrEqual(b.share + 1e-12));
        // A single pack carries everything; every share lies in (0, 1].
        for (const a of after) expect(a.share > 0 && a.share <= 1).toBe(true);
      }),
    );
  });

  it('property: with every resistance measured the shares add up to the whole current', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 1e-4, max: 1, noNaN: true }), { minLength: 1, maxLength: 6 }), (rs) => {
        const sum = parallelShares(rs).reduce((t, x) => t + x.share, 0);
        expect(sum).toBeCloseTo(1, 9);
      }),
    );
  });
});

describe('packs that must not be used as listed', () => {
  it('refuses one pack listed twice in series: over, naming the pack', () => {
    const base = truckContext();
    const s = supplyOf({ ...base, build: { ...base.build, supplies: [{ id: 'x', arrangement: 'series', batteryIds: ['pack-a', 'pack-a'] }] } });
    const f = finding(s, 'pack-repeated');
    expect(f.status).toBe('over');
    expect(f.message).toMatch(/"Pack A" appears more than once/);
  });

  it('refuses one pack in two supplies of the same build', () => {
    const base = truckContext();
    const v = evaluateBuild({
      ...base,
      build: {
        ...base.build,
        supplies: [
          { id: 'x', arrangement: 'series', batteryIds: ['pack-a'] },
          { id: 'y', arrangement: 'series', batteryIds: ['pack-a'] },
        ],
      },
    });
    expect(v.supplies.map((s) => s.findings.some((f) => f.rule === 'pack-repeated'))).toEqual([true, true]);
    expect(v.status).toBe('over');
  });

  it('reads a build with a retired pack over', () => {
    const pack = battery({ retired: true });
    const s = supplyOf(truckContext({ batteries: packs(pack) }));
    const f = finding(s, 'pack-retired');
    expect(f.status).toBe('over');
    expect(f.message).toMatch(/^Pack retired: "Pack A"/);
    expect(s.status).toBe('over');
  });

  it('reports LiPo beside Li-ion of the same cell count as a mismatch', () => {
    const a = battery({ id: 'a', chemistry: 'lipo', cellsSeries: 3 });
    const b = battery({ id: 'b', chemistry: 'liion', cellsSeries: 3 });
    const base = truckContext();
    const s = supplyOf({ ...base, batteries: packs(a, b), build: { ...base.build, supplies: [{ id: 'p', arrangement: 'parallel', batteryIds: ['a', 'b'] }] } });
    const f = finding(s, 'supply-match');
    expect(f.status).toBe('over');
    // Same full charge (4.20 V a cell, cell makers' sheets), different nominal: 3 × 3.7 against 3 × 3.6 V.
    expect(f.value).toBeCloseTo(11.1, 9);
    expect(f.limit).toBeCloseTo(10.8, 9);
    expect(f.message).toMatch(/within 0.1 V per cell/);
  });
});

describe('propeller tip speed at the rpm the propeller can reach', () => {
  it('judges the unloaded rpm, Kv × (V − I0·R), and keeps the static figure', () => {
    const s = supplyOf(quadContext());
    const f = s.figures;
    // Loop resistance per motor: winding 0.05 + controller 0.004 + 4 motors × pack 4 × 3 mΩ.
    const loopR = 0.05 + 0.004 + 4 * 0.012;
    const rpm = 1700 * (16.8 - 1.2 * loopR);
    // Tip speed = π · D · n (rotation alone), with mathjs doing the units.
    const expected = evaluate(`pi * 127 mm * ${rpm} / minute`).toNumber('m/s');
    expect(f.tipSpeedMps).toBeCloseTo(expected, 9);
    expect(f.propellerRpmUnloaded).toBeCloseTo(rpm, 6);
    expect(f.tipSpeedStaticMps as number).toBeLessThan(f.tipSpeedMps as number);
    expect(finding(s, 'prop-tip-speed').value).toBeCloseTo(expected, 9);
  });

  it('judges against the maker rpm limit where it is stricter than the Mach limit', () => {
    // A maker limit of the form K ÷ diameter: 125 000 ÷ 5 in = 25 000 rpm, below the ~28 350 rpm unloaded.
    const s = supplyOf(quadContext({ propeller: propeller({ maxRpm: 125_000 / 5 }) }));
    const f = finding(s, 'prop-tip-speed');
    expect(f.limit).toBeCloseTo(evaluate('pi * 127 mm * 25000 / minute').toNumber('m/s'), 9);
    expect(f.status).toBe('over');
    expect(f.message).toMatch(/maker's limit of 25000 rpm/);
    // 0.85 (common practice) of 340.294 m/s (ISA at 15 °C, ISO 2533) is the ceiling either way.
    expect(supplyOf(quadContext({ propeller: propeller({ maxRpm: 400_000 }) })).findings.find((x) => x.rule === 'prop-tip-speed')?.limit).toBeCloseTo(0.85 * 340.294, 9);
  });

  it('never advises a larger propeller when tight', () => {
    const s = supplyOf(quadContext({ propeller: propeller({ maxRpm: 36_000 }) }));
    const f = finding(s, 'prop-tip-speed');
    if (f.status === 'tight') expect(f.message).toMatch(/do not fit a larger propeller/);
    expect(f.message).not.toMatch(/larger propeller .*would pass/);
  });
});

describe('geared propeller builds', () => {
  const base = quadContext();
  const plane = (ratio: number): BuildContext => ({
    ...base,
    vehicle: vehicle({ id: 'plane', kind: 'plane', massKg: 2, tractionCoefficient: null }),
    build: { ...base.build, motorCount: 1, gearing: { pinionTeeth: null, spurTeeth: null, internalRatio: ratio, tireDiameterMm: null, drivetrainEfficiency: 0.9 } },
    propeller: propeller({ diameterMm: 254, pitchMm: 152.4 }),
  });

  it('turns the propeller at motor rpm ÷ ratio for current, thrust and tip speed', () => {
    const direct = supplyOf(plane(1)).figures;
    const geared = supplyOf(plane(2)).figures;
    expect(geared.finalDriveRatio).toBe(2);
    expect(geared.propellerRpmUnloaded as number).toBeCloseTo((direct.propellerRpmUnloaded as number) / 2, 0);
    expect(geared.tipSpeedMps as number).toBeLessThan(direct.tipSpeedMps as number);
    // Static point: motor rpm ÷ 2 is what the propeller turns at.
    expect(geared.propellerRpmStatic as number).toBeCloseTo((geared.loadedRpmFull as number) / 2, 6);
    expect(geared.peakCurrentA).not.toBeCloseTo(direct.peakCurrentA as number, 3);
  });

  it('shows pitch speed, not a tyre speed', () => {
    const f = supplyOf(plane(2)).figures;
    expect(f.theoreticalSpeedKmh).toBeNull();
    expect(f.rolloutMm).toBeNull();
    // Pitch speed = pitch × propeller rev/s at the nominal no-load rpm: 6 in × (Kv × 14.8 V ÷ 2) per minute.
    const expected = evaluate(`6 inch * ${(1700 * 14.8) / 2} / minute`).toNumber('km/h');
    expect(f.pitchSpeedKmh).toBeCloseTo(expected, 9);
  });
});

describe('boats', () => {
  const base = quadContext();
  const boat = (water: 'fresh' | 'sea' | null): BuildContext => ({
    ...base,
    vehicle: vehicle({ id: 'boat', kind: 'boat', water }),
    build: { ...base.build, motorCount: 1, gearing: { ...base.build.gearing, internalRatio: 1 } },
    propeller: propeller({ diameterMm: 40 }),
  });

  it('sea water (1025 kg/m³) loads the propeller more than fresh water, and is taken when not recorded', () => {
    const sea = supplyOf(boat('sea')).figures;
    const fresh = supplyOf(boat('fresh')).figures;
    const unset = supplyOf(boat(null));
    // Sea water about 1025 kg/m³ (UNESCO 1980 equation of state, surface water; from memory).
    expect(sea.fluidDensityKgM3).toBe(1025);
    expect(fresh.fluidDensityKgM3).toBe(1000);
    expect(sea.peakCurrentA as number).toBeGreaterThan(fresh.peakCurrentA as number);
    expect(unset.figures.fluidDensityKgM3).toBe(1025);
    expect(unset.assumptions.join(' ')).toMatch(/Water type not recorded: sea water taken/);
  });
});

describe('peak power without a measured pack resistance', () => {
  it('is not shown as a plain figure but as assuming no sag', () => {
    const pack = battery({ cellResistanceOhm: null });
    const s = supplyOf(truckContext({ batteries: packs(pack) }));
    expect(s.figures.peakPowerW).toBeNull();
    expect(s.figures.peakPowerNoSagW as number).toBeCloseTo((s.figures.peakCurrentA as number) * 16.8, 6);
    expect(s.assumptions.join(' ')).toMatch(/no sag/);
  });
});

describe('the full-throttle run of a car or truck', () => {
  // A motor with no no-load current, on a vehicle with no drag and no rolling resistance and no
  // wheelspin limit, obeys m·dv/dt = k·(V − b·v): the speed approaches V/b exponentially with
  // τ = 1/(k·b) and the current decays as (V/R)·e^(−t/τ) (a first-order linear system; the
  // power-limited acceleration of T. D. Gillespie, "Fundamentals of Vehicle Dynamics", ch. 2,
  // from memory). RMS over T = (V/R)·√(τ/(2T)·(1 − e^(−2T/τ))), mean = (V/R)·(τ/T)·(1 − e^(−T/τ)).
  const kv = 3000;
  const R = 0.05;
  const V = 12;
  const d = { motorCount: 1, finalDrive: 10, tireDiameterMm: 100, efficiency: 0.9 };
  const mass = 2;
  const m = motorParams(kv, R, 0);
  const r = 0.05;
  const kvRad = m.kvRad;
  const b = d.finalDrive / (r * kvRad);
  const k = (d.finalDrive * d.efficiency) / (r * kvRad * R * mass);
  const tau = 1 / (k * b);
  const model: RunModel = { m, voltageV: V, d, road: { massKg: mass, dragAreaM2: 0, rollingCoefficient: 0, airDensity: 1.225 }, tractionForceN: null };

  it('matches the closed form of a first-order system', () => {
    const T = 3;
    const run = fullThrottleRun(model, T, true);
    const rms = (V / R) * Math.sqrt((tau / (2 * T)) * (1 - Math.exp((-2 * T) / tau)));
    const mean = (V / R) * (tau / T) * (1 - Math.exp(-T / tau));
    expect(run.rmsCurrentA / rms).toBeCloseTo(1, 9);
    expect(run.averageCurrentA / mean).toBeCloseTo(1, 9);
    expect(run.endSpeedMps / ((V / b) * (1 - Math.exp(-T / tau)))).toBeCloseTo(1, 9);
    expect(run.timeS).toHaveLength(run.currentA.length);
  });

  it('accelerates at μ·g·(driven share) while traction limits', () => {
    // Traction-limited acceleration a = μ·W_driven ÷ m (Gillespie, ch. 2, from memory), with
    // g = 9.80665 m/s² (CGPM). A grip of 0.2 on half the weight stays traction-limited here.
    const traction = 0.2 * mass * 9.80665 * 0.5;
    const run = fullThrottleRun({ ...model, tractionForceN: traction }, 0.5);
    expect(run.endSpeedMps).toBeCloseTo(0.2 * 9.80665 * 0.5 * 0.5, 6);
    // The current the tyres allow is the launch current of the same share.
    expect(run.rmsCurrentA).toBeCloseTo(launchCurrent(m, V, d, 0.2, mass, 0.5), 6);
  });

  it('property: the continuous figure is at least the steady current, and a longer run never raises the RMS', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 30, noNaN: true }), fc.double({ min: 0.5, max: 30, noNaN: true }), fc.double({ min: 0.3, max: 1.5, noNaN: true }), (t1, t2, mu) => {
        const lo = Math.min(t1, t2);
        const hi = Math.max(t1, t2);
        const withGrip = { ...model, road: { ...model.road, dragAreaM2: 0.02, rollingCoefficient: 0.03 }, tractionForceN: mu * mass * 9.80665 };
        // Current falls as speed rises once traction lets go, so more time at speed lowers the RMS.
        expect(fullThrottleRun(withGrip, hi).rmsCurrentA).toBeLessThanOrEqual(fullThrottleRun(withGrip, lo).rmsCurrentA * (1 + 1e-6));
        const base = truckContext();
        const s = supplyOf({ ...base, vehicle: vehicle({ tractionCoefficient: mu }), build: { ...base.build, runLengthS: hi } });
        expect(s.figures.continuousCurrentA as number).toBeGreaterThanOrEqual((s.figures.steadyCurrentA as number) * (1 - 1e-12));
        expect(s.figures.continuousCurrentA as number).toBeLessThanOrEqual((s.figures.peakCurrentA as number) * (1 + 1e-12));
      }),
      { numRuns: 60 },
    );
  });

  it('judges continuous ratings against the run, higher than the steady top-speed current', () => {
    const s = supplyOf(truckContext({ build: { ...truckContext().build, runLengthS: 2 } }));
    const f = s.figures;
    expect(f.runLengthS).toBe(2);
    expect(f.runRmsCurrentA as number).toBeGreaterThan(f.steadyCurrentA as number);
    expect(f.continuousCurrentA).toBeCloseTo(f.runRmsCurrentA as number, 9);
    expect(finding(s, 'controller-continuous').value).toBeCloseTo(f.runRmsCurrentA as number, 9);
    expect(s.assumptions.join(' ')).toMatch(/2 s full-throttle run/);
  });

  it('agrees with a plain time-stepped integration of the same equations, traction and drag included', () => {
    // An independent check of the closed forms: explicit Euler steps of m·dv/dt = F − road load,
    // 400 000 of them, with the force held to the traction limit while the tyres would spin.
    const withGrip: RunModel = { ...model, m: motorParams(kv, R, 1.5), road: { ...model.road, dragAreaM2: 0.03, rollingCoefficient: 0.03 }, tractionForceN: 0.9 * mass * 9.80665 * 0.7 };
    const T = 4;
    const steps = 400_000;
    const dt = T / steps;
    const radius = d.tireDiameterMm / 2000;
    let v = 0;
    let sumSq = 0;
    let sum = 0;
    for (let k = 0; k < steps; k++) {
      const omega = (v / radius) * d.finalDrive;
      let i = (V - omega / withGrip.m.kvRad) / R;
      let force = (((i - 1.5) / withGrip.m.kvRad) * d.finalDrive * d.efficiency) / radius;
      if (force > withGrip.tractionForceN!) {
        force = withGrip.tractionForceN!;
        i = ((force * radius) / d.finalDrive / d.efficiency) * withGrip.m.kvRad + 1.5;
      }
      const road = 0.5 * 1.225 * 0.03 * v * v + 0.03 * mass * 9.80665;
      sum += i * dt;
      sumSq += i * i * dt;
      v += ((force - road) / mass) * dt;
    }
    const run = fullThrottleRun(withGrip, T, true);
    expect(run.rmsCurrentA / Math.sqrt(sumSq / T)).toBeCloseTo(1, 3);
    expect(run.averageCurrentA / (sum / T)).toBeCloseTo(1, 3);
    expect(run.endSpeedMps / v).toBeCloseTo(1, 3);
    // The chart's samples lie on the same run.
    expect(run.speedMps.at(-1)).toBeCloseTo(run.endSpeedMps, 9);
  });
});

describe('weight on the driven wheels', () => {
  it('scales the traction-limited launch current; 2WD takes 0.7 where none is recorded', () => {
    const at = (v: Partial<Parameters<typeof vehicle>[0]>): number => {
      const s = supplyOf(truckContext({ vehicle: vehicle({ tractionCoefficient: 0.9, ...v }) }));
      return s.figures.motorPeakCurrentA as number;
    };
    const all = at({});
    const twoWd = at({ driveLayout: '2wd' });
    const share = at({ drivenWeightShare: 0.6 });
    // Launch current = μ·share·m·g·r ÷ ratio ÷ η · Kv + I0: the part above I0 scales with the share.
    expect((twoWd - 2.5) / (all - 2.5)).toBeCloseTo(0.7, 6);
    expect((share - 2.5) / (all - 2.5)).toBeCloseTo(0.6, 6);
    expect(supplyOf(truckContext({ vehicle: vehicle({ driveLayout: '2wd' }) })).assumptions.join(' ')).toMatch(/70 % \(2WD default/);
  });
});

describe('measured currents belong to one supply', () => {
  const base = truckContext();
  const second = battery({ id: 'pack-b', name: 'Pack B' });
  const two = (measuredSupplyId: string | null, peak = 400): BuildContext => ({
    ...base,
    batteries: packs(battery(), second),
    build: {
      ...base.build,
      supplies: [
        { id: 's1', arrangement: 'series', batteryIds: ['pack-a'] },
        { id: 's2', arrangement: 'series', batteryIds: ['pack-b'] },
      ],
      measuredPeakCurrentA: peak,
      measuredAverageCurrentA: null,
      measuredSupplyId,
    },
  });

  it('applies them to the supply they were logged on only', () => {
    const v = evaluateBuild(two('s2'));
    expect(v.supplies[0]?.figures.peakCurrentSource).toBe('model');
    expect(v.supplies[1]?.figures.peakCurrentSource).toBe('measured');
    expect(v.supplies[1]?.figures.peakCurrentA).toBe(400);
    expect(v.supplies[0]?.assumptions.join(' ')).toMatch(/logged on another supply/);
  });

  it('uses none of them when several supplies and none is named', () => {
    const v = evaluateBuild(two(null));
    expect(v.supplies.map((s) => s.figures.peakCurrentSource)).toEqual(['model', 'model']);
    expect(v.supplies[0]?.assumptions.join(' ')).toMatch(/not tied to a supply/);
  });

  it('flags a measured peak below the model continuous current as suspect and keeps the model', () => {
    const v = evaluateBuild(two('s1', 5));
    const s = v.supplies[0]!;
    expect(s.figures.peakCurrentSource).toBe('model');
    expect(s.figures.peakCurrentA as number).toBeGreaterThan(5);
    expect(s.assumptions.join(' ')).toMatch(/looks suspect/);
  });
});

describe('ranking', () => {
  it('an unrated controller voltage is not hidden behind a tight finding', () => {
    // A threshold of 0.9 makes every checked rule tight; the missing controller voltage leaves one unchecked.
    const ctx = truckContext({ controller: controller({ maxVoltageV: null, maxCells: null }) });
    const v = evaluateBuild({ ...ctx, build: { ...ctx.build, tightThreshold: 0.9 } });
    const statuses = v.supplies[0]!.findings.map((f) => f.status);
    expect(statuses).toContain('tight');
    expect(statuses).toContain('incomplete');
    expect(v.status).toBe('incomplete');
  });
});

describe('plausibility', () => {
  it('bounds what a hobby part can have', () => {
    expect(isPlausible('motor.kv', 9.99)).toBe(false);
    expect(isPlausible('motor.kv', 10)).toBe(true);
    expect(isPlausible('motor.kv', 100_001)).toBe(false);
    expect(isPlausible('motor.resistanceOhm', 10.5)).toBe(false);
    expect(isPlausible('gearing.drivetrainEfficiency', 0.29)).toBe(false);
    expect(isPlausible('battery.cellResistanceOhm', 0)).toBe(false);
    expect(plausibleMessage('motor.kv')).toBe('Kv must be from 10 to 100000 rpm/V (hobby motors lie in this range)');
  });

  it('an implausible stored value counts as missing, so the check reads incomplete', () => {
    const s = supplyOf(truckContext({ motor: motor({ kv: 5 }) }));
    expect(finding(s, 'motor-speed').missing).toEqual(['motor.kv']);
    expect(s.status).toBe('incomplete');
  });
});
