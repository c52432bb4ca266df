import { test, expect } from './local-shell';
import { openApp, seedOneBuild, type SheetValue, type StoredRecord } from './app-helpers';

test('swap preview: cancel changes nothing, save writes it and history shows it', async ({ page, shell }) => {
  const { build } = await seedOneBuild(shell);
  const bigger = await shell.api<StoredRecord>('motors.create', { name: 'Test 2650Kv hot', kv: 2650, resistanceOhm: 0.006, noLoadCurrentA: 3, maxCurrentA: 100, maxPowerW: 1800, maxVoltageV: 26, maxRpm: 60000 });
  const before = await shell.api<SheetValue>('builds.get', { id: build.id });
  const historyBefore = await shell.api<unknown[]>('history.list', { buildId: build.id });

  await openApp(page, shell, `#/builds/${build.id}`);
  await page.getByRole('link', { name: 'Swap preview' }).click();
  await page.getByLabel('Part to replace').selectOption({ label: 'Motor: Test 2200Kv' });
  await page.getByLabel('Replacement').selectOption({ label: 'Test 2650Kv hot' });
  await page.getByRole('button', { name: 'Preview' }).click();
  const result = page.getByTestId('preview-result');
  await expect(result).toBeVisible();
  // Before and after side by side: the no-load speed rises with the higher Kv (2200 → 2650 rpm/V at 14.8 V nominal).
  const rpm = result.locator('[data-testid="preview-figure"][data-key="noLoadRpm"]');
  await expect(rpm.locator('.before')).toHaveText('32,560 rpm');
  await expect(rpm.locator('.after')).toHaveText('39,220 rpm');
  await expect(result.locator('[data-testid="preview-check"]').first()).toBeVisible();

  await page.getByRole('button', { name: 'Cancel' }).click();
  await expect(page.getByTestId('build-sheet')).toBeVisible();
  const afterCancel = await shell.api<SheetValue>('builds.get', { id: build.id });
  expect(afterCancel.build.version).toBe(before.build.version);
  expect(afterCancel.build.motorId).toBe(before.build.motorId);
  expect(afterCancel.verdict).toEqual(before.verdict);
  expect(await shell.api<unknown[]>('history.list', { buildId: build.id })).toHaveLength(historyBefore.length);

  // Again, and this time save with a reason.
  await page.getByRole('link', { name: 'Swap preview' }).click();
  await page.getByLabel('Part to replace').selectOption({ label: 'Motor: Test 2200Kv' });
  await page.getByLabel('Replacement').selectOption({ label: 'Test 2650Kv hot' });
  await page.getByRole('button', { name: 'Preview' }).click();
  await expect(page.getByTestId('preview-result')).toBeVisible();
  const previewed = await page.getByTestId('preview-result').locator('.overall [data-status]').last().getAttribute('data-status');
  await page.getByLabel('Reason (kept in history)').fill('customer wants more top speed');
  await page.getByRole('button', { name: 'Save this change' }).click();
  await expect(page.getByTestId('build-sheet')).toBeVisible();
  const saved = await shell.api<SheetValue>('builds.get', { id: build.id });
  expect(saved.build.motorId).toBe(bigger.id);
  expect(saved.build.version).toBe(before.build.version + 1);
  // What the preview promised is what was stored.
  expect(saved.verdict?.status).toBe(previewed);

  await page.getByTestId('build-sheet').getByRole('link', { name: 'History', exact: true }).click();
  const entry = page.getByTestId('history-entry').first();
  await expect(entry).toContainText('Changed build');
  await expect(entry).toContainText('customer wants more top speed');
  await expect(entry).toContainText('Motor');
  await expect(entry).toContainText('Test 2200Kv');
  await expect(entry).toContainText('Test 2650Kv hot');
});

test("editing a shared pack's rating previews every build that uses it", async ({ page, shell }) => {
  const { pack, build, car, motor, esc } = await seedOneBuild(shell);
  const other = await shell.api<{ record: StoredRecord }>('builds.create', {
    name: 'Second truck on the same pack',
    vehicleId: car.id,
    motorId: motor.id,
    controllerId: esc.id,
    supplies: [{ arrangement: 'series', batteryIds: [pack.id] }],
    gearing: { pinionTeeth: 12, spurTeeth: 50, internalRatio: 2.85, tireDiameterMm: 110, drivetrainEfficiency: 0.88 },
  });
  await openApp(page, shell, `#/builds/${build.id}/swap`);
  await page.getByRole('tab', { name: "Edit a shared part's ratings" }).click();
  await page.getByLabel('Part record').selectOption({ label: 'pack: Test 4S 5000' });
  await page.getByLabel('Field').selectOption({ label: 'Continuous C rating (C)' });
  await expect(page.getByLabel('New value')).toHaveValue('50');
  // 2 C × 5 Ah = 10 A continuous, below what either truck draws at top speed.
  await page.getByLabel('New value').fill('2');
  await page.getByRole('button', { name: 'Preview' }).click();
  const others = page.getByTestId('preview-other');
  await expect(others).toHaveCount(1);
  await expect(others.first()).toContainText('Second truck on the same pack');
  await expect(others.first().locator('[data-status]').last()).toHaveAttribute('data-status', 'over');
  // Nothing stored by the preview.
  const stored = await shell.api<StoredRecord>('batteries.get', { id: pack.id });
  expect(stored.cRatingContinuous).toBe(50);
  expect(stored.version).toBe(pack.version);
  const second = await shell.api<SheetValue>('builds.get', { id: other.record.id });
  expect(second.verdict?.status).not.toBe('over');
});
