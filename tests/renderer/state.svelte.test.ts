import { afterEach, describe, expect, it } from 'vitest';
import { BuildsListState } from '../../src-renderer/lib/state/builds-list.svelte';
import { PartFormState } from '../../src-renderer/lib/state/part-form.svelte';
import { SwapPreviewState } from '../../src-renderer/lib/state/swap-preview.svelte';
import { BuildFormState } from '../../src-renderer/lib/state/build-form.svelte';
import { seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { clientOnService, settle } from './service-client';

let fixture: ServiceFixture | null = null;
afterEach(async () => {
  await fixture?.close();
  fixture = null;
});

/** Two buggies on a real service, listed by a list state that follows the service's events. */
async function twoBuggiesListed() {
  const { f, client } = await clientOnService();
  fixture = f;
  const seed = await seedTwoBuggies(f);
  const list = new BuildsListState(client);
  const stop = list.follow();
  await list.load();
  return { f, seed, list, stop };
}

describe('builds list state', () => {
  it('filters and sorts the loaded summaries, and follows a re-check made by another client', async () => {
    const { f, seed, list, stop } = await twoBuggiesListed();
    expect(list.all.map((b) => b.name).sort()).toEqual(['Buggy on 2S', 'Buggy on 4S']);
    list.text = '4s';
    expect(list.visible.map((b) => b.name)).toEqual(['Buggy on 4S']);
    list.text = '';
    list.sortBy('name');
    list.sortBy('name');
    expect(list.visible.map((b) => b.name)).toEqual(['Buggy on 4S', 'Buggy on 2S']);

    const before = list.all.find((b) => b.id === seed.onFour.id)!.status;
    expect(before).not.toBe('over');
    // Another client lowers the 4S pack's rating far below the draw.
    await f.call('batteries.update', { id: seed.pack4s.id, expectedVersion: seed.pack4s.version, changes: { cRatingContinuous: 1, cRatingBurst: 1 }, reason: '' });
    await settle();
    expect(list.all.find((b) => b.id === seed.onFour.id)!.status).toBe('over');
    expect(list.recentlyChanged.has(seed.onFour.id)).toBe(true);
    list.statuses = ['over'];
    expect(list.visible.map((b) => b.id)).toEqual([seed.onFour.id]);

    // 5 000 mAh at 1 C is 5 A continuous (capacity × C rating, common practice): the 4S buggy's pack check is over.
    list.statuses = ['clear'];
    list.chooseRule('battery-continuous');
    expect(list.statuses).toEqual([]);
    expect(list.query.rule).toBe('battery-continuous');
    expect(list.visible.map((b) => b.id)).toEqual([seed.onFour.id]);
    expect(list.counts.over).toBe(1);
    list.toggleStatus('tight');
    expect(list.visible).toEqual([]);
    list.toggleStatus('tight');
    list.toggleStatus('over');
    expect(list.visible.map((b) => b.id)).toEqual([seed.onFour.id]);
    // The same check judged on the 2S pack, untouched, raises nothing there.
    list.statuses = [];
    list.text = '2s';
    expect(list.visible).toEqual([]);
    list.clearFilters();
    expect(list.rule).toBe('');
    expect(list.visible).toHaveLength(2);
    stop();
  });
});

describe('builds list recent filters', () => {
  it('answers a filter typed again from its recent answer, never from one of another filter or of an older list', async () => {
    const { f, seed, list, stop } = await twoBuggiesListed();
    list.text = '4s';
    expect(list.visible.map((b) => b.id)).toEqual([seed.onFour.id]);
    // The search cleared and typed again.
    list.text = '';
    expect(list.visible).toHaveLength(2);
    list.text = '4s';
    expect(list.visible.map((b) => b.id)).toEqual([seed.onFour.id]);
    // The same text with a verdict chosen is another filter.
    expect(list.all.find((b) => b.id === seed.onFour.id)!.status).not.toBe('over');
    list.statuses = ['over'];
    expect(list.visible).toEqual([]);
    list.statuses = [];
    // Another client makes the 4S buggy over: the re-read list is filtered afresh.
    await f.call('batteries.update', { id: seed.pack4s.id, expectedVersion: seed.pack4s.version, changes: { cRatingContinuous: 1, cRatingBurst: 1 }, reason: '' });
    await settle();
    list.statuses = ['over'];
    expect(list.visible.map((b) => b.id)).toEqual([seed.onFour.id]);
    list.statuses = [];
    expect(list.visible[0]!.status).toBe('over');
    // Typing on from an answer found in the recent ones narrows it correctly.
    list.text = '4s buggy';
    expect(list.visible.map((b) => b.id)).toEqual([seed.onFour.id]);
    list.text = '4s buggyz';
    expect(list.visible).toEqual([]);
    stop();
  });
});

describe('part form state', () => {
  it('puts a refused value beside its field and keeps every typed value', async () => {
    const { f, client } = await clientOnService();
    fixture = f;
    const form = new PartFormState(client, 'batteries', null, 'metric');
    form.draft.name = 'Typo pack';
    form.draft.capacityMah = '-5';
    expect(await form.save()).toBeNull();
    expect(Object.keys(form.errors)).toEqual(['capacityMah']);
    expect(form.errors.capacityMah).toBe('must be greater than 0 mAh');
    expect(form.formError?.message).toBe('Capacity (mAh): must be greater than 0 mAh');
    expect(form.draft.name).toBe('Typo pack');
    expect(form.draft.capacityMah).toBe('-5');
    expect(await f.call('batteries.list', {})).toEqual([]);
  });

  it('reports a conflict, then saves the user edits on top of the newer version', async () => {
    const { f, client } = await clientOnService();
    fixture = f;
    const pack = await f.call('batteries.create', { name: 'P', chemistry: 'lipo', cellsSeries: 4, capacityMah: 5000 });
    const form = new PartFormState(client, 'batteries', pack.id, 'metric');
    await form.load();
    form.draft.cycleCount = '12';
    await f.call('batteries.update', { id: pack.id, expectedVersion: pack.version, changes: { name: 'P renamed' }, reason: '' });
    expect(await form.save()).toBeNull();
    expect(form.conflict).toBe(true);
    expect(form.draft.cycleCount).toBe('12');
    await form.rebase();
    expect(form.draft.name).toBe('P renamed');
    expect(form.draft.cycleCount).toBe('12');
    expect(await form.save()).not.toBeNull();
    const stored = await f.call('batteries.get', { id: pack.id });
    expect([stored.name, stored.cycleCount, stored.version]).toEqual(['P renamed', 12, 3]);
  });
});

describe('build form state', () => {
  it('creates a build from the form and names a refused gearing field by its path', async () => {
    const { f, client } = await clientOnService();
    fixture = f;
    const seed = await seedTwoBuggies(f);
    const form = new BuildFormState(client, null, 'metric');
    form.draft.name = 'Form buggy';
    form.draft.vehicleId = seed.vehicle.id;
    form.draft.motorId = seed.motor.id;
    form.draft['gearing.pinionTeeth'] = '2';
    form.supplies[0]!.batteryIds[0] = seed.pack2s.id;
    expect(await form.save()).toBeNull();
    expect(Object.keys(form.errors)).toEqual(['gearing.pinionTeeth']);
    expect(form.formError?.message).toBe('Pinion (teeth): must be 5 or more');
    form.draft['gearing.pinionTeeth'] = '17';
    const saved = await form.save();
    expect(saved?.record.gearing.pinionTeeth).toBe(17);
    expect(saved?.record.supplies[0]?.batteryIds).toEqual([seed.pack2s.id]);
    expect(saved?.verdict?.status).toBeDefined();
  });
});

describe('swap preview state', () => {
  it('previews a pack swap without writing, then saves it with the reason', async () => {
    const { f, client } = await clientOnService();
    fixture = f;
    const seed = await seedTwoBuggies(f);
    const swap = new SwapPreviewState(client, seed.onTwo.id, 'metric');
    await swap.load();
    swap.mode = 'part';
    swap.slot = 'pack:0:0';
    swap.replacementId = seed.pack4s.id;
    await swap.preview();
    const after = swap.result!.after.find((v) => v.buildId === seed.onTwo.id)!;
    // Two 4.2 V cells become four: full-charge voltage 8.4 V → 16.8 V (LiPo 4.20 V per cell, cell makers' sheets).
    expect(swap.result!.before.find((v) => v.buildId === seed.onTwo.id)!.supplies[0]!.figures.packVoltageFullV).toBeCloseTo(8.4, 9);
    expect(after.supplies[0]!.figures.packVoltageFullV).toBeCloseTo(16.8, 9);
    expect((await f.call('builds.get', { id: seed.onTwo.id })).build.version).toBe(seed.onTwo.version);

    swap.reason = 'more punch';
    expect(await swap.save()).toBe(true);
    const stored = await f.call('builds.get', { id: seed.onTwo.id });
    expect(stored.build.supplies[0]!.batteryIds).toEqual([seed.pack4s.id]);
    const history = await f.call('history.list', { buildId: seed.onTwo.id });
    expect(history[0]!.reason).toBe('more punch');
  });
});
