import type { Page } from '@playwright/test';
import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp, type StoredRecord } from './app-helpers';
import { seedFleet, type SeededFleet } from './fleet-seed';
import type { Shell } from './local-shell';
import { expectNoAxeViolations } from './axe-check';

// The build sheet of every vehicle kind: the power path at the top, checks first, figures by
// stage one level down. Each kind is photographed for people to look at.

async function shot(page: Page, name: string) {
  await page.screenshot({ path: `${SCREENSHOT_DIR}/sheet-${name}.png`, fullPage: true });
  await expectNoAxeViolations(page, `sheet ${name}`);
}

/** The monster truck gets a second supply: the same 2 × 4S in series, or its 6S basher pack. */
async function withTwoSupplies(shell: Shell, fleet: SeededFleet): Promise<string> {
  const id = fleet.builds.monster8s!;
  const sheet = await shell.api<{ build: StoredRecord }>('builds.get', { id });
  await shell.api('builds.update', {
    id,
    expectedVersion: sheet.build.version,
    changes: {
      supplies: [
        { arrangement: 'series', batteryIds: [fleet.packs.shop4s1, fleet.packs.shop4s2] },
        { arrangement: 'series', batteryIds: [fleet.packs.basher6s] },
      ],
    },
    reason: 'the 6S pack as a second supply',
  });
  return id;
}

async function openSheet(page: Page, id: string, name: string) {
  await page.evaluate((h) => (window.location.hash = `#/builds/${h}`), id);
  const sheet = page.getByTestId('build-sheet');
  await expect(sheet.getByRole('heading', { level: 1, name })).toBeVisible();
  await expect(sheet.getByTestId('path-stage')).toHaveCount(5);
  return sheet;
}

test('every sheet kind leads with the power path and the deciding checks', async ({ page, shell }) => {
  test.setTimeout(240_000);
  const fleet = await seedFleet((name, args) => shell.api(name, args));
  await openApp(page, shell, '#/builds');
  await expect(page.getByTestId('build-count')).toHaveText('11 builds');

  // Car: the strip reads pack → controller → motor → gearing → wheels, each with its rating.
  let sheet = await openSheet(page, fleet.builds.buggyRace!, 'Buggy club race');
  const stages = sheet.getByTestId('path-stage');
  await expect(stages.locator('h3')).toHaveText(['Pack', 'Speed controller', 'Motor', 'Gearing', 'Wheels']);
  // The speed controller's rating is 80 A continuous and 380 A burst (fleet seed); the voltage limit is 17.4 V.
  await expect(stages.nth(1).getByTestId('stage-asked')).toHaveText(/ of (80 A continuous|380 A burst|17\.4 V maximum input)$/u);
  await expect(stages.nth(1)).toContainText('assumed:');
  // Checks come before the figures, which sit one level down, grouped by stage.
  const order = await sheet.evaluate((el) => {
    const at = (sel: string) => [...el.querySelectorAll('*')].indexOf(el.querySelector(sel)!);
    return [at('[data-testid="power-path"]'), at('[data-testid="finding"]'), at('[data-testid="figures"]')];
  });
  expect(order[0]).toBeLessThan(order[1]!);
  expect(order[1]).toBeLessThan(order[2]!);
  // Groups follow the figure catalogue's stages; the supply current is the packs' figure, so a
  // car shows four groups (packs, motor, gearing, wheels) and no controller-only group.
  await expect(sheet.getByTestId('figures').locator('[data-group]')).toHaveCount(4);
  await shot(page, 'car');

  sheet = await openSheet(page, fleet.builds.sct!, 'SC truck 4S');
  await shot(page, 'truck');

  // Crawler on NiMH with a 40 A brushed controller.
  sheet = await openSheet(page, fleet.builds.crawler!, 'Crawler trail');
  await expect(sheet.getByTestId('path-stage').nth(1)).toContainText('Crawler 40A brushed');
  await shot(page, 'crawler');

  // A crawler with no controller: the stage says so.
  sheet = await openSheet(page, fleet.builds.crawlerNoEsc!, 'Crawler rebuild');
  await expect(sheet.getByTestId('path-stage').nth(1)).toContainText('no speed controller chosen');
  await expect(sheet.getByTestId('path-stage').nth(1).locator('[data-status="incomplete"]')).toBeVisible();

  // Propeller builds: the path ends in the propeller and the thrust.
  sheet = await openSheet(page, fleet.builds.boat!, 'Deep-V 6S');
  await expect(sheet.getByTestId('path-stage').locator('h3')).toHaveText(['Packs', 'Speed controller', 'Motor', 'Propeller', 'Thrust']);
  await shot(page, 'boat');

  sheet = await openSheet(page, fleet.builds.glider!, 'Glider climb');
  // The Li-ion pack is over its rating: the strip marks the packs over, and the deciding check carries the fire caution.
  await expect(sheet.getByTestId('path-stage').first().locator('[data-status="over"]')).toBeVisible();
  await expect(sheet.getByTestId('deciding-checks').locator('[data-rule="battery-continuous"]')).toContainText('Fire risk');
  await shot(page, 'plane');

  sheet = await openSheet(page, fleet.builds.quad!, 'Freestyle 6S');
  await expect(sheet.getByTestId('path-stage').nth(2).locator('h3')).toHaveText('Motors × 4');
  await shot(page, 'multirotor');
});

test('a stage opens its part, and the supply choice sits on the strip', async ({ page, shell }) => {
  test.setTimeout(120_000);
  const fleet = await seedFleet((name, args) => shell.api(name, args));
  const id = await withTwoSupplies(shell, fleet);
  await openApp(page, shell, `#/builds/${id}`);
  const sheet = page.getByTestId('build-sheet');
  await expect(sheet.getByTestId('path-stage')).toHaveCount(5);
  const choice = sheet.getByTestId('power-path').getByTestId('supply-choice');
  await expect(choice.getByRole('radio')).toHaveCount(2);
  await expect(sheet.getByTestId('path-stage').first()).toContainText('Shop 4S 5000 #1');
  await expect(sheet.getByRole('heading', { name: 'Checks, supply 1' })).toBeVisible();
  await shot(page, 'several-supplies');

  await choice.getByRole('radio', { name: /Supply 2/ }).check();
  await expect(sheet.getByRole('heading', { name: 'Checks, supply 2' })).toBeVisible();
  await expect(sheet.getByTestId('path-stage').first()).toContainText('Basher 6S 8000');
  // 25 C × 8 Ah = 200 A continuous, 50 C × 8 Ah = 400 A burst (fleet seed; rating = C × capacity, common practice).
  await expect(sheet.getByTestId('path-stage').first().getByTestId('stage-asked')).toHaveText(/ of (200 A continuous|400 A burst)$/u);
  await shot(page, 'several-supplies-second');

  // The pack stage opens the pack's record; the motor stage the motor's.
  await sheet.getByTestId('path-stage').first().getByRole('link', { name: 'Basher 6S 8000' }).click();
  await expect(page).toHaveURL(new RegExp(`#/parts/packs/${fleet.packs.basher6s}$`));
  await expect(page.getByRole('form', { name: 'Edit pack' })).toBeVisible();
  await page.goBack();
  await sheet.getByTestId('path-stage').nth(2).getByRole('link', { name: 'Shop 2050 4-pole 2200Kv' }).click();
  await expect(page).toHaveURL(new RegExp(`#/parts/motors/${fleet.motors.shop2050}$`));
});

test('imperial units on the strip and the figures', async ({ page, shell }) => {
  test.setTimeout(120_000);
  const fleet = await seedFleet((name, args) => shell.api(name, args));
  await openApp(page, shell, '#/settings');
  await page.getByRole('radio', { name: /Imperial/ }).check();
  await expect(page.getByRole('status')).toContainText('imperial');
  const sheet = await openSheet(page, fleet.builds.sct!, 'SC truck 4S');
  await expect(sheet.getByTestId('path-stage').last()).toContainText('mph');
  await expect(sheet.getByTestId('path-stage').last()).not.toContainText('km/h');
  await shot(page, 'truck-imperial');
  const boat = await openSheet(page, fleet.builds.quad!, 'Freestyle 6S');
  await expect(boat.getByTestId('path-stage').last()).toContainText('oz');
  await shot(page, 'multirotor-imperial');
});
