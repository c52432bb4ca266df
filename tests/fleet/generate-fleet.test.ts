import { afterEach, describe, expect, it } from 'vitest';
import { generateFleet, HOT_MOTOR_ID, HOT_PACK_ID } from '../../demo-fixtures/generate-fleet';
import { inspectFleet } from '../../src-main/service/fleet/inspect-fleet';
import { evaluateFleet } from '../../src-main/service/fleet/evaluate-fleet';
import { fleetText } from '../../src-main/service/fleet/export-fleet';
import { serviceFixture, type ServiceFixture } from '../helpers/service-fixture';

const open: ServiceFixture[] = [];
afterEach(async () => {
  for (const f of open.splice(0)) await f.close();
});

describe('large-fleet generator', () => {
  it('is deterministic from the seed, and another seed gives another fleet', () => {
    const a = JSON.stringify(generateFleet({ builds: 200, seed: 42 }));
    expect(JSON.stringify(generateFleet({ builds: 200, seed: 42 }))).toBe(a);
    expect(JSON.stringify(generateFleet({ builds: 200, seed: 43 }))).not.toBe(a);
  });

  it('shares one hot motor with every build and one hot pack with half of them', () => {
    const fleet = generateFleet({ builds: 1000, packs: 50, motors: 5, seed: 1 });
    expect(fleet.builds).toHaveLength(1000);
    expect(fleet.batteries).toHaveLength(50);
    expect(fleet.motors).toHaveLength(6);
    expect(fleet.builds.every((b) => b.motorId === HOT_MOTOR_ID)).toBe(true);
    const withHotPack = fleet.builds.filter((b) => b.supplies.some((s) => s.batteryIds.includes(HOT_PACK_ID))).length;
    expect(withHotPack).toBeGreaterThanOrEqual(500);
    expect(withHotPack).toBeLessThan(700);
    expect(new Set(fleet.vehicles.map((v) => v.kind)).size).toBe(5);
  });

  it('gives a mix of verdicts, mostly clear, like a real fleet', () => {
    const verdicts = evaluateFleet(generateFleet({ builds: 1000, seed: 2 }));
    const share = (s: string) => verdicts.filter((v) => v.status === s).length / verdicts.length;
    expect(share('clear')).toBeGreaterThan(0.5);
    for (const s of ['over', 'tight', 'incomplete']) expect(share(s), s).toBeGreaterThan(0.01);
  });

  it('passes the same checks as any file, and imports with stable ids', async () => {
    const fleet = generateFleet({ builds: 400, seed: 5 });
    const inspection = inspectFleet(structuredClone(fleet));
    expect(inspection.ok).toBe(true);
    const f = await serviceFixture();
    open.push(f);
    const report = await f.call('fleet.import', { text: fleetText(fleet), mode: 'replace' });
    expect(report.ok).toBe(true);
    expect(report.rechecked).toBe(400);
    const back = await f.call('fleet.export', {});
    expect(new Set(back.builds.map((b) => b.id))).toEqual(new Set(fleet.builds.map((b) => b.id)));
    // Editing the hot pack re-checks every build that uses it, through the index.
    const edit = await f.call('batteries.update', { id: HOT_PACK_ID, expectedVersion: 1, changes: { cycleCount: 1 } });
    expect(edit.rechecked).toBe(fleet.builds.filter((b) => b.supplies.some((s) => s.batteryIds.includes(HOT_PACK_ID))).length);
  });
});
