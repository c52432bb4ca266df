import { afterEach, describe, expect, it } from 'vitest';
import { ApiCallError } from '../../src-renderer/lib/api/client';
import { partApi, partOps } from '../../src-renderer/lib/parts/part-api';
import { BuildFormState } from '../../src-renderer/lib/state/build-form.svelte';
import { Loader } from '../../src-renderer/lib/state/loader.svelte';
import { PartFormState } from '../../src-renderer/lib/state/part-form.svelte';
import { BuildSheetState } from '../../src-renderer/lib/state/build-sheet.svelte';
import { seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { clientOnService, settle } from './service-client';

// Every test runs the renderer's own classes against the real handler map on a temporary
// SQLite file; only the wire between them is skipped (see service-client.ts).

let fixture: ServiceFixture | null = null;
afterEach(async () => {
  await fixture?.close();
  fixture = null;
});

describe('form lifecycle', () => {
  it('after a conflict, rebasing keeps the fields the user typed and takes the other writer’s everywhere else', async () => {
    const { f, client } = await clientOnService();
    fixture = f;
    const seed = await seedTwoBuggies(f);
    const form = new BuildFormState(client, seed.onTwo.id, 'metric');
    await form.load();
    form.draft.name = 'Buggy on 2S, long gearing';
    form.draft['gearing.pinionTeeth'] = '19';
    // Meanwhile another window changes the notes and the spur of the same build.
    await f.call('builds.update', {
      id: seed.onTwo.id,
      expectedVersion: seed.onTwo.version,
      changes: { notes: 'new spur fitted', gearing: { ...seed.onTwo.gearing, spurTeeth: 81 } },
      reason: 'bench',
    });

    expect(await form.save()).toBeNull();
    expect(form.conflict).toBe(true);
    // Nothing of the refused save was written: the other writer's version stands.
    const between = (await f.call('builds.get', { id: seed.onTwo.id })).build;
    expect([between.name, between.gearing.pinionTeeth, between.version]).toEqual(['Buggy on 2S', 17, seed.onTwo.version + 1]);
    expect(form.draft.name).toBe('Buggy on 2S, long gearing');

    await form.rebase();
    expect(form.conflict).toBe(false);
    expect(form.draft.name).toBe('Buggy on 2S, long gearing');
    expect(form.draft['gearing.pinionTeeth']).toBe('19');
    expect(form.draft.notes).toBe('new spur fitted');
    expect(form.draft['gearing.spurTeeth']).toBe('81');
    expect(form.record?.version).toBe(seed.onTwo.version + 1);

    const saved = await form.save();
    expect(saved).not.toBeNull();
    const stored = (await f.call('builds.get', { id: seed.onTwo.id })).build;
    expect([stored.name, stored.notes, stored.gearing.pinionTeeth, stored.gearing.spurTeeth]).toEqual(['Buggy on 2S, long gearing', 'new spur fitted', 19, 81]);
  });

  it('a vehicle form rebased after a conflict sends only the user’s own field again', async () => {
    const { f, client } = await clientOnService();
    fixture = f;
    const seed = await seedTwoBuggies(f);
    const form = new PartFormState(client, 'vehicles', seed.vehicle.id, 'metric');
    await form.load();
    form.draft.className = 'Track team';
    await f.call('vehicles.update', { id: seed.vehicle.id, expectedVersion: seed.vehicle.version, changes: { massKg: 1.75 }, reason: 'weighed' });
    expect(await form.save()).toBeNull();
    expect(form.formError?.kind).toBe('conflict');
    await form.rebase();
    expect(form.draft.massKg).toBe('1.75');
    expect(Object.keys(form.draft).filter((k) => form.draft[k] !== form.base[k])).toEqual(['className']);
    expect(await form.save()).not.toBeNull();
    const stored = await f.call('vehicles.get', { id: seed.vehicle.id });
    expect([stored.className, stored.massKg]).toEqual(['Track team', 1.75]);
  });

  it('a save the service refuses writes nothing and keeps every typed value, the refusal beside its field', async () => {
    const { f, client } = await clientOnService();
    fixture = f;
    const seed = await seedTwoBuggies(f);
    const form = new BuildFormState(client, null, 'metric');
    form.draft.name = 'Buggy on a missing chassis';
    // A vehicle the store does not hold passes the form's own checks; only the service knows.
    form.draft.vehicleId = 'vehicle-gone';
    form.draft.motorId = seed.motor.id;
    form.draft['gearing.pinionTeeth'] = '18';
    form.supplies[0]!.batteryIds[0] = seed.pack2s.id;
    const historyBefore = (await f.call('history.list', {})).length;

    expect(await form.save()).toBeNull();
    expect(Object.keys(form.errors)).toEqual(['vehicleId']);
    expect(form.formError?.message.startsWith('Vehicle')).toBe(true);
    expect(form.saving).toBe(false);
    expect([form.draft.name, form.draft.vehicleId, form.draft['gearing.pinionTeeth']]).toEqual(['Buggy on a missing chassis', 'vehicle-gone', '18']);
    expect(form.supplies[0]!.batteryIds).toEqual([seed.pack2s.id]);
    expect(form.dirty).toBe(true);
    expect(form.leaveMessage()).toBe('This new build has changes that are not saved.');
    expect((await f.call('builds.list', {})).map((b) => b.name).sort()).toEqual(['Buggy on 2S', 'Buggy on 4S']);
    expect((await f.call('history.list', {})).length).toBe(historyBefore);
  });
});

describe('loader', () => {
  it('shows a read error, keeps nothing stale it never had, and answers on retry', async () => {
    const { f, client } = await clientOnService();
    fixture = f;
    const seed = await seedTwoBuggies(f);
    const sheet = new BuildSheetState(client, 'build-made-later');
    await sheet.load();
    expect(sheet.sheet).toBeNull();
    expect(sheet.source.error?.kind).toBe('not-found');
    expect(sheet.error).not.toBeNull();

    await f.call('builds.create', { id: 'build-made-later', name: 'Late buggy', vehicleId: seed.vehicle.id, motorId: seed.motor.id, gearing: seed.onTwo.gearing, supplies: [{ batteryIds: [seed.pack2s.id] }] });
    expect(await sheet.source.retry()).toBe(true);
    expect(sheet.error).toBeNull();
    expect(sheet.sheet?.build.name).toBe('Late buggy');
  });

  it('keeps the last value on screen while re-reading and after a failed re-read, then recovers', async () => {
    const { f, client } = await clientOnService();
    fixture = f;
    const seed = await seedTwoBuggies(f);
    let id = seed.pack2s.id;
    const pack = new Loader(() => client.call('batteries.get', { id }));
    expect(await pack.load()).toBe(true);

    const reread = pack.load();
    expect(pack.loading).toBe(true);
    expect(pack.reloading).toBe(true);
    expect(pack.value?.name).toBe('Test 2S');
    await reread;
    expect(pack.reloading).toBe(false);

    id = 'battery-gone';
    expect(await pack.retry()).toBe(false);
    expect(pack.error?.kind).toBe('not-found');
    expect(pack.value?.id).toBe(seed.pack2s.id);

    id = seed.pack2s.id;
    expect(await pack.retry()).toBe(true);
    expect(pack.error).toBeNull();
  });

  it('re-reads on the store-change events it follows, and only the newest read answers', async () => {
    const { f, client } = await clientOnService();
    fixture = f;
    const seed = await seedTwoBuggies(f);
    const pack = new Loader(() => client.call('batteries.get', { id: seed.pack4s.id }));
    const stop = pack.follow(client, (event) => event.type === 'records-changed' && event.kind === 'batteries' && event.ids.includes(seed.pack4s.id));
    await pack.load();
    await f.call('batteries.update', { id: seed.pack4s.id, expectedVersion: seed.pack4s.version, changes: { name: 'Test 4S, tired' }, reason: '' });
    await settle();
    expect(pack.value?.name).toBe('Test 4S, tired');
    stop();
    await f.call('batteries.update', { id: seed.pack4s.id, expectedVersion: seed.pack4s.version + 1, changes: { name: 'Test 4S, retired' }, reason: '' });
    await settle();
    expect(pack.value?.name).toBe('Test 4S, tired');

    // Two reads in flight: the older one's answer is dropped, whichever arrives last.
    let answer = 'first';
    const slow = new Loader(async () => {
      const mine = answer;
      if (mine === 'first') await settle(50);
      return mine;
    });
    const older = slow.load();
    answer = 'second';
    await slow.load();
    await older;
    expect(slow.value).toBe('second');
  });
});

describe('typed part operations', () => {
  it('answer each kind’s own record, and refuse a change by its field without sending it', async () => {
    const { f, client } = await clientOnService();
    fixture = f;
    const seed = await seedTwoBuggies(f);
    const motor = await partOps(client).motors.get({ id: seed.motor.id });
    expect(motor.kv).toBe(3300);
    const refusal = await partApi.update(client, 'batteries', seed.pack2s.id, seed.pack2s.version, { capacityMah: -5 }, '').catch((e: unknown) => e);
    expect(refusal).toBeInstanceOf(ApiCallError);
    expect(refusal instanceof ApiCallError ? refusal.field : null).toBe('changes.capacityMah');
    const stored = await f.call('batteries.get', { id: seed.pack2s.id });
    expect([stored.capacityMah, stored.version]).toEqual([5000, seed.pack2s.version]);
  });
});
