import { afterEach, describe, expect, it } from 'vitest';
import { evaluateBuild } from '../../src-main/core/evaluate';
import { loadBuildContexts } from '../../src-main/service/recheck';
import { byIds } from '../../src-main/store/build-selector';
import { IN_CHUNK } from '../../src-main/store/db-handle';
import { getStoredStatuses, sameVerdictRow, verdictToRow } from '../../src-main/store/repositories/verdicts';
import { serviceFixture, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

let f: ServiceFixture | undefined;
afterEach(async () => {
  await f?.close();
  f = undefined;
});

const BUILDS = 1000;

/**
 * A shop's worth of customer builds: each on its own vehicle, each with a pack of its own and a
 * second one from a shared shelf, all sharing one motor. More distinct vehicles and packs than
 * the store binds in one statement, so the re-check's reads by id cross a chunk boundary.
 */
function ownVehicleFleet() {
  const shelf = Array.from({ length: 7 }, (_, i) => ({
    id: `shelf-${i}`,
    name: `Shelf 2S ${i}`,
    chemistry: 'lipo',
    cellsSeries: 2,
    cellsParallel: 1,
    capacityMah: 4000 + i * 100,
    cRatingContinuous: 40,
    cRatingBurst: 80,
    cellResistanceOhm: 0.004,
  }));
  const own = Array.from({ length: BUILDS }, (_, i) => ({
    id: `pack-${i}`,
    name: `Customer pack ${i}`,
    chemistry: 'lipo',
    cellsSeries: 2,
    cellsParallel: 1,
    capacityMah: 3000 + (i % 40) * 100,
    cRatingContinuous: 30 + (i % 5) * 10,
    cRatingBurst: 80,
    cellResistanceOhm: 0.003,
  }));
  const vehicles = Array.from({ length: BUILDS }, (_, i) => ({
    id: `car-${i}`,
    name: `Customer buggy ${i}`,
    kind: 'car',
    massKg: 1.4 + (i % 7) * 0.1,
    dragAreaM2: 0.03,
    rollingCoefficient: 0.03,
    tractionCoefficient: 1.0,
    owner: `Customer ${i % 50}`,
  }));
  const builds = Array.from({ length: BUILDS }, (_, i) => ({
    id: `b${String(i).padStart(4, '0')}`,
    name: `Customer build ${i}`,
    vehicleId: `car-${i}`,
    motorId: 'shop-motor',
    controllerId: 'shop-esc',
    gearing: { pinionTeeth: 16 + (i % 12), spurTeeth: 87, internalRatio: 2.6, tireDiameterMm: 84, drivetrainEfficiency: 0.9 },
    supplies: [{ arrangement: 'parallel', batteryIds: [`pack-${i}`, `shelf-${i % 7}`] }],
  }));
  return {
    format: 'rigbook-fleet',
    version: 1,
    batteries: [...shelf, ...own],
    motors: [{ id: 'shop-motor', name: 'Shop 3300', kv: 3300, resistanceOhm: 0.012, noLoadCurrentA: 2.5, maxCurrentA: 120, maxPowerW: 1800, maxVoltageV: 17.4, maxRpm: 60000 }],
    controllers: [{ id: 'shop-esc', name: 'Shop 120 A', maxVoltageV: 25.2, continuousCurrentA: 120, burstCurrentA: 760, resistanceOhm: 0.001 }],
    propellers: [],
    vehicles,
    builds,
  };
}

forEachEngine((engine) => {
  describe("the re-check's reads", () => {
    it('resolve every vehicle and pack of a thousand builds past the bound-id chunk, as a one-build read does', async () => {
      f = await serviceFixture(engine);
      await f.call('fleet.import', { fleet: ownVehicleFleet(), mode: 'replace', reason: 'shop fleet' });
      const all = await loadBuildContexts(f.db, { by: 'part', kind: 'motors', id: 'shop-motor' }, 0.15);
      expect(all).toHaveLength(BUILDS);
      // The reads must cross the chunk boundary for this test to mean anything.
      expect(new Set(all.map((c) => c.vehicle?.id)).size).toBeGreaterThan(IN_CHUNK);
      for (const context of all) {
        expect(context.vehicle?.id).toBe(context.build.vehicleId);
        expect(context.motor?.id).toBe('shop-motor');
        expect(context.controller?.id).toBe('shop-esc');
        for (const id of context.build.supplies.flatMap((s) => s.batteryIds)) expect(context.batteries.get(id)?.id).toBe(id);
      }
      // Builds read alone, on either side of the boundary, see the same records and the same verdict.
      for (const index of [0, IN_CHUNK - 1, IN_CHUNK, BUILDS - 1]) {
        const together = all[index]!;
        const [alone] = await loadBuildContexts(f.db, byIds([together.build.id]), 0.15);
        expect(alone!.build).toEqual(together.build);
        expect(alone!.vehicle).toEqual(together.vehicle);
        for (const id of together.build.supplies.flatMap((s) => s.batteryIds)) expect(alone!.batteries.get(id)).toEqual(together.batteries.get(id));
        expect(evaluateBuild(alone!)).toEqual(evaluateBuild(together));
      }
    });

    it('leave, after a shared motor is edited, every stored verdict equal to what a one-build read evaluates', async () => {
      f = await serviceFixture(engine);
      await f.call('fleet.import', { fleet: ownVehicleFleet(), mode: 'replace', reason: 'shop fleet' });
      const motor = await f.call('motors.get', { id: 'shop-motor' });
      // The builds draw about 18–37 A through the motor (their gearing differs): a 28 A rating leaves
      // some over it and some clear, so the re-check writes verdicts of more than one kind.
      const answer = await f.call('motors.update', { id: 'shop-motor', expectedVersion: motor.version, changes: { maxCurrentA: 28 }, reason: 'a smaller motor rating' });
      expect(answer.rechecked).toBe(BUILDS);
      const stored = await getStoredStatuses(f.db, { by: 'all' });
      const statuses = new Set<string>();
      for (const index of [0, 1, IN_CHUNK - 1, IN_CHUNK, IN_CHUNK + 1, BUILDS - 1]) {
        const id = `b${String(index).padStart(4, '0')}`;
        const [alone] = await loadBuildContexts(f.db, byIds([id]), 0.15);
        const row = verdictToRow(evaluateBuild(alone!, { messages: false }), '2026-12-01T00:00:00.000Z');
        expect(sameVerdictRow(stored.get(id), row), id).toBe(true);
      }
      for (const s of stored.values()) statuses.add(s.status);
      expect(statuses.size).toBeGreaterThan(1);
    });
  });
});
