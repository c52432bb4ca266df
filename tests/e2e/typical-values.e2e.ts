import { test, expect } from './local-shell';
import { SCREENSHOT_DIR } from './local-shell';
import { openApp, TRUCK_GEARING, type StoredRecord } from './app-helpers';

// An owner enters a truck the way most do: kind and mass, no drag area, rolling coefficient or
// grip. The sheet checks every current on typical values, marks the figures resting on them and
// reads no better than tight; ticking "Typical values confirmed" on the vehicle lets it read clear.

test('a truck on typical values reads tight with its figures marked, and clear once the values are confirmed', async ({ page, shell }) => {
  const pack = await shell.api<StoredRecord>('batteries.create', { name: 'Roomy 4S 5000', chemistry: 'lipo', cellsSeries: 4, capacityMah: 5000, cRatingContinuous: 500, cRatingBurst: 1000, cellResistanceOhm: 0.003 });
  const motor = await shell.api<StoredRecord>('motors.create', { name: 'Roomy 2200Kv', kv: 2200, resistanceOhm: 0.008, noLoadCurrentA: 2.4, maxCurrentA: 2000, maxPowerW: 100_000, maxVoltageV: 26, maxRpm: 100_000 });
  const esc = await shell.api<StoredRecord>('controllers.create', { name: 'Roomy 2000A', maxVoltageV: 26, continuousCurrentA: 2000, burstCurrentA: 4000, resistanceOhm: 0.0008 });
  const truck = await shell.api<StoredRecord>('vehicles.create', { name: 'Blue short-course truck', kind: 'truck', massKg: 3, surface: 'dirt' });
  const build = await shell.api<{ record: StoredRecord }>('builds.create', {
    name: 'Blue truck on 4S',
    vehicleId: truck.id,
    motorId: motor.id,
    controllerId: esc.id,
    supplies: [{ batteryIds: [pack.id] }],
    gearing: TRUCK_GEARING,
  });

  await openApp(page, shell, `#/builds/${build.record.id}`);
  const supply = page.getByTestId('supply').first();
  const used = supply.getByTestId('values-used');
  await expect(used).toContainText('Rolling coefficient: 0.08, typical value for the kind and surface');
  await expect(used).toContainText('Tyre grip μ: 0.7');
  await expect(supply.getByTestId('deciding-checks')).toContainText('typical values not yet confirmed');
  await expect(supply.getByTestId('typical-tag').first()).toBeVisible();
  await supply.getByText('All figures, by stage of the power path').click();
  await expect(supply.getByTestId('figure-mark').first()).toHaveText('typical value used');
  expect((await shell.api<{ verdict: { status: string } }>('builds.get', { id: build.record.id })).verdict.status).toBe('tight');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/typical-values-unconfirmed.png`, fullPage: true });
  // The printed sheet carries the wider figures and the values they rest on.
  await page.emulateMedia({ media: 'print' });
  await expect(supply.getByTestId('wider-figures')).toContainText('Run time to the depth of discharge');
  await expect(supply.getByTestId('wider-figures')).toContainText('Heat loss per motor');
  await expect(supply.getByTestId('wider-figures').getByTestId('figure-mark').first()).toBeVisible();
  await expect(used).toBeVisible();
  await page.screenshot({ path: `${SCREENSHOT_DIR}/typical-values-print.png`, fullPage: true });
  await page.emulateMedia({ media: 'screen' });

  await page.evaluate((id) => (window.location.hash = `#/vehicles/${id}`), truck.id);
  const form = page.getByRole('form', { name: 'Edit vehicle' });
  await form.getByLabel('Typical values confirmed (drag area, rolling coefficient, grip)').check();
  await form.getByRole('button', { name: 'Save changes' }).click();
  await expect(form.getByRole('status')).toContainText('Saved');
  expect((await shell.api<{ typicalValuesConfirmed: boolean }>('vehicles.get', { id: truck.id })).typicalValuesConfirmed).toBe(true);

  await openApp(page, shell, `#/builds/${build.record.id}`);
  const after = page.getByTestId('supply').first();
  await expect(after.getByTestId('deciding-checks')).toContainText('Every check is clear');
  await expect(after.getByTestId('typical-tag')).toHaveCount(0);
  await expect(after.getByTestId('values-used')).toContainText('Rolling coefficient: 0.08');
  expect((await shell.api<{ verdict: { status: string } }>('builds.get', { id: build.record.id })).verdict.status).toBe('clear');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/typical-values-confirmed.png`, fullPage: true });
});
