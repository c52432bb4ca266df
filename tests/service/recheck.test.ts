import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

let f: ServiceFixture;
forEachEngine((engine) => {
  beforeEach(async () => {
    f = await serviceFixture(engine);
  });
  afterEach(async () => f.close());

  async function evaluatedAt(buildId: string): Promise<string> {
    const row = await f.db.selectFrom('verdicts').select('evaluatedAt').where('buildId', '=', buildId).executeTakeFirstOrThrow();
    return row.evaluatedAt;
  }

  describe('re-check on every change', () => {
    it('stores a verdict for a new build', async () => {
      const seed = await seedTwoBuggies(f);
      const sheet = await f.call('builds.get', { id: seed.onTwo.id });
      expect(sheet.verdict).not.toBeNull();
      expect(sheet.verdict?.supplies).toHaveLength(1);
      // 2 cells × 4.20 V full charge (cell makers' specification sheets).
      expect(sheet.verdict?.supplies[0]?.figures.packVoltageFullV).toBeCloseTo(8.4, 6);
    });

    it('re-checks exactly the builds that use an edited pack, and logs the verdict changes', async () => {
      const seed = await seedTwoBuggies(f);
      const untouchedAt = await evaluatedAt(seed.onFour.id);
      const before = (await f.call('builds.get', { id: seed.onTwo.id })).verdict!;
      // A pack whose maker rates it at 1C continuous cannot feed a racing buggy.
      const result = await f.call('batteries.update', { id: seed.pack2s.id, expectedVersion: 1, changes: { cRatingContinuous: 1, cRatingBurst: 2 }, reason: 'label misread' });
      expect(result.rechecked).toBe(1);
      const after = (await f.call('builds.get', { id: seed.onTwo.id })).verdict!;
      expect(after.status).toBe('over');
      expect(await evaluatedAt(seed.onFour.id)).toBe(untouchedAt);

      const supplyId = seed.onTwo.supplies[0]!.id;
      const history = await f.call('history.list', { entityKind: 'batteries', entityId: seed.pack2s.id });
      expect(history[0]?.reason).toBe('label misread');
      expect(history[0]?.verdictChanges).toContainEqual({ buildId: seed.onTwo.id, supplyId, from: before.supplies[0]!.status, to: 'over' });
      // The build's own timeline shows the pack edit that changed it.
      const timeline = await f.call('history.list', { buildId: seed.onTwo.id });
      expect(timeline.map((h) => h.entityKind)).toEqual(['batteries', 'builds']);
      expect(f.events).toContainEqual({ type: 'verdicts-changed', buildIds: [seed.onTwo.id] });
    });

    it('writes only the verdict rows that changed', async () => {
      const seed = await seedTwoBuggies(f);
      const firstAt = [await evaluatedAt(seed.onTwo.id), await evaluatedAt(seed.onFour.id)];
      // A note moves no figure: both builds are re-checked, neither row is written.
      const quiet = await f.call('motors.update', { id: seed.motor.id, expectedVersion: 1, changes: { notes: 'bearings replaced' } });
      expect(quiet.rechecked).toBe(2);
      expect([await evaluatedAt(seed.onTwo.id), await evaluatedAt(seed.onFour.id)]).toEqual(firstAt);
      // A 6 V rating is under both packs' full charge (2 × 4.20 V and 4 × 4.20 V, cell makers' sheets): both rows change.
      await f.call('motors.update', { id: seed.motor.id, expectedVersion: 2, changes: { maxVoltageV: 6 } });
      const afterAt = [await evaluatedAt(seed.onTwo.id), await evaluatedAt(seed.onFour.id)];
      expect(afterAt[0]).not.toBe(firstAt[0]);
      expect(afterAt[1]).not.toBe(firstAt[1]);
      expect((await f.call('builds.list', {})).every((s) => s.status === 'over')).toBe(true);
    });

    it('re-checks both builds when their shared motor changes', async () => {
      const seed = await seedTwoBuggies(f);
      const result = await f.call('motors.update', { id: seed.motor.id, expectedVersion: 1, changes: { maxVoltageV: 6 } });
      expect(result.rechecked).toBe(2);
      const statuses = await f.call('builds.list', {});
      expect(statuses.every((s) => s.status === 'over')).toBe(true);
    });

    it('a preview shows before and after and writes nothing', async () => {
      const seed = await seedTwoBuggies(f);
      const historyBefore = await f.call('history.list', {});
      const versionBefore = (await f.call('batteries.get', { id: seed.pack2s.id })).version;
      const preview = await f.call('builds.preview', { part: { kind: 'batteries', id: seed.pack2s.id, expectedVersion: 1, changes: { cRatingContinuous: 1, cRatingBurst: 2 } } });
      expect(preview.before.map((v) => v.buildId)).toEqual([seed.onTwo.id]);
      expect(preview.after[0]?.status).toBe('over');
      expect(preview.before[0]?.status).not.toBe('over');
      expect(await f.call('history.list', {})).toEqual(historyBefore);
      expect((await f.call('batteries.get', { id: seed.pack2s.id })).version).toBe(versionBefore);
      expect((await f.call('builds.get', { id: seed.onTwo.id })).verdict?.status).not.toBe('over');
    });

    it('a gearing preview names the build change and the verdict it would give', async () => {
      const seed = await seedTwoBuggies(f);
      const preview = await f.call('builds.preview', {
        build: { id: seed.onTwo.id, expectedVersion: 1, changes: { gearing: { pinionTeeth: 21, spurTeeth: 87, internalRatio: 2.6, tireDiameterMm: 84, drivetrainEfficiency: 0.9 } } },
      });
      const beforeSpeed = preview.before[0]!.supplies[0]!.figures.theoreticalSpeedKmh!;
      const afterSpeed = preview.after[0]!.supplies[0]!.figures.theoreticalSpeedKmh!;
      // Theoretical speed scales with pinion teeth at a fixed spur: 21/17.
      expect(afterSpeed / beforeSpeed).toBeCloseTo(21 / 17, 6);
      expect((await f.call('builds.get', { id: seed.onTwo.id })).build.gearing.pinionTeeth).toBe(17);
    });

    it('refuses a build that names a missing pack, naming the supply field', async () => {
      const seed = await seedTwoBuggies(f);
      const error = await f.refuse('builds.create', { name: 'Build with a missing pack', vehicleId: seed.vehicle.id, supplies: [{ batteryIds: [seed.pack2s.id, 'pack-missing'] }] });
      expect(error).toMatchObject({ kind: 'invalid', field: 'supplies.0.batteryIds.1' });
      expect(await f.call('builds.list', {})).toHaveLength(2);
    });

    it('filters the builds list by verdict, part and text', async () => {
      const seed = await seedTwoBuggies(f);
      expect((await f.call('builds.list', { partId: seed.pack4s.id })).map((b) => b.id)).toEqual([seed.onFour.id]);
      expect((await f.call('builds.list', { text: 'on 2s' })).map((b) => b.id)).toEqual([seed.onTwo.id]);
      expect((await f.call('builds.list', { text: '%' })).length).toBe(0);
      const list = await f.call('builds.list', {});
      expect(list[0]?.supplyLabels).toEqual(['Test 2S']);
    });

    it('changing the default tight threshold re-checks every build', async () => {
      await seedTwoBuggies(f);
      await f.call('settings.update', { tightThreshold: 0.5 });
      const history = await f.call('history.list', { entityKind: 'settings' });
      expect(history).toHaveLength(1);
      expect((await f.call('settings.get', {})).tightThreshold).toBe(0.5);
    });
  });
});
