import type { Page } from '@playwright/test';
import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp } from './app-helpers';
import { seedFleet } from './fleet-seed';

async function shot(page: Page, name: string) {
  await page.screenshot({ path: `${SCREENSHOT_DIR}/${name}.png`, fullPage: true });
}

async function names(page: Page): Promise<string[]> {
  return page.getByTestId('part-row').locator('td:first-child a').allTextContents();
}

test('the packs table searches, sorts by a rating, and its used-by count opens the builds that use the pack', async ({ page, shell }) => {
  const fleet = await seedFleet(shell.api);
  const buildsWith4s1 = await shell.api<{ id: string; name: string }[]>('builds.list', { partId: fleet.packs.shop4s1 });
  expect(buildsWith4s1.length).toBeGreaterThan(1);
  await openApp(page, shell, '#/parts/packs');
  const table = page.getByTestId('parts-table');
  await expect(page.getByTestId('part-row')).toHaveCount(10);
  // The columns that matter for a pack: cells in series and in parallel, both C ratings, how many builds use it.
  for (const heading of ['Cells in series (S)', 'Cells in parallel (P)', 'Continuous C rating (C)', 'Burst C rating (C)', 'Used by', 'Last log']) {
    await expect(table.getByRole('columnheader', { name: heading })).toBeVisible();
  }

  // Every word must be found: "3s 5200" keeps the two boat packs.
  await page.getByRole('searchbox', { name: 'Search packs' }).fill('3s 5200');
  expect(await names(page)).toEqual(['Boat 3S 5200 A', 'Boat 3S 5200 B']);
  await expect(page.getByTestId('parts-count')).toHaveText('2 of 10 in use');
  await page.getByRole('searchbox', { name: 'Search packs' }).fill('');

  // Sorted by continuous C rating, highest first: the 100C quad pack leads, the 3C Li-ion pack trails.
  const cHeader = table.getByRole('columnheader', { name: /Continuous C rating/ });
  await cHeader.getByRole('button').click();
  await expect(cHeader).toHaveAttribute('aria-sort', 'ascending');
  expect((await names(page))[0]).toBe('Glider 4S2P Li-ion');
  await cHeader.getByRole('button').click();
  await expect(cHeader).toHaveAttribute('aria-sort', 'descending');
  const descending = await names(page);
  expect(descending[0]).toBe('Quad 6S 1300');
  expect(descending.at(-1)).toBe('Glider 4S2P Li-ion');
  await shot(page, 'inventory-packs-sorted');

  const row = page.getByTestId('part-row').filter({ hasText: 'Shop 4S 5000 #1' });
  await expect(row.getByTestId('used-by-count')).toHaveText(String(buildsWith4s1.length));
  await row.getByTestId('used-by-count').getByRole('link').click();
  await expect(page).toHaveURL(new RegExp(`#/builds\\?part=${fleet.packs.shop4s1}$`));
  await expect(page.getByTestId('build-row')).toHaveCount(buildsWith4s1.length);
  for (const b of buildsWith4s1) await expect(page.getByTestId('build-row').filter({ hasText: b.name })).toHaveCount(1);
});
