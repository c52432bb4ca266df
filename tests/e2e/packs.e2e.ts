import { test, expect } from './local-shell';
import { openApp } from './app-helpers';

test('add a pack through its form, see it listed, reload, still there', async ({ page, shell }) => {
  await openApp(page, shell, '#/parts/packs/new');
  const form = page.getByRole('form', { name: 'Add pack' });
  await form.getByLabel('Name').fill('Bench 4S 5000');
  await form.getByLabel('Cells in series (S)').fill('4');
  await form.getByLabel('Capacity (mAh)').fill('5000');
  await form.getByLabel('Continuous C rating (C)').fill('45');
  await form.getByRole('button', { name: 'Add pack' }).click();
  await expect(page.getByTestId('part-row').filter({ hasText: 'Bench 4S 5000' })).toBeVisible();
  await page.reload();
  await expect(page.getByTestId('part-row').filter({ hasText: 'Bench 4S 5000' })).toBeVisible();
  // The store on disk has it too, read by a second client, with the rating as typed.
  const packs = await shell.api<{ name: string; cRatingContinuous: number }[]>('batteries.list', {});
  expect(packs.map((p) => [p.name, p.cRatingContinuous])).toEqual([['Bench 4S 5000', 45]]);
});

test('bad input gets a message beside the field it names, keeps what was typed, and stores nothing', async ({ page, shell }) => {
  await openApp(page, shell, '#/parts/packs/new');
  const form = page.getByRole('form', { name: 'Add pack' });
  await form.getByLabel('Name').fill('Typo pack');
  await form.getByLabel('Capacity (mAh)').fill('-5000');
  await form.getByRole('button', { name: 'Add pack' }).click();
  // Beside the field: inside the capacity field's own box, described by it.
  const field = form.locator('[data-field="capacityMah"]');
  await expect(field.getByRole('alert')).toContainText('must be greater than 0');
  await expect(form.getByLabel('Capacity (mAh)')).toHaveAttribute('aria-invalid', 'true');
  // The summary names the field by its label.
  await expect(form.getByRole('alert').first()).toContainText('Capacity (mAh)');
  await expect(form.getByLabel('Name')).toHaveValue('Typo pack');
  await expect(form.getByLabel('Capacity (mAh)')).toHaveValue('-5000');
  expect(await shell.api<unknown[]>('batteries.list', {})).toEqual([]);
});
