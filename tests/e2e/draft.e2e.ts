import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp, seedOneBuild, type SheetValue, type StoredRecord } from './app-helpers';

// A part typed in on the swap screen is tried and thrown away: the store is the same until the
// person asks for the part to be added, and then only the part is added, in no build.
test("try a part you don't own: previewed without a write, added to the inventory only when asked", async ({ page, shell }) => {
  const { build, motor } = await seedOneBuild(shell);
  const before = await shell.api<SheetValue>('builds.get', { id: build.id });
  const historyBefore = await shell.api<unknown[]>('history.list', {});

  await openApp(page, shell, `#/builds/${build.id}/swap`);
  await page.getByRole('tab', { name: "Try a part you don't own" }).click();
  const form = page.getByTestId('draft-part');
  await form.getByLabel('Kind of draft part').selectOption({ label: 'motor' });
  // Only the fields the checks read: no notes (the pole count is asked: the eRPM check reads it;
  // the mass too: without a rated heat loss the heat check takes a rule of thumb on it).
  await expect(form.locator('input[name="kv"]')).toBeVisible();
  await expect(form.locator('[name="poles"]')).toHaveCount(1);
  await expect(form.locator('[name="massKg"]')).toHaveCount(1);
  await expect(form.locator('[name="notes"]')).toHaveCount(0);

  await form.locator('input[name="name"]').fill('Draft 2650Kv');
  await page.getByRole('button', { name: 'Preview' }).click();
  // Kv left empty: named beside its field, nothing sent.
  await expect(form.locator('[data-field="kv"] .error')).toBeVisible();
  await expect(page.getByTestId('preview-result')).toHaveCount(0);

  await form.locator('input[name="kv"]').fill('2650');
  await form.locator('input[name="resistanceOhm"]').fill('6');
  await form.locator('input[name="noLoadCurrentA"]').fill('3');
  await form.locator('input[name="maxCurrentA"]').fill('100');
  await form.locator('input[name="maxPowerW"]').fill('1800');
  await form.locator('input[name="maxVoltageV"]').fill('26');
  await form.locator('input[name="maxRpm"]').fill('60000');
  await page.getByRole('button', { name: 'Preview' }).click();
  const result = page.getByTestId('preview-result');
  await expect(result).toBeVisible();
  await expect(result).toContainText('nothing has been saved');
  // No-load speed = Kv × nominal voltage: 2200 and 2650 rpm/V × 14.8 V (4 × 3.70 V, cell makers' sheets).
  const rpm = result.locator('[data-testid="preview-figure"][data-key="noLoadRpm"]');
  await expect(rpm.locator('.before')).toHaveText('32,560 rpm');
  await expect(rpm.locator('.after')).toHaveText('39,220 rpm');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/swap-draft-part.png`, fullPage: true });

  // Previewed, not saved: the same motors, build and history.
  expect((await shell.api<StoredRecord[]>('motors.list', {})).map((m) => m.id)).toEqual([motor.id]);
  const afterPreview = await shell.api<SheetValue>('builds.get', { id: build.id });
  expect(afterPreview.build.version).toBe(before.build.version);
  expect(afterPreview.verdict).toEqual(before.verdict);
  expect(await shell.api<unknown[]>('history.list', {})).toHaveLength(historyBefore.length);

  // Asked for: the part alone is added, the build keeps its motor.
  await page.getByRole('button', { name: 'Add this part to the inventory' }).click();
  await expect(page.getByTestId('draft-added')).toContainText('Draft 2650Kv');
  const motors = await shell.api<(StoredRecord & { kv: number; resistanceOhm: number })[]>('motors.list', {});
  const added = motors.find((m) => m.name === 'Draft 2650Kv');
  // What was typed is what is stored: 6 mΩ is 0.006 Ω.
  expect(added).toMatchObject({ kv: 2650, resistanceOhm: 0.006 });
  expect((await shell.api<SheetValue>('builds.get', { id: build.id })).build.motorId).toBe(motor.id);

  // The added part can then be swapped in as any other: the replacement list has it chosen.
  await page.getByRole('button', { name: "Try it in this build's place" }).click();
  await expect(page.getByRole('tab', { name: 'Replace a part' })).toHaveAttribute('aria-selected', 'true');
  await expect(page.getByLabel('Replacement')).toHaveValue(added!.id);
});

test('a draft pack tried on every build of the vehicle re-checks each of them, and saves nothing', async ({ page, shell }) => {
  const { build, car, motor, esc, pack } = await seedOneBuild(shell);
  const other = await shell.api<{ record: StoredRecord }>('builds.create', {
    name: 'Second truck, same vehicle',
    vehicleId: car.id,
    motorId: motor.id,
    controllerId: esc.id,
    supplies: [{ arrangement: 'series', batteryIds: [pack.id] }],
    gearing: { pinionTeeth: 12, spurTeeth: 50, internalRatio: 2.85, tireDiameterMm: 110, drivetrainEfficiency: 0.88 },
  });
  const packsBefore = await shell.api<StoredRecord[]>('batteries.list', {});

  await openApp(page, shell, `#/builds/${build.id}/swap`);
  await page.getByRole('tab', { name: "Try a part you don't own" }).click();
  const form = page.getByTestId('draft-part');
  await form.getByLabel('Kind of draft part').selectOption({ label: 'pack' });
  await form.getByLabel('Builds to try it on').selectOption({ label: 'every active build of this vehicle' });
  await form.locator('input[name="name"]').fill('Draft 2S 5000');
  await form.locator('input[name="cellsSeries"]').fill('2');
  await form.locator('input[name="capacityMah"]').fill('5000');
  await form.locator('input[name="cRatingContinuous"]').fill('50');
  await form.locator('input[name="cRatingBurst"]').fill('100');
  await page.getByRole('button', { name: 'Preview' }).click();
  const result = page.getByTestId('preview-result');
  await expect(result).toBeVisible();
  // Full charge: 2 × 4.20 V where the 4S pack gave 4 × 4.20 V (cell makers' sheets).
  const volts = result.locator('[data-testid="preview-figure"][data-key="packVoltageFullV"]');
  await expect(volts.locator('.before')).toHaveText('16.80 V');
  await expect(volts.locator('.after')).toHaveText('8.40 V');
  await expect(page.getByTestId('preview-other')).toHaveCount(1);
  await expect(page.getByTestId('preview-other').first()).toContainText('Second truck, same vehicle');
  // The supply names the pack the draft stands in for.
  await expect(result.getByRole('region', { name: 'Supply 1 before and after' })).toContainText('Test 4S 5000 → draft "Draft 2S 5000"');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/swap-draft-pack-vehicle.png`, fullPage: true });

  expect(await shell.api<StoredRecord[]>('batteries.list', {})).toEqual(packsBefore);
  expect((await shell.api<SheetValue>('builds.get', { id: other.record.id })).build.version).toBe(other.record.version);
  await page.getByRole('button', { name: 'Done, keep nothing' }).click();
  await expect(page.getByTestId('build-sheet')).toBeVisible();
  expect(await shell.api<StoredRecord[]>('batteries.list', {})).toEqual(packsBefore);
});
