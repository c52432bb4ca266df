import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { fleetText } from '../../src-main/service/fleet/export-fleet';
import type { FleetFile } from '../../src-main/service/fleet/fleet-format';
import { demoFleet } from '../../demo-fixtures/demo-fleet';
import { dumpStore } from './store-dump';
import { forEachEngine } from '../helpers/store-engines';

const fixtures: ServiceFixture[] = [];
forEachEngine((engine) => {
  async function fresh(): Promise<ServiceFixture> {
    const f = await serviceFixture(engine);
    fixtures.push(f);
    return f;
  }
  let f: ServiceFixture;
  beforeEach(async () => {
    f = await fresh();
  });
  afterEach(async () => {
    for (const x of fixtures.splice(0)) await x.close();
  });

  async function exportText(x: ServiceFixture): Promise<string> {
    return fleetText(await x.call('fleet.export', {}));
  }

  describe('rigbook-fleet export and import', () => {
    it('export, import into an empty store, export again: the same bytes, the same ids', async () => {
      await f.call('demo.load', {});
      const seed = await seedTwoBuggies(f);
      // A record edited twice and one archived: versions and archivedAt must survive the trip.
      await f.call('batteries.update', { id: seed.pack2s.id, expectedVersion: 1, changes: { cycleCount: 5 } });
      await f.call('batteries.update', { id: seed.pack2s.id, expectedVersion: 2, changes: { notes: '=SUM(A1) is text here' } });
      await f.call('motors.archive', { id: seed.motor.id, expectedVersion: 1, reason: 'worn bearings' });
      const first = await exportText(f);

      const other = await fresh();
      const report = await other.call('fleet.import', { text: first, mode: 'merge' });
      expect(report.ok).toBe(true);
      const second = await exportText(other);
      expect(second).toBe(first);

      const parsed = JSON.parse(second) as FleetFile;
      expect(parsed.batteries.find((b) => b.id === seed.pack2s.id)).toMatchObject({ version: 3, cycleCount: 5 });
      expect(parsed.motors.find((m) => m.id === seed.motor.id)?.archivedAt).not.toBeNull();
      // Supply ids are kept too, not regenerated.
      expect(parsed.builds.find((b) => b.id === seed.onTwo.id)?.supplies[0]?.id).toBe(seed.onTwo.supplies[0]!.id);
    });

    it('writes the documented envelope, every kind as a list, records with units in their names', async () => {
      await seedTwoBuggies(f);
      const fleet = await f.call('fleet.export', {});
      expect(Object.keys(fleet)).toEqual(['$schema', 'format', 'version', 'batteries', 'motors', 'controllers', 'propellers', 'customers', 'vehicles', 'classes', 'classRules', 'builds', 'packEvents', 'runLogs', 'workOrders']);
      expect(fleet).toMatchObject({ format: 'rigbook-fleet', version: 2 });
      expect(Object.keys(fleet.batteries[0]!)).toEqual(expect.arrayContaining(['id', 'capacityMah', 'cellResistanceOhm', 'massKg', 'version', 'archivedAt']));
      expect(Object.keys(fleet.builds[0]!.gearing)).toEqual(['pinionTeeth', 'spurTeeth', 'internalRatio', 'tireDiameterMm', 'drivetrainEfficiency']);
      // Bookkeeping of the store itself stays out of the file.
      expect(fleet.batteries[0]).not.toHaveProperty('createdAt');
    });

    it('merge: stored records are updated with their version bumped, identical ones left alone, nothing removed', async () => {
      const seed = await seedTwoBuggies(f);
      const file = await f.call('fleet.export', {});
      const extra = await f.call('batteries.create', { name: 'Kept aside', chemistry: 'lipo', cellsSeries: 3, capacityMah: 2200 });
      const pack = file.batteries.find((b) => b.id === seed.pack2s.id)!;
      pack.cRatingContinuous = 1;
      pack.cRatingBurst = 2;
      pack.version = 99;

      const report = await f.call('fleet.import', { fleet: file, mode: 'merge', reason: 'label re-read' });
      expect(report.ok).toBe(true);
      expect(report.counts.batteries).toEqual({ added: 0, updated: 1, unchanged: 1 });
      expect(report.counts.builds).toEqual({ added: 0, updated: 0, unchanged: 2 });
      // The file's version is not trusted for a stored record: the stored one goes up by one.
      expect((await f.call('batteries.get', { id: seed.pack2s.id })).version).toBe(2);
      expect((await f.call('batteries.get', { id: seed.pack4s.id })).version).toBe(1);
      expect((await f.call('batteries.get', { id: extra.id })).name).toBe('Kept aside');
      // The pack at 1C cannot feed the buggy: its build is re-checked inside the import.
      expect((await f.call('builds.get', { id: seed.onTwo.id })).verdict?.status).toBe('over');
      expect(report.verdictChanges).toContainEqual(expect.objectContaining({ buildId: seed.onTwo.id, to: 'over' }));

      const history = await f.call('history.list', { entityKind: 'fleet' });
      expect(history).toHaveLength(1);
      expect(history[0]).toMatchObject({ action: 'import', reason: 'label re-read' });
      expect(history[0]!.summary).toContain('updated 1 pack');
      const timeline = await f.call('history.list', { buildId: seed.onTwo.id });
      expect(timeline[0]?.entityKind).toBe('fleet');
      expect(f.events).toContainEqual({ type: 'records-changed', kind: 'batteries', ids: [seed.pack2s.id] });
    });

    it('replace: empties the store first, keeps history, and writes the file with its versions', async () => {
      await seedTwoBuggies(f);
      const historyBefore = (await f.call('history.list', {})).length;
      const demo = demoFleet() as FleetFile;
      const report = await f.call('fleet.import', { fleet: demo, mode: 'replace' });
      expect(report.ok).toBe(true);
      expect(report.removed).toMatchObject({ batteries: 2, motors: 1, builds: 2 });
      expect((await f.call('builds.list', { includeArchived: true })).length).toBe(demo.builds.length);
      expect(await f.call('batteries.list', { includeArchived: true })).toHaveLength(demo.batteries.length);
      expect((await f.call('history.list', { limit: 1000 })).length).toBe(historyBefore + 1);
    });

    it('a dry run reports what would happen and writes nothing', async () => {
      await seedTwoBuggies(f);
      const before = await dumpStore(f.db);
      const report = await f.call('fleet.import', { fleet: demoFleet(), mode: 'replace', dryRun: true });
      expect(report).toMatchObject({ ok: true, dryRun: true, historyId: null });
      expect(report.counts.builds.added).toBeGreaterThan(10);
      expect(report.statuses.over).toBeGreaterThan(0);
      expect(await dumpStore(f.db)).toEqual(before);
    });

    it('reports progress as service events, ending at the total', async () => {
      await f.call('fleet.import', { fleet: demoFleet(), mode: 'merge' });
      const progress = f.events.filter((e) => e.type === 'progress');
      const writes = progress.filter((e) => e.type === 'progress' && e.task === 'write');
      expect(writes.at(-1)).toMatchObject({ kind: 'fleet', task: 'write' });
      const last = writes.at(-1) as { done: number; total: number };
      expect(last.done).toBe(last.total);
      expect(last.total).toBeGreaterThan(50);
    });

    it('moves a supply id from one build to another when both are in the file', async () => {
      const seed = await seedTwoBuggies(f);
      const file = await f.call('fleet.export', {});
      const a = file.builds.find((b) => b.id === seed.onTwo.id)!;
      const b = file.builds.find((x) => x.id === seed.onFour.id)!;
      const moved = a.supplies[0]!.id;
      b.supplies = [{ id: moved, arrangement: 'series', batteryIds: [seed.pack4s.id] }];
      a.supplies = [{ id: 'fresh-supply', arrangement: 'series', batteryIds: [seed.pack2s.id] }];
      const report = await f.call('fleet.import', { fleet: file, mode: 'merge' });
      expect(report.ok).toBe(true);
      expect((await f.call('builds.get', { id: seed.onFour.id })).build.supplies.map((s) => s.id)).toEqual([moved]);
      expect((await f.call('builds.get', { id: seed.onTwo.id })).build.supplies.map((s) => s.id)).toEqual(['fresh-supply']);
    });
  });
});
