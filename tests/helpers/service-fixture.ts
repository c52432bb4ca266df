import { openServiceHost } from '../../src-main/service/open-service-host';
import { demoFleet } from '../../demo-fixtures/demo-fleet';
import type { ApiInput, ApiOutput, HandlerName } from '../../src-main/service/handlers';
import type { ApiError, ServiceEvent } from '../../src-main/service/contract';
import { SQLITE, type StoreEngine } from './store-engines';

/** A real service on a real store (a SQLite file unless an engine is given), with a steady clock and readable ids. */
export async function serviceFixture(engine: StoreEngine = SQLITE) {
  const store = await engine.fresh();
  let tick = Date.parse('2026-12-01T08:00:00Z');
  let seq = 0;
  const dbPath = store.location;
  const host = await openServiceHost({
    dbPath,
    actor: 'tester',
    demoFleet,
    now: () => new Date((tick += 1000)),
    newId: (prefix) => `${prefix}-${++seq}`,
  });
  const events: ServiceEvent[] = [];
  host.subscribe((e) => events.push(e));

  async function call<K extends HandlerName>(name: K, args: ApiInput<K>): Promise<ApiOutput<K>> {
    const result = await host.call(name, args);
    if (!result.ok) throw new Error(`${name} failed: ${result.error.kind}: ${result.error.message}`);
    return result.value as ApiOutput<K>;
  }

  /** Calls with anything at all and expects a refusal. */
  async function refuse(name: string, args: unknown): Promise<ApiError> {
    const result = await host.call(name, args);
    if (result.ok) throw new Error(`${name} accepted ${JSON.stringify(args)}`);
    return result.error;
  }

  async function close() {
    await host.close();
    await store.remove();
  }
  return { host, call, refuse, events, dbPath, close, db: host.ctx.db };
}

export type ServiceFixture = Awaited<ReturnType<typeof serviceFixture>>;

/** A small bench-top scenario: one 1/10 buggy on a 2S pack and one on a 4S pack, sharing a motor. */
export async function seedTwoBuggies(f: ServiceFixture) {
  const vehicle = await f.call('vehicles.create', { name: 'Test buggy', kind: 'car', massKg: 1.6, dragAreaM2: 0.03, rollingCoefficient: 0.03, tractionCoefficient: 1.0 });
  const motor = await f.call('motors.create', { name: 'Test 3300', kv: 3300, resistanceOhm: 0.012, noLoadCurrentA: 2.5, maxCurrentA: 120, maxPowerW: 1800, maxVoltageV: 17.4, maxRpm: 60000 });
  const esc = await f.call('controllers.create', { name: 'Test 120A', maxVoltageV: 25.2, continuousCurrentA: 120, burstCurrentA: 760, resistanceOhm: 0.001 });
  const pack2s = await f.call('batteries.create', { name: 'Test 2S', chemistry: 'lipo', cellsSeries: 2, capacityMah: 5000, cRatingContinuous: 50, cRatingBurst: 100, cellResistanceOhm: 0.003 });
  const pack4s = await f.call('batteries.create', { name: 'Test 4S', chemistry: 'lipo', cellsSeries: 4, capacityMah: 5000, cRatingContinuous: 50, cRatingBurst: 100, cellResistanceOhm: 0.003 });
  const gearing = { pinionTeeth: 17, spurTeeth: 87, internalRatio: 2.6, tireDiameterMm: 84, drivetrainEfficiency: 0.9 };
  const onTwo = await f.call('builds.create', { name: 'Buggy on 2S', vehicleId: vehicle.id, motorId: motor.id, controllerId: esc.id, gearing, supplies: [{ batteryIds: [pack2s.id] }] });
  const onFour = await f.call('builds.create', { name: 'Buggy on 4S', vehicleId: vehicle.id, motorId: motor.id, controllerId: esc.id, gearing, supplies: [{ batteryIds: [pack4s.id] }] });
  return { vehicle, motor, esc, pack2s, pack4s, onTwo: onTwo.record, onFour: onFour.record };
}
