import fc from 'fast-check';
import { evaluate } from 'mathjs';
import { describe, expect, it } from 'vitest';
import type { BuildContext, SupplyVerdict } from '../../../src-main/core/domain';
import { evaluateBuild } from '../../../src-main/core/evaluate';
import { battery, classRule, controller, finding, motor, quadContext, supplyOf, truckContext, vehicle } from './fixtures';

describe('figures of a truck on 4S', () => {
  const s = supplyOf(truckContext());
  const f = s.figures;

  it('follow the definitions of the interchange format', () => {
    // 4S LiPo: 14.8 V nominal, 16.8 V full (cell makers' spec sheets).
    expect(f.packVoltageNominalV).toBeCloseTo(14.8, 10);
    expect(f.packVoltageFullV).toBeCloseTo(16.8, 10);
    expect(f.torqueConstantNmPerA).toBeCloseTo(60 / (2 * Math.PI * 2200), 12);
    expect(f.noLoadRpm).toBeCloseTo(2200 * 14.8, 8);
    expect(f.noLoadRpmFull).toBeCloseTo(2200 * 16.8, 8);
    expect(f.finalDriveRatio).toBeCloseTo((46 / 15) * 2.6, 12);
    // Theoretical speed = no-load rpm ÷ ratio × π × tyre diameter, converted by mathjs.
    expect(f.theoreticalSpeedKmh).toBeCloseTo(evaluate(`${2200 * 14.8} / ${(46 / 15) * 2.6} * pi * 115 mm / minute`).toNumber('km/h'), 9);
    expect(f.rolloutMm).toBeCloseTo((Math.PI * 115) / ((46 / 15) * 2.6), 9);
    expect(f.packResistanceOhm).toBeCloseTo(0.012, 12);
    expect(f.capacityMah).toBe(5000);
  });

  it('quote the loaded top speed below the theoretical (no-load) speed, both at nominal voltage', () => {
    // Road load only takes speed away from the no-load figure (force balance; any vehicle
    // dynamics text), so loaded < theoretical at the same voltage.
    expect(f.loadedTopSpeedKmh).toBeGreaterThan(0);
    expect(f.loadedTopSpeedKmh ?? Infinity).toBeLessThan(f.theoreticalSpeedKmh ?? 0);
  });

  it('place the full-charge operating point on the motor line the currents come from', () => {
    // Drela's first-order model: I = (V − ω/Kv)/R with V = 16.8 V (4 × 4.20 V) and R the
    // winding, controller and pack resistance in series, 0.011 + 0.001 + 4 × 0.003 Ω.
    const rpm = f.loadedRpmFull as number;
    expect(f.steadyCurrentA).toBeCloseTo((16.8 - rpm / 2200) / 0.024, 6);
    // The continuous current judged is at least the steady one (the run's RMS where larger).
    expect(f.motorContinuousCurrentA as number).toBeGreaterThanOrEqual((f.steadyCurrentA as number) - 1e-9);
    // The nominal-voltage rpm quoted beside the speed is lower.
    expect(f.loadedRpm as number).toBeLessThan(rpm);
  });

  it('carry model currents with the peak at least the continuous', () => {
    expect(f.currentSource).toBe('model');
    expect(f.peakCurrentA).toBeGreaterThan(0);
    expect(f.continuousCurrentA).toBeGreaterThan(0);
    expect(f.peakCurrentA ?? 0).toBeGreaterThanOrEqual(f.continuousCurrentA ?? Infinity);
    expect(f.loadedVoltageV).toBeCloseTo(16.8 - (f.peakCurrentA ?? 0) * 0.012, 9);
    expect(f.peakPowerW).toBeCloseTo((f.peakCurrentA ?? 0) * (f.loadedVoltageV ?? 0), 6);
    expect(f.thrustN).toBeNull();
  });

  it('check every built-in rule except the propeller one', () => {
    expect(s.findings.map((x) => x.rule)).toEqual(['controller-voltage', 'motor-voltage', 'motor-speed', 'battery-continuous', 'battery-burst', 'controller-continuous', 'controller-burst', 'motor-current', 'motor-power', 'motor-heat']);
    expect(s.status).toBe('clear');
  });
});

describe('rules on a build', () => {
  it('take the controller limit from its cell count at 4.2 V a cell', () => {
    const s = supplyOf(truckContext({ controller: controller({ maxVoltageV: null, maxCells: 3 }) }));
    const f = finding(s, 'controller-voltage');
    expect(f.limit).toBeCloseTo(12.6, 10);
    expect(f.status).toBe('over');
    expect(f.message).toMatch(/fire/);
  });

  it('read a full 4S LiPo on a controller rated for 4 cells as within its rating, and 4S LiHV as over', () => {
    // A "4S" rating means 4 × 4.20 V = 16.8 V at full charge (common practice); LiHV cells
    // charge to 4.35 V (common practice), 17.4 V for four, past that rating.
    const rated4s = controller({ maxVoltageV: null, maxCells: 4 });
    const lipo = finding(supplyOf(truckContext({ controller: rated4s })), 'controller-voltage');
    expect(lipo.value).toBeCloseTo(16.8, 10);
    expect(lipo.margin).toBeCloseTo(0, 10);
    expect(lipo.status).toBe('clear');
    const lihv = finding(supplyOf(truckContext({ controller: rated4s, batteries: new Map([['pack-a', battery({ chemistry: 'lihv' })]]) })), 'controller-voltage');
    expect(lihv.status).toBe('over');
  });

  it('read a rating that is not given as incomplete, naming the field', () => {
    const s = supplyOf(truckContext({ motor: motor({ maxVoltageV: null }) }));
    const f = finding(s, 'motor-voltage');
    expect(f.status).toBe('incomplete');
    expect(f.missing).toEqual(['motor.maxVoltageV']);
    expect(s.status).toBe('incomplete');
  });

  it('name missing model inputs on the current rules and leave the figure null', () => {
    const s = supplyOf(truckContext({ motor: motor({ resistanceOhm: null }), vehicle: vehicle({ massKg: null }) }));
    expect(s.figures.continuousCurrentA).toBeNull();
    expect(s.figures.peakCurrentA).toBeNull();
    const f = finding(s, 'battery-continuous');
    expect(f.status).toBe('incomplete');
    expect(f.missing).toEqual(expect.arrayContaining(['motor.resistanceOhm', 'vehicle.massKg']));
    // Voltage rules need neither and still judge.
    expect(finding(s, 'controller-voltage').status).toBe('clear');
  });

  it('name a missing part by the build field that points to it', () => {
    const s = supplyOf(truckContext({ motor: null, vehicle: null }));
    expect(finding(s, 'motor-current').missing).toEqual(expect.arrayContaining(['build.motorId']));
    expect(finding(s, 'battery-burst').missing).toEqual(expect.arrayContaining(['build.vehicleId', 'build.motorId']));
  });

  it('name a pack that is not in the records', () => {
    const base = truckContext();
    const s = supplyOf({ ...base, build: { ...base.build, supplies: [{ id: 's', arrangement: 'series', batteryIds: ['nope'] }] } });
    expect(s.figures.packVoltageFullV).toBeNull();
    expect(finding(s, 'controller-voltage').missing).toEqual(['supply.batteryIds']);
  });

  it('use measured currents where given and say so', () => {
    const base = truckContext();
    const s = supplyOf({ ...base, build: { ...base.build, measuredPeakCurrentA: 130, measuredAverageCurrentA: null } });
    expect(s.figures.peakCurrentA).toBe(130);
    expect(s.figures.peakCurrentSource).toBe('measured');
    expect(s.figures.continuousCurrentSource).toBe('model');
    const burst = finding(s, 'motor-current');
    expect(burst.source).toBe('measured');
    expect(burst.value).toBe(130);
    expect(burst.status).toBe('over'); // 130 A against 120 A rated
    expect(finding(s, 'battery-continuous').source).toBe('model');
    const model = supplyOf(base);
    expect(finding(model, 'motor-current').value).not.toBe(130);
  });

  it('reports packs of different cell counts in parallel as over', () => {
    const a = battery({ id: 'a', cellsSeries: 4 });
    const b = battery({ id: 'b', cellsSeries: 3 });
    const base = truckContext();
    const ctx: BuildContext = {
      ...base,
      batteries: new Map([
        [a.id, a],
        [b.id, b],
      ]),
      build: { ...base.build, supplies: [{ id: 'p', arrangement: 'parallel', batteryIds: ['a', 'b'] }] },
    };
    const s = supplyOf(ctx);
    const f = finding(s, 'supply-match');
    expect(f.status).toBe('over');
    expect(f.value).toBeCloseTo(16.8, 10);
    expect(f.limit).toBeCloseTo(12.6, 10);
    expect(f.message).toMatch(/fire/);
    expect(evaluateBuild(ctx).status).toBe('over');
    // The same packs in series are a 7S supply and fine to combine.
    const series = supplyOf({ ...ctx, build: { ...ctx.build, supplies: [{ id: 'p', arrangement: 'series', batteryIds: ['a', 'b'] }] } });
    expect(series.findings.some((x) => x.rule === 'supply-match')).toBe(false);
    expect(series.figures.packVoltageNominalV).toBeCloseTo(25.9, 10);
  });

  it('judge every supply on its own and take the worst for the build', () => {
    const small = battery({ id: 'small', capacityMah: 500, cRatingContinuous: 20, cRatingBurst: 30 });
    const base = truckContext();
    const ctx: BuildContext = {
      ...base,
      batteries: new Map([...base.batteries, [small.id, small]]),
      build: {
        ...base.build,
        supplies: [...base.build.supplies, { id: 'weak', arrangement: 'series', batteryIds: ['small'] }],
      },
    };
    const v = evaluateBuild(ctx);
    expect(v.supplies.map((x) => x.status)).toEqual(['clear', 'over']);
    expect(v.status).toBe('over');
    expect(finding(v.supplies[1] as SupplyVerdict, 'battery-burst').message).toMatch(/catch fire/);
  });

  it('reads a build without supplies as incomplete', () => {
    const base = truckContext();
    const v = evaluateBuild({ ...base, build: { ...base.build, supplies: [] } });
    expect(v.status).toBe('incomplete');
    expect(finding(v.supplies[0] as SupplyVerdict, 'controller-voltage').missing).toEqual(['build.supplies']);
  });

  it('applies class rules of the vehicle class and their threshold', () => {
    const ctx = truckContext({
      vehicle: vehicle({ className: 'Club Stock' }),
      classRules: [
        classRule({ limit: 80 }),
        classRule({ id: 'r2', ruleId: 'class-mass', figure: 'noSuchFigure', limit: 5 }),
        classRule({ id: 'r3', className: 'Other', ruleId: 'class-other', limit: 1 }),
        classRule({ id: 'r4', ruleId: 'class-archived', limit: 1, archivedAt: '2026-01-01T00:00:00Z' }),
      ],
    });
    const s = supplyOf(ctx);
    expect(finding(s, 'class-speed').status).toBe('over');
    expect(finding(s, 'class-mass').missing).toEqual(['classRule.figure']);
    expect(s.findings.some((x) => x.rule === 'class-other' || x.rule === 'class-archived')).toBe(false);
  });
});

describe('propeller builds', () => {
  it("a quad draws four motors' current from the pack and checks tip speed", () => {
    const s = supplyOf(quadContext());
    const f = s.figures;
    expect(f.peakCurrentA).toBeCloseTo(4 * (f.motorPeakCurrentA as number), 9);
    expect(f.thrustN).toBeGreaterThan(0);
    expect(f.tipSpeedMps).toBeGreaterThan(0);
    expect(finding(s, 'controller-burst').value).toBeCloseTo(f.motorPeakCurrentA as number, 9);
    const tip = finding(s, 'prop-tip-speed');
    // 0.85 (common practice) × 340.294 m/s, the speed of sound at 15 °C (ISO 2533, ICAO Doc 7488).
    expect(tip.limit).toBeCloseTo(0.85 * 340.294, 9);
    // Direct drive: ratio 1, and no tyre-based speed for a propeller build.
    expect(f.finalDriveRatio).toBe(1);
    expect(f.theoreticalSpeedKmh).toBeNull();
  });

  it('names missing propeller coefficients where no pitch lets them be estimated', () => {
    const base = quadContext();
    const s = supplyOf({ ...base, propeller: { ...(base.propeller as NonNullable<BuildContext['propeller']>), powerCoefficient: null, pitchMm: null } });
    // The current checks cannot be made without C_P ...
    expect(finding(s, 'motor-current').missing).toEqual(['propeller.powerCoefficient']);
    // ... but the unloaded tip speed needs no propeller coefficient, so it is still judged.
    expect(finding(s, 'prop-tip-speed').status).not.toBe('incomplete');
  });

  it('boats use water and have no tip-speed rule', () => {
    const base = quadContext();
    const boat = supplyOf({ ...base, vehicle: vehicle({ kind: 'boat' }), build: { ...base.build, motorCount: 1 }, propeller: { ...(base.propeller as NonNullable<BuildContext['propeller']>), diameterMm: 40 } });
    const air = supplyOf({ ...base, vehicle: vehicle({ kind: 'plane' }), build: { ...base.build, motorCount: 1 }, propeller: { ...(base.propeller as NonNullable<BuildContext['propeller']>), diameterMm: 40 } });
    expect(boat.findings.some((x) => x.rule === 'prop-tip-speed')).toBe(false);
    expect(air.findings.some((x) => x.rule === 'prop-tip-speed')).toBe(true);
    expect(boat.figures.peakCurrentA as number).toBeGreaterThan(air.figures.peakCurrentA as number);
  });
});

describe('properties', () => {
  it('more cells never lower the no-load speed', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 14 }), fc.constantFrom('lipo', 'lihv', 'lifepo4', 'liion', 'nimh' as const), fc.integer({ min: 100, max: 5000 }), (cells, chemistry, kv) => {
        const at = (s: number): number | string | null => {
          const pack = battery({ cellsSeries: s, chemistry });
          return supplyOf(truckContext({ motor: motor({ kv }), batteries: new Map([[pack.id, pack]]) })).figures.noLoadRpm;
        };
        expect(at(cells + 1) as number).toBeGreaterThanOrEqual(at(cells) as number);
      }),
    );
  });

  it('a larger pinion never lowers the theoretical speed', () => {
    fc.assert(
      fc.property(fc.integer({ min: 8, max: 60 }), fc.integer({ min: 30, max: 120 }), (pinion, spur) => {
        const at = (p: number): number => {
          const base = truckContext();
          return supplyOf({ ...base, build: { ...base.build, gearing: { ...base.build.gearing, pinionTeeth: p, spurTeeth: spur } } }).figures.theoreticalSpeedKmh as number;
        };
        expect(at(pinion + 1)).toBeGreaterThanOrEqual(at(pinion));
      }),
    );
  });

  const wild = fc.oneof(
    fc.constant(null),
    fc.double(), // includes NaN, ±Infinity, −0 and extremes
    fc.integer({ min: -5, max: 20 }),
    fc.double({ min: 1e-6, max: 1e6, noNaN: true }),
  );
  const wildNum = fc.oneof(fc.double(), fc.integer({ min: -5, max: 20 }), fc.double({ min: 1e-6, max: 1e6, noNaN: true }));

  it('never yields NaN or Infinity in figures, whatever the inputs; over only with a negative margin', () => {
    fc.assert(
      fc.property(
        fc.record({
          kind: fc.constantFrom('car', 'truck', 'boat', 'multirotor', 'plane', 'hovercraft'),
          arrangement: fc.constantFrom('series' as const, 'parallel' as const),
          packs: fc.array(fc.record({ cells: wildNum, parallel: wildNum, cap: wildNum, c: wild, burst: wild, r: wild, chem: fc.constantFrom('lipo', 'nimh', 'unobtainium') }), { minLength: 0, maxLength: 3 }),
          kv: wildNum,
          rm: wild,
          i0: wild,
          maxA: wild,
          maxW: wild,
          maxV: wild,
          maxRpm: wild,
          escV: wild,
          escCells: wild,
          escCont: wild,
          escBurst: wild,
          escR: wild,
          mass: wild,
          cda: wild,
          crr: wild,
          mu: wild,
          pinion: wild,
          spur: wild,
          ratio: wildNum,
          tire: wild,
          eff: wildNum,
          diam: wildNum,
          ct: wild,
          cp: wild,
          motors: wildNum,
          measuredPeak: wild,
          measuredAvg: wild,
          threshold: wild,
          hasMotor: fc.boolean(),
          hasEsc: fc.boolean(),
          hasVehicle: fc.boolean(),
          hasProp: fc.boolean(),
        }),
        (x) => {
          const packs = x.packs.map((p, i) =>
            battery({ id: `p${i}`, chemistry: p.chem as 'lipo', cellsSeries: p.cells, cellsParallel: p.parallel, capacityMah: p.cap, cRatingContinuous: p.c, cRatingBurst: p.burst, cellResistanceOhm: p.r }),
          );
          const base = quadContext();
          const ctx: BuildContext = {
            ...base,
            build: {
              ...base.build,
              motorCount: x.motors,
              measuredPeakCurrentA: x.measuredPeak,
              measuredAverageCurrentA: x.measuredAvg,
              tightThreshold: x.threshold,
              gearing: { pinionTeeth: x.pinion, spurTeeth: x.spur, internalRatio: x.ratio, tireDiameterMm: x.tire, drivetrainEfficiency: x.eff },
              supplies: [{ id: 's', arrangement: x.arrangement, batteryIds: packs.map((p) => p.id) }],
            },
            vehicle: x.hasVehicle ? vehicle({ kind: x.kind as 'car', massKg: x.mass, dragAreaM2: x.cda, rollingCoefficient: x.crr, tractionCoefficient: x.mu, className: 'Club Stock' }) : null,
            motor: x.hasMotor ? motor({ kv: x.kv, resistanceOhm: x.rm, noLoadCurrentA: x.i0, maxCurrentA: x.maxA, maxPowerW: x.maxW, maxVoltageV: x.maxV, maxRpm: x.maxRpm }) : null,
            controller: x.hasEsc ? controller({ maxVoltageV: x.escV, maxCells: x.escCells, continuousCurrentA: x.escCont, burstCurrentA: x.escBurst, resistanceOhm: x.escR }) : null,
            propeller: x.hasProp ? { ...(base.propeller as NonNullable<BuildContext['propeller']>), diameterMm: x.diam, thrustCoefficient: x.ct, powerCoefficient: x.cp } : null,
            batteries: new Map(packs.map((p) => [p.id, p])),
            classRules: [classRule({ figure: 'peakCurrentA', limit: 100, unit: 'A' })],
          };
          const v = evaluateBuild(ctx);
          expect(['over', 'tight', 'incomplete', 'clear']).toContain(v.status);
          for (const s of v.supplies) {
            for (const [key, value] of Object.entries(s.figures)) {
              if (typeof value === 'number') expect(Number.isFinite(value), key).toBe(true);
            }
            for (const f of s.findings) {
              if (f.margin === null) expect(f.status).toBe('incomplete');
              else {
                expect(Number.isFinite(f.margin)).toBe(true);
                expect(f.status === 'over').toBe(f.margin < 0);
              }
              if (f.value !== null) expect(Number.isFinite(f.value)).toBe(true);
              if (f.status === 'incomplete') expect(f.message).toMatch(/^Not checked/);
              expect(f.message.length).toBeGreaterThan(20);
            }
          }
        },
      ),
      { numRuns: 500 },
    );
  });
});
