import { unit } from 'mathjs';
import { afterEach, describe, expect, it } from 'vitest';
import { draftFieldKeys } from '../../src-main/core/catalogue/draft-fields';
import { DraftPart, draftDefs } from '../../src-renderer/lib/state/draft-part.svelte';
import { SwapPreviewState } from '../../src-renderer/lib/state/swap-preview.svelte';
import { seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { clientOnService } from './service-client';

let fixture: ServiceFixture | null = null;
afterEach(async () => {
  await fixture?.close();
  fixture = null;
});

describe('a draft part on the page', () => {
  it('asks for the fields the core names, in the form’s order', () => {
    for (const kind of ['batteries', 'motors', 'controllers', 'propellers'] as const) {
      expect(
        draftDefs(kind)
          .map((d) => d.key)
          .sort(),
      ).toEqual([...draftFieldKeys(kind)].sort());
    }
  });

  it('reads what was typed in the user’s units into stored units, as mathjs converts them', () => {
    const draft = new DraftPart(() => 'imperial');
    draft.setKind('propellers');
    Object.assign(draft.values, { name: 'Draft 5 × 4.5', diameterMm: '5', pitchMm: '4.5', thrustCoefficient: '0.11', powerCoefficient: '0.05' });
    expect(draft.check()).toBeNull();
    const record = draft.record();
    // Reference: mathjs (inch = 25.4 mm exactly, NIST SP 811).
    expect(record['diameterMm']).toBeCloseTo(unit(5, 'inch').toNumber('mm'), 9);
    expect(record['pitchMm']).toBeCloseTo(unit(4.5, 'inch').toNumber('mm'), 9);
    expect(Object.keys(record).sort()).toEqual([...draftFieldKeys('propellers')].sort());
  });

  it('names each field that cannot be used, before anything is sent', () => {
    const draft = new DraftPart(() => 'metric');
    draft.setKind('motors');
    Object.assign(draft.values, { name: 'Draft', kv: 'fast', resistanceOhm: '6' });
    expect(draft.check()).not.toBeNull();
    expect(Object.keys(draft.errors)).toEqual(['kv']);
  });
});

describe('the swap screen with a draft part, on the real handler map', () => {
  it('previews without a write, adds the part only when asked, then offers it as a replacement', async () => {
    const { f, client } = await clientOnService();
    fixture = f;
    const seed = await seedTwoBuggies(f);
    const swap = new SwapPreviewState(client, seed.onTwo.id, 'metric');
    await swap.load();
    swap.mode = 'draft';
    swap.draft.setKind('motors');
    Object.assign(swap.draft.values, { name: 'Draft 2400', kv: '2400', resistanceOhm: '20', noLoadCurrentA: '2', maxCurrentA: '90', maxPowerW: '1200', maxVoltageV: '17.4', maxRpm: '50000' });
    await swap.preview();
    expect(swap.error).toBeNull();
    const after = swap.result?.after.find((a) => a.buildId === seed.onTwo.id);
    // No-load speed = Kv × nominal voltage: 2400 rpm/V × 7.4 V (2 × 3.70 V, cell makers' sheets) = 17 760 rpm.
    expect(after?.supplies[0]?.figures.noLoadRpm).toBeCloseTo(17_760, 0);
    expect((await f.call('motors.list', {})).map((m) => m.name)).toEqual(['Test 3300']);

    expect(await swap.addDraftToInventory()).toBe(true);
    const motors = await f.call('motors.list', {});
    const added = motors.find((m) => m.name === 'Draft 2400');
    // 20 mΩ typed, 0.02 Ω stored.
    expect(added?.resistanceOhm).toBeCloseTo(0.02, 12);
    expect((await f.call('builds.get', { id: seed.onTwo.id })).build.motorId).toBe(seed.motor.id);

    swap.fitAdded();
    expect(swap.mode).toBe('part');
    expect(swap.slot).toBe('motorId');
    expect(swap.replacementId).toBe(added?.id);
  });
});
