import type { ServiceHost } from '../../../src-main/service/contract';
import { ok } from './store-audit';

// An invented club fleet where a few packs, motors and controllers are shared by many
// builds, so that one part edit re-checks dozens of builds inside its transaction.

export interface SeededFleet {
  vehicles: string[];
  motors: string[];
  controllers: string[];
  batteries: string[];
  classRules: string[];
  builds: string[];
}

export async function seedSharedFleet(host: Pick<ServiceHost, 'call'>, buildCount: number, random: () => number): Promise<SeededFleet> {
  const pick = <T>(items: readonly T[]): T => items[Math.floor(random() * items.length)] as T;
  const id = async (name: string, args: unknown) => (await ok<{ id: string }>(host, name, args)).id;
  const fleet: SeededFleet = { vehicles: [], motors: [], controllers: [], batteries: [], classRules: [], builds: [] };
  fleet.vehicles.push(
    await id('vehicles.create', { name: 'Club buggy', kind: 'car', massKg: 1.6, dragAreaM2: 0.03, rollingCoefficient: 0.03, tractionCoefficient: 1.0, className: 'club' }),
    await id('vehicles.create', { name: 'Basher truck', kind: 'truck', massKg: 3.2, dragAreaM2: 0.05, rollingCoefficient: 0.04, tractionCoefficient: 0.9 }),
    await id('vehicles.create', { name: 'Touring car', kind: 'car', massKg: 1.4, dragAreaM2: 0.025, rollingCoefficient: 0.02, tractionCoefficient: 1.1, className: 'club' }),
  );
  for (const [name, kv] of [
    ['Shared 3300', 3300],
    ['Shared 2200', 2200],
    ['Shared 4600', 4600],
  ] as const) {
    fleet.motors.push(await id('motors.create', { name, kv, resistanceOhm: 0.012, noLoadCurrentA: 2.5, maxCurrentA: 120, maxPowerW: 1800, maxVoltageV: 17.4, maxRpm: 60000 }));
  }
  for (const [name, amps] of [
    ['Shared 120A', 120],
    ['Shared 60A', 60],
  ] as const) {
    fleet.controllers.push(await id('controllers.create', { name, maxVoltageV: 25.2, continuousCurrentA: amps, burstCurrentA: amps * 4, resistanceOhm: 0.001 }));
  }
  for (const cells of [2, 2, 3, 4, 4, 6]) {
    fleet.batteries.push(await id('batteries.create', { name: `Shared ${cells}S`, chemistry: 'lipo', cellsSeries: cells, capacityMah: 5000, cRatingContinuous: 50, cRatingBurst: 100, cellResistanceOhm: 0.003 }));
  }
  fleet.classRules.push(await id('classRules.create', { className: 'club', ruleId: 'class-voltage', figure: 'packVoltageFullV', limit: 9, unit: 'V' }));
  for (let i = 0; i < buildCount; i++) {
    // One physical pack can be in one place only: the packs of a build are all different.
    const packs = [...fleet.batteries];
    const take = (): string => packs.splice(Math.floor(random() * packs.length), 1)[0]!;
    const supplies = [{ batteryIds: [take()] }, ...(random() < 0.3 ? [{ arrangement: 'parallel', batteryIds: [take(), take()] }] : [])];
    const created = await ok<{ record: { id: string } }>(host, 'builds.create', {
      name: `Seed build ${i}`,
      vehicleId: pick(fleet.vehicles),
      motorId: pick(fleet.motors),
      controllerId: pick(fleet.controllers),
      gearing: { pinionTeeth: 12 + Math.floor(random() * 15), spurTeeth: 87, internalRatio: 2.6, tireDiameterMm: 84, drivetrainEfficiency: 0.9 },
      supplies,
    });
    fleet.builds.push(created.record.id);
  }
  return fleet;
}
