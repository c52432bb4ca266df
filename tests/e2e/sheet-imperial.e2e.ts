import type { Page } from '@playwright/test';
import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp, type StoredRecord } from './app-helpers';
import { seedFleet } from './fleet-seed';
import { expectNoAxeViolations } from './axe-check';

// The sheet kinds the metric walk (sheet.e2e.ts) photographs, in imperial units: each renders
// its strip in the imperial unit of its last stage and logs no console error (the harness fails
// a test whose page does). The truck and the multirotor are photographed there.

async function openSheet(page: Page, id: string, name: string) {
  await page.evaluate((h) => (window.location.hash = `#/builds/${h}`), id);
  const sheet = page.getByTestId('build-sheet');
  await expect(sheet.getByRole('heading', { level: 1, name })).toBeVisible();
  await expect(sheet.getByTestId('path-stage')).toHaveCount(5);
  return sheet;
}

test('car, crawler, boat, plane and a build with several supplies, in imperial units', async ({ page, shell }) => {
  test.setTimeout(240_000);
  const fleet = await seedFleet((name, args) => shell.api(name, args));
  const monster = fleet.builds.monster8s!;
  const stored = await shell.api<{ build: StoredRecord }>('builds.get', { id: monster });
  await shell.api('builds.update', {
    id: monster,
    expectedVersion: stored.build.version,
    changes: { supplies: [{ batteryIds: [fleet.packs.shop4s1, fleet.packs.shop4s2] }, { batteryIds: [fleet.packs.basher6s] }] },
  });

  await openApp(page, shell, '#/settings');
  await page.getByRole('radio', { name: /Imperial/ }).check();
  await expect(page.getByRole('status')).toContainText('imperial');

  const kinds = [
    { id: fleet.builds.buggyRace!, name: 'Buggy club race', shot: 'car', unit: 'mph', metric: 'km/h' },
    { id: fleet.builds.crawler!, name: 'Crawler trail', shot: 'crawler', unit: 'mph', metric: 'km/h' },
    // Thrust in pounds-force, with the mass it holds up in ounces beside it.
    { id: fleet.builds.boat!, name: 'Deep-V 6S', shot: 'boat', unit: 'lbf', metric: ' N' },
    { id: fleet.builds.glider!, name: 'Glider climb', shot: 'plane', unit: 'lbf', metric: ' N' },
    { id: monster, name: stored.build['name'] as string, shot: 'several-supplies', unit: 'mph', metric: 'km/h' },
  ];
  for (const k of kinds) {
    const sheet = await openSheet(page, k.id, k.name);
    const last = sheet.getByTestId('path-stage').last();
    await expect(last, k.shot).toContainText(k.unit);
    await expect(last, k.shot).not.toContainText(k.metric);
    await page.screenshot({ path: `${SCREENSHOT_DIR}/sheet-${k.shot}-imperial.png`, fullPage: true });
    await expectNoAxeViolations(page, `sheet ${k.shot}, imperial`);
  }
  // The second supply of the monster truck, chosen on the strip.
  await page
    .getByTestId('supply-choice')
    .getByRole('radio', { name: /Supply 2/ })
    .check();
  await expect(page.getByTestId('build-sheet').getByRole('heading', { name: 'Checks, supply 2' })).toBeVisible();
  await expect(page.getByTestId('path-stage').first()).toContainText('Basher 6S 8000');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/sheet-several-supplies-second-imperial.png`, fullPage: true });
});
