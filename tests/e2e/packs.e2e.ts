import { test, expect, SCREENSHOT_DIR } from './local-shell';

test('add a pack, see it listed, reload, still there', async ({ page, shell }) => {
  await page.goto(shell.openUrl);
  const form = page.getByRole('form', { name: 'Add pack' });
  await form.getByLabel('Name').fill('Bench 4S 5000');
  await form.getByLabel('Cells in series').fill('4');
  await form.getByLabel('Capacity (mAh)').fill('5000');
  await form.getByRole('button', { name: 'Add pack' }).click();
  await expect(page.getByTestId('pack-row').filter({ hasText: 'Bench 4S 5000' })).toBeVisible();
  await page.reload();
  await expect(page.getByTestId('pack-row').filter({ hasText: 'Bench 4S 5000' })).toBeVisible();
  // The store on disk has it too, read by a second client.
  const packs = await shell.api<{ name: string }[]>('batteries.list', {});
  expect(packs.map((p) => p.name)).toEqual(['Bench 4S 5000']);
  await page.screenshot({ path: `${SCREENSHOT_DIR}/packs.png`, fullPage: true });
});

test('bad input gets a message naming the field and nothing is stored', async ({ page, shell }) => {
  await page.goto(shell.openUrl);
  const form = page.getByRole('form', { name: 'Add pack' });
  await form.getByLabel('Name').fill('Typo pack');
  await form.getByLabel('Capacity (mAh)').fill('-5000');
  await form.getByRole('button', { name: 'Add pack' }).click();
  await expect(page.getByRole('alert')).toContainText('capacityMah');
  // What the user typed is kept for the correction.
  await expect(form.getByLabel('Name')).toHaveValue('Typo pack');
  expect(await shell.api<unknown[]>('batteries.list', {})).toEqual([]);
});
