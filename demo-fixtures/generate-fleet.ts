// Large fleets for tests and the benchmark: deterministic from the seed, with parts shared
// the way a re-check finds hardest — one "hot" motor in every build and one "hot" pack in
// half of them — so editing either touches thousands of builds.

import type { Battery, Build, Controller, Customer, Motor, Propeller, Vehicle, VehicleKind } from '../src-main/core/domain';
import { FLEET_FORMAT, FLEET_VERSION, type FleetFile } from '../src-main/service/fleet/fleet-format';
import { seededRandom } from './seeded-random';

export interface GenerateOptions {
  builds: number;
  /** Packs in the fleet (at least 2); default one for every four builds, at most 2000. */
  packs?: number;
  /** Motors in the fleet besides the hot one (spares on the shelf); default 20. */
  motors?: number;
  seed: number;
}

export const HOT_MOTOR_ID = 'gen-mot-hot';
export const HOT_PACK_ID = 'gen-pk-hot';

const KINDS: readonly VehicleKind[] = ['car', 'truck', 'car', 'truck', 'boat', 'multirotor', 'plane'];

function id(prefix: string, n: number): string {
  return `${prefix}-${String(n).padStart(6, '0')}`;
}

const meta = { version: 1, archivedAt: null, notes: '' };

export function generateFleet(options: GenerateOptions): FleetFile {
  const rnd = seededRandom(options.seed);
  const pick = <T>(list: readonly T[]): T => list[Math.floor(rnd() * list.length)]!;
  const between = (lo: number, hi: number, step = 1) => Math.round((lo + rnd() * (hi - lo)) / step) * step;
  const n = Math.max(0, Math.floor(options.builds));
  const packCount = Math.max(2, options.packs ?? Math.min(2000, Math.ceil(n / 4)));
  const spareMotors = Math.max(0, options.motors ?? 20);

  const batteries: Battery[] = [];
  for (let i = 0; i < packCount; i++) {
    const cells = i === 0 ? 3 : pick([2, 2, 3, 3, 4]);
    batteries.push({
      ...meta,
      id: i === 0 ? HOT_PACK_ID : id('gen-pk', i),
      name: `${cells}S pack ${i}`,
      chemistry: 'lipo',
      cellsSeries: cells,
      cellsParallel: 1,
      capacityMah: between(2000, 6500, 100),
      // A few packs without a printed C rating, so some builds read incomplete as in a real shop.
      cRatingContinuous: i > 0 && rnd() < 0.05 ? null : pick([25, 35, 50, 60]),
      cRatingBurst: pick([50, 70, 100, 120]),
      cellResistanceOhm: pick([null, 0.002, 0.003, 0.005, 0.008]),
      massKg: between(0.15, 0.9, 0.01),
      cycleCount: between(0, 300),
      retired: false,
    });
  }
  const hotMotor: Motor = {
    ...meta,
    id: HOT_MOTOR_ID,
    name: 'Shared 2000 Kv motor',
    kv: 2000,
    resistanceOhm: 0.012,
    noLoadCurrentA: 2.5,
    maxCurrentA: 150,
    maxPowerW: 3000,
    maxVoltageV: 26,
    maxRpm: 90000,
    poles: 4,
    // Invented, as the rest: a rated heat loss keeps the heat check on a rating, as a shop's own parts would be.
    maxLossW: 200,
    massKg: 0.3,
  };
  const motors: Motor[] = [hotMotor];
  for (let i = 1; i <= spareMotors; i++) {
    motors.push({ ...hotMotor, id: id('gen-mot', i), name: `Spare motor ${i}`, kv: between(900, 4500, 50), maxCurrentA: between(30, 160) });
  }
  const controllerCount = Math.max(3, Math.ceil(n / 50));
  const controllers: Controller[] = [];
  for (let i = 0; i < controllerCount; i++) {
    controllers.push({
      ...meta,
      id: id('gen-esc', i),
      name: `Controller ${i}`,
      maxVoltageV: null,
      maxCells: pick([4, 6, 6, 8]),
      continuousCurrentA: between(80, 200, 10),
      burstCurrentA: between(200, 1000, 10),
      resistanceOhm: pick([null, 0.0005, 0.001]),
      massKg: null,
    });
  }
  const propellers: Propeller[] = [
    { ...meta, id: 'gen-prop-boat', name: 'Boat prop 32 mm', diameterMm: 32, pitchMm: 45, blades: 2, thrustCoefficient: 0.35, powerCoefficient: 0.4 },
    { ...meta, id: 'gen-prop-quad', name: 'Quad prop 4 inch', diameterMm: 102, pitchMm: 76, blades: 3, thrustCoefficient: 0.11, powerCoefficient: 0.065 },
    { ...meta, id: 'gen-prop-plane', name: 'Plane prop 10 inch', diameterMm: 254, pitchMm: 152, blades: 2, thrustCoefficient: 0.1, powerCoefficient: 0.042 },
  ];
  const customers: Customer[] = Array.from({ length: 37 }, (_, i) => ({ ...meta, id: id('gen-cust', i), name: `Customer ${i}`, contact: '' }));
  const vehicleCount = Math.max(KINDS.length, Math.ceil(n / 20));
  const vehicles: Vehicle[] = [];
  for (let i = 0; i < vehicleCount; i++) {
    const kind = KINDS[i % KINDS.length]!;
    const ground = kind === 'car' || kind === 'truck';
    vehicles.push({
      ...meta,
      id: id('gen-veh', i),
      name: `${kind} ${i}`,
      kind,
      massKg: ground ? between(1.2, 6, 0.1) : between(0.5, 3, 0.1),
      dragAreaM2: ground ? between(0.02, 0.12, 0.005) : null,
      rollingCoefficient: ground ? between(0.015, 0.06, 0.005) : null,
      tractionCoefficient: ground ? between(0.8, 1.3, 0.05) : null,
      // Every 38th vehicle is the shop's own; the rest belong to 37 customers.
      customerId: i % 38 === 37 ? null : id('gen-cust', i % 37),
      className: '',
    });
  }
  const builds: Build[] = [];
  for (let i = 0; i < n; i++) {
    const vehicle = vehicles[i % vehicles.length]!;
    const ground = vehicle.kind === 'car' || vehicle.kind === 'truck';
    const buildId = id('gen-b', i);
    const first = i % 2 === 0 ? HOT_PACK_ID : batteries[1 + Math.floor(rnd() * (batteries.length - 1))]!.id;
    const supplies = [{ id: `${buildId}.s1`, arrangement: 'series' as const, batteryIds: [first] }];
    if (rnd() < 0.3) {
      // One physical pack can be in one place only: a second supply takes another pack.
      let second = pick(batteries).id;
      if (second === first) second = batteries[(batteries.findIndex((b) => b.id === first) + 1) % batteries.length]!.id;
      supplies.push({ id: `${buildId}.s2`, arrangement: 'series' as const, batteryIds: [second] });
    }
    builds.push({
      ...meta,
      id: buildId,
      name: `Build ${i}`,
      vehicleId: vehicle.id,
      motorId: HOT_MOTOR_ID,
      motorCount: vehicle.kind === 'multirotor' ? 4 : 1,
      controllerId: pick(controllers).id,
      propellerId: ground ? null : vehicle.kind === 'boat' ? 'gen-prop-boat' : vehicle.kind === 'multirotor' ? 'gen-prop-quad' : 'gen-prop-plane',
      gearing: ground
        ? { pinionTeeth: between(12, 22), spurTeeth: between(50, 90), internalRatio: 2.6, tireDiameterMm: between(80, 170), drivetrainEfficiency: 0.9 }
        : { pinionTeeth: null, spurTeeth: null, internalRatio: 1, tireDiameterMm: null, drivetrainEfficiency: 0.9 },
      supplies,
      measuredPeakCurrentA: null,
      measuredAverageCurrentA: null,
      tightThreshold: null,
    });
  }
  return { format: FLEET_FORMAT, version: FLEET_VERSION, batteries, motors, controllers, propellers, customers, vehicles, classes: [], classRules: [], builds, workOrders: [] };
}
