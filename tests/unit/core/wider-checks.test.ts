import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fieldAir, isaPressurePa } from '../../../src-main/core/atmosphere';
import { STANDARD_GRAVITY } from '../../../src-main/core/constants';
import type { BuildContext, SupplyVerdict } from '../../../src-main/core/domain';
import { ESTIMATE, estimateStaticCoefficients } from '../../../src-main/core/propeller-estimate';
import { typicalDragArea } from '../../../src-main/core/typical-values';
import { LOSS_W_PER_GRAM, motorHeatLimit } from '../../../src-main/core/motor-heat-limit';
import { chassisAmpacity } from '../../../src-main/core/wire-ampacity';
import { battery, controller, finding, motor, propeller, quadContext, supplyOf, truckContext, vehicle } from './fixtures';

const INCH = 0.0254;

/** A truck with its road coefficients left empty (as most owners leave them). */
function plainTruck(over: Partial<BuildContext['vehicle'] & object> = {}): BuildContext {
  return truckContext({ vehicle: vehicle({ dragAreaM2: null, rollingCoefficient: null, tractionCoefficient: null, ...over }) });
}

/** A quad whose propeller is known by size only. */
function plainQuad(over: Partial<BuildContext> = {}): BuildContext {
  return quadContext({ propeller: propeller({ thrustCoefficient: null, powerCoefficient: null }), ...over });
}

describe('air density at the field (ISO 2533 standard atmosphere)', () => {
  it('at 1000 m and 30 °C matches a hand computation from the ISO 2533 troposphere formula', () => {
    // Hand computation: T_std = 288.15 − 0.0065·1000 = 281.65 K; g₀/(L·R) = 9.80665 ÷ (0.0065 ×
    // 287.05287) = 5.25588; p = 101 325 × (281.65/288.15)^5.25588 = 89 874.6 Pa (the ISO 2533 table
    // lists 8.98746 × 10⁴ Pa at 1000 m); ρ = 89 874.6 ÷ (287.05287 × 303.15) = 1.03280 kg/m³.
    const air = fieldAir(1000, 30);
    expect(air.pressurePa).toBeCloseTo(89_874.6, 0);
    expect(air.densityKgM3).toBeCloseTo(1.0328, 4);
  });

  it('at 1000 m with no temperature takes the standard one: 1.1116 kg/m³ (ISO 2533 table: 1.1117)', () => {
    expect(fieldAir(1000, null).densityKgM3).toBeCloseTo(1.1117, 3);
    expect(fieldAir(1000, null).temperatureC).toBeCloseTo(8.5, 9);
  });

  it('at sea level and 15 °C is the ISA sea-level density, 1.225 kg/m³', () => {
    expect(fieldAir(0, 15).densityKgM3).toBeCloseTo(1.225, 4);
    expect(isaPressurePa(0)).toBe(101_325);
  });

  it('is what every propeller figure of the build uses', () => {
    const base = quadContext();
    const high = supplyOf({ ...base, build: { ...base.build, fieldAltitudeM: 1000, airTemperatureC: 30 } });
    expect(high.figures.fluidDensityKgM3).toBeCloseTo(1.0328, 4);
    expect(high.assumptions.some((a) => a.includes('1000 m') && a.includes('30 \u00b0C'))).toBe(true);
    // Thinner air loads the propeller less: less current, less thrust.
    const sea = supplyOf(base);
    expect(high.figures.peakCurrentA!).toBeLessThan(sea.figures.peakCurrentA!);
    expect(high.figures.thrustN!).toBeLessThan(sea.figures.thrustN!);
  });

  it('more altitude never raises thrust (property)', () => {
    const base = quadContext();
    fc.assert(
      fc.property(fc.double({ min: -400, max: 5000, noNaN: true }), fc.double({ min: 0, max: 5000, noNaN: true }), fc.double({ min: -30, max: 45, noNaN: true }), (low, rise, temp) => {
        const at = (h: number) => supplyOf({ ...base, build: { ...base.build, fieldAltitudeM: h, airTemperatureC: temp } }).figures.thrustN!;
        expect(at(low + rise)).toBeLessThanOrEqual(at(low) * (1 + 1e-9));
      }),
      { numRuns: 60 },
    );
  });
});

describe('typical values for a car or truck', () => {
  it('an empty coefficient takes its typical value, from the top of its range, and an entered one wins', () => {
    const s = supplyOf(plainTruck());
    // Surface not recorded: the highest rolling coefficient (grass, 0.1) and grip (carpet, 1.2) of
    // the table (common practice, from memory; see core/typical-values.ts).
    expect(s.valuesUsed).toEqual([
      { field: 'vehicle.dragAreaM2', value: typicalDragArea('truck', 3.2), basis: 'typical' },
      { field: 'vehicle.rollingCoefficient', value: 0.1, basis: 'typical' },
      { field: 'vehicle.tractionCoefficient', value: 1.2, basis: 'typical' },
    ]);
    // Cd 1.0 × 0.025 m²/kg^(2/3) × 3.2^(2/3) kg^(2/3) = 0.0543 m², inside the 0.02–0.06 m² of a
    // 1/10 truck body (common practice, from memory).
    expect(typicalDragArea('truck', 3.2)).toBeCloseTo(0.0543, 4);
    const asphalt = supplyOf(plainTruck({ surface: 'asphalt', rollingCoefficient: 0.02 }));
    expect(asphalt.valuesUsed?.map((u) => [u.field, u.value])).toEqual([
      ['vehicle.dragAreaM2', typicalDragArea('truck', 3.2)],
      ['vehicle.tractionCoefficient', 0.9],
    ]);
    expect(supplyOf(truckContext()).valuesUsed).toBeUndefined();
  });

  it('every current check reaches a verdict, the figures resting on typical values are marked', () => {
    const s = supplyOf(plainTruck());
    for (const rule of ['battery-continuous', 'battery-burst', 'controller-continuous', 'controller-burst', 'motor-current', 'motor-power']) {
      expect(finding(s, rule).status, rule).not.toBe('incomplete');
    }
    expect(s.markedFigures).toContain('peakCurrentA');
    expect(s.markedFigures).toContain('loadedTopSpeedKmh');
    expect(s.markedFigures).not.toContain('packVoltageFullV');
  });

  it('a verdict resting on typical values reads no better than tight until they are confirmed', () => {
    // Generous ratings: every current check would read clear on entered values.
    const roomy = {
      controller: controller({ continuousCurrentA: 2000, burstCurrentA: 4000 }),
      motor: motor({ maxCurrentA: 2000, maxPowerW: 100_000 }),
      batteries: new Map([['pack-a', battery({ cRatingContinuous: 500, cRatingBurst: 1000 })]]),
    };
    const typical = supplyOf({ ...plainTruck(), ...roomy });
    const confirmed = supplyOf({ ...plainTruck({ typicalValuesConfirmed: true }), ...roomy });
    const f = finding(typical, 'controller-continuous');
    expect(f.status).toBe('tight');
    expect(f.typical).toContain('vehicle.rollingCoefficient');
    expect(f.message).toMatch(/typical values not yet confirmed/);
    expect(finding(confirmed, 'controller-continuous').status).toBe('clear');
    expect(finding(confirmed, 'controller-continuous').typical).toBeUndefined();
  });
});

describe('propeller coefficients from diameter, pitch and blades', () => {
  it('a 10 × 4.7 in two-blade propeller: static C_T and C_P within the stated ±20 % of a published static test', () => {
    // Published static test of a 10 × 4.7 in two-blade thin electric propeller: C_T about 0.11,
    // C_P about 0.045 near 5000 rpm (J. B. Brandt and M. S. Selig, "Propeller Performance Data
    // at Low Reynolds Numbers", AIAA 2011-1255; from memory).
    const est = estimateStaticCoefficients(10 * INCH, 4.7 * INCH, 2);
    expect(ESTIMATE.accuracy).toBe(0.2);
    expect(Math.abs(est.thrustCoefficient / 0.11 - 1)).toBeLessThanOrEqual(ESTIMATE.accuracy);
    expect(Math.abs(est.powerCoefficient / 0.045 - 1)).toBeLessThanOrEqual(ESTIMATE.accuracy);
  });

  it('more pitch never lowers C_P at the same diameter and blade count (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.02, max: 2, noNaN: true }), fc.double({ min: 0.1, max: 1.5, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.integer({ min: 2, max: 6 }), (d, ratio, more, blades) => {
        const lo = estimateStaticCoefficients(d, d * ratio, blades);
        const hi = estimateStaticCoefficients(d, d * (ratio + more), blades);
        expect(hi.powerCoefficient).toBeGreaterThanOrEqual(lo.powerCoefficient);
      }),
    );
  });

  it('a quad known by propeller size only reaches a verdict on every current check, marked estimated, an entered coefficient winning', () => {
    const s = supplyOf(plainQuad());
    for (const rule of ['battery-continuous', 'battery-burst', 'controller-continuous', 'controller-burst', 'motor-current', 'motor-power', 'thrust-to-weight']) {
      expect(finding(s, rule).status, rule).not.toBe('incomplete');
    }
    const est = estimateStaticCoefficients(0.127, 0.114, 3);
    expect(s.valuesUsed).toEqual([
      { field: 'propeller.thrustCoefficient', value: est.thrustCoefficient, basis: 'estimated', method: 'air-blade-element' },
      { field: 'propeller.powerCoefficient', value: est.powerCoefficient, basis: 'estimated', method: 'air-blade-element' },
    ]);
    expect(s.markedFigures).toContain('thrustN');
    expect(s.markedFigures).not.toContain('tipSpeedMps');
    const half = supplyOf(quadContext({ propeller: propeller({ thrustCoefficient: 0.11, powerCoefficient: null }) }));
    expect(half.valuesUsed?.map((u) => u.field)).toEqual(['propeller.powerCoefficient']);
    // A boat's propeller is estimated by the water method, not this one.
    const boat = supplyOf(plainQuad({ vehicle: vehicle({ kind: 'boat', massKg: 2 }) }));
    expect(boat.valuesUsed?.map((u) => u.method)).toEqual(['water-b-series', 'water-b-series']);
  });
});

describe('run time and pack energy', () => {
  it('4S LiPo 5000 mAh: 74 Wh nominal; at a measured 40 A average and 80 % depth of discharge, 6 minutes', () => {
    // 4 × 3.7 V × 5 Ah = 74 Wh; 5 Ah × 0.8 ÷ 40 A = 0.1 h = 6 min (hand computation).
    const base = truckContext();
    const s = supplyOf({ ...base, build: { ...base.build, measuredAverageCurrentA: 40 } });
    expect(s.figures.packEnergyWh).toBeCloseTo(74, 9);
    expect(s.figures.runTimeMin).toBeCloseTo(6, 9);
    const half = supplyOf({ ...base, build: { ...base.build, measuredAverageCurrentA: 40, depthOfDischarge: 0.5 } });
    expect(half.figures.runTimeMin).toBeCloseTo(3.75, 9);
  });
});

describe('multirotor hover and thrust-to-weight', () => {
  it('thrust-to-weight is static thrust over the all-up weight, vehicle plus packs', () => {
    const s = supplyOf(quadContext());
    // Quad fixture: 1.2 kg frame + 0.5 kg pack.
    expect(s.figures.allUpMassKg).toBeCloseTo(1.7, 12);
    expect(s.figures.thrustToWeight).toBeCloseTo(s.figures.thrustN! / (1.7 * STANDARD_GRAVITY), 12);
    // Thrust in grams: newtons ÷ 9.80665 m/s² (standard gravity, 3rd CGPM) × 1000.
    expect(s.figures.thrustGrams).toBeCloseTo((s.figures.thrustN! / 9.80665) * 1000, 9);
  });

  it('hover needs less than full throttle and less current than full throttle; a heavier craft more', () => {
    const light = supplyOf(quadContext());
    const heavy = supplyOf(quadContext({ vehicle: vehicle({ id: 'quad-a', kind: 'multirotor', massKg: 1.6 }) }));
    expect(light.figures.hoverThrottle!).toBeGreaterThan(0);
    expect(light.figures.hoverThrottle!).toBeLessThan(1);
    expect(light.figures.hoverCurrentA!).toBeLessThan(light.figures.peakCurrentA!);
    expect(heavy.figures.hoverCurrentA!).toBeGreaterThan(light.figures.hoverCurrentA!);
    expect(heavy.figures.hoverMotorCurrentA!).toBeGreaterThan(light.figures.hoverMotorCurrentA!);
    // The run time of a multirotor is worked out at its hover current.
    expect(light.figures.runTimeMin).toBeCloseTo((5 * 0.8 * 60) / light.figures.hoverCurrentA!, 9);
  });

  it('under 2 reads tight, under 1.3 over (common practice)', () => {
    const mass = (kg: number) => supplyOf(quadContext({ vehicle: vehicle({ id: 'quad-a', kind: 'multirotor', massKg: kg }) }));
    const weightFor = (tw: number) => supplyOf(quadContext()).figures.thrustN! / (tw * STANDARD_GRAVITY) - 0.5;
    expect(finding(mass(weightFor(2.2)), 'thrust-to-weight').status).toBe('clear');
    expect(finding(mass(weightFor(1.8)), 'thrust-to-weight').status).toBe('tight');
    const over = finding(mass(weightFor(1.2)), 'thrust-to-weight');
    expect(over.status).toBe('over');
    expect(over.limit).toBe(1.3);
    const noMass = finding(supplyOf(quadContext({ vehicle: vehicle({ id: 'quad-a', kind: 'multirotor', massKg: null }) })), 'thrust-to-weight');
    expect(noMass.status).toBe('incomplete');
    expect(noMass.missing).toContain('vehicle.massKg');
  });
});

describe('motor heat and controller eRPM', () => {
  // Truck fixture: R 0.011 Ω, I₀ 2.5 A, 4S LiPo full 16.8 V, Kv 2200, 4 poles.
  const at40Context = (over: Partial<BuildContext>): BuildContext => {
    const base = truckContext(over);
    return { ...base, build: { ...base.build, measuredAverageCurrentA: 40 } };
  };
  const at40 = (over: Partial<BuildContext>) => supplyOf(at40Context(over));

  it('loss is I²R + I₀V at the continuous current: 40² × 0.011 + 2.5 × 16.8 = 59.6 W', () => {
    expect(at40({}).figures.motorLossW).toBeCloseTo(59.6, 9);
  });

  it('is judged against the rated heat loss where one is entered, whatever the motor weighs', () => {
    expect(finding(at40({ motor: motor({ maxLossW: 50 }) }), 'motor-heat').status).toBe('over');
    expect(finding(at40({ motor: motor({ maxLossW: 65 }) }), 'motor-heat').status).toBe('tight');
    const rated = supplyOf({ ...at40Context({ motor: motor({ maxLossW: 80, massKg: 0.1 }) }) });
    expect(finding(rated, 'motor-heat')).toMatchObject({ status: 'clear', limit: 80 });
    expect(finding(rated, 'motor-heat').typical).toBeUndefined();
    expect(rated.valuesUsed).toBeUndefined();
  });

  it('is not judged with neither a rated heat loss nor a motor mass', () => {
    expect(at40({ motor: motor({ maxLossW: null, massKg: null }) }).findings.some((f) => f.rule === 'motor-heat')).toBe(false);
    expect(motorHeatLimit(null, null)).toBeNull();
  });

  it('eRPM is no-load rpm at full charge × pole pairs: 2200 × 16.8 × 2 = 73 920', () => {
    expect(at40({}).figures.erpm).toBeCloseTo(73_920, 6);
    expect(finding(at40({ controller: controller({ maxErpm: 70_000 }) }), 'controller-erpm').status).toBe('over');
    expect(finding(at40({ controller: controller({ maxErpm: 100_000 }) }), 'controller-erpm').status).toBe('clear');
    const noPoles = finding(at40({ controller: controller({ maxErpm: 100_000 }), motor: motor({ poles: null }) }), 'controller-erpm');
    expect(noPoles.status).toBe('incomplete');
    expect(noPoles.missing).toEqual(['motor.poles']);
  });
});

describe('motor heat by the rule of thumb on the motor mass', () => {
  // Truck fixture at a measured 40 A: loss 40² × 0.011 + 2.5 × 16.8 = 59.6 W (copper loss I²·R plus
  // the no-load loss I₀·V, the first-order motor model of any electric-machines handbook).
  // The limit per gram is the project's rule of thumb (common practice, from memory); the limits
  // below are that figure times the mass, worked by hand for 0.15 W/g.
  const unrated = (massKg: number | null, over: Partial<BuildContext> = {}): SupplyVerdict => {
    const base = truckContext({ motor: motor({ maxLossW: null, massKg }), ...over });
    return supplyOf({ ...base, build: { ...base.build, measuredAverageCurrentA: 40 } });
  };

  it('takes 0.15 W a gram, on the low side, and an entered rating always wins', () => {
    expect(LOSS_W_PER_GRAM).toBe(0.15);
    // 300 g × 0.15 W/g = 45 W.
    expect(motorHeatLimit(null, 0.3)).toEqual({ lossW: 45, ruleOfThumb: true });
    expect(motorHeatLimit(80, 0.3)).toEqual({ lossW: 80, ruleOfThumb: false });
    // A stored zero rating is no rating.
    expect(motorHeatLimit(0, 0.3)?.ruleOfThumb).toBe(true);
  });

  it('over: 59.6 W against 45 W for a 300 g motor', () => {
    const s = unrated(0.3);
    const f = finding(s, 'motor-heat');
    expect(f).toMatchObject({ status: 'over', limit: 45, typical: ['motor.maxLossW'] });
    expect(f.value).toBeCloseTo(59.6, 9);
    expect(f.message).toMatch(/rule of thumb of 0\.15 W per gram of motor mass/);
    expect(f.message).toContain("Follow the part maker's ratings.");
  });

  it('tight: 59.6 W against 67.5 W for a 450 g motor ((67.5 − 59.6) ÷ 67.5 = 11.7 %, under the 15 % threshold)', () => {
    const f = finding(unrated(0.45), 'motor-heat');
    expect(f.limit).toBeCloseTo(67.5, 9);
    expect(f.margin).toBeCloseTo((67.5 - 59.6) / 67.5, 9);
    expect(f.status).toBe('tight');
  });

  it('never clear on the rule of thumb: 59.6 W against 150 W for a 1 kg motor reads tight, and says why', () => {
    const s = unrated(1);
    const f = finding(s, 'motor-heat');
    // (150 − 59.6) ÷ 150 = 60 % to spare: clear on the margin, held to tight.
    expect(f.margin).toBeCloseTo(0.6027, 4);
    expect(f.status).toBe('tight');
    expect(f.message).toMatch(/no better than tight/);
    expect(f.message).toMatch(/rated heat loss/);
    // The vehicle's confirmation vouches for the vehicle's values, not for the motor's limit.
    const confirmed = unrated(1, { vehicle: vehicle({ typicalValuesConfirmed: true }) });
    expect(finding(confirmed, 'motor-heat').status).toBe('tight');
    // With the maker's rating entered it clears.
    expect(finding(at40RatedAt(150, 1), 'motor-heat').status).toBe('clear');
  });

  it('is listed as a typical value on the sheet, marking no figure', () => {
    const s = unrated(1);
    expect(s.valuesUsed).toEqual([{ field: 'motor.maxLossW', value: 150, basis: 'rule-of-thumb' }]);
    expect(s.markedFigures).toBeUndefined();
    expect(s.assumptions.some((a) => a.startsWith('Motor heat limit: 150 W per motor, a rule of thumb of 0.15 W per gram'))).toBe(true);
    // Other checks do not rest on it: they still read clear.
    expect(finding(s, 'motor-current').status).toBe('clear');
    expect(finding(s, 'motor-current').typical).toBeUndefined();
  });

  it('beside typical road values, a modelled heat finding names both and the sheet keeps them apart', () => {
    // No measured current: the loss rests on the model, and so on the typical drag area.
    const s = supplyOf(truckContext({ motor: motor({ maxLossW: null, massKg: 1 }), vehicle: vehicle({ dragAreaM2: null }) }));
    expect(s.valuesUsed?.map((u) => u.field)).toEqual(['vehicle.dragAreaM2', 'motor.maxLossW']);
    expect(finding(s, 'motor-heat').typical).toEqual(['vehicle.dragAreaM2', 'motor.maxLossW']);
    // At a measured current the loss rests on the limit alone.
    expect(finding(unrated(1, { vehicle: vehicle({ dragAreaM2: null }) }), 'motor-heat').typical).toEqual(['motor.maxLossW']);
    expect(s.assumptions.find((a) => a.startsWith('Typical values used'))).not.toContain('rule of thumb');
  });

  it('incomplete where the loss cannot be worked out, naming the missing input', () => {
    const base = truckContext({ motor: motor({ maxLossW: null, massKg: 0.3, resistanceOhm: null }) });
    const g = finding(supplyOf({ ...base, build: { ...base.build, measuredAverageCurrentA: 40 } }), 'motor-heat');
    expect(g.status).toBe('incomplete');
    expect(g.missing).toEqual(['motor.resistanceOhm']);
  });
});

/** The truck at a measured 40 A with a rated heat loss and a mass. */
function at40RatedAt(maxLossW: number, massKg: number): SupplyVerdict {
  const base = truckContext({ motor: motor({ maxLossW, massKg }) });
  return supplyOf({ ...base, build: { ...base.build, measuredAverageCurrentA: 40 } });
}

describe('BEC current', () => {
  // A controller's BEC rated 3 A against what the receiver and servos draw, as entered. Check
  // values worked by hand against the default 15 % tight threshold; the loads are of the size a
  // receiver with a few standard servos draws, more with a servo near stall (common practice,
  // from memory).
  const withBec = (ratingA: number | null, loadA: number | null): SupplyVerdict => {
    const base = truckContext({ controller: controller({ becCurrentA: ratingA }) });
    return supplyOf({ ...base, build: { ...base.build, becLoadA: loadA } });
  };

  it('over: 3.5 A of load on a 3 A BEC', () => {
    const s = withBec(3, 3.5);
    const f = finding(s, 'bec-current');
    expect(f).toMatchObject({ status: 'over', value: 3.5, limit: 3, unit: 'A' });
    expect(f.message).toMatch(/receiver browns out/);
    expect(s.figures.becLoadA).toBe(3.5);
  });

  it('tight: 2.8 A on 3 A leaves (3 − 2.8) ÷ 3 = 6.7 %, under the 15 % threshold', () => {
    const f = finding(withBec(3, 2.8), 'bec-current');
    expect(f.margin).toBeCloseTo(0.2 / 3, 9);
    expect(f.status).toBe('tight');
  });

  it('clear: 2 A on 3 A leaves 33 %; the build’s own threshold decides tight', () => {
    expect(finding(withBec(3, 2), 'bec-current').status).toBe('clear');
    const base = truckContext({ controller: controller({ becCurrentA: 3 }) });
    const strict = supplyOf({ ...base, build: { ...base.build, becLoadA: 2, tightThreshold: 0.4 } });
    expect(finding(strict, 'bec-current').status).toBe('tight');
  });

  it('no load entered: nothing to judge, so no finding (never claimed clear)', () => {
    for (const s of [withBec(3, null), withBec(null, null)]) {
      expect(s.findings.some((f) => f.rule === 'bec-current')).toBe(false);
    }
    expect(withBec(3, null).figures.becLoadA).toBeNull();
  });

  it('incomplete: a load entered on a controller with no BEC rating names the missing rating', () => {
    const s = withBec(null, 2);
    const f = finding(s, 'bec-current');
    expect(f.status).toBe('incomplete');
    expect(f.missing).toContain('controller.becCurrentA');
    expect(f.message).toMatch(/BEC current rating/);
    expect(s.status).not.toBe('clear');
    // The load is shown as entered even where the controller has no rating.
    expect(s.figures.becLoadA).toBe(2);
  });
});

describe('controller minimum voltage', () => {
  // Truck fixture: 4S LiPo, cut-off 3.0 V per cell (cell makers' specification sheets) = 12.0 V;
  // 4 × 3 mΩ = 12 mΩ; at a measured 100 A peak the cut-off voltage sags to 12.0 − 1.2 = 10.8 V.
  const at100 = (over: Partial<BuildContext>) => {
    const base = truckContext(over);
    return supplyOf({ ...base, build: { ...base.build, measuredPeakCurrentA: 100 } });
  };

  it('the cut-off voltage under the peak current is held above the controller minimum', () => {
    expect(at100({}).figures.loadedCutoffVoltageV).toBeCloseTo(10.8, 9);
    expect(at100({}).findings.some((f) => f.rule === 'controller-min-voltage')).toBe(false);
    const over = finding(at100({ controller: controller({ minVoltageV: 11 }) }), 'controller-min-voltage');
    expect(over).toMatchObject({ status: 'over', limit: 11 });
    expect(over.message).toMatch(/under the controller's minimum input voltage of 11 V/);
    // (10.8 − 10) ÷ 10 = 8 % to spare, under the 15 % threshold: tight; (10.8 − 9) ÷ 9 = 20 %: clear.
    expect(finding(at100({ controller: controller({ minVoltageV: 10 }) }), 'controller-min-voltage').status).toBe('tight');
    expect(finding(at100({ controller: controller({ minVoltageV: 9 }) }), 'controller-min-voltage').status).toBe('clear');
  });

  it('without a measured pack resistance the sag is not known: incomplete, naming it', () => {
    const f = finding(at100({ controller: controller({ minVoltageV: 9 }), batteries: new Map([['pack-a', battery({ cellResistanceOhm: null })]]) }), 'controller-min-voltage');
    expect(f.status).toBe('incomplete');
    expect(f.missing).toEqual(['battery.cellResistanceOhm']);
  });
});

describe('lead wire and connector', () => {
  it('12 AWG carries 41 A in chassis wiring (AWG ampacity table, chassis wiring column)', () => {
    expect(chassisAmpacity(12)).toBe(41);
    expect(chassisAmpacity(3)).toBeNull();
  });

  it('the continuous current is judged against the lead gauge and the connector rating where entered', () => {
    const run = (b: Parameters<typeof battery>[0]) => {
      const base = truckContext({ batteries: new Map([['pack-a', battery(b)]]) });
      return supplyOf({ ...base, build: { ...base.build, measuredAverageCurrentA: 40 } });
    };
    expect(run({}).findings.some((f) => f.rule === 'wire-current' || f.rule === 'connector-current')).toBe(false);
    const wire12 = finding(run({ wireGaugeAwg: 12 }), 'wire-current');
    expect(wire12).toMatchObject({ status: 'tight', value: 40, limit: 41, batteryId: 'pack-a' });
    expect(finding(run({ wireGaugeAwg: 14 }), 'wire-current').status).toBe('over');
    expect(finding(run({ wireGaugeAwg: 10 }), 'wire-current').status).toBe('clear');
    expect(finding(run({ connectorRatingA: 30 }), 'connector-current').status).toBe('over');
    expect(finding(run({ connectorRatingA: 90 }), 'connector-current').status).toBe('clear');
  });
});
