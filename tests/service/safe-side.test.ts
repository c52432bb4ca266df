import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { sql } from 'kysely';
import { seedTwoBuggies, serviceFixture, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

let f: ServiceFixture;
forEachEngine((engine) => {
  beforeEach(async () => {
    f = await serviceFixture(engine);
  });
  afterEach(async () => f.close());

  async function count(table: 'builds' | 'motors' | 'history'): Promise<number> {
    return Number(
      (
        await f.db
          .selectFrom(table)
          .select(sql<number>`count(*)`.as('n'))
          .executeTakeFirstOrThrow()
      ).n,
    );
  }

  describe('plausibility at the edge', () => {
    it.each([
      ['Kv below 10', 'motors.create', { name: 'M', kv: 5 }, 'kv', /Kv must be from 10 to 100000 rpm\/V/],
      ['Kv above 100 000', 'motors.create', { name: 'M', kv: 150_000 }, 'kv', /Kv must be from 10 to 100000/],
      ['winding resistance above 10 Ω', 'motors.create', { name: 'M', kv: 2000, resistanceOhm: 12 }, 'resistanceOhm', /Winding resistance must be above 0 Ω and at most 10 Ω/],
      ['a cell resistance of exactly 0', 'batteries.create', { name: 'P', chemistry: 'lipo', cellsSeries: 3, capacityMah: 5000, cellResistanceOhm: 0 }, 'cellResistanceOhm', /Cell resistance must be above 0/],
      ['a driven share above 1', 'vehicles.create', { name: 'V', kind: 'car', drivenWeightShare: 65 }, 'drivenWeightShare', /Weight on driven wheels must be above 0 and at most 1/],
      ['a propeller rpm limit of 10', 'propellers.create', { name: 'P', diameterMm: 127, maxRpm: 10 }, 'maxRpm', /Propeller rpm limit must be from 1000/],
    ])('refuses %s, with what was expected', async (_label, name, args, field, message) => {
      const error = await f.refuse(name, args);
      expect(error).toMatchObject({ kind: 'invalid', field });
      expect(error.message).toMatch(message);
    });

    it('refuses a drivetrain efficiency under 30 % and writes nothing', async () => {
      const seed = await seedTwoBuggies(f);
      const before = await count('history');
      const error = await f.refuse('builds.update', { id: seed.onTwo.id, expectedVersion: 1, changes: { gearing: { ...seed.onTwo.gearing, drivetrainEfficiency: 0.2 } }, reason: '' });
      expect(error.field).toBe('changes.gearing.drivetrainEfficiency');
      expect(error.message).toMatch(/Drivetrain efficiency must be from 0.3 to 1/);
      expect(await count('history')).toBe(before);
    });
  });

  describe('one physical pack in one place', () => {
    it('refuses a pack listed twice in series, naming the pack, and writes nothing', async () => {
      const seed = await seedTwoBuggies(f);
      const builds = await count('builds');
      const error = await f.refuse('builds.create', { name: 'Double', vehicleId: seed.vehicle.id, supplies: [{ arrangement: 'series', batteryIds: [seed.pack2s.id, seed.pack2s.id] }] });
      expect(error).toMatchObject({ kind: 'invalid', field: 'supplies.0.batteryIds.1' });
      expect(error.message).toMatch(/pack "Test 2S" is already in this build/);
      expect(await count('builds')).toBe(builds);
    });

    it('refuses one pack in two supplies of the same build', async () => {
      const seed = await seedTwoBuggies(f);
      const error = await f.refuse('builds.update', {
        id: seed.onTwo.id,
        expectedVersion: 1,
        changes: { supplies: [{ batteryIds: [seed.pack2s.id] }, { batteryIds: [seed.pack2s.id] }] },
        reason: '',
      });
      expect(error.field).toBe('supplies.1.batteryIds.0');
    });
  });

  describe('verdicts through the service', () => {
    it('a retired pack reads over in the list and on the sheet', async () => {
      const seed = await seedTwoBuggies(f);
      await f.call('batteries.update', { id: seed.pack2s.id, expectedVersion: 1, changes: { retired: true }, reason: 'swollen' });
      const list = await f.call('builds.list', {});
      expect(list.find((b) => b.id === seed.onTwo.id)?.status).toBe('over');
      const sheet = await f.call('builds.get', { id: seed.onTwo.id });
      expect(sheet.verdict!.supplies[0]!.findings.find((x) => x.rule === 'pack-retired')?.message).toMatch(/^Pack retired: "Test 2S"/);
    });

    it('the swap preview shows the parallel pack past its rating by conductance share', async () => {
      const seed = await seedTwoBuggies(f);
      const small = await f.call('batteries.create', { name: 'Small 3S 2200', chemistry: 'lipo', cellsSeries: 3, capacityMah: 2200, cRatingContinuous: 25, cRatingBurst: 50, cellResistanceOhm: 0.002 });
      const big = await f.call('batteries.create', { name: 'Big 3S 8000', chemistry: 'lipo', cellsSeries: 3, capacityMah: 8000, cRatingContinuous: 25, cRatingBurst: 50, cellResistanceOhm: 0.01 });
      const preview = await f.call('builds.preview', {
        build: {
          id: seed.onTwo.id,
          expectedVersion: 1,
          changes: { supplies: [{ arrangement: 'parallel', batteryIds: [small.id, big.id] }], measuredPeakCurrentA: 106, measuredAverageCurrentA: 106 },
          reason: '',
        },
      });
      const supply = preview.after[0]!.supplies[0]!;
      const finding = supply.findings.find((x) => x.rule === 'battery-continuous')!;
      // Current division (Alexander & Sadiku, "Fundamentals of Electric Circuits", ch. 2):
      // 106 A × 30 mΩ ÷ (6 mΩ + 30 mΩ) = 88.3 A through the small pack, against 25 C × 2.2 Ah = 55 A.
      expect(finding.value).toBeCloseTo((106 * 0.03) / 0.036, 6);
      expect(finding.limit).toBeCloseTo(55, 9);
      expect(finding.status).toBe('over');
      expect(supply.packShares.map((p) => p.name)).toEqual(['Small 3S 2200', 'Big 3S 8000']);
      // A preview writes nothing.
      expect((await f.call('builds.get', { id: seed.onTwo.id })).build.supplies[0]!.batteryIds).toEqual([seed.pack2s.id]);
    });

    it('measured currents name a supply of the build, and stay on it', async () => {
      const seed = await seedTwoBuggies(f);
      const wrong = await f.refuse('builds.update', { id: seed.onTwo.id, expectedVersion: 1, changes: { measuredPeakCurrentA: 300, measuredSupplyId: 'nope' }, reason: '' });
      expect(wrong).toMatchObject({ kind: 'invalid', field: 'measuredSupplyId' });
      const updated = await f.call('builds.update', {
        id: seed.onTwo.id,
        expectedVersion: 1,
        changes: {
          supplies: [
            { id: 'two-a', batteryIds: [seed.pack2s.id] },
            { id: 'two-b', batteryIds: [seed.pack4s.id] },
          ],
          measuredPeakCurrentA: 300,
          measuredSupplyId: 'two-b',
        },
        reason: '',
      });
      expect(updated.record.measuredSupplyId).toBe('two-b');
      const sheet = await f.call('builds.get', { id: seed.onTwo.id });
      expect(sheet.verdict!.supplies.map((s) => s.figures.peakCurrentSource)).toEqual(['model', 'measured']);
    });

    it('new inputs round-trip through create and read', async () => {
      const vehicle = await f.call('vehicles.create', { name: 'Lake boat', kind: 'boat', water: 'sea' });
      expect(vehicle).toMatchObject({ water: 'sea', driveLayout: null, drivenWeightShare: null });
      const prop = await f.call('propellers.create', { name: 'P', diameterMm: 127, maxRpm: 25_000 });
      expect(prop.maxRpm).toBe(25_000);
      const build = await f.call('builds.create', { name: 'B', vehicleId: vehicle.id, runLengthS: 6 });
      expect(build.record).toMatchObject({ runLengthS: 6, measuredSupplyId: null });
      expect(await count('motors')).toBe(0);
    });
  });
});
