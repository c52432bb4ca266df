import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { fleetText } from '../../src-main/service/fleet/export-fleet';
import type { FleetFile } from '../../src-main/service/fleet/fleet-format';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

const fixtures: ServiceFixture[] = [];
forEachEngine((engine) => {
  let f: ServiceFixture;
  beforeEach(async () => {
    f = await serviceFixture(engine);
    fixtures.push(f);
  });
  afterEach(async () => {
    for (const x of fixtures.splice(0)) await x.close();
  });

  describe('classes in fleet files', () => {
    it('an export carries each class with its notes, and a store fed the file has the same classes and limits', async () => {
      const seed = await seedTwoBuggies(f);
      await f.call('vehicles.update', { id: seed.vehicle.id, expectedVersion: 1, changes: { className: 'Club buggy' } });
      const [club] = await f.call('classes.list', {});
      await f.call('classes.save', { id: club!.id, expectedVersion: 1, name: 'Club buggy', notes: 'Season rules, sheet 3', limits: [{ figure: 'packVoltageFullV', limit: 8.4 }] });
      const file = await f.call('fleet.export', {});
      expect(file.classes).toEqual([{ id: club!.id, name: 'Club buggy', notes: 'Season rules, sheet 3', version: 2, archivedAt: null }]);
      expect(file.classRules.map((r) => [r.className, r.figure, r.limit])).toEqual([['Club buggy', 'packVoltageFullV', 8.4]]);

      const other = await serviceFixture(engine);
      fixtures.push(other);
      const report = await other.call('fleet.import', { text: fleetText(file), mode: 'merge' });
      expect(report.ok).toBe(true);
      expect(report.counts.classes).toEqual({ added: 1, updated: 0, unchanged: 0 });
      const [copied] = await other.call('classes.list', {});
      expect(copied).toMatchObject({ id: club!.id, name: 'Club buggy', notes: 'Season rules, sheet 3', vehicleCount: 1, buildCount: 2 });
      expect(copied?.limits.map((l) => l.limit)).toEqual([8.4]);
      // The 4S build is over the class's 8.4 V in the copy as in the original.
      expect((await other.call('builds.get', { id: seed.onFour.id })).verdict?.status).toBe('over');
    });

    it('a file from before classes were records (limits and vehicles only) still imports, and its classes get records', async () => {
      const seed = await seedTwoBuggies(f);
      const old = (await f.call('fleet.export', {})) as Partial<FleetFile>;
      delete old.classes;
      old.vehicles = old.vehicles!.map((v) => ({ ...v, className: 'Stock' }));
      old.classRules = [{ id: 'rule-old', className: 'Stock', ruleId: 'class-volts', figure: 'packVoltageFullV', limit: 9, unit: 'V', version: 1, archivedAt: null, notes: '' }];
      const other = await serviceFixture(engine);
      fixtures.push(other);
      const report = await other.call('fleet.import', { fleet: old, mode: 'merge' });
      expect(report.ok).toBe(true);
      expect(report.counts.classes.added).toBe(1);
      const classes = await other.call('classes.list', {});
      expect(classes.map((c) => [c.name, c.limits.map((l) => l.id)])).toEqual([['Stock', ['rule-old']]]);
      expect((await other.call('builds.get', { id: seed.onFour.id })).verdict?.status).toBe('over');
    });

    it('a file whose class takes a name another stored class holds is refused whole, naming the place', async () => {
      await f.call('classes.save', { name: 'Modified', limits: [] });
      const report = await f.call('fleet.import', {
        fleet: { format: 'rigbook-fleet', version: 1, classes: [{ id: 'cls-other', name: 'Modified', notes: '' }] },
        mode: 'merge',
      });
      expect(report.ok).toBe(false);
      expect(report.problems).toEqual([{ place: 'classes[0].name', message: expect.stringContaining('"Modified" is already the name of class') as string }]);
      expect((await f.call('classes.list', {})).map((c) => c.id)).not.toContain('cls-other');
    });
  });
});
