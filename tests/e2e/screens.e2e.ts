import type { Page } from '@playwright/test';
import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp, type StoredRecord } from './app-helpers';
import { seedFleet, type SeededFleet } from './fleet-seed';
import type { Shell } from './local-shell';
import { expectNoAxeViolations } from './axe-check';

// Screenshots of every screen on an invented fleet, for people to look at; each test also
// checks what the screen must show, and every screen photographed passes the accessibility rules.

async function seedWithHistory(shell: Shell): Promise<SeededFleet> {
  const fleet = await seedFleet((name, args) => shell.api(name, args));
  const pack = await shell.api<StoredRecord>('batteries.get', { id: fleet.packs.shop4s2 });
  await shell.api('batteries.update', { id: pack.id, expectedVersion: pack.version, changes: { cellResistanceOhm: 0.0041, cycleCount: 96 }, reason: 'measured on the shop charger after 96 cycles' });
  const sct = await shell.api<{ build: StoredRecord }>('builds.get', { id: fleet.builds.sct! });
  await shell.api('builds.update', {
    id: sct.build.id,
    expectedVersion: sct.build.version,
    changes: { gearing: { pinionTeeth: 15, spurTeeth: 50, internalRatio: 2.85, tireDiameterMm: 110, drivetrainEfficiency: 0.88 } },
    reason: 'one tooth up for the long straight',
  });
  return fleet;
}

async function shot(page: Page, name: string, fullPage = false, rules = true) {
  await page.screenshot({ path: `${SCREENSHOT_DIR}/${name}.png`, fullPage });
  if (rules) await expectNoAxeViolations(page, name);
}

test('screens of the fleet: list, greyscale badges, sheet, parts, vehicles, history, settings', async ({ page, shell }) => {
  test.setTimeout(240_000);
  const fleet = await seedWithHistory(shell);
  await openApp(page, shell, '#/builds');
  await expect(page.getByTestId('build-count')).toHaveText('11 builds');
  // Every verdict is present in the invented fleet.
  for (const status of ['over', 'tight', 'incomplete', 'clear']) await expect(page.locator(`[data-testid="build-row"] [data-status="${status}"]`).first()).toBeVisible();
  await page.locator(`[data-build-id="${fleet.builds.sct}"]`).click();
  await shot(page, 'builds-list');

  // The same in greyscale: word, shape and fill must still tell the verdicts apart. The filter
  // is set through CSSOM (allowed by the style-src policy), not an injected stylesheet.
  await page.evaluate(() => document.documentElement.style.setProperty('filter', 'grayscale(1)'));
  // The rules read the colours as styled, not as filtered: the colour screen above is the one judged.
  await shot(page, 'badges-greyscale', false, false);
  await page.evaluate(() => document.documentElement.style.removeProperty('filter'));

  await page.evaluate((id) => (window.location.hash = `#/builds/${id}`), fleet.builds.monster6s!);
  const sheet = page.getByTestId('build-sheet');
  await expect(sheet.getByRole('heading', { name: 'Monster 6S' })).toBeVisible();
  // What the build asks: the full-throttle run with the current ratings as bands, and drive force against road load.
  await expect(sheet.locator('canvas')).toHaveCount(2);
  await expect(sheet.locator('[data-chart-view="asks"]')).toBeVisible();
  await expect(sheet).toContainText('rpm per volt at no load');
  await expect(sheet.locator('[data-rule="motor-power"]')).toContainText("Follow the part maker's ratings");
  await shot(page, 'build-sheet', true);
  // The motor curves remain one view among several.
  await sheet.getByRole('button', { name: 'Motor curves' }).click();
  await expect(sheet.locator('[data-chart-view="motor"] canvas')).toHaveCount(2);
  await shot(page, 'build-sheet-motor-curves');
  await sheet.getByRole('button', { name: 'Currents against ratings' }).click();
  await expect(sheet.locator('[data-chart-view="limits"] canvas')).toHaveCount(1);

  // A lithium pack over its rating: the fire caution shows.
  await page.evaluate((id) => (window.location.hash = `#/builds/${id}`), fleet.builds.glider!);
  await expect(page.getByTestId('build-sheet').locator('[data-rule="battery-continuous"]')).toContainText('Fire risk');
  await shot(page, 'build-sheet-glider', true);

  await page.evaluate((id) => (window.location.hash = `#/parts/packs/${id}`), fleet.packs.shop4s1);
  await expect(page.getByTestId('used-by')).toHaveCount(3);
  await shot(page, 'parts');
  await page.evaluate((id) => (window.location.hash = `#/parts/motors/${id}`), fleet.motors.shop2050);
  await expect(page.getByRole('form', { name: 'Edit motor' }).getByLabel('Kv (rpm/V)')).toHaveValue('2200');
  await shot(page, 'parts-motors');

  await page.evaluate((id) => (window.location.hash = `#/vehicles/${id}`), fleet.vehicles.monster);
  await expect(page.getByRole('form', { name: 'Edit vehicle' }).getByLabel('Drag area Cd·A (m²)')).toHaveValue('0.06');
  await shot(page, 'vehicles');

  await page.evaluate(() => (window.location.hash = '#/history'));
  await expect(page.getByTestId('history-entry').first()).toContainText('one tooth up for the long straight');
  await shot(page, 'history');

  await page.evaluate(() => (window.location.hash = '#/settings'));
  await expect(page.getByRole('radio', { name: /Metric/ })).toBeChecked();
  await shot(page, 'settings');

  await page.evaluate((id) => (window.location.hash = `#/builds/${id}/edit`), fleet.builds.monster8s!);
  const form = page.getByRole('form', { name: 'Edit build' });
  await expect(form.getByLabel('Pinion (teeth)')).toHaveValue('13');
  await expect(form.getByLabel('Supply 1 wiring')).toHaveValue('series');
  await expect(form.getByTestId('supply-editor').locator('select')).toHaveCount(3);
  await shot(page, 'build-form', true);
});

test('swap preview of a gearing change, side by side', async ({ page, shell }) => {
  test.setTimeout(120_000);
  const fleet = await seedFleet((name, args) => shell.api(name, args));
  await openApp(page, shell, `#/builds/${fleet.builds.monster6s}/swap`);
  await page.getByRole('tab', { name: 'Change gearing' }).click();
  await page.locator('input[name="gearing.pinionTeeth"]').fill('12');
  await page.getByRole('button', { name: 'Preview' }).click();
  const result = page.getByTestId('preview-result');
  await expect(result).toBeVisible();
  // A smaller pinion means a taller final drive ratio: 46 / 12 × 3.6 = 13.8 (was 46 / 15 × 3.6 = 11.04).
  const ratio = result.locator('[data-testid="preview-figure"][data-key="finalDriveRatio"]');
  await expect(ratio.locator('.before')).toHaveText('11.04:1');
  await expect(ratio.locator('.after')).toHaveText('13.80:1');
  await shot(page, 'swap-preview', true);
  // And the pack's shared record: every build on it, before and after.
  await page.getByRole('tab', { name: "Edit a shared part's ratings" }).click();
  await page.getByLabel('Part record').selectOption({ label: 'motor: Shop 2050 4-pole 2200Kv' });
  await page.getByLabel('Field').selectOption({ label: 'Rated power (W)' });
  await page.getByLabel('New value').fill('2000');
  await page.getByRole('button', { name: 'Preview' }).click();
  await expect(page.getByTestId('preview-other')).toHaveCount(4);
  await shot(page, 'swap-preview-shared', true);
});

test('the printable build sheet: no navigation, black on white, cautions and the printed date', async ({ page, shell }) => {
  const fleet = await seedFleet((name, args) => shell.api(name, args));
  await openApp(page, shell, `#/builds/${fleet.builds.monster8s}`);
  // The full-throttle run and drive force against road load on screen; the printed sheet leaves the charts out.
  await expect(page.getByTestId('build-sheet').locator('canvas')).toHaveCount(2);
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('navigation', { name: 'Screens' })).toBeHidden();
  await expect(page.getByRole('button', { name: 'Print' })).toBeHidden();
  await expect(page.getByText(/^Rigbook build sheet/)).toBeVisible();
  await expect(page.locator('.printhead')).toContainText(/printed \d{4}-\d{2}-\d{2} \d{2}:\d{2}/);
  await expect(page.getByRole('heading', { name: 'Safety' })).toBeVisible();
  await expect(page.getByText('Lithium packs can burn')).toBeVisible();
  // The power path and the checks print; the charts and the figure table one level down do not.
  await expect(page.getByTestId('power-path')).toBeVisible();
  await expect(page.getByTestId('path-stage')).toHaveCount(5);
  await expect(page.getByTestId('supply').getByTestId('finding').first()).toBeVisible();
  await expect(page.locator('canvas').first()).toBeHidden();
  await expect(page.getByText(/customer Ravi Lindqvist/)).toBeVisible();
  const background = await page.evaluate(() => getComputedStyle(document.body).backgroundColor);
  expect(background).toBe('rgb(255, 255, 255)');
  const ink = await page.evaluate(() => getComputedStyle(document.querySelector('h1')!).color);
  expect(ink).toBe('rgb(0, 0, 0)');
  await shot(page, 'print-view', true);
});

test('the first start screen', async ({ page, shell }) => {
  await openApp(page, shell, '#/builds');
  await expect(page.getByRole('heading', { name: 'Nothing on the books yet' })).toBeVisible();
  await shot(page, 'empty-start');
});
