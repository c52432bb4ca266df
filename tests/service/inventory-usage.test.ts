import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

let f: ServiceFixture;
forEachEngine((engine) => {
  beforeEach(async () => {
    f = await serviceFixture(engine);
  });
  afterEach(async () => f.close());

  describe('inventory usage', () => {
    it('counts the builds in use that use each part, and dates the last logged current from the history', async () => {
      const seed = await seedTwoBuggies(f);
      const spare = await f.call('batteries.create', { name: 'Spare 2S', chemistry: 'lipo', cellsSeries: 2, capacityMah: 4000 });

      const packs = await f.call('inventory.usage', { table: 'batteries' });
      expect(packs[seed.pack2s.id]).toEqual({ buildCount: 1, lastLogAt: null, loggedCharges: 0 });
      expect(packs[seed.pack4s.id]).toEqual({ buildCount: 1, lastLogAt: null, loggedCharges: 0 });
      expect(packs[spare.id]).toBeUndefined();
      expect((await f.call('inventory.usage', { table: 'motors' }))[seed.motor.id]).toEqual({ buildCount: 2, lastLogAt: null, loggedCharges: 0 });

      // A logged peak current entered on one build dates that build's parts.
      await f.call('builds.update', { id: seed.onFour.id, expectedVersion: seed.onFour.version, changes: { measuredPeakCurrentA: 96 }, reason: 'logger run' });
      const [logged] = await f.call('history.list', { entityKind: 'builds', entityId: seed.onFour.id });
      const motors = await f.call('inventory.usage', { table: 'motors' });
      expect(motors[seed.motor.id]).toEqual({ buildCount: 2, lastLogAt: logged!.at, loggedCharges: 0 });
      const after = await f.call('inventory.usage', { table: 'batteries' });
      expect(after[seed.pack4s.id]?.lastLogAt).toBe(logged!.at);
      expect(after[seed.pack2s.id]?.lastLogAt).toBeNull();
      // A later edit that leaves the logged current alone does not move the date.
      const renamed = await f.call('builds.update', { id: seed.onFour.id, expectedVersion: seed.onFour.version + 1, changes: { name: 'Buggy on 4S, club night' } });
      expect(renamed.record.name).toBe('Buggy on 4S, club night');
      expect((await f.call('inventory.usage', { table: 'motors' }))[seed.motor.id]?.lastLogAt).toBe(logged!.at);

      // An archived build no longer counts as using its parts.
      await f.call('builds.archive', { id: seed.onTwo.id, expectedVersion: seed.onTwo.version });
      expect((await f.call('inventory.usage', { table: 'motors' }))[seed.motor.id]?.buildCount).toBe(1);
      expect((await f.call('inventory.usage', { table: 'batteries' }))[seed.pack2s.id]).toBeUndefined();
      expect((await f.refuse('inventory.usage', { table: 'classRules' })).kind).toBe('invalid');
    });

    it("counts a pack's logged charges as cycles and dates it by its own newest log entry, in a build or not", async () => {
      const seed = await seedTwoBuggies(f);
      const spare = await f.call('batteries.create', { name: 'Spare 2S', chemistry: 'lipo', cellsSeries: 2, capacityMah: 4000 });
      await f.call('packLog.add', { batteryId: spare.id, at: '2026-11-01', kind: 'charge', mah: 3900, voltagePerCellV: 4.2 });
      await f.call('packLog.add', { batteryId: spare.id, at: '2026-11-03', kind: 'storage', voltagePerCellV: 3.85 });
      await f.call('packLog.add', { batteryId: spare.id, at: '2026-11-02', kind: 'charge', mah: 3950 });
      await f.call('packLog.add', { batteryId: seed.pack2s.id, at: '2026-10-05', kind: 'discharge', mah: 3000 });
      const packs = await f.call('inventory.usage', { table: 'batteries' });
      // Two charges (the storage entry is not a cycle); the newest entry of any kind dates the pack.
      expect(packs[spare.id]).toEqual({ buildCount: 0, lastLogAt: '2026-11-03', loggedCharges: 2 });
      expect(packs[seed.pack2s.id]).toEqual({ buildCount: 1, lastLogAt: '2026-10-05', loggedCharges: 0 });
    });
  });
});
