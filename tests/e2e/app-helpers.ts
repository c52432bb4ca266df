import type { Page } from '@playwright/test';
import type { Shell } from './local-shell';

/** Opens the app with the shell's token, then goes to a screen by its address. */
export async function openApp(page: Page, shell: Shell, hash = '#/builds'): Promise<void> {
  await page.goto(shell.openUrl);
  await page.evaluate((h) => {
    window.location.hash = h;
  }, hash);
}

export interface StoredRecord {
  id: string;
  version: number;
  [key: string]: unknown;
}

/** A minimal pack + motor + controller + car + build, for tests that need one build and nothing else. */
/** The test truck's gearing: seedOneBuild's build, and the tests' other builds on the same truck. */
export const TRUCK_GEARING = { pinionTeeth: 14, spurTeeth: 50, internalRatio: 2.85, tireDiameterMm: 110, drivetrainEfficiency: 0.88 };

export async function seedOneBuild(shell: Shell, overrides: { cRatingContinuous?: number; cRatingBurst?: number } = {}) {
  const pack = await shell.api<StoredRecord>('batteries.create', {
    name: 'Test 4S 5000',
    chemistry: 'lipo',
    cellsSeries: 4,
    capacityMah: 5000,
    cRatingContinuous: overrides.cRatingContinuous ?? 50,
    cRatingBurst: overrides.cRatingBurst ?? 100,
    cellResistanceOhm: 0.003,
  });
  const motor = await shell.api<StoredRecord>('motors.create', {
    name: 'Test 2200Kv',
    kv: 2200,
    resistanceOhm: 0.008,
    noLoadCurrentA: 2.4,
    maxCurrentA: 140,
    maxPowerW: 2600,
    maxVoltageV: 26,
    maxRpm: 60000,
  });
  const esc = await shell.api<StoredRecord>('controllers.create', { name: 'Test 150A', maxCells: 6, continuousCurrentA: 150, burstCurrentA: 900, resistanceOhm: 0.0008 });
  const car = await shell.api<StoredRecord>('vehicles.create', {
    name: 'Test truck',
    kind: 'truck',
    massKg: 3.2,
    dragAreaM2: 0.045,
    rollingCoefficient: 0.04,
    tractionCoefficient: 0.9,
    customerId: (await shell.api<StoredRecord>('customers.create', { name: 'Test customer' })).id,
  });
  const build = await shell.api<{ record: StoredRecord }>('builds.create', {
    name: 'Test truck 4S',
    vehicleId: car.id,
    motorId: motor.id,
    controllerId: esc.id,
    supplies: [{ arrangement: 'series', batteryIds: [pack.id] }],
    gearing: TRUCK_GEARING,
  });
  return { pack, motor, esc, car, build: build.record };
}

export interface SheetValue {
  build: StoredRecord & { motorId: string | null; gearing: Record<string, number | null> };
  verdict: { status: string; supplies: { status: string; figures: Record<string, number | null> }[] } | null;
}
