import { existsSync, readFileSync } from 'node:fs';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { BuildVerdict } from '../../src-main/core/domain';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';
import { dumpStore } from '../fleet/store-dump';

// A draft part is tried inside a write that is always rolled back: the store must come out
// exactly as it went in, and the figures must be the ones saving the part and fitting it give.

let f: ServiceFixture;

/** The SQLite file and its log as bytes; null on PostgreSQL, where the row dump stands alone. */
function fileBytes(): Buffer[] | null {
  if (!existsSync(f.dbPath)) return null;
  return [f.dbPath, `${f.dbPath}-wal`].filter((p) => existsSync(p)).map((p) => readFileSync(p));
}

/** What a verdict says, less the ids of the parts (a draft's id is not the saved part's). */
function judged(v: BuildVerdict | undefined) {
  return v?.supplies.map((s) => ({ status: s.status, figures: s.figures, findings: s.findings.map((x) => ({ rule: x.rule, status: x.status, value: x.value, limit: x.limit, margin: x.margin })) }));
}

// A 4S lithium-polymer pack of the same make as the seed's: 4 × 4.20 V = 16.8 V at full charge (cell makers' sheets).
const draftPack = { name: 'Draft 4S', chemistry: 'lipo', cellsSeries: 4, capacityMah: 5000, cRatingContinuous: 50, cRatingBurst: 100, cellResistanceOhm: 0.003 } as const;
// A motor with a lower Kv than the seed's 3300.
const draftMotor = { name: 'Draft 2400', kv: 2400, resistanceOhm: 0.02, noLoadCurrentA: 2, maxCurrentA: 90, maxPowerW: 1200, maxVoltageV: 17.4, maxRpm: 50000 } as const;

forEachEngine((engine) => {
  beforeEach(async () => {
    f = await serviceFixture(engine);
  });
  afterEach(async () => f.close());

  describe('a draft part tried against a build', () => {
    it('leaves every row (and on SQLite every byte of the file) as it was, and announces nothing', async () => {
      const seed = await seedTwoBuggies(f);
      const rows = await dumpStore(f.db);
      const bytes = fileBytes();
      const events = f.events.length;
      const preview = await f.call('builds.preview', { draft: { kind: 'motors', part: draftMotor, buildId: seed.onTwo.id } });
      expect(preview.after.map((a) => a.buildId)).toEqual([seed.onTwo.id]);
      const pack = await f.call('builds.preview', { draft: { kind: 'batteries', part: draftPack, buildId: seed.onTwo.id, scope: 'vehicle' } });
      expect(pack.after).toHaveLength(2);
      expect(await dumpStore(f.db)).toEqual(rows);
      if (engine.name === 'SQLite') {
        expect(bytes).not.toBeNull();
        expect(fileBytes()).toEqual(bytes);
      }
      expect(f.events.length).toBe(events);
      expect((await f.call('motors.list', {})).map((m) => m.name)).toEqual(['Test 3300']);
    });

    it('gives the figures saving the part and fitting it give', async () => {
      const seed = await seedTwoBuggies(f);
      const preview = await f.call('builds.preview', { draft: { kind: 'batteries', part: draftPack, buildId: seed.onTwo.id } });
      const after = preview.after.find((a) => a.buildId === seed.onTwo.id);
      // 4 cells × 4.20 V full charge (cell makers' specification sheets), where the 2S pack gave 8.4 V.
      expect(after?.supplies[0]?.figures.packVoltageFullV).toBeCloseTo(16.8, 6);
      expect(preview.before.find((b) => b.buildId === seed.onTwo.id)?.supplies[0]?.figures.packVoltageFullV).toBeCloseTo(8.4, 6);

      const saved = await f.call('batteries.create', draftPack);
      await f.call('builds.update', { id: seed.onTwo.id, expectedVersion: seed.onTwo.version, changes: { supplies: [{ id: seed.onTwo.supplies[0]!.id, batteryIds: [saved.id] }] } });
      const sheet = await f.call('builds.get', { id: seed.onTwo.id });
      expect(judged(after)).toEqual(judged({ buildId: seed.onTwo.id, status: sheet.verdict.status, supplies: sheet.verdict.supplies }));
    });

    it('tried on every active build of the vehicle gives what fitting it to each gives', async () => {
      const seed = await seedTwoBuggies(f);
      const third = await f.call('builds.duplicate', { id: seed.onFour.id, name: 'Buggy, stored' });
      await f.call('builds.archive', { id: third.record.id, expectedVersion: third.record.version });
      const preview = await f.call('builds.preview', { draft: { kind: 'motors', part: draftMotor, buildId: seed.onFour.id, scope: 'vehicle' } });
      // Both active builds, the archived copy left out.
      expect(preview.after.map((a) => a.buildId).sort()).toEqual([seed.onFour.id, seed.onTwo.id].sort());
      expect(preview.skipped).toEqual([]);

      const saved = await f.call('motors.create', draftMotor);
      for (const b of [seed.onTwo, seed.onFour]) await f.call('builds.update', { id: b.id, expectedVersion: b.version, changes: { motorId: saved.id } });
      for (const b of [seed.onTwo, seed.onFour]) {
        const sheet = await f.call('builds.get', { id: b.id });
        expect(judged(preview.after.find((a) => a.buildId === b.id)), b.name).toEqual(judged({ buildId: b.id, status: sheet.verdict.status, supplies: sheet.verdict.supplies }));
      }
      // The saved motor's no-load speed: 2400 rpm/V × 14.8 V nominal (4 × 3.70 V, cell makers' sheets) = 35 520 rpm.
      expect((await f.call('builds.get', { id: seed.onFour.id })).verdict.supplies[0]?.figures.noLoadRpm).toBeCloseTo(35_520, 0);
    });

    it('a draft pack tried on the vehicle names the builds with no pack at that place', async () => {
      const seed = await seedTwoBuggies(f);
      // The 2S buggy gets a second supply; the 4S one has only one.
      const spare = await f.call('batteries.create', { ...draftPack, name: 'Spare 4S' });
      await f.call('builds.update', { id: seed.onTwo.id, expectedVersion: seed.onTwo.version, changes: { supplies: [{ id: seed.onTwo.supplies[0]!.id, batteryIds: [seed.pack2s.id] }, { batteryIds: [spare.id] }] } });
      const rows = await dumpStore(f.db);
      const preview = await f.call('builds.preview', { draft: { kind: 'batteries', part: draftPack, buildId: seed.onTwo.id, scope: 'vehicle', packAt: { supply: 1, pack: 0 } } });
      expect(preview.after.map((a) => a.buildId)).toEqual([seed.onTwo.id]);
      expect(preview.skipped).toEqual([seed.onFour.id]);
      expect(await dumpStore(f.db)).toEqual(rows);
    });

    it('names the field of a draft that cannot be used, and takes only the fields the checks read', async () => {
      const seed = await seedTwoBuggies(f);
      const rows = await dumpStore(f.db);
      const { kv: _kv, ...noKv } = draftMotor;
      expect((await f.refuse('builds.preview', { draft: { kind: 'motors', part: noKv, buildId: seed.onTwo.id } })).field).toBe('draft.part.kv');
      expect((await f.refuse('builds.preview', { draft: { kind: 'motors', part: { ...draftMotor, notes: 'x' }, buildId: seed.onTwo.id } })).field).toBe('draft.part.notes');
      expect((await f.refuse('builds.preview', { draft: { kind: 'batteries', part: draftPack, buildId: seed.onTwo.id, packAt: { supply: 0, pack: 1 } } })).field).toBe('draft.packAt');
      // A vehicle is not a part one tries in a build.
      expect((await f.refuse('builds.preview', { draft: { kind: 'vehicles', part: {}, buildId: seed.onTwo.id } })).kind).toBe('invalid');
      expect((await f.refuse('builds.preview', { draft: { kind: 'motors', part: draftMotor, buildId: 'nope' } })).kind).toBe('not-found');
      expect(await dumpStore(f.db)).toEqual(rows);
    });
  });
});
