import type { Page } from '@playwright/test';
import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp, seedOneBuild, TRUCK_GEARING, type SheetValue, type StoredRecord } from './app-helpers';

// The screens say what their figures mean, keep their state in the address, can be worked by
// keyboard, and never let a change that takes a build past a rating pass unremarked.

async function shot(page: Page, name: string, fullPage = false) {
  await page.screenshot({ path: `${SCREENSHOT_DIR}/${name}.png`, fullPage });
}

interface ListRow {
  id: string;
  name: string;
  status: string;
  peakCurrentA: number | null;
  peakCurrentLimitA: number | null;
  currentRule: string | null;
  archivedAt: string | null;
}

test('the current column names its check (peak or continuous, whose rating), past and near differ in words, and the footer matches the columns', async ({ page, shell }) => {
  // A pack rated 5 C continuous / 6 C burst cannot feed the truck: the pack checks are over.
  const { build } = await seedOneBuild(shell, { cRatingContinuous: 5, cRatingBurst: 6 });
  const rows = await shell.api<ListRow[]>('builds.list', {});
  const row = rows.find((r) => r.id === build.id)!;
  expect(row.status).toBe('over');
  expect(row.currentRule).toMatch(/^battery-(continuous|burst)$/);
  expect(row.peakCurrentA! > row.peakCurrentLimitA!).toBe(true);

  await openApp(page, shell, '#/builds');
  const header = page.getByRole('columnheader', { name: /Current \/ limit/ });
  await expect(header).toBeVisible();
  const cell = page.locator(`[data-build-id="${build.id}"] [data-testid="current-cell"]`);
  const basis = row.currentRule === 'battery-continuous' ? 'cont.' : 'peak';
  await expect(cell).toContainText(`${Math.round(row.peakCurrentA!)} A / ${Math.round(row.peakCurrentLimitA!)} A`);
  await expect(cell).toContainText(`${basis} · pack`);
  // Past the limit is said in a word, not only in red.
  await expect(cell.locator('.mark')).toHaveText('past');
  await expect(cell).toHaveAttribute('title', /against its (continuous|burst) rating/);
  await expect(page.getByRole('columnheader', { name: 'Volts, full' })).toBeVisible();
  await expect(page.getByRole('columnheader', { name: 'Speed, nominal' })).toBeVisible();
  const footer = page.getByTestId('list-footer');
  await expect(footer).toContainText('Volts, full: supply at full charge');
  await expect(footer).toContainText('Speed, nominal: no-load speed at nominal voltage');
  await expect(footer).toContainText('Current / limit: the tightest current check');
  await shot(page, 'builds-list-current-column');

  // The sheet labels nominal and full-charge figures.
  await page.locator(`[data-build-id="${build.id}"]`).dblclick();
  const sheet = page.getByTestId('build-sheet');
  await expect(sheet).toContainText('Theoretical speed, nominal');
  await expect(sheet).toContainText('Peak current, full charge');
  await expect(sheet).toContainText('Full-charge voltage');
});

test('keyboard: skip link to the list, sort from a column heading, focus on the sheet heading', async ({ page, shell }) => {
  const { car, motor, esc, pack } = await seedOneBuild(shell);
  await shell.api('builds.create', { name: 'Alpha first by name', vehicleId: car.id, motorId: motor.id, controllerId: esc.id, supplies: [{ arrangement: 'series', batteryIds: [pack.id] }] });
  await openApp(page, shell, '#/builds');
  await expect(page.getByTestId('build-row')).toHaveCount(2);

  // The first Tab reaches the skip link; Enter puts the focus on the grid.
  await page.locator('body').focus();
  await page.keyboard.press('Tab');
  const skip = page.getByRole('link', { name: 'Skip to the builds list' });
  await expect(skip).toBeFocused();
  await shot(page, 'skip-link');
  await page.keyboard.press('Enter');
  await expect(page.getByRole('grid', { name: 'Builds' })).toBeFocused();

  // The column headings are buttons in the tab order: Enter sorts, Enter again reverses.
  const nameHeader = page.getByRole('columnheader', { name: /^Build/ });
  const nameButton = nameHeader.getByRole('button');
  await nameButton.focus();
  await page.keyboard.press('Enter');
  await expect(nameHeader).toHaveAttribute('aria-sort', 'ascending');
  await expect(page.getByTestId('build-row').first()).toContainText('Alpha first by name');
  await page.keyboard.press('Enter');
  await expect(nameHeader).toHaveAttribute('aria-sort', 'descending');
  await expect(page.getByTestId('build-row').first()).toContainText('Test truck 4S');

  // Arrow to a row and open it: the sheet's heading has the focus.
  await page.getByRole('grid', { name: 'Builds' }).focus();
  await page.keyboard.press('ArrowDown');
  await page.keyboard.press('Enter');
  await expect(page.getByRole('heading', { level: 1, name: 'Test truck 4S' })).toBeFocused();
});

test('filters, sort and search live in the address: a reload and Back keep them', async ({ page, shell }) => {
  const { car, motor, esc, pack } = await seedOneBuild(shell, { cRatingContinuous: 5, cRatingBurst: 6 });
  const weak = await shell.api<StoredRecord>('batteries.create', { name: 'Spare 4S 3000', chemistry: 'lipo', cellsSeries: 4, capacityMah: 3000, cRatingContinuous: 2, cRatingBurst: 3, cellResistanceOhm: 0.004 });
  for (const name of ['Blue truck on spare', 'Green truck on spare']) {
    await shell.api('builds.create', { name, vehicleId: car.id, motorId: motor.id, controllerId: esc.id, gearing: TRUCK_GEARING, supplies: [{ arrangement: 'series', batteryIds: [weak.id] }] });
  }
  await shell.api('builds.create', { name: 'Truck with no controller', vehicleId: car.id, motorId: motor.id, supplies: [{ arrangement: 'series', batteryIds: [pack.id] }] });
  await openApp(page, shell, '#/builds');
  await expect(page.getByTestId('build-row')).toHaveCount(4);

  await page.getByRole('button', { name: /^Over/ }).click();
  await page.getByLabel('Search builds').fill('spare');
  await page
    .getByRole('columnheader', { name: /^Build/ })
    .getByRole('button')
    .click();
  await page
    .getByRole('columnheader', { name: /^Build/ })
    .getByRole('button')
    .click();
  await expect(page.getByTestId('build-row')).toHaveCount(2);
  await expect(page.getByTestId('build-row').first()).toContainText('Green truck on spare');
  // The address follows a moment after the last change (not on every keystroke).
  await expect.poll(() => page.evaluate(() => /q=spare/u.test(window.location.hash) && /dir=desc/u.test(window.location.hash))).toBe(true);
  const hash = await page.evaluate(() => window.location.hash);
  const query = new URLSearchParams(hash.split('?')[1]);
  expect(query.get('v')).toBe('over');
  expect(query.get('q')).toBe('spare');
  expect(query.get('sort')).toBe('name');
  expect(query.get('dir')).toBe('desc');

  await page.reload();
  await expect(page.getByLabel('Search builds')).toHaveValue('spare');
  await expect(page.getByRole('button', { name: /^Over/ })).toHaveAttribute('aria-pressed', 'true');
  await expect(page.getByRole('columnheader', { name: /^Build/ })).toHaveAttribute('aria-sort', 'descending');
  await expect(page.getByTestId('build-row')).toHaveCount(2);
  await expect(page.getByTestId('build-row').first()).toContainText('Green truck on spare');
  await shot(page, 'builds-list-filtered-address');

  // Open a build, then Back: the list is as it was.
  await page.getByTestId('build-row').first().dblclick();
  await expect(page.getByTestId('build-sheet')).toBeVisible();
  await page.goBack();
  await expect(page.getByTestId('build-row')).toHaveCount(2);
  await expect(page.getByLabel('Search builds')).toHaveValue('spare');
  await expect(page.getByRole('columnheader', { name: /^Build/ })).toHaveAttribute('aria-sort', 'descending');

  // The Builds tab keeps the list as it was left, and writes it back into the address.
  await page.getByTestId('build-row').first().dblclick();
  await page.getByRole('navigation', { name: 'Screens' }).getByRole('link', { name: 'Builds' }).click();
  await expect(page.getByLabel('Search builds')).toHaveValue('spare');
  await expect.poll(() => page.evaluate(() => window.location.hash)).toBe(hash);
});

test('archive, list the archived, restore, duplicate, and start a build from a vehicle; history names archived builds in local time', async ({ page, shell }) => {
  const { build, car } = await seedOneBuild(shell);
  await openApp(page, shell, `#/builds/${build.id}`);
  const sheet = page.getByTestId('build-sheet');
  await sheet.getByRole('button', { name: 'Archive' }).click();
  await expect(page.getByTestId('sheet-message')).toContainText('Archived');
  expect((await shell.api<SheetValue>('builds.get', { id: build.id })).build.archivedAt).not.toBeNull();
  await shot(page, 'build-sheet-archived');

  await page.evaluate(() => (window.location.hash = '#/builds'));
  await expect(page.getByTestId('build-count')).toHaveText('0 builds');
  await page.getByTestId('show-archived').click();
  await expect(page.getByTestId('build-count')).toHaveText('1 archived builds');
  await expect(page.getByTestId('build-row')).toHaveCount(1);
  await expect(page.getByTestId('build-row').first()).toContainText('Test truck 4S');
  await expect.poll(() => page.evaluate(() => window.location.hash)).toContain('archived=1');
  await shot(page, 'builds-list-archived');

  // History names the archived build (not its id) and dates it in the reader's own calendar.
  await page.evaluate(() => (window.location.hash = '#/history'));
  const entry = page.getByTestId('history-entry').first();
  await expect(entry).toContainText('Archived build');
  await expect(entry.getByRole('link', { name: 'Test truck 4S' })).toBeVisible();
  const stamp = await entry.locator('time').getAttribute('datetime');
  const local = await page.evaluate((iso) => new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' }).format(new Date(iso!)), stamp);
  await expect(entry.locator('time')).toHaveText(local);
  await shot(page, 'history-local-time');

  // Restore from the sheet.
  await entry.getByRole('link', { name: 'Test truck 4S' }).click();
  await page.getByTestId('build-sheet').getByRole('button', { name: 'Restore' }).click();
  await expect(page.getByTestId('sheet-message')).toContainText('Restored');
  expect((await shell.api<SheetValue>('builds.get', { id: build.id })).build.archivedAt).toBeNull();

  // Duplicate: a copy with every setting, opened in its form.
  await page.getByTestId('build-sheet').getByRole('button', { name: 'Duplicate' }).click();
  await expect(page.getByRole('heading', { name: 'Edit Test truck 4S (copy)' })).toBeVisible();
  const all = await shell.api<ListRow[]>('builds.list', {});
  expect(all.map((r) => r.name).sort()).toEqual(['Test truck 4S', 'Test truck 4S (copy)']);
  const copy = all.find((r) => r.name === 'Test truck 4S (copy)')!;
  const [orig, dup] = await Promise.all([build.id, copy.id].map((id) => shell.api<SheetValue>('builds.get', { id })));
  expect(dup!.build.gearing).toEqual(orig!.build.gearing);
  expect(dup!.build.motorId).toBe(orig!.build.motorId);
  expect(dup!.verdict?.status).toBe(orig!.verdict?.status);

  // A new build started from the vehicle has the vehicle chosen.
  await page.evaluate((id) => (window.location.hash = `#/vehicles/${id}`), car.id);
  await page.getByRole('link', { name: 'New build for this vehicle' }).click();
  const form = page.getByRole('form', { name: 'New build' });
  await expect(form.getByLabel('Vehicle')).toHaveValue(car.id);
  await form.getByLabel('Build name').fill('Started from the truck');
  await form.getByRole('button', { name: 'Add build' }).click();
  await expect(page.getByTestId('build-sheet').getByRole('heading', { name: 'Started from the truck' })).toBeVisible();
  const made = (await shell.api<ListRow[]>('builds.list', {})).find((r) => r.name === 'Started from the truck');
  expect(made).toBeDefined();
  expect((await shell.api<SheetValue>('builds.get', { id: made!.id })).build.vehicleId).toBe(car.id);
});

test('a swap from OVER to Incomplete says the new part lacks data; saving into OVER asks first and says why', async ({ page, shell }) => {
  const { build, esc } = await seedOneBuild(shell);
  // A 2S controller on a 4S pack: over on voltage. A controller with no ratings on record: nothing to check.
  const small = await shell.api<StoredRecord>('controllers.create', { name: 'Little 2S controller', maxCells: 2, continuousCurrentA: 150, burstCurrentA: 900, resistanceOhm: 0.0008 });
  await shell.api<StoredRecord>('controllers.create', { name: 'Unlabelled controller' });
  const before = await shell.api<SheetValue>('builds.get', { id: build.id });
  expect(before.verdict?.status).not.toBe('over');

  // Saving the swap to the 2S controller: the dialog names the check and the figures.
  await openApp(page, shell, `#/builds/${build.id}/swap`);
  await page.getByLabel('Part to replace').selectOption({ label: 'Speed controller: Test 150A' });
  await page.getByLabel('Replacement').selectOption({ label: 'Little 2S controller' });
  await page.getByRole('button', { name: 'Preview' }).click();
  await page.getByRole('button', { name: 'Save this change' }).click();
  const dialog = page.getByTestId('over-confirm');
  await expect(dialog).toBeVisible();
  await expect(dialog).toContainText('Save and make a build OVER?');
  await expect(dialog).toContainText('Controller voltage');
  await expect(dialog).toContainText('16.8 V against a limit of 8.40 V');
  await shot(page, 'swap-save-over-confirm');
  // Going back saves nothing.
  await dialog.getByRole('button', { name: "Go back, don't save" }).click();
  await expect(dialog).toBeHidden();
  expect((await shell.api<SheetValue>('builds.get', { id: build.id })).build.version).toBe(before.build.version);
  await page.getByRole('button', { name: 'Save this change' }).click();
  await dialog.getByTestId('save-anyway').click();
  await expect(page.getByTestId('build-sheet')).toBeVisible();
  const over = await shell.api<SheetValue & { build: { controllerId: string } }>('builds.get', { id: build.id });
  expect(over.build.controllerId).toBe(small.id);
  expect(over.verdict?.status).toBe('over');

  // Now over: a swap to the unlabelled controller reads Incomplete, and says it is no improvement.
  await page.getByRole('link', { name: 'Swap preview' }).click();
  await page.getByLabel('Part to replace').selectOption({ label: 'Speed controller: Little 2S controller' });
  await page.getByLabel('Replacement').selectOption({ label: 'Unlabelled controller' });
  await page.getByRole('button', { name: 'Preview' }).click();
  const result = page.getByTestId('preview-result');
  await expect(result.locator('.overall [data-status]').last()).toHaveAttribute('data-status', 'incomplete');
  const lost = page.getByTestId('over-to-incomplete');
  await expect(lost).toContainText('Not an improvement: the new part lacks data');
  await expect(lost).toContainText('Controller voltage');
  await expect(lost).toContainText('the controller maximum voltage');
  await expect(result.locator('[data-testid="preview-check"][data-rule="controller-voltage"]')).toContainText('was over, now lacks data');
  await shot(page, 'swap-over-to-incomplete', true);

  // The build form asks too: back to the 150 A controller is fine, so no question; the 2S one asks.
  await page.evaluate((id) => (window.location.hash = `#/builds/${id}/edit`), build.id);
  const form = page.getByRole('form', { name: 'Edit build' });
  await form.getByLabel('Speed controller').selectOption({ label: 'Test 150A' });
  await form.getByRole('button', { name: 'Save build' }).click();
  await expect(page.getByTestId('build-sheet')).toBeVisible();
  expect((await shell.api<SheetValue & { build: { controllerId: string } }>('builds.get', { id: build.id })).build.controllerId).toBe(esc.id);
  await page.evaluate((id) => (window.location.hash = `#/builds/${id}/edit`), build.id);
  await form.getByLabel('Speed controller').selectOption({ label: 'Little 2S controller' });
  await form.getByRole('button', { name: 'Save build' }).click();
  await expect(dialog).toBeVisible();
  await expect(dialog).toContainText('Controller voltage');
  await dialog.getByRole('button', { name: "Go back, don't save" }).click();
  await expect(page.getByTestId('form-notice')).toContainText('Not saved');
  expect((await shell.api<SheetValue & { build: { controllerId: string } }>('builds.get', { id: build.id })).build.controllerId).toBe(esc.id);

  // A part edit that turns the build over asks as well. (Leaving the unsaved build form asks first; accept.)
  page.once('dialog', (d) => void d.accept());
  await page.evaluate((id) => (window.location.hash = `#/parts/controllers/${id}`), esc.id);
  const partForm = page.getByRole('form', { name: /Edit/ });
  // 5 A continuous: far below what the truck draws at its loaded top speed.
  await partForm.getByLabel('Continuous current (A)').fill('5');
  await partForm.getByRole('button', { name: /Save/ }).click();
  await expect(dialog).toBeVisible();
  await expect(dialog).toContainText('Controller continuous current');
  await shot(page, 'part-edit-over-confirm');
  await dialog.getByTestId('save-anyway').click();
  await expect(dialog).toBeHidden();
  await expect.poll(async () => (await shell.api<StoredRecord>('controllers.get', { id: esc.id })).continuousCurrentA).toBe(5);
  expect((await shell.api<SheetValue>('builds.get', { id: build.id })).verdict?.status).toBe('over');
});
