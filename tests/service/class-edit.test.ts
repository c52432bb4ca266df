import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { generateFleet } from '../../demo-fixtures/generate-fleet';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

// Full charge of a LiPo cell: 4.20 V (common practice; cell makers' specification sheets).
const LIPO_FULL_V = 4.2;
const CLASS = 'Club stock';

let f: ServiceFixture;
forEachEngine((engine) => {
  beforeEach(async () => {
    f = await serviceFixture(engine);
  });
  afterEach(async () => f.close());

  async function verdictRows() {
    const rows = await f.db.selectFrom('verdicts').select(['buildId', 'status', 'evaluatedAt']).execute();
    return new Map(rows.map((r) => [r.buildId, r]));
  }

  describe('a class edited in the window', () => {
    it('re-checks all 1 000 builds of the class in one write, and the history names the class and every changed verdict', { timeout: 240_000 }, async () => {
      // 1 000 builds, every vehicle in the class; one more vehicle outside it with a build of its own.
      const fleet = generateFleet({ builds: 1000, seed: 16 });
      for (const v of fleet.vehicles) v.className = CLASS;
      const template = fleet.builds[0]!;
      fleet.vehicles.push({ ...fleet.vehicles[0]!, id: 'veh-open', name: 'Open-class truck', className: 'Open' });
      fleet.builds.push({ ...template, id: 'build-open', name: 'Open-class build', vehicleId: 'veh-open', supplies: template.supplies.map((s, i) => ({ ...s, id: `build-open.s${i + 1}` })) });
      const imported = await f.call('fleet.import', { fleet, mode: 'replace' });
      expect(imported.ok).toBe(true);
      // The file names its classes only on the vehicles: each got its record.
      expect(imported.counts.classes.added).toBe(2);

      const classes = await f.call('classes.list', {});
      const club = classes.find((c) => c.name === CLASS)!;
      expect(club.buildCount).toBe(1000);
      const before = await verdictRows();

      // A 2S class: full-charge supply voltage at most 2 × 4.20 V.
      const saved = await f.call('classes.save', {
        id: club.id,
        expectedVersion: club.version,
        name: CLASS,
        notes: 'Club rules, 2S only',
        limits: [{ figure: 'packVoltageFullV', limit: 2 * LIPO_FULL_V }],
        reason: 'club rules for the season',
      });
      expect(saved.rechecked).toBe(1000);
      expect(saved.record.limits).toHaveLength(1);
      expect(saved.record.limits[0]).toMatchObject({ className: CLASS, figure: 'packVoltageFullV', limit: 8.4, unit: 'V', ruleId: 'class-pack-voltage-full-v' });

      // Which builds have a supply above 2S, worked out from the file's packs, not the engine.
      const packCells = new Map(fleet.batteries.map((p) => [p.id, p.cellsSeries]));
      const aboveTwoS = new Set(
        fleet.builds
          .filter((b) => b.vehicleId !== 'veh-open')
          .filter((b) => b.supplies.some((s) => (s.arrangement === 'series' ? s.batteryIds.reduce((n, id) => n + packCells.get(id)!, 0) : Math.max(...s.batteryIds.map((id) => packCells.get(id)!))) * LIPO_FULL_V > 2 * LIPO_FULL_V + 1e-9))
          .map((b) => b.id),
      );
      expect(aboveTwoS.size).toBeGreaterThan(100);
      const after = await verdictRows();
      for (const id of aboveTwoS) expect(after.get(id)?.status, id).toBe('over');
      expect(after.get('build-open')).toEqual(before.get('build-open'));

      const [entry] = await f.call('history.list', { entityKind: 'classes', entityId: club.id });
      expect(entry?.summary).toContain(`Changed class "${CLASS}"`);
      expect(entry?.summary).toContain('added limit Full-charge voltage at most 8.4 V');
      expect(entry?.reason).toBe('club rules for the season');
      // Every build whose verdict moved is in the entry, and nothing else.
      const moved = [...after].filter(([id, row]) => before.get(id)?.status !== row.status).map(([id]) => id);
      const listed = entry!.verdictChanges.filter((c) => c.supplyId === null).map((c) => c.buildId);
      expect(new Set(listed)).toEqual(new Set(moved));
      expect(moved.length).toBeGreaterThan(0);
      // One write: the verdicts it changed carry the entry's own time.
      for (const id of moved) expect(after.get(id)?.evaluatedAt).toBe(entry!.at);
      // The class is the selector, one row, not 1 000 links.
      const selectors = await f.db.selectFrom('historySelectors').selectAll().where('historyId', '=', entry!.id).execute();
      expect(selectors).toEqual([{ historyId: entry!.id, selects: 'class', partKind: '', target: CLASS }]);
      const unchangedBuild = fleet.builds.find((b) => b.vehicleId !== 'veh-open' && !moved.includes(b.id))!;
      const timeline = await f.call('history.list', { buildId: unchangedBuild.id });
      expect(timeline.map((e) => e.id)).toContain(entry!.id);
      const openTimeline = await f.call('history.list', { buildId: 'build-open' });
      expect(openTimeline.map((e) => e.id)).not.toContain(entry!.id);
    });

    it('a rename takes the vehicles and limits along; a stale version or a taken name changes nothing', async () => {
      const seed = await seedTwoBuggies(f);
      await f.call('vehicles.update', { id: seed.vehicle.id, expectedVersion: 1, changes: { className: 'Stock buggy' } });
      const [stock] = await f.call('classes.list', {});
      expect(stock?.name).toBe('Stock buggy');
      // 2S LiPo full charge 8.40 V passes a 9 V limit; 4S (16.8 V) does not.
      const first = await f.call('classes.save', { id: stock!.id, expectedVersion: 1, name: 'Stock buggy', limits: [{ figure: 'packVoltageFullV', limit: 9 }] });
      expect(first.rechecked).toBe(2);
      expect((await f.call('builds.get', { id: seed.onFour.id })).verdict?.status).toBe('over');

      const stale = await f.refuse('classes.save', { id: stock!.id, expectedVersion: 1, name: 'Renamed', limits: [] });
      expect(stale.kind).toBe('conflict');
      await f.call('classes.save', { name: 'Modified', limits: [] });
      const taken = await f.refuse('classes.save', { id: stock!.id, expectedVersion: 2, name: 'Modified', limits: [] });
      expect(taken).toMatchObject({ kind: 'conflict', field: 'name' });
      const twice = await f.refuse('classes.save', {
        id: stock!.id,
        expectedVersion: 2,
        name: 'Stock buggy',
        limits: [
          { figure: 'packVoltageFullV', limit: 9 },
          { figure: 'packVoltageFullV', limit: 10 },
        ],
      });
      expect(twice).toMatchObject({ kind: 'invalid', field: 'limits[1].figure' });
      const freeText = await f.refuse('classes.save', { id: stock!.id, expectedVersion: 2, name: 'Stock buggy', limits: [{ figure: 'volts', limit: 9 }] });
      expect(freeText.kind).toBe('invalid');
      expect(freeText.message).toContain('limits');
      expect((await f.call('vehicles.get', { id: seed.vehicle.id })).className).toBe('Stock buggy');

      const limitId = first.record.limits[0]!.id;
      const renamed = await f.call('classes.save', { id: stock!.id, expectedVersion: 2, name: 'Club buggy', limits: [{ id: limitId, figure: 'packVoltageFullV', limit: 18 }] });
      expect(renamed.record.limits.map((l) => [l.id, l.className, l.limit])).toEqual([[limitId, 'Club buggy', 18]]);
      expect((await f.call('vehicles.get', { id: seed.vehicle.id })).className).toBe('Club buggy');
      expect((await f.call('builds.get', { id: seed.onFour.id })).verdict?.status).not.toBe('over');
      const [entry] = await f.call('history.list', { entityKind: 'classes', entityId: stock!.id });
      expect(entry?.summary).toContain('renamed from "Stock buggy"');
      expect(entry?.summary).toContain('limit Full-charge voltage at most 9 V → 18 V');

      // A limit the editor leaves out is archived: it no longer applies, and history keeps it.
      const cleared = await f.call('classes.save', { id: stock!.id, expectedVersion: 3, name: 'Club buggy', limits: [] });
      expect(cleared.record.limits).toEqual([]);
      const archived = await f.call('classRules.get', { id: limitId });
      expect(archived.archivedAt).not.toBeNull();
    });
  });
});
