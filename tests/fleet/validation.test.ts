import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { fleetText } from '../../src-main/service/fleet/export-fleet';
import type { FleetFile } from '../../src-main/service/fleet/fleet-format';
import { problemLine } from '../../src-main/service/fleet/fleet-problems';
import { inspectFleet } from '../../src-main/service/fleet/inspect-fleet';
import { generateFleet } from '../../demo-fixtures/generate-fleet';
import { demoFleet } from '../../demo-fixtures/demo-fleet';
import { dumpStore } from './store-dump';

let f: ServiceFixture;
beforeEach(async () => {
  f = await serviceFixture();
});
afterEach(async () => f.close());

function demo(): FleetFile {
  return demoFleet() as FleetFile;
}

/** Imports and expects a refusal that leaves every table exactly as it was. */
async function refused(args: Parameters<ServiceFixture['call']>[1] & object): Promise<string[]> {
  const before = await dumpStore(f.db);
  const report = await f.call('fleet.import', args as never);
  expect(report.ok).toBe(false);
  expect(report.historyId).toBeNull();
  expect(await dumpStore(f.db)).toEqual(before);
  return report.problems.map(problemLine);
}

describe('a fleet file is checked whole before anything is written', () => {
  it('one bad record among many: every problem named with its place, the store byte-for-byte the same', async () => {
    await seedTwoBuggies(f);
    const fleet = generateFleet({ builds: 300, seed: 11 });
    fleet.batteries[2]!.chemistry = 'lead-acid' as never;
    fleet.builds[3]!.supplies[0]!.batteryIds = [fleet.batteries[1]!.id, 'x'];
    fleet.motors[0]!.kv = 'fast' as never;
    const problems = await refused({ fleet, mode: 'merge' });
    expect(problems).toEqual(['batteries[2].chemistry: must be one of: lipo, lihv, lifepo4, liion, nimh', 'motors[0].kv: must be a number', 'builds[3].supplies[0].batteryIds[1]: no pack with id "x" in this file or the store']);
  });

  it('a reference to a record that failed its own check is not reported twice', async () => {
    const fleet = demo();
    fleet.vehicles[0]!.kind = 'hovercraft' as never;
    const problems = await refused({ fleet, mode: 'replace' });
    expect(problems).toEqual(['vehicles[0].kind: must be one of: car, truck, boat, multirotor, plane']);
  });

  it('truncated JSON is unreadable, with the reason', async () => {
    const text = fleetText(demo());
    const before = await dumpStore(f.db);
    const report = await f.call('fleet.import', { text: text.slice(0, Math.floor(text.length / 2)), mode: 'merge' });
    expect(report).toMatchObject({ ok: false, unreadable: true });
    expect(report.problems[0]?.message).toMatch(/not complete JSON.*cut off/);
    expect(await dumpStore(f.db)).toEqual(before);
  });

  it('JSON with a syntax slip names the line and column', async () => {
    const report = await f.call('fleet.import', { text: '{\n  "format": "rigbook-fleet",\n  "version": 1,\n  "batteries": [x]\n}', mode: 'merge' });
    expect(report.unreadable).toBe(true);
    expect(report.problems[0]?.message).toBe('The file is not JSON: unexpected "x" where a value should be, at line 4, column 17.');
  });

  it('wrong types anywhere are each named', async () => {
    const fleet = demo() as unknown as Record<'batteries' | 'motors' | 'builds', Record<string, unknown>[]>;
    fleet.builds[0]!.motorCount = '2';
    fleet.builds[1]!.gearing = { pinionTeeth: 2.5 };
    fleet.batteries[0]!.retired = 'no';
    fleet.batteries[1]!.colour = 'red';
    delete fleet.motors[1]!.name;
    const problems = await refused({ fleet, mode: 'merge' });
    expect(problems).toEqual([
      'batteries[0].retired: must be true or false',
      'batteries[1].colour: is not a field Rigbook knows',
      'motors[1].name: is required',
      'builds[0].motorCount: must be a number',
      'builds[1].gearing.pinionTeeth: must be a whole number',
    ]);
  });

  it('duplicate ids: within a kind, and supply ids across builds', async () => {
    const fleet = demo();
    fleet.batteries[5]!.id = fleet.batteries[2]!.id;
    fleet.builds[4]!.supplies[0]!.id = fleet.builds[1]!.supplies[0]!.id;
    const problems = await refused({ fleet, mode: 'replace' });
    expect(problems).toContain(`batteries[5].id: "${fleet.batteries[2]!.id}" is used twice in this file (also batteries[2])`);
    expect(problems).toContain(`builds[4].supplies[0].id: "${fleet.builds[1]!.supplies[0]!.id}" is used twice in this file (also builds[1].supplies[0])`);
  });

  it('references resolve against the store when merging, against the file alone when replacing', async () => {
    const seed = await seedTwoBuggies(f);
    const fleet: FleetFile = { ...demo(), builds: [] };
    fleet.builds.push({ ...demo().builds[0]!, id: 'uses-stored-pack', supplies: [{ id: 'u1', arrangement: 'series', batteryIds: [seed.pack2s.id] }] });
    expect((await f.call('fleet.import', { fleet, mode: 'merge', dryRun: true })).ok).toBe(true);
    const problems = await refused({ fleet, mode: 'replace' });
    expect(problems).toEqual([`builds[0].supplies[0].batteryIds[0]: no pack with id "${seed.pack2s.id}" in this file`]);
  });

  it('a supply id held by a stored build the file leaves alone is refused', async () => {
    const seed = await seedTwoBuggies(f);
    const fleet: FleetFile = { ...demo(), builds: [{ ...demo().builds[0]!, supplies: [{ id: seed.onTwo.supplies[0]!.id, arrangement: 'series', batteryIds: [seed.pack2s.id] }] }] };
    const problems = await refused({ fleet, mode: 'merge' });
    expect(problems).toEqual([`builds[0].supplies[0].id: "${seed.onTwo.supplies[0]!.id}" already belongs to build "${seed.onTwo.id}" in the store`]);
  });

  it.each([
    ['not an object', [], '', /one JSON object/],
    ['another format', { format: 'some-other-list', version: 1 }, 'format', /must be "rigbook-fleet"/],
    ['a newer version', { format: 'rigbook-fleet', version: 3 }, 'version', /newer Rigbook.*reads version 2/],
    ['no version', { format: 'rigbook-fleet' }, 'version', /is required/],
  ])('refuses %s before looking at records', (_label, value, place, message) => {
    const result = inspectFleet(value);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems).toHaveLength(1);
    expect(result.problems[0]!.place).toBe(place);
    expect(result.problems[0]!.message).toMatch(message);
  });

  it('a top-level field that is not part of the format, and a kind that is not a list', () => {
    const result = inspectFleet({ format: 'rigbook-fleet', version: 1, packs: [], motors: {} });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems.map(problemLine)).toEqual([
      'packs: is not part of a rigbook-fleet file (it holds: batteries, motors, controllers, propellers, customers, vehicles, classes, classRules, builds, workOrders)',
      'motors: must be a list of motors',
    ]);
  });

  it('a field with an odd name is still named exactly', () => {
    const result = inspectFleet({ format: 'rigbook-fleet', version: 1, motors: [{ id: 'm1', name: 'M', kv: 1000, '': 1, 'top speed': 2 }] });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems.map(problemLine)).toEqual(['motors[0][""]: is not a field Rigbook knows', 'motors[0]["top speed"]: is not a field Rigbook knows']);
  });

  it('a hand-written file may leave out kinds, supply ids and fields that have defaults', () => {
    const result = inspectFleet({
      format: 'rigbook-fleet',
      version: 1,
      batteries: [{ id: 'p1', name: 'Pack', chemistry: 'lipo', cellsSeries: 2, capacityMah: 4000 }],
      vehicles: [{ id: 'v1', name: 'Car', kind: 'car' }],
      builds: [{ id: 'b1', name: 'Car on 2S', vehicleId: 'v1', supplies: [{ batteryIds: ['p1'] }] }],
    });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.fleet.batteries[0]).toMatchObject({ cellsParallel: 1, version: 1, archivedAt: null, retired: false });
    // A supply without an id gets one derived from the build's, the same every time the file is read.
    expect(result.fleet.builds[0]!.supplies[0]!.id).toBe('b1.s1');
  });

  it('refuses both text and object, or neither', async () => {
    expect((await f.refuse('fleet.import', { mode: 'merge' })).field).toBe('text');
    expect((await f.refuse('fleet.import', { text: '{}', fleet: {}, mode: 'merge' })).field).toBe('text');
    expect((await f.refuse('fleet.import', { fleet: {}, mode: 'overwrite' })).field).toBe('mode');
  });
});

describe('customers in a fleet file', () => {
  /** A file as written before customers were records: vehicles name their owner as text. */
  function olderFile() {
    return {
      format: 'rigbook-fleet',
      version: 1,
      vehicles: [
        { id: 'v1', name: 'Yellow buggy', kind: 'car', owner: 'Dana Ó Briain' },
        { id: 'v2', name: 'Red truck', kind: 'truck', owner: ' Dana Ó Briain ' },
        { id: 'v3', name: 'Shop crawler', kind: 'truck', owner: '' },
      ],
    };
  }

  it('an older file with owner text imports, one customer per distinct owner, and exports without owner', async () => {
    const report = await f.call('fleet.import', { fleet: olderFile(), mode: 'merge' });
    expect(report.problems).toEqual([]);
    expect(report.counts.customers).toEqual({ added: 1, updated: 0, unchanged: 0 });
    const [dana] = await f.call('customers.list', {});
    expect(dana).toMatchObject({ name: 'Dana Ó Briain', contact: '' });
    expect((await f.call('vehicles.list', {})).map((v) => [v.id, v.customerId])).toEqual([
      ['v2', dana!.id],
      ['v3', null],
      ['v1', dana!.id],
    ]);
    const exported = await f.call('fleet.export', {});
    expect(exported.customers.map((c) => c.name)).toEqual(['Dana Ó Briain']);
    expect(exported.vehicles.every((v) => !('owner' in v))).toBe(true);
  });

  it('importing the older file again leaves a customer edited since as it is', async () => {
    await f.call('fleet.import', { fleet: olderFile(), mode: 'merge' });
    const [dana] = await f.call('customers.list', {});
    await f.call('customers.update', { id: dana!.id, expectedVersion: dana!.version, changes: { contact: 'dana@example.org' } });
    const again = await f.call('fleet.import', { fleet: olderFile(), mode: 'merge' });
    expect(again.ok).toBe(true);
    expect(again.counts.customers).toEqual({ added: 0, updated: 0, unchanged: 0 });
    expect((await f.call('customers.get', { id: dana!.id })).contact).toBe('dana@example.org');
  });

  it('a vehicle naming a customer that is neither in the file nor the store is refused with its place', async () => {
    const fleet = { format: 'rigbook-fleet', version: 1, customers: [{ id: 'cust-a', name: 'A' }], vehicles: [{ id: 'v1', name: 'Buggy', kind: 'car', customerId: 'cust-b' }] };
    expect(await refused({ fleet, mode: 'merge' })).toEqual(['vehicles[0].customerId: no customer with id "cust-b" in this file or the store']);
    const blank = { format: 'rigbook-fleet', version: 1, customers: [{ id: 'cust-a', name: ' ' }] };
    expect(await refused({ fleet: blank, mode: 'merge' })).toEqual(['customers[0].name: is required']);
  });
});
