import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

let f: ServiceFixture;
forEachEngine((engine) => {
  beforeEach(async () => {
    f = await serviceFixture(engine);
  });
  afterEach(async () => f.close());

  describe('archiving, restoring and duplicating builds', () => {
    it('archives a build out of the list, lists it among the archived, and restores it', async () => {
      const seed = await seedTwoBuggies(f);
      const archived = await f.call('builds.archive', { id: seed.onTwo.id, expectedVersion: seed.onTwo.version, reason: 'sold the car' });
      expect(archived.record.archivedAt).not.toBeNull();
      expect((await f.call('builds.list', {})).map((b) => b.id)).toEqual([seed.onFour.id]);
      const withArchived = await f.call('builds.list', { includeArchived: true });
      expect(withArchived.find((b) => b.id === seed.onTwo.id)?.archivedAt).toBe(archived.record.archivedAt);

      const restored = await f.call('builds.archive', { id: seed.onTwo.id, expectedVersion: archived.record.version, archived: false });
      expect(restored.record.archivedAt).toBeNull();
      expect((await f.call('builds.list', {})).map((b) => b.id).sort()).toEqual([seed.onFour.id, seed.onTwo.id].sort());
      const timeline = await f.call('history.list', { entityKind: 'builds', entityId: seed.onTwo.id });
      expect(timeline.map((h) => h.action)).toEqual(['restore', 'archive', 'create']);
    });

    it('duplicates every setting under a new id and new supply ids, with a history entry naming the original', async () => {
      const seed = await seedTwoBuggies(f);
      await f.call('builds.update', { id: seed.onTwo.id, expectedVersion: 1, changes: { measuredPeakCurrentA: 88, notes: 'club spec', tightThreshold: 0.2 } });
      const original = (await f.call('builds.get', { id: seed.onTwo.id })).build;
      const copy = await f.call('builds.duplicate', { id: seed.onTwo.id });
      expect(copy.record.id).not.toBe(original.id);
      expect(copy.record.name).toBe('Buggy on 2S (copy)');
      expect(copy.record.version).toBe(1);
      const { id: _a, name: _b, version: _c, supplies: s1, ...rest1 } = original;
      const { id: _d, name: _e, version: _f, supplies: s2, ...rest2 } = copy.record;
      expect(rest2).toEqual(rest1);
      expect(s2.map((s) => s.batteryIds)).toEqual(s1.map((s) => s.batteryIds));
      expect(s2.map((s) => s.id).some((id) => s1.some((o) => o.id === id))).toBe(false);
      // Same inputs, same verdict.
      const [a, b] = await Promise.all([f.call('builds.get', { id: original.id }), f.call('builds.get', { id: copy.record.id })]);
      expect(b.verdict.status).toBe(a.verdict.status);
      expect(b.verdict.supplies[0]?.figures).toEqual(a.verdict.supplies[0]?.figures);
      const history = await f.call('history.list', { entityKind: 'builds', entityId: copy.record.id });
      expect(history[0]?.summary).toBe('Added build "Buggy on 2S (copy)" as a copy of "Buggy on 2S"');
    });

    it('duplicates an archived build as an active one, and refuses an id that is taken', async () => {
      const seed = await seedTwoBuggies(f);
      await f.call('builds.archive', { id: seed.onTwo.id, expectedVersion: 1 });
      const copy = await f.call('builds.duplicate', { id: seed.onTwo.id, name: 'Back on track' });
      expect(copy.record.archivedAt).toBeNull();
      expect(copy.record.name).toBe('Back on track');
      await expect(f.call('builds.duplicate', { id: seed.onTwo.id, newId: seed.onFour.id })).rejects.toThrow(/conflict: newId: a build with id .* already exists/);
      await expect(f.call('builds.duplicate', { id: 'nope' })).rejects.toThrow(/not-found: id: no build with id "nope"/);
    });

    it('names builds in history, archived ones included', async () => {
      const seed = await seedTwoBuggies(f);
      await f.call('builds.archive', { id: seed.onTwo.id, expectedVersion: 1 });
      await f.call('motors.update', { id: seed.motor.id, expectedVersion: 1, changes: { maxVoltageV: 6 } });
      const [entry] = await f.call('history.list', { limit: 1 });
      expect(entry?.entityKind).toBe('motors');
      expect(entry?.buildNames[seed.onTwo.id]).toBe('Buggy on 2S');
      expect(entry?.buildNames[seed.onFour.id]).toBe('Buggy on 4S');
    });

    it('previews a new build without writing it', async () => {
      const seed = await seedTwoBuggies(f);
      const before = await f.call('builds.list', { includeArchived: true });
      const preview = await f.call('builds.preview', {
        create: { name: 'Buggy on 4S, low-voltage controller', vehicleId: seed.vehicle.id, motorId: seed.motor.id, controllerId: seed.esc.id, supplies: [{ batteryIds: [seed.pack4s.id] }] },
      });
      expect(preview.before).toEqual([]);
      expect(preview.after).toHaveLength(1);
      expect(await f.call('builds.list', { includeArchived: true })).toEqual(before);
    });

    it("stores the rule and source of the list's current", async () => {
      const seed = await seedTwoBuggies(f);
      const rows = await f.call('builds.list', {});
      const row = rows.find((r) => r.id === seed.onTwo.id)!;
      const sheet = await f.call('builds.get', { id: seed.onTwo.id });
      const currentChecks = sheet.verdict.supplies.flatMap((s) => s.findings).filter((x) => x.unit === 'A' && x.margin !== null);
      const tightest = currentChecks.reduce((a, b) => (b.margin! < a.margin! ? b : a));
      expect(row.currentRule).toBe(tightest.rule);
      expect([row.peakCurrentA, row.peakCurrentLimitA]).toEqual([tightest.value, tightest.limit]);
      expect(row.currentSource).toBe('model');
    });
  });
});
