// An invented club-and-shop fleet for the end-to-end tests and the screenshots: a few vehicles
// of different kinds sharing packs, with every verdict present. Names, customers and parts are
// made up; ratings are typical of their size class (common practice, from memory), not any
// maker's data sheet.

export type Api = <T = unknown>(name: string, args: unknown) => Promise<T>;

interface Stored {
  id: string;
  version: number;
}

const PACKS = {
  shop4s1: { name: 'Shop 4S 5000 #1', chemistry: 'lipo', cellsSeries: 4, capacityMah: 5000, cRatingContinuous: 50, cRatingBurst: 100, cellResistanceOhm: 0.003, massKg: 0.5, cycleCount: 64 },
  shop4s2: { name: 'Shop 4S 5000 #2', chemistry: 'lipo', cellsSeries: 4, capacityMah: 5000, cRatingContinuous: 50, cRatingBurst: 100, cellResistanceOhm: 0.0032, massKg: 0.5, cycleCount: 71 },
  club2s: { name: 'Club 2S 6500 shorty', chemistry: 'lipo', cellsSeries: 2, capacityMah: 6500, cRatingContinuous: 60, cRatingBurst: 120, cellResistanceOhm: 0.002, massKg: 0.32, cycleCount: 12 },
  basher6s: { name: 'Basher 6S 8000', chemistry: 'lipo', cellsSeries: 6, capacityMah: 8000, cRatingContinuous: 25, cRatingBurst: 50, cellResistanceOhm: 0.004, massKg: 1.1, cycleCount: 140 },
  boatA: { name: 'Boat 3S 5200 A', chemistry: 'lipo', cellsSeries: 3, capacityMah: 5200, cRatingContinuous: 40, cRatingBurst: 80, cellResistanceOhm: 0.003, massKg: 0.38, cycleCount: 33 },
  boatB: { name: 'Boat 3S 5200 B', chemistry: 'lipo', cellsSeries: 3, capacityMah: 5200, cRatingContinuous: 40, cRatingBurst: 80, cellResistanceOhm: 0.003, massKg: 0.38, cycleCount: 35 },
  quad6s: { name: 'Quad 6S 1300', chemistry: 'lipo', cellsSeries: 6, capacityMah: 1300, cRatingContinuous: 100, cRatingBurst: 150, cellResistanceOhm: 0.006, massKg: 0.21, cycleCount: 88 },
  liion: { name: 'Glider 4S2P Li-ion', chemistry: 'liion', cellsSeries: 4, cellsParallel: 2, capacityMah: 6000, cRatingContinuous: 3, cRatingBurst: 5, cellResistanceOhm: 0.02, massKg: 0.37, cycleCount: 20 },
  nimh: { name: 'Crawler NiMH 7-cell', chemistry: 'nimh', cellsSeries: 7, capacityMah: 3000, cRatingContinuous: 10, cRatingBurst: 20, cellResistanceOhm: 0.006, massKg: 0.4, cycleCount: 210 },
  old3s: { name: 'Old 3S 2200', chemistry: 'lipo', cellsSeries: 3, capacityMah: 2200, cRatingContinuous: 20, cRatingBurst: 30, massKg: 0.19, cycleCount: 300, retired: true },
} as const;

// Rated heat losses near each motor's loss at its rated current and voltage (I²·R + I₀·V).
const MOTORS = {
  shop2050: { name: 'Shop 2050 4-pole 2200Kv', kv: 2200, resistanceOhm: 0.008, noLoadCurrentA: 2.4, maxCurrentA: 140, maxPowerW: 2600, maxVoltageV: 26, maxRpm: 60000, maxLossW: 220, poles: 4, massKg: 0.36 },
  stadium: { name: 'Stadium 3660 3300Kv', kv: 3300, resistanceOhm: 0.012, noLoadCurrentA: 3.5, maxCurrentA: 100, maxPowerW: 1500, maxVoltageV: 17, maxRpm: 55000, maxLossW: 180, poles: 4, massKg: 0.25 },
  crawler: { name: 'Crawler 540 21T', kv: 2000, resistanceOhm: 0.04, noLoadCurrentA: 1.5, maxCurrentA: 40, maxPowerW: 300, maxVoltageV: 12, maxRpm: 30000, maxLossW: 80, poles: 2, massKg: 0.17 },
  marine: { name: 'Marine 4074 2000Kv', kv: 2000, resistanceOhm: 0.007, noLoadCurrentA: 3, maxCurrentA: 150, maxPowerW: 3000, maxVoltageV: 26, maxRpm: 55000, maxLossW: 240, poles: 4, massKg: 0.45 },
  // 1650 Kv on 6S keeps the unloaded five-inch tips just under 85 % of the speed of sound: tight.
  quad: { name: 'Quad 2207 1650Kv', kv: 1650, resistanceOhm: 0.065, noLoadCurrentA: 1.2, maxCurrentA: 40, maxPowerW: 800, maxVoltageV: 26, maxRpm: 50000, maxLossW: 135, poles: 14, massKg: 0.033 },
  glider: { name: 'Glider 3520 700Kv', kv: 700, resistanceOhm: 0.03, noLoadCurrentA: 1, maxCurrentA: 60, maxPowerW: 1000, maxVoltageV: 19, maxRpm: 20000, maxLossW: 130, poles: 14, massKg: 0.2 },
} as const;

const CONTROLLERS = {
  shop150: { name: 'Shop 150A 2-6S', maxCells: 6, continuousCurrentA: 150, burstCurrentA: 900, resistanceOhm: 0.0008, massKg: 0.2 },
  stadium80: { name: 'Stadium 80A 2-4S', maxVoltageV: 17.4, continuousCurrentA: 80, burstCurrentA: 380, resistanceOhm: 0.001, massKg: 0.09 },
  crawler40: { name: 'Crawler 40A brushed', maxVoltageV: 12, continuousCurrentA: 40, burstCurrentA: 180, massKg: 0.06 },
  marine180: { name: 'Marine 180A water-cooled', maxCells: 8, continuousCurrentA: 180, burstCurrentA: 900, resistanceOhm: 0.0005, massKg: 0.17 },
  quad45: { name: '4-in-1 45A', maxCells: 6, continuousCurrentA: 45, burstCurrentA: 55, resistanceOhm: 0.004, massKg: 0.015 },
  glider60: { name: 'Glider 60A', maxCells: 4, continuousCurrentA: 60, burstCurrentA: 80, resistanceOhm: 0.002, massKg: 0.06 },
} as const;

const PROPS = {
  boat: { name: 'Hull prop 42 mm 2-blade', diameterMm: 42, pitchMm: 58, blades: 2, thrustCoefficient: 0.22, powerCoefficient: 0.09 },
  quad: { name: '5.1 × 4.5 tri-blade', diameterMm: 129.5, pitchMm: 114, blades: 3, thrustCoefficient: 0.13, powerCoefficient: 0.065 },
  glider: { name: 'Folding 12 × 6', diameterMm: 305, pitchMm: 152, blades: 2, thrustCoefficient: 0.1, powerCoefficient: 0.04 },
} as const;

const VEHICLES = {
  buggy: { name: 'Track buggy #7', kind: 'car', massKg: 1.75, dragAreaM2: 0.02, rollingCoefficient: 0.03, tractionCoefficient: 1.0, customer: 'dana', className: 'Club 2WD' },
  sct: { name: 'Short-course truck', kind: 'truck', massKg: 3.2, dragAreaM2: 0.045, rollingCoefficient: 0.04, tractionCoefficient: 0.9, customer: 'dana', className: '' },
  monster: { name: 'Shop monster truck', kind: 'truck', massKg: 4.8, dragAreaM2: 0.06, rollingCoefficient: 0.05, tractionCoefficient: 0.9, customer: 'ravi', className: '' },
  crawler: { name: 'Scale crawler', kind: 'truck', massKg: 2.4, dragAreaM2: 0.05, rollingCoefficient: 0.06, tractionCoefficient: 1.1, customer: 'mika', className: '' },
  boat: { name: 'Deep-V racer', kind: 'boat', massKg: 2.9, water: 'fresh', customer: 'ravi', className: 'Offshore' },
  quad: { name: 'Five-inch quad', kind: 'multirotor', massKg: 0.65, customer: 'mika', className: '' },
  glider: { name: 'Club glider', kind: 'plane', massKg: 1.8, customer: 'dana', className: '' },
} as const;

const CUSTOMERS = {
  dana: { name: 'Dana Okafor', contact: 'dana.okafor@example.org' },
  ravi: { name: 'Ravi Lindqvist', contact: 'phone 555-0188' },
  mika: { name: 'Mika Tanaka', contact: '' },
};

export interface SeededFleet {
  customers: Record<keyof typeof CUSTOMERS, string>;
  packs: Record<keyof typeof PACKS, string>;
  motors: Record<keyof typeof MOTORS, string>;
  controllers: Record<keyof typeof CONTROLLERS, string>;
  propellers: Record<keyof typeof PROPS, string>;
  vehicles: Record<keyof typeof VEHICLES, string>;
  builds: Record<string, string>;
}

async function createAll<K extends string>(api: Api, handler: string, rows: Record<K, object>): Promise<Record<K, string>> {
  const out = {} as Record<K, string>;
  for (const [key, row] of Object.entries(rows) as [K, object][]) out[key] = (await api<Stored>(handler, row)).id;
  return out;
}

export async function seedFleet(api: Api): Promise<SeededFleet> {
  const packs = await createAll(api, 'batteries.create', PACKS);
  const motors = await createAll(api, 'motors.create', MOTORS);
  const controllers = await createAll(api, 'controllers.create', CONTROLLERS);
  const propellers = await createAll(api, 'propellers.create', PROPS);
  const customers = await createAll(api, 'customers.create', CUSTOMERS);
  // A vehicle names its customer by the seed's key; the rest are the shop's own.
  const vehicleRows = Object.fromEntries(
    Object.entries(VEHICLES).map(([key, row]) => {
      const { customer, ...rest } = row as { customer?: keyof typeof CUSTOMERS };
      return [key, customer ? { ...rest, customerId: customers[customer] } : rest];
    }),
  ) as Record<keyof typeof VEHICLES, object>;
  const vehicles = await createAll(api, 'vehicles.create', vehicleRows);
  const one = (id: string) => [{ arrangement: 'series', batteryIds: [id] }];
  const builds: Record<string, object> = {
    buggyRace: {
      name: 'Buggy club race',
      vehicleId: vehicles.buggy,
      motorId: motors.stadium,
      controllerId: controllers.stadium80,
      supplies: one(packs.club2s),
      gearing: { pinionTeeth: 19, spurTeeth: 87, internalRatio: 2.6, tireDiameterMm: 83, drivetrainEfficiency: 0.9 },
    },
    buggyBash: {
      name: 'Buggy 4S bash',
      vehicleId: vehicles.buggy,
      motorId: motors.shop2050,
      controllerId: controllers.shop150,
      supplies: one(packs.shop4s1),
      gearing: { pinionTeeth: 13, spurTeeth: 54, internalRatio: 2.6, tireDiameterMm: 83, drivetrainEfficiency: 0.9 },
    },
    sct: {
      name: 'SC truck 4S',
      vehicleId: vehicles.sct,
      motorId: motors.shop2050,
      controllerId: controllers.shop150,
      supplies: one(packs.shop4s1),
      gearing: { pinionTeeth: 14, spurTeeth: 50, internalRatio: 2.85, tireDiameterMm: 110, drivetrainEfficiency: 0.88 },
    },
    sctAlt: {
      name: 'SC truck spare pack',
      vehicleId: vehicles.sct,
      motorId: motors.shop2050,
      controllerId: controllers.shop150,
      supplies: one(packs.shop4s2),
      gearing: { pinionTeeth: 14, spurTeeth: 50, internalRatio: 2.85, tireDiameterMm: 110, drivetrainEfficiency: 0.88 },
    },
    monster6s: {
      name: 'Monster 6S',
      vehicleId: vehicles.monster,
      motorId: motors.shop2050,
      controllerId: controllers.shop150,
      supplies: one(packs.basher6s),
      gearing: { pinionTeeth: 15, spurTeeth: 46, internalRatio: 3.6, tireDiameterMm: 170, drivetrainEfficiency: 0.85 },
    },
    monster8s: {
      name: 'Monster 2 × 4S in series',
      vehicleId: vehicles.monster,
      motorId: motors.shop2050,
      controllerId: controllers.shop150,
      supplies: [{ arrangement: 'series', batteryIds: [packs.shop4s1, packs.shop4s2] }],
      gearing: { pinionTeeth: 13, spurTeeth: 46, internalRatio: 3.6, tireDiameterMm: 170, drivetrainEfficiency: 0.85 },
    },
    crawler: {
      name: 'Crawler trail',
      vehicleId: vehicles.crawler,
      motorId: motors.crawler,
      controllerId: controllers.crawler40,
      supplies: one(packs.nimh),
      gearing: { pinionTeeth: 11, spurTeeth: 87, internalRatio: 3.0, tireDiameterMm: 108, drivetrainEfficiency: 0.8 },
    },
    crawlerNoEsc: {
      name: 'Crawler rebuild',
      vehicleId: vehicles.crawler,
      motorId: motors.crawler,
      controllerId: null,
      supplies: one(packs.nimh),
      gearing: { pinionTeeth: 11, spurTeeth: 87, internalRatio: 3.0, tireDiameterMm: 108, drivetrainEfficiency: 0.8 },
    },
    boat: { name: 'Deep-V 6S', vehicleId: vehicles.boat, motorId: motors.marine, controllerId: controllers.marine180, propellerId: propellers.boat, supplies: [{ arrangement: 'series', batteryIds: [packs.boatA, packs.boatB] }] },
    quad: { name: 'Freestyle 6S', vehicleId: vehicles.quad, motorId: motors.quad, motorCount: 4, controllerId: controllers.quad45, propellerId: propellers.quad, supplies: one(packs.quad6s) },
    glider: { name: 'Glider climb', vehicleId: vehicles.glider, motorId: motors.glider, controllerId: controllers.glider60, propellerId: propellers.glider, supplies: one(packs.liion) },
  };
  const buildIds: Record<string, string> = {};
  for (const [key, row] of Object.entries(builds)) buildIds[key] = (await api<{ record: Stored }>('builds.create', row)).record.id;
  return { packs, motors, controllers, propellers, customers, vehicles, builds: buildIds };
}
