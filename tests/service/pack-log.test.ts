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

  const count = async (table: 'packEvents' | 'history') =>
    Number(
      (
        await f.db
          .selectFrom(table)
          .select(sql<number>`count(*)`.as('n'))
          .executeTakeFirstOrThrow()
      ).n,
    );

  describe('pack log', () => {
    it('counts cycles from the log on top of the starting count', async () => {
      const { pack2s } = await seedTwoBuggies(f);
      await f.call('batteries.update', { id: pack2s.id, expectedVersion: 1, changes: { cycleCount: 12 } });
      await f.call('packLog.add', { batteryId: pack2s.id, at: '2026-11-01', kind: 'charge', mah: 4800, voltagePerCellV: 4.2 });
      await f.call('packLog.add', { batteryId: pack2s.id, at: '2026-11-01', kind: 'discharge', mah: 4100, voltagePerCellV: 3.7 });
      const added = await f.call('packLog.add', { batteryId: pack2s.id, at: '2026-11-02', kind: 'charge', mah: 4200 });
      expect(added.log).toMatchObject({ startingCycles: 12, cycles: 14 });
      const log = await f.call('packLog.list', { batteryId: pack2s.id });
      expect(log.events.map((e) => e.kind)).toEqual(['charge', 'discharge', 'charge']);
    });

    it('the newest resistance measurement sets the sag of every build using the pack, re-checked in the same write, typed value kept', async () => {
      const { pack2s, onTwo } = await seedTwoBuggies(f);
      const before = await f.call('builds.get', { id: onTwo.id });
      // Typed: 3 mΩ a cell, 2S1P: 6 mΩ (series cells add).
      expect(before.verdict.supplies[0]!.figures.packResistanceOhm).toBeCloseTo(0.006, 12);
      const added = await f.call('packLog.add', { batteryId: pack2s.id, at: '2026-11-20', kind: 'resistance', cellResistancesOhm: [0.007, 0.009], temperatureC: 22 });
      expect(added.log.newestResistance).toMatchObject({ at: '2026-11-20' });
      expect(added.log.newestResistance!.packOhm).toBeCloseTo(0.016, 12);
      const after = await f.call('builds.get', { id: onTwo.id });
      // 7 + 9 mΩ = 16 mΩ for the pack.
      expect(after.verdict.supplies[0]!.figures.packResistanceOhm).toBeCloseTo(0.016, 12);
      expect(after.verdict.supplies[0]!.figures.loadedVoltageV!).toBeLessThan(before.verdict.supplies[0]!.figures.loadedVoltageV!);
      expect((await f.call('batteries.get', { id: pack2s.id })).cellResistanceOhm).toBe(0.003);
      // One history entry for the entry, on the pack.
      const history = await f.call('history.list', { entityKind: 'batteries', entityId: pack2s.id });
      expect(history.find((h) => h.action === 'log')?.summary).toMatch(/resistance measured of 2026-11-20/i);
    });

    it('a puffed inspection turns the builds using the pack over with a pack-health finding; removing it clears it', async () => {
      const { pack2s, onTwo, onFour } = await seedTwoBuggies(f);
      const added = await f.call('packLog.add', { batteryId: pack2s.id, at: '2026-11-20', kind: 'inspection', puffed: true, note: 'swollen after a hot run' });
      expect(added.verdictChanges.some((c) => c.buildId === onTwo.id && c.to === 'over')).toBe(true);
      expect(added.verdictChanges.some((c) => c.buildId === onFour.id)).toBe(false);
      const sheet = await f.call('builds.get', { id: onTwo.id });
      const finding = sheet.verdict.supplies[0]!.findings.find((x) => x.rule === 'pack-health');
      expect(finding).toMatchObject({ status: 'over', batteryId: pack2s.id });
      expect(finding!.message).toMatch(/found puffed/);
      expect(added.log.health).toMatchObject([{ kind: 'inspection', status: 'over' }]);
      const stored = await f.db.selectFrom('verdicts').select('status').where('buildId', '=', onTwo.id).executeTakeFirstOrThrow();
      expect(stored.status).toBe('over');
      await f.call('packLog.remove', { id: added.event.id });
      const clean = await f.call('builds.get', { id: onTwo.id });
      expect(clean.verdict.supplies[0]!.findings.some((x) => x.rule === 'pack-health')).toBe(false);
    });

    it('thresholds come from settings, with their basis, and a change re-checks the builds', async () => {
      const { pack2s, onTwo } = await seedTwoBuggies(f);
      const got = await f.call('settings.packHealth', {});
      expect(got.thresholds).toEqual({ resistanceGrowthShare: 0.5, capacityShareOfRated: 0.8, storageDays: 7 });
      expect(got.basis.capacityShareOfRated).toMatch(/common practice/i);
      // 4100 of 5000 mAh: 82 %, clear at 80 %, worn at 85 %.
      await f.call('packLog.add', { batteryId: pack2s.id, at: '2026-11-20', kind: 'discharge', mah: 4100, capacityCheck: true, voltagePerCellV: 3.6 });
      expect((await f.call('builds.get', { id: onTwo.id })).verdict.supplies[0]!.findings.some((x) => x.rule === 'pack-health')).toBe(false);
      const changed = await f.call('settings.updatePackHealth', { capacityShareOfRated: 0.85 });
      expect(changed.thresholds.capacityShareOfRated).toBe(0.85);
      expect(changed.verdictChanges.some((c) => c.buildId === onTwo.id && c.to === 'over')).toBe(true);
    });

    it.each([
      ['a day not on the calendar', { at: '2026-02-30', kind: 'charge' }, 'at'],
      ['an unknown kind', { at: '2026-11-01', kind: 'polish' }, 'kind'],
      ['readings on a charge', { at: '2026-11-01', kind: 'charge', cellResistancesOhm: [0.003] }, 'cellResistancesOhm'],
      ['more readings than cells', { at: '2026-11-01', kind: 'resistance', cellResistancesOhm: [0.003, 0.003, 0.003] }, 'cellResistancesOhm'],
      ['a resistance entry without readings', { at: '2026-11-01', kind: 'resistance' }, 'cellResistancesOhm'],
      ['milliohms typed as ohms', { at: '2026-11-01', kind: 'resistance', cellResistancesOhm: [3] }, 'cellResistancesOhm'],
      ['a storage entry without its voltage', { at: '2026-11-01', kind: 'storage' }, 'voltagePerCellV'],
    ])('refuses %s, naming the field, writing nothing', async (_label, args, field) => {
      const { pack2s } = await seedTwoBuggies(f);
      const before = [await count('packEvents'), await count('history')];
      const error = await f.refuse('packLog.add', { batteryId: pack2s.id, ...args });
      expect(error.kind).toBe('invalid');
      expect(error.field ?? '').toMatch(new RegExp(`^${field}`));
      expect([await count('packEvents'), await count('history')]).toEqual(before);
    });

    it('refuses an entry for a pack that does not exist', async () => {
      expect(await f.refuse('packLog.add', { batteryId: 'pack-none', at: '2026-11-01', kind: 'charge' })).toMatchObject({ kind: 'not-found', field: 'batteryId' });
    });
  });
});
