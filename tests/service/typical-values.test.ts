import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { serviceFixture, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

// A build entered as a shop would from scratch: the vehicle's kind (and mass), the motor's Kv,
// resistance and no-load current, the controller's ratings, the gearing or the propeller's size,
// and packs. Every current check reaches a verdict on the typical and estimated values, the
// figures resting on them are marked, and confirming them on the vehicle lets a verdict read clear.

const CURRENT_RULES = ['battery-continuous', 'battery-burst', 'controller-continuous', 'controller-burst', 'motor-current'];

let f: ServiceFixture;
forEachEngine((engine) => {
  beforeEach(async () => {
    f = await serviceFixture(engine);
  });
  afterEach(async () => f.close());

  async function parts() {
    const motor = await f.call('motors.create', { name: 'Shop 2200', kv: 2200, resistanceOhm: 0.011, noLoadCurrentA: 2.5, maxCurrentA: 2000 });
    const esc = await f.call('controllers.create', { name: 'Shop 150A', maxVoltageV: 26, continuousCurrentA: 2000, burstCurrentA: 4000 });
    const pack = await f.call('batteries.create', { name: 'Shop 4S', chemistry: 'lipo', cellsSeries: 4, capacityMah: 5000, cRatingContinuous: 500, cRatingBurst: 1000, massKg: 0.5 });
    return { motor, esc, pack };
  }

  describe('a build entered with only what an owner knows', () => {
    it('a truck by kind and mass reaches a verdict on every current check, marked typical, tight until confirmed', async () => {
      const { motor, esc, pack } = await parts();
      const truck = await f.call('vehicles.create', { name: 'Blue short-course truck', kind: 'truck', massKg: 3 });
      const build = await f.call('builds.create', {
        name: 'Blue truck on 4S',
        vehicleId: truck.id,
        motorId: motor.id,
        controllerId: esc.id,
        gearing: { pinionTeeth: 15, spurTeeth: 46, internalRatio: 2.6, tireDiameterMm: 115 },
        supplies: [{ batteryIds: [pack.id] }],
      });
      const sheet = await f.call('builds.get', { id: build.record.id });
      const supply = sheet.verdict!.supplies[0]!;
      for (const rule of CURRENT_RULES) {
        const finding = supply.findings.find((x) => x.rule === rule)!;
        expect(finding.status, rule).toBe('tight');
        expect(finding.typical, rule).toContain('vehicle.dragAreaM2');
      }
      expect(supply.valuesUsed?.map((u) => u.field)).toEqual(['vehicle.dragAreaM2', 'vehicle.rollingCoefficient', 'vehicle.tractionCoefficient']);
      expect(supply.markedFigures).toContain('peakCurrentA');

      // Confirmed on the vehicle: the same build is re-checked and reads clear.
      await f.call('vehicles.update', { id: truck.id, expectedVersion: truck.version, changes: { typicalValuesConfirmed: true }, reason: 'checked on the bench' });
      const after = (await f.call('builds.get', { id: build.record.id })).verdict!.supplies[0]!;
      for (const rule of CURRENT_RULES) {
        const finding = after.findings.find((x) => x.rule === rule)!;
        expect(finding.status, rule).toBe('clear');
        expect(finding.typical, rule).toBeUndefined();
      }
    });

    it('a quad with its propeller known by diameter × pitch reaches a verdict on every current check, marked estimated', async () => {
      const { motor, esc, pack } = await parts();
      const quad = await f.call('vehicles.create', { name: 'Orange camera quad', kind: 'multirotor', massKg: 1.2 });
      const prop = await f.call('propellers.create', { name: '5 × 4.5 three-blade', diameterMm: 127, pitchMm: 114, blades: 3 });
      const build = await f.call('builds.create', {
        name: 'Orange quad',
        vehicleId: quad.id,
        motorId: motor.id,
        motorCount: 4,
        controllerId: esc.id,
        propellerId: prop.id,
        gearing: { internalRatio: 1 },
        fieldAltitudeM: 1500,
        supplies: [{ batteryIds: [pack.id] }],
      });
      const sheet = await f.call('builds.get', { id: build.record.id });
      const supply = sheet.verdict!.supplies[0]!;
      for (const rule of [...CURRENT_RULES, 'thrust-to-weight']) expect(supply.findings.find((x) => x.rule === rule)?.status, rule).not.toBe('incomplete');
      expect(supply.valuesUsed?.map((u) => u.basis)).toEqual(['estimated', 'estimated']);
      expect(supply.markedFigures).toContain('thrustN');
      // ISO 2533 at 1500 m, standard temperature (5.4 °C): 1.0581 kg/m³ (ISO 2533 table, from memory).
      expect(supply.figures.fluidDensityKgM3 as number).toBeCloseTo(1.0581, 3);
    });

    it('a boat with its propeller known by diameter × pitch reaches a verdict on every current check, estimated as a water propeller, tight until confirmed', async () => {
      const { motor, esc, pack } = await parts();
      const boat = await f.call('vehicles.create', { name: 'Teal mono hull', kind: 'boat', massKg: 2, water: 'fresh' });
      const prop = await f.call('propellers.create', { name: '40 × 56 two-blade', diameterMm: 40, pitchMm: 56, blades: 2 });
      const build = await f.call('builds.create', {
        name: 'Teal mono on 4S',
        vehicleId: boat.id,
        motorId: motor.id,
        controllerId: esc.id,
        propellerId: prop.id,
        gearing: { internalRatio: 1 },
        supplies: [{ batteryIds: [pack.id] }],
      });
      const supply = (await f.call('builds.get', { id: build.record.id })).verdict!.supplies[0]!;
      for (const rule of CURRENT_RULES) {
        const finding = supply.findings.find((x) => x.rule === rule)!;
        expect(finding.status, rule).not.toBe('incomplete');
        expect(finding.status, rule).not.toBe('clear');
      }
      expect(supply.valuesUsed?.map((u) => [u.field, u.basis, u.method])).toEqual([
        ['propeller.thrustCoefficient', 'estimated', 'water-b-series'],
        ['propeller.powerCoefficient', 'estimated', 'water-b-series'],
      ]);
      expect(supply.assumptions.join(' ')).toMatch(/water propeller, B-series at bollard/);
      // Fresh water, rounded from 999.97 kg/m³ at 4 °C (common practice).
      expect(supply.figures.fluidDensityKgM3).toBe(1000);
      await f.call('vehicles.update', { id: boat.id, expectedVersion: boat.version, changes: { typicalValuesConfirmed: true }, reason: 'checked on the bench' });
      const after = (await f.call('builds.get', { id: build.record.id })).verdict!.supplies[0]!;
      for (const rule of CURRENT_RULES) expect(after.findings.find((x) => x.rule === rule)!.typical, rule).toBeUndefined();
    });

    it('refuses an implausible field altitude, naming the field, and writes nothing', async () => {
      const { motor } = await parts();
      const car = await f.call('vehicles.create', { name: 'Red touring car', kind: 'car', massKg: 1.5 });
      const error = await f.refuse('builds.create', { name: 'Too high', vehicleId: car.id, motorId: motor.id, fieldAltitudeM: 20_000 });
      expect(error).toMatchObject({ kind: 'invalid', field: 'fieldAltitudeM' });
      expect((await f.call('builds.list', {})).some((b) => b.name === 'Too high')).toBe(false);
    });
  });
});
