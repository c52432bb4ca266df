import { test, expect } from './local-shell';
import { openApp, seedOneBuild, type SheetValue, type StoredRecord } from './app-helpers';

test('add a pack and a build through the forms and see the verdict the service computed', async ({ page, shell }) => {
  await shell.api('motors.create', { name: 'Bench 3300Kv', kv: 3300, resistanceOhm: 0.012, noLoadCurrentA: 3.5, maxCurrentA: 100, maxPowerW: 1500, maxVoltageV: 17, maxRpm: 55000 });
  await shell.api('controllers.create', { name: 'Bench 80A', maxVoltageV: 17.4, continuousCurrentA: 80, burstCurrentA: 380 });
  await shell.api('vehicles.create', { name: 'Bench buggy', kind: 'car', massKg: 1.75, dragAreaM2: 0.02, rollingCoefficient: 0.03, tractionCoefficient: 1 });

  await openApp(page, shell, '#/parts/packs/new');
  const packForm = page.getByRole('form', { name: 'Add pack' });
  await packForm.getByLabel('Name').fill('Bench 2S 6500');
  await packForm.getByLabel('Cells in series (S)').fill('2');
  await packForm.getByLabel('Capacity (mAh)').fill('6500');
  await packForm.getByLabel('Continuous C rating (C)').fill('60');
  await packForm.getByLabel('Burst C rating (C)').fill('120');
  await packForm.getByRole('button', { name: 'Add pack' }).click();
  await expect(page.getByTestId('part-row').filter({ hasText: 'Bench 2S 6500' })).toBeVisible();

  await page.evaluate(() => (window.location.hash = '#/builds/new'));
  const form = page.getByRole('form', { name: 'New build' });
  await form.getByLabel('Build name').fill('Bench buggy 2S');
  await form.getByLabel('Vehicle').selectOption({ label: 'Bench buggy · Car' });
  await form.getByLabel('Motor', { exact: true }).selectOption({ label: 'Bench 3300Kv · 3300 rpm/V' });
  await form.getByLabel('Speed controller').selectOption({ label: 'Bench 80A' });
  await form.getByLabel('Pinion (teeth)').fill('19');
  await form.getByLabel('Spur (teeth)').fill('87');
  await form.getByLabel('Internal ratio (:1)').fill('2.6');
  await form.getByLabel('Tyre diameter (mm)').fill('83');
  await form.getByLabel('Supply 1 pack 1').selectOption({ index: 1 });
  await form.getByRole('button', { name: 'Add build' }).click();

  const sheet = page.getByTestId('build-sheet');
  await expect(sheet.getByRole('heading', { name: 'Bench buggy 2S' })).toBeVisible();
  const builds = await shell.api<{ id: string; status: string }[]>('builds.list', {});
  expect(builds).toHaveLength(1);
  const stored = await shell.api<SheetValue>('builds.get', { id: builds[0]!.id });
  // The badge in the header is the stored verdict, and the figures are there with units.
  await expect(sheet.locator('.overall [data-status]')).toHaveAttribute('data-status', stored.verdict!.status);
  await expect(sheet.getByTestId('supply').first()).toContainText('Full-charge voltage');
  await expect(sheet.getByTestId('supply').first()).toContainText('8.40');
  // And the list shows the same verdict.
  await page.evaluate(() => (window.location.hash = '#/builds'));
  const row = page.getByTestId('build-row').filter({ hasText: 'Bench buggy 2S' });
  await expect(row.locator('[data-status]')).toHaveAttribute('data-status', stored.verdict!.status);
  await expect(row).toContainText('8.4 V');
});

test('a pack re-rated by a second client changes the badge in the list without a reload', async ({ page, shell }) => {
  const { pack, build } = await seedOneBuild(shell);
  await openApp(page, shell, '#/builds');
  const row = page.locator(`[data-build-id="${build.id}"]`);
  await expect(row.locator('[data-status]')).toHaveAttribute('data-status', 'clear');
  // A marker on the window: a reload would wipe it.
  await page.evaluate(() => ((window as unknown as { marker: number }).marker = 42));

  // Another window lowers the pack's C rating below what the truck draws continuously.
  await shell.api('batteries.update', { id: pack.id, expectedVersion: pack.version, changes: { cRatingContinuous: 5, cRatingBurst: 6 }, reason: 'bench test: pack puffed' });

  await expect(row.locator('[data-status]')).toHaveAttribute('data-status', 'over');
  await expect(row.getByText('Over', { exact: true })).toBeVisible();
  expect(await page.evaluate(() => (window as unknown as { marker?: number }).marker)).toBe(42);
  const stored = await shell.api<SheetValue>('builds.get', { id: build.id });
  expect(stored.verdict?.status).toBe('over');
});

test('the list draws only a window of rows, filters as you type, and opens a build from the keyboard', async ({ page, shell }) => {
  const { pack, motor, esc, car } = await seedOneBuild(shell);
  const other = await shell.api<StoredRecord>('customers.create', { name: 'Other customer' });
  const boat = await shell.api<StoredRecord>('vehicles.create', { name: 'Pond boat', kind: 'boat', customerId: other.id });
  for (let i = 0; i < 140; i++) {
    await shell.api('builds.create', {
      name: `Fleet build ${String(i).padStart(3, '0')}`,
      vehicleId: i % 2 === 0 ? car.id : boat.id,
      motorId: motor.id,
      controllerId: i % 7 === 0 ? null : esc.id,
      supplies: [{ arrangement: 'series', batteryIds: [pack.id] }],
      gearing: { pinionTeeth: 12 + (i % 10), spurTeeth: 50, internalRatio: 2.85, tireDiameterMm: 110, drivetrainEfficiency: 0.88 },
    });
  }
  await openApp(page, shell, '#/builds');
  await expect(page.getByTestId('build-count')).toHaveText('141 builds');
  const drawn = await page.getByTestId('build-row').count();
  expect(drawn).toBeGreaterThan(10);
  expect(drawn).toBeLessThan(50);

  // Search narrows the list on the client, with no call to the service.
  // Every word must match somewhere: boats (odd numbers) whose name holds "01": 001, 011, 013, 015, 017, 019, 101.
  await page.getByLabel('Search builds').fill('pond 01');
  await expect(page.getByTestId('build-count')).toHaveText('7 of 141 shown');
  await page.getByLabel('Search builds').fill('');
  await page.getByLabel('Customer').selectOption('Other customer');
  await expect(page.getByTestId('build-count')).toHaveText('70 of 141 shown');
  await page.getByLabel('Customer').selectOption('Test customer');
  await page.getByRole('button', { name: /Incomplete/ }).click();
  // The truck's builds without a controller: even multiples of 7 from 0 to 126 → 10 builds.
  await expect(page.getByTestId('build-count')).toHaveText('10 of 141 shown');
  await page.getByRole('button', { name: 'Clear filters' }).click();

  // Sort by name descending, then walk down with the arrow keys and open with Enter.
  await page.getByRole('columnheader', { name: /Build/ }).getByRole('button').click();
  await page.getByRole('columnheader', { name: /Build/ }).getByRole('button').click();
  await page.getByRole('grid', { name: 'Builds' }).focus();
  // Descending: "Test truck 4S", then Fleet build 139, 138 …
  await page.keyboard.press('ArrowDown');
  await page.keyboard.press('ArrowDown');
  await page.keyboard.press('ArrowDown');
  await expect(page.locator('[data-testid="build-row"][aria-selected="true"]')).toContainText('Fleet build 138');
  await page.keyboard.press('End');
  await expect(page.locator('[data-testid="build-row"][aria-selected="true"]')).toContainText('Fleet build 000');
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('build-sheet').getByRole('heading', { name: 'Fleet build 000' })).toBeVisible();
  expect(page.url()).toMatch(/#\/builds\/build-/);
  // A reload keeps the screen.
  await page.reload();
  await expect(page.getByTestId('build-sheet').getByRole('heading', { name: 'Fleet build 000' })).toBeVisible();
});
