import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { sql } from 'kysely';
import { serviceFixture, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

let f: ServiceFixture;
forEachEngine((engine) => {
  beforeEach(async () => {
    f = await serviceFixture(engine);
  });
  afterEach(async () => f.close());

  async function counts() {
    const tables = ['batteries', 'motors', 'history', 'builds'] as const;
    const out: Record<string, number> = {};
    for (const t of tables)
      out[t] = Number(
        (
          await f.db
            .selectFrom(t)
            .select(sql<number>`count(*)`.as('n'))
            .executeTakeFirstOrThrow()
        ).n,
      );
    return out;
  }

  describe('parts through the handler map', () => {
    it('creates, lists and reads a pack, with defaults filled and a history entry', async () => {
      const pack = await f.call('batteries.create', { name: 'Club 4S 5000', chemistry: 'lipo', cellsSeries: 4, capacityMah: 5000 });
      expect(pack).toMatchObject({ name: 'Club 4S 5000', cellsParallel: 1, retired: false, version: 1, archivedAt: null });
      expect((await f.call('batteries.list', {})).map((p) => p.id)).toEqual([pack.id]);
      expect(await f.call('batteries.get', { id: pack.id })).toEqual(pack);
      const history = await f.call('history.list', { entityKind: 'batteries', entityId: pack.id });
      expect(history).toHaveLength(1);
      expect(history[0]).toMatchObject({ action: 'create', actor: 'tester', before: null });
    });

    it.each([
      ['a string for Kv', 'motors.create', { name: 'M', kv: 'fast' }, 'kv'],
      ['a negative capacity', 'batteries.create', { name: 'P', chemistry: 'lipo', cellsSeries: 4, capacityMah: -5 }, 'capacityMah'],
      ['an unknown field', 'batteries.create', { name: 'P', chemistry: 'lipo', cellsSeries: 4, capacityMah: 5000, colour: 'red' }, 'colour'],
      ['an over-long name', 'batteries.create', { name: 'x'.repeat(121), chemistry: 'lipo', cellsSeries: 4, capacityMah: 5000 }, 'name'],
      ['an unknown chemistry', 'batteries.create', { name: 'P', chemistry: 'lead-acid', cellsSeries: 4, capacityMah: 5000 }, 'chemistry'],
      ['Infinity', 'motors.create', { name: 'M', kv: Number.POSITIVE_INFINITY }, 'kv'],
      ['half a cell', 'batteries.create', { name: 'P', chemistry: 'lipo', cellsSeries: 2.5, capacityMah: 5000 }, 'cellsSeries'],
      ['a missing id', 'batteries.get', {}, 'id'],
      ['a prototype key', 'batteries.create', JSON.parse('{"name":"P","chemistry":"lipo","cellsSeries":4,"capacityMah":5000,"__proto__":{"admin":true}}') as unknown, '__proto__'],
    ])('refuses %s, names the field, writes nothing', async (_label, name, args, field) => {
      const before = await counts();
      const error = await f.refuse(name, args);
      expect(error.kind).toBe('invalid');
      expect(error.field).toBe(field);
      expect(error.message.startsWith(`${field}:`)).toBe(true);
      expect(await counts()).toEqual(before);
    });

    it('refuses an unknown operation and prototype names', async () => {
      expect((await f.refuse('batteries.drop', {})).kind).toBe('unknown-handler');
      expect((await f.refuse('constructor', {})).kind).toBe('unknown-handler');
      expect((await f.refuse('__proto__', {})).kind).toBe('unknown-handler');
    });

    it('refuses an update that names an old version, and keeps the other writer’s change', async () => {
      const pack = await f.call('batteries.create', { name: 'Shared 2S', chemistry: 'lipo', cellsSeries: 2, capacityMah: 4000 });
      const first = await f.call('batteries.update', { id: pack.id, expectedVersion: 1, changes: { cycleCount: 12 } });
      expect(first.record.version).toBe(2);
      const historyBefore = (await counts()).history;
      const error = await f.refuse('batteries.update', { id: pack.id, expectedVersion: 1, changes: { cycleCount: 3 } });
      expect(error.kind).toBe('conflict');
      expect(error.message).toMatch(/changed elsewhere/);
      const stored = await f.call('batteries.get', { id: pack.id });
      expect(stored.cycleCount).toBe(12);
      expect((await counts()).history).toBe(historyBefore);
    });

    it('archives a part and hides it from the default list', async () => {
      const motor = await f.call('motors.create', { name: 'Old can', kv: 2000 });
      await f.call('motors.archive', { id: motor.id, expectedVersion: 1, reason: 'burnt' });
      expect(await f.call('motors.list', {})).toEqual([]);
      const all = await f.call('motors.list', { includeArchived: true });
      expect(all[0]?.archivedAt).not.toBeNull();
      const history = await f.call('history.list', { entityKind: 'motors', entityId: motor.id });
      expect(history[0]).toMatchObject({ action: 'archive', reason: 'burnt' });
    });

    it('refuses a duplicate id', async () => {
      await f.call('batteries.create', { id: 'pack-a', name: 'A', chemistry: 'lipo', cellsSeries: 2, capacityMah: 4000 });
      const error = await f.refuse('batteries.create', { id: 'pack-a', name: 'B', chemistry: 'lipo', cellsSeries: 2, capacityMah: 4000 });
      expect(error).toMatchObject({ kind: 'conflict', field: 'id' });
    });
  });

  describe('messages for fields left out', () => {
    it('says a missing required field is required, naming it', async () => {
      const f2 = await serviceFixture(engine);
      try {
        const error = await f2.refuse('batteries.create', { name: 'No chemistry', cellsSeries: 4, capacityMah: 5000 });
        expect(error).toMatchObject({ kind: 'invalid', field: 'chemistry', message: 'chemistry: is required' });
        const nested = await f2.refuse('builds.update', { id: 'b', expectedVersion: 1 });
        expect(nested).toMatchObject({ field: 'changes', message: 'changes: is required' });
      } finally {
        await f2.close();
      }
    });
  });
});
