import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import type { Status } from '../../src-main/core/domain';
import type { FleetFile } from '../../src-main/service/fleet/fleet-format';
import { demoFleet } from '../../demo-fixtures/demo-fleet';
import { forEachEngine } from '../helpers/store-engines';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { tempDir } from '../helpers/temp-dir';

let f: ServiceFixture;
forEachEngine((engine) => {
  beforeEach(async () => {
    f = await serviceFixture(engine);
  });
  afterEach(async () => f.close());

  /** Each demo build's verdict and the rules that give it, with the story behind each. */
  const EXPECTED: Record<string, { status: Status; rules: string[] }> = {
    // Club gearing: every figure inside its rating.
    'demo-b-buggy2-24': { status: 'clear', rules: [] },
    'demo-b-buggy2-23-old': { status: 'clear', rules: [] },
    // A 30T pinion passes the club's 50 km/h theoretical-speed cap.
    'demo-b-buggy2-30': { status: 'over', rules: ['class-speed'] },
    'demo-b-buggy4': { status: 'clear', rules: [] },
    // High-grip tyres: launch current close to the 50 A motor rating.
    'demo-b-touring': { status: 'tight', rules: ['motor-current'] },
    'demo-b-drift': { status: 'clear', rules: [] },
    // A pinion too big for the motor: past its rated current, and shedding more heat than it is rated for.
    'demo-b-shortcourse-big': { status: 'over', rules: ['motor-current', 'motor-heat'] },
    'demo-b-shortcourse-ok': { status: 'clear', rules: [] },
    // A 6S pack on a controller rated for 4S.
    'demo-b-monster': { status: 'over', rules: ['controller-voltage'] },
    'demo-b-monster-8s': { status: 'clear', rules: [] },
    // The NiMH stick has no C rating entered.
    'demo-b-crawler': { status: 'incomplete', rules: ['battery-burst', 'battery-continuous'] },
    // Logged currents above what the old 20C pack and the motor are rated for.
    'demo-b-stadium': { status: 'over', rules: ['battery-burst', 'motor-current'] },
    // A LiHV and a LiPo pack in parallel.
    'demo-b-deepvee': { status: 'over', rules: ['supply-match'] },
    // In flight the five-inch props unload toward the motors' no-load speed: tips past 85 % of Mach.
    'demo-b-quad': { status: 'over', rules: ['prop-tip-speed'] },
    // Li-ion cells cannot give the current the trainer's motor draws.
    'demo-b-trainer': { status: 'over', rules: ['battery-continuous'] },
    'demo-b-rally': { status: 'clear', rules: [] },
  };

  describe('the demo fleet', () => {
    it('loads through the real service and shows every verdict, each for its real reason', async () => {
      const report = await f.call('demo.load', {});
      expect(report.ok).toBe(true);
      const fleet = demoFleet() as FleetFile;
      // About a dozen vehicles of every kind and about two dozen shared packs.
      expect(fleet.vehicles).toHaveLength(12);
      expect(new Set(fleet.vehicles.map((v) => v.kind))).toEqual(new Set(['car', 'truck', 'boat', 'multirotor', 'plane']));
      expect(fleet.batteries).toHaveLength(24);

      const list = await f.call('builds.list', { includeArchived: true });
      expect(new Set(list.map((b) => b.status))).toEqual(new Set(['over', 'tight', 'incomplete', 'clear']));
      expect(Object.fromEntries(list.map((b) => [b.id, b.status]))).toEqual(Object.fromEntries(Object.entries(EXPECTED).map(([id, e]) => [id, e.status])));

      for (const [id, expected] of Object.entries(EXPECTED)) {
        const sheet = await f.call('builds.get', { id });
        const worst = sheet.verdict!.supplies.flatMap((s) => s.findings).filter((x) => x.status === expected.status && expected.status !== 'clear');
        expect([...new Set(worst.map((x) => x.rule))].sort(), id).toEqual(expected.rules);
      }
    });

    it('the reasons hold in the figures', async () => {
      await f.call('demo.load', {});
      const monster = (await f.call('builds.get', { id: 'demo-b-monster' })).verdict!;
      for (const supply of monster.supplies) {
        const finding = supply.findings.find((x) => x.rule === 'controller-voltage')!;
        // 6 cells × 4.20 V (LiPo full charge, cell makers' specification sheets) against a
        // controller rated in cells: 4 × 4.2 V.
        expect(finding.value).toBeCloseTo(25.2, 9);
        expect(finding.limit).toBeCloseTo(16.8, 9);
      }
      // Both 6S supplies read over: the single 6S pack and two 3S packs in series.
      expect(monster.supplies.map((s) => s.status)).toEqual(['over', 'over']);

      const boat = (await f.call('builds.get', { id: 'demo-b-deepvee' })).verdict!;
      // The mixed pair is over; the matched pair the shop sold is only tight.
      expect(boat.supplies.map((s) => s.status)).toEqual(['over', 'tight']);
      const match = boat.supplies[0]!.findings.find((x) => x.rule === 'supply-match')!;
      // 3 × 4.35 V (LiHV, common practice) against 3 × 4.20 V.
      expect(match.value).toBeCloseTo(13.05, 9);
      expect(match.limit).toBeCloseTo(12.6, 9);

      const plane = (await f.call('builds.get', { id: 'demo-b-trainer' })).verdict!;
      expect(plane.supplies.map((s) => s.status)).toEqual(['clear', 'over']);
      // 3 C × 7000 mAh = 21 A continuous for the Li-ion pack.
      expect(plane.supplies[1]!.findings.find((x) => x.rule === 'battery-continuous')!.limit).toBeCloseTo(21, 9);

      const quad = (await f.call('builds.get', { id: 'demo-b-quad' })).verdict!;
      const tip = quad.supplies[0]!.findings.find((x) => x.rule === 'prop-tip-speed')!;
      // 0.85 (common practice) × 340.294 m/s, the speed of sound at 15 °C (ISO 2533 / ICAO Doc 7488).
      expect(tip.limit).toBeCloseTo(0.85 * 340.294, 9);
      // Judged at the unloaded rpm; the static figure alone stays under the limit.
      expect(quad.supplies[0]!.figures.tipSpeedStaticMps as number).toBeLessThan(tip.limit!);
      expect(tip.value as number).toBeGreaterThan(tip.limit!);
      // The rest of the quad is still only close to its ratings (at static full throttle the motors near their rated heat loss).
      expect(
        quad.supplies[0]!.findings.filter((x) => x.status === 'tight')
          .map((x) => x.rule)
          .sort(),
      ).toEqual(['battery-continuous', 'motor-current', 'motor-heat']);

      // The trainer's receiver and servos on its controller's 3 A BEC: 1.8 A leaves 40 %.
      const bec = plane.supplies[0]!.findings.find((x) => x.rule === 'bec-current')!;
      expect(bec).toMatchObject({ status: 'clear', value: 1.8, limit: 3 });
      expect(plane.supplies[0]!.figures.becLoadA).toBe(1.8);

      const crawler = (await f.call('builds.get', { id: 'demo-b-crawler' })).verdict!;
      // The crawler's brushed motor has no rated heat loss: 160 g × 0.15 W/g = 24 W by the rule of
      // thumb (common practice, from memory), which can read no better than tight.
      const heat = crawler.supplies[0]!.findings.find((x) => x.rule === 'motor-heat')!;
      expect(heat).toMatchObject({ status: 'tight', typical: ['motor.maxLossW'] });
      expect(heat.limit).toBeCloseTo(24, 9);
      expect(crawler.supplies[0]!.valuesUsed?.map((u) => u.field)).toEqual(['motor.maxLossW']);
      const missing = crawler.supplies[0]!.findings.filter((x) => x.status === 'incomplete').flatMap((x) => x.missing ?? []);
      expect(missing.sort()).toEqual(['battery.cRatingBurst', 'battery.cRatingContinuous']);

      const truck = (await f.call('builds.get', { id: 'demo-b-stadium' })).verdict!;
      expect(truck.supplies[0]!.findings.find((x) => x.rule === 'battery-burst')).toMatchObject({ source: 'measured', value: 96, limit: 88 });
    });

    it('packs are shared between builds', async () => {
      const fleet = demoFleet() as FleetFile;
      const uses = new Map<string, number>();
      for (const b of fleet.builds) for (const s of b.supplies) for (const id of s.batteryIds) uses.set(id, (uses.get(id) ?? 0) + 1);
      expect([...uses.values()].filter((n) => n > 1).length).toBeGreaterThanOrEqual(4);
    });

    it('refuses a store that already holds records, unless asked to merge', async () => {
      await seedTwoBuggies(f);
      const error = await f.refuse('demo.load', {});
      expect(error.kind).toBe('conflict');
      expect(error.message).toMatch(/already holds records \(2 packs, 1 motor, 1 speed controller, 1 vehicle, 2 builds\).*Nothing was loaded/);
      expect((await f.call('builds.list', {})).length).toBe(2);
      const merged = await f.call('demo.load', { merge: true });
      expect(merged.ok).toBe(true);
      expect((await f.call('builds.list', { includeArchived: true })).length).toBe(2 + Object.keys(EXPECTED).length);
    });
  });

  it('comes from the shell: a host opened without a demo fleet refuses and writes nothing', async () => {
    const temp = tempDir();
    const host = await openServiceHost({ dbPath: temp.file('store.sqlite'), actor: 'tester' });
    try {
      const result = await host.call('demo.load', {});
      expect(result).toMatchObject({ ok: false, error: { kind: 'not-found' } });
      expect(await host.call('builds.list', {})).toEqual({ ok: true, value: [] });
    } finally {
      await host.close();
      temp.remove();
    }
  });
});
