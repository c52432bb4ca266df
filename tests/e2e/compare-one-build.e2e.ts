import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp, seedOneBuild, type SheetValue, type StoredRecord } from './app-helpers';
import { expectNoAxeViolations } from './axe-check';

// One build compared with itself: its supplies side by side, or as built beside a change tried
// on the swap screen. Both print; neither writes anything.

test("a build's supplies side by side: a column each, the differing rows marked, printable", async ({ page, shell }) => {
  const { build, pack } = await seedOneBuild(shell);
  const small = await shell.api<StoredRecord>('batteries.create', { name: 'Test 2S 5000', chemistry: 'lipo', cellsSeries: 2, capacityMah: 5000, cRatingContinuous: 50, cRatingBurst: 100, cellResistanceOhm: 0.003 });
  await shell.api('builds.update', { id: build.id, expectedVersion: build.version, changes: { supplies: [{ batteryIds: [pack.id] }, { batteryIds: [small.id] }] } });

  await openApp(page, shell, `#/builds/${build.id}`);
  await page.getByRole('link', { name: 'Compare supplies' }).click();
  await expect(page).toHaveURL(/#\/compare\?ids=[^&]+&supplies=1$/u);
  const view = page.getByTestId('compare');
  await expect(view.getByRole('heading', { level: 1, name: 'Supplies of Test truck 4S side by side' })).toBeVisible();
  const columns = view.getByTestId('compare-checks').getByTestId('compare-column');
  await expect(columns).toHaveCount(2);
  await expect(columns.nth(0)).toContainText('Supply 1');
  await expect(columns.nth(0)).toContainText('Test 4S 5000');
  await expect(columns.nth(1)).toContainText('Test 2S 5000');

  const figures = view.getByTestId('compare-figures');
  // Full charge: 4 × 4.20 V and 2 × 4.20 V (cell makers' sheets): the row differs and says so.
  const full = figures.locator('[data-key="packVoltageFullV"]');
  await expect(full).toHaveAttribute('data-differs', 'true');
  await expect(full.locator('td').nth(0)).toHaveText('16.80 V');
  await expect(full.locator('td').nth(1)).toHaveText('8.40 V');
  // One gearing for both supplies: the ratio row is the same and unmarked.
  const ratio = figures.locator('[data-key="finalDriveRatio"]');
  await expect(ratio).toHaveAttribute('data-differs', 'false');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/compare-supplies.png`, fullPage: true });
  await expectNoAxeViolations(page, 'compare supplies');

  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('navigation', { name: 'Breadcrumb' })).toBeHidden();
  await expect(page.getByTestId('compare-figures')).toBeVisible();
  await page.screenshot({ path: `${SCREENSHOT_DIR}/compare-supplies-print.png`, fullPage: true });
  await page.emulateMedia({ media: 'screen' });
});

test('a build as built beside a draft part: previewed afresh from the address, nothing written', async ({ page, shell }) => {
  const { build, motor } = await seedOneBuild(shell);
  const before = await shell.api<SheetValue>('builds.get', { id: build.id });
  const historyBefore = await shell.api<unknown[]>('history.list', {});

  await openApp(page, shell, `#/builds/${build.id}/swap`);
  await page.getByRole('tab', { name: "Try a part you don't own" }).click();
  const form = page.getByTestId('draft-part');
  await form.getByLabel('Kind of draft part').selectOption({ label: 'motor' });
  const typed = { name: 'Draft 2650Kv', kv: '2650', resistanceOhm: '6', noLoadCurrentA: '3', maxCurrentA: '100', maxPowerW: '1800', maxVoltageV: '26', maxRpm: '60000' };
  for (const [key, value] of Object.entries(typed)) await form.locator(`input[name="${key}"]`).fill(value);
  await page.getByRole('button', { name: 'Preview' }).click();
  await page.getByTestId('compare-change').click();

  await expect(page).toHaveURL(/#\/compare\?ids=[^&]+&change=/u);
  const check = async () => {
    const view = page.getByTestId('compare');
    await expect(view.getByRole('heading', { level: 1 })).toHaveText('Test truck 4S: as built and with the draft motor "Draft 2650Kv"');
    const columns = view.getByTestId('compare-checks').getByTestId('compare-column');
    await expect(columns).toHaveCount(2);
    await expect(columns.nth(0)).toContainText('As built');
    await expect(columns.nth(1)).toContainText('With the change');
    // No-load speed = Kv × 14.8 V nominal (4 × 3.70 V, cell makers' sheets): 2200 and 2650 rpm/V.
    const rpm = view.getByTestId('compare-figures').locator('[data-key="noLoadRpm"]');
    await expect(rpm).toHaveAttribute('data-differs', 'true');
    await expect(rpm.locator('td').nth(0)).toHaveText('32,560 rpm');
    await expect(rpm.locator('td').nth(1)).toHaveText('39,220 rpm');
    // The pack is the same: its voltage row is not marked.
    await expect(view.getByTestId('compare-figures').locator('[data-key="packVoltageFullV"]')).toHaveAttribute('data-differs', 'false');
  };
  await check();
  await page.screenshot({ path: `${SCREENSHOT_DIR}/compare-draft-change.png`, fullPage: true });
  await expectNoAxeViolations(page, 'compare with a draft change');
  await page.reload();
  await check();

  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('navigation', { name: 'Breadcrumb' })).toBeHidden();
  await page.screenshot({ path: `${SCREENSHOT_DIR}/compare-draft-change-print.png`, fullPage: true });
  await page.emulateMedia({ media: 'screen' });

  // Previewed twice and printed: the store is as it was.
  expect((await shell.api<StoredRecord[]>('motors.list', {})).map((m) => m.id)).toEqual([motor.id]);
  const after = await shell.api<SheetValue>('builds.get', { id: build.id });
  expect(after.build.version).toBe(before.build.version);
  expect(after.verdict).toEqual(before.verdict);
  expect(await shell.api<unknown[]>('history.list', {})).toHaveLength(historyBefore.length);
});

test('a part swapped from the inventory compares the same way', async ({ page, shell }) => {
  const { build } = await seedOneBuild(shell);
  await shell.api<StoredRecord>('controllers.create', { name: 'Test 60A small', maxCells: 3, continuousCurrentA: 60, burstCurrentA: 120, resistanceOhm: 0.002 });
  await openApp(page, shell, `#/builds/${build.id}/swap`);
  await page.getByLabel('Part to replace').selectOption({ label: 'Speed controller: Test 150A' });
  await page.getByLabel('Replacement').selectOption({ label: 'Test 60A small' });
  await page.getByRole('button', { name: 'Preview' }).click();
  await page.getByTestId('compare-change').click();
  const view = page.getByTestId('compare');
  await expect(view.getByRole('heading', { level: 1 })).toHaveText('Test truck 4S: as built and with speed controller Test 60A small');
  // A 3-cell controller taken at 4.2 V a cell (common practice) = 12.6 V, under the 4S pack's 16.8 V: over.
  const volts = view.getByTestId('compare-checks').locator('[data-key="controller-voltage"]');
  await expect(volts).toHaveAttribute('data-differs', 'true');
  await expect(volts.locator('td').nth(1).locator('[data-status]').first()).toHaveAttribute('data-status', 'over');
});
