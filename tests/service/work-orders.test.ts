import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { seedTwoBuggies, serviceFixture, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

let f: ServiceFixture;
forEachEngine((engine) => {
  beforeEach(async () => {
    f = await serviceFixture(engine);
  });
  afterEach(async () => f.close());

  async function seedCustomerBuggy() {
    const seed = await seedTwoBuggies(f);
    const customer = await f.call('customers.create', { name: 'Dana Ó Briain', contact: 'dana@example.org' });
    const { record: vehicle } = await f.call('vehicles.update', { id: seed.vehicle.id, expectedVersion: seed.vehicle.version, changes: { customerId: customer.id }, reason: 'brought in by Dana' });
    return { ...seed, customer, vehicle };
  }

  async function entriesOf(workOrderId: string) {
    return (await f.call('history.list', { entityKind: 'workOrders', entityId: workOrderId })).map((e) => e.action).reverse();
  }

  describe('customers', () => {
    it('a vehicle belongs to a customer or to the shop; the builds list filters by either', async () => {
      const seed = await seedCustomerBuggy();
      const shopTruck = await f.call('vehicles.create', { name: 'Shop truck', kind: 'truck' });
      await f.call('builds.create', { name: 'Shop truck bare', vehicleId: shopTruck.id });
      const theirs = await f.call('builds.list', { customer: seed.customer.id });
      expect(theirs.map((b) => [b.name, b.customerName])).toEqual([
        ['Buggy on 2S', 'Dana Ó Briain'],
        ['Buggy on 4S', 'Dana Ó Briain'],
      ]);
      const own = await f.call('builds.list', { customer: '-' });
      expect(own.map((b) => [b.name, b.customerId])).toEqual([['Shop truck bare', null]]);
      // The text search finds builds by their customer's name.
      expect((await f.call('builds.list', { text: 'briain' })).length).toBe(2);
    });

    it('refuses a vehicle naming a customer that is not stored, naming the field; nothing is written', async () => {
      const error = await f.refuse('vehicles.create', { name: 'Stray', kind: 'car', customerId: 'cust-nobody' });
      expect(error).toMatchObject({ kind: 'not-found', field: 'customerId' });
      expect(error.message).toContain('no customer with id "cust-nobody"');
      expect(await f.call('vehicles.list', {})).toEqual([]);
      const blank = await f.refuse('customers.create', { name: '   ' });
      expect(blank).toMatchObject({ kind: 'invalid', field: 'name' });
    });
  });

  describe('a work order from intake to hand-over', () => {
    it('goes through every status, its steps link the history entries they caused, and it keeps the verdicts before and after', async () => {
      const seed = await seedCustomerBuggy();
      const before = await f.call('builds.list', {});
      const order = await f.call('workOrders.open', { vehicleId: seed.vehicle.id, complaint: 'Cuts out after two minutes on the 4S pack; motor very hot.' });
      expect(order).toMatchObject({ status: 'open', customerId: seed.customer.id, version: 1, steps: [], verdictsAtHandOver: null });
      // The snapshot at opening is the stored verdict of every active build of the vehicle.
      expect(order.verdictsAtOpening.map((s) => [s.buildName, s.status])).toEqual(before.map((b) => [b.name, b.status]));

      await f.call('workOrders.addStep', { id: order.id, kind: 'checked', text: 'Motor at 95 °C after a 2-minute run; 4S pack puffed slightly.', reason: 'the complaint' });
      // A re-gear through the build form, then the step that records it and links its entry.
      const gearing = { pinionTeeth: 13, spurTeeth: 87, internalRatio: 2.6, tireDiameterMm: 84, drivetrainEfficiency: 0.9 };
      await f.call('builds.update', { id: seed.onFour.id, expectedVersion: seed.onFour.version, changes: { gearing }, reason: 'work order: motor too hot' });
      const [regear] = await f.call('history.list', { entityKind: 'builds', entityId: seed.onFour.id, limit: 1 });
      const viewed = await f.call('workOrders.get', { id: order.id });
      expect(viewed.unlinkedHistory.map((e) => e.id)).toContain(regear!.id);
      await f.call('workOrders.addStep', { id: order.id, kind: 're-geared', text: 'Pinion 17 → 13 on the 4S build.', reason: 'lower the motor current on 4S', historyIds: [regear!.id] });

      let current = await f.call('workOrders.setStatus', { id: order.id, expectedVersion: 1, status: 'waiting-for-parts' });
      current = await f.call('workOrders.setStatus', { id: order.id, expectedVersion: current.version, status: 'open' });
      // Straight from open to handed over is refused: the job must be ready first.
      const skipped = await f.refuse('workOrders.setStatus', { id: order.id, expectedVersion: current.version, status: 'handed-over' });
      expect(skipped).toMatchObject({ kind: 'invalid', field: 'status' });
      expect(skipped.message).toBe('status: a work order that is "Open" can go to "Waiting for parts" or "Ready", not to "Handed over"');
      current = await f.call('workOrders.setStatus', { id: order.id, expectedVersion: current.version, status: 'ready' });
      await f.call('workOrders.addStep', { id: order.id, kind: 'tested', text: 'Three 4-minute runs, motor 62 °C.' });
      // A stale version is a conflict, and nothing changes.
      const stale = await f.refuse('workOrders.setStatus', { id: order.id, expectedVersion: 1, status: 'handed-over' });
      expect(stale.kind).toBe('conflict');
      const done = await f.call('workOrders.setStatus', { id: order.id, expectedVersion: current.version, status: 'handed-over', signedOffBy: 'Tess at the bench' });
      expect(done).toMatchObject({ status: 'handed-over', signedOffBy: 'Tess at the bench', handedOverAt: expect.stringMatching(/^2026-12-01T/) });

      const after = await f.call('builds.list', {});
      expect(done.verdictsAtHandOver?.map((s) => [s.buildName, s.status])).toEqual(after.map((b) => [b.name, b.status]));
      expect(done.steps.map((s) => [s.position, s.kind, s.historyIds])).toEqual([
        [1, 'checked', []],
        [2, 're-geared', [regear!.id]],
        [3, 'tested', []],
      ]);
      const sheet = await f.call('workOrders.get', { id: order.id });
      expect(sheet.linkedHistory.map((e) => e.summary)).toEqual([regear!.summary]);
      expect(sheet.customer?.name).toBe('Dana Ó Briain');
      expect(sheet.verdictsNow).toEqual(done.verdictsAtHandOver);
      expect(await entriesOf(order.id)).toEqual(['open', 'step', 'step', 'status', 'status', 'status', 'step', 'status']);

      // Handed over is the end: no more steps, no more status changes.
      const late = await f.refuse('workOrders.addStep', { id: order.id, kind: 'note', text: 'Forgot something' });
      expect(late.message).toContain('handed over and is closed');
      const reopen = await f.refuse('workOrders.setStatus', { id: order.id, expectedVersion: done.version, status: 'open' });
      expect(reopen).toMatchObject({ kind: 'invalid', field: 'status' });
      expect((await f.call('workOrders.list', { customerId: seed.customer.id })).map((o) => [o.id, o.status, o.stepCount, o.vehicleName])).toEqual([[order.id, 'handed-over', 3, 'Test buggy']]);
    });

    it('refuses a step linking a history entry that does not exist, and an empty complaint, naming the field', async () => {
      const seed = await seedCustomerBuggy();
      const empty = await f.refuse('workOrders.open', { vehicleId: seed.vehicle.id, complaint: '  ' });
      expect(empty).toMatchObject({ kind: 'invalid', field: 'complaint' });
      const order = await f.call('workOrders.open', { vehicleId: seed.vehicle.id, complaint: 'Noisy drivetrain' });
      const missing = await f.refuse('workOrders.addStep', { id: order.id, kind: 'part-swapped', text: 'New spur', historyIds: [999_999] });
      expect(missing).toMatchObject({ kind: 'not-found', field: 'historyIds' });
      expect((await f.call('workOrders.get', { id: order.id })).order.steps).toEqual([]);
    });
  });
});

forEachEngine((engine) => {
  let g: ServiceFixture;
  beforeEach(async () => {
    f = await serviceFixture(engine);
    g = await serviceFixture(engine);
  });
  afterEach(async () => {
    await f.close();
    await g.close();
  });

  describe('work orders in fleet files', () => {
    it('export and import carry work orders with their steps and snapshots; links stay only where the entry is in the store', async () => {
      const seed = await seedTwoBuggies(f);
      const customer = await f.call('customers.create', { name: 'Ravi Lindqvist' });
      await f.call('vehicles.update', { id: seed.vehicle.id, expectedVersion: seed.vehicle.version, changes: { customerId: customer.id } });
      const order = await f.call('workOrders.open', { vehicleId: seed.vehicle.id, complaint: 'Stutters at launch' });
      const [entry] = await f.call('history.list', { limit: 1 });
      await f.call('workOrders.addStep', { id: order.id, kind: 'checked', text: 'Sensor lead loose', historyIds: [entry!.id] });
      const file = await f.call('fleet.export', {});
      expect(file.workOrders.map((o) => [o.id, o.status, o.steps.length])).toEqual([[order.id, 'open', 1]]);

      // The same store reads its own export back unchanged.
      const again = await f.call('fleet.import', { fleet: file, mode: 'merge' });
      expect(again.counts.workOrders).toEqual({ added: 0, updated: 0, unchanged: 1 });
      // Another store gets the work order whole; the link to an entry it does not hold is dropped.
      const other = await g.call('fleet.import', { fleet: file, mode: 'merge' });
      expect(other.problems).toEqual([]);
      expect(other.counts.workOrders).toEqual({ added: 1, updated: 0, unchanged: 0 });
      const copied = await g.call('workOrders.get', { id: order.id });
      expect(copied.order).toMatchObject({ complaint: 'Stutters at launch', customerId: customer.id, verdictsAtOpening: order.verdictsAtOpening });
      expect(copied.order.steps.map((s) => [s.text, s.historyIds])).toEqual([['Sensor lead loose', []]]);
      expect((await f.call('workOrders.get', { id: order.id })).order.steps[0]!.historyIds).toEqual([entry!.id]);

      // A work order naming a vehicle that is nowhere is refused with its place; nothing is written.
      const broken = { ...file, workOrders: [{ ...file.workOrders[0]!, id: 'job-x', vehicleId: 'veh-nowhere' }] };
      const refused = await g.call('fleet.import', { fleet: broken, mode: 'merge' });
      expect(refused.ok).toBe(false);
      expect(refused.problems).toContainEqual({ place: 'workOrders[0].vehicleId', message: 'no vehicle with id "veh-nowhere" in this file or the store' });
    });
  });
});
