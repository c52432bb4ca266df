import { test, expect } from './local-shell';
import { openApp, seedOneBuild, TRUCK_GEARING, type StoredRecord } from './app-helpers';

test('the build sheet shows the run, each parallel pack with the worst named, and what was assumed', async ({ page, shell }) => {
  const { build, car, motor, esc } = await seedOneBuild(shell);
  const small = await shell.api<StoredRecord>('batteries.create', { name: 'Small 4S 2200', chemistry: 'lipo', cellsSeries: 4, capacityMah: 2200, cRatingContinuous: 25, cRatingBurst: 50, cellResistanceOhm: 0.002 });
  const big = await shell.api<StoredRecord>('batteries.create', { name: 'Big 4S 8000', chemistry: 'lipo', cellsSeries: 4, capacityMah: 8000, cRatingContinuous: 25, cRatingBurst: 50, cellResistanceOhm: 0.01 });
  const pair = await shell.api<{ record: StoredRecord }>('builds.create', {
    name: 'Truck on a mixed pair',
    vehicleId: car.id,
    motorId: motor.id,
    controllerId: esc.id,
    supplies: [{ arrangement: 'parallel', batteryIds: [small.id, big.id] }],
    gearing: TRUCK_GEARING,
  });

  await openApp(page, shell, `#/builds/${build.id}`);
  const sheet = page.getByTestId('build-sheet');
  // A truck: the run chart (current and speed against time) and the assumptions it rests on.
  await expect(sheet.getByText(/Full-throttle run from standstill, 4\.0 s \(default length\)/)).toBeVisible();
  await expect(sheet.getByRole('img', { name: /Supply current and speed against time/ })).toBeVisible();
  await expect(sheet.getByTestId('assumptions')).toContainText('RMS current over a 4 s full-throttle run');

  await openApp(page, shell, `#/builds/${pair.record.id}`);
  const shares = page.getByTestId('pack-shares');
  await expect(shares).toBeVisible();
  // The small, stiffer pack takes 10 ÷ 12 of the current (current division: R_big ÷ (R_small + R_big)).
  await expect(shares.locator('tr.worst')).toContainText('Small 4S 2200');
  await expect(shares.locator('tr.worst')).toContainText('worst pack');
  await expect(shares.locator('tr.worst')).toContainText('83 %');
  await expect(page.getByTestId('assumptions')).toContainText('conductance');
});

test('a boat shows pitch speed and both tip speeds, not a tyre speed', async ({ page, shell }) => {
  const { motor, esc, pack } = await seedOneBuild(shell);
  const boat = await shell.api<StoredRecord>('vehicles.create', { name: 'Lake boat', kind: 'boat', massKg: 2, water: 'fresh' });
  const prop = await shell.api<StoredRecord>('propellers.create', { name: '40 mm brass', diameterMm: 40, pitchMm: 56, blades: 2, thrustCoefficient: 0.1, powerCoefficient: 0.05 });
  const build = await shell.api<{ record: StoredRecord }>('builds.create', {
    name: 'Lake boat 4S',
    vehicleId: boat.id,
    motorId: motor.id,
    controllerId: esc.id,
    propellerId: prop.id,
    supplies: [{ batteryIds: [pack.id] }],
  });
  await openApp(page, shell, `#/builds/${build.record.id}`);
  const supply = page.getByTestId('supply').first();
  await expect(supply).toContainText('Pitch speed');
  await expect(supply).toContainText('Tip speed, static');
  await expect(supply).toContainText('Tip speed, unloaded');
  await expect(supply).not.toContainText('Theoretical speed');
  await expect(page.getByTestId('assumptions')).toContainText('Fresh water, 1000 kg/m³');
});
