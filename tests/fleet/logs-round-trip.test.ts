import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { fleetText } from '../../src-main/service/fleet/export-fleet';
import { seedTwoBuggies, serviceFixture, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

const CSV = ['Time (s),Current (A),Voltage (V)', '0,10,8.3', '0.5,60,7.9', '1,30,8.1', '1.5,20,8.2'].join('\n');

let f: ServiceFixture;
let other: ServiceFixture;
forEachEngine((engine) => {
  beforeEach(async () => {
    f = await serviceFixture(engine);
    other = await serviceFixture(engine);
  });
  afterEach(async () => {
    await f.close();
    await other.close();
  });

  /** A store with two buggies, a pack log and a run log. */
  async function seeded() {
    const seed = await seedTwoBuggies(f);
    await f.call('packLog.add', { batteryId: seed.pack2s.id, at: '2026-11-01', kind: 'resistance', cellResistancesOhm: [0.004, 0.005], temperatureC: 21 });
    await f.call('packLog.add', { batteryId: seed.pack2s.id, at: '2026-11-02', kind: 'inspection', puffed: true, note: 'slight swelling' });
    const log = await f.call('runLogs.import', { buildId: seed.onTwo.id, name: 'Heat 1', recordedAt: '2026-11-02', text: CSV });
    return { ...seed, log };
  }

  describe('fleet file version 2: pack log and run logs', () => {
    it('exports both sections, and a second store reads them back to the same file, sag and health included', async () => {
      const { onTwo, log } = await seeded();
      const first = await f.call('fleet.export', {});
      expect(first.version).toBe(2);
      expect(first.$schema).toBe('urn:rigbook:schema:rigbook-fleet:2');
      expect(first.packEvents).toHaveLength(2);
      expect(first.runLogs).toHaveLength(1);
      expect(first.runLogs![0]).toMatchObject({ id: log.id, buildId: onTwo.id, peakCurrentA: 60, sampleCount: 4 });
      expect(first.runLogs![0]!.samples.currentA).toEqual([10, 60, 30, 20]);

      const report = await other.call('fleet.import', { text: fleetText(first), mode: 'replace' });
      expect(report.ok).toBe(true);
      expect(fleetText(await other.call('fleet.export', {}))).toBe(fleetText(first));
      const sheet = await other.call('builds.get', { id: onTwo.id });
      // The logged 4 + 5 mΩ (series readings add), and the puffed inspection, reach the imported store's verdict.
      expect(sheet.verdict.supplies[0]!.figures.packResistanceOhm).toBeCloseTo(0.009, 12);
      expect(sheet.verdict.supplies[0]!.findings.find((x) => x.rule === 'pack-health')?.status).toBe('over');
      expect(await other.call('runLogs.list', { buildId: onTwo.id })).toHaveLength(1);
    });

    it('still imports a version 1 file, which has no logs', async () => {
      await seeded();
      const file = await f.call('fleet.export', {});
      const { packEvents: _p, runLogs: _r, ...rest } = file;
      const v1 = { ...rest, version: 1, $schema: 'urn:rigbook:schema:rigbook-fleet:1' };
      const report = await other.call('fleet.import', { fleet: v1, mode: 'replace' });
      expect(report.problems).toEqual([]);
      expect(report.ok).toBe(true);
      expect((await other.call('fleet.export', {})).packEvents).toEqual([]);
    });

    it('refuses log entries that point nowhere, naming the place, and writes nothing', async () => {
      await seeded();
      const file = await f.call('fleet.export', {});
      file.packEvents![0]!.batteryId = 'pack-nowhere';
      file.runLogs![0]!.supplyId = 'supply-nowhere';
      const report = await other.call('fleet.import', { fleet: file, mode: 'replace' });
      expect(report.ok).toBe(false);
      expect(report.problems).toEqual(expect.arrayContaining([{ place: 'packEvents[0].batteryId', message: 'no pack with id "pack-nowhere" in this file' }, expect.objectContaining({ place: 'runLogs[0].supplyId' })]));
      expect(await other.call('batteries.list', {})).toEqual([]);
    });
  });
});
