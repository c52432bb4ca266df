import type { Page } from '@playwright/test';
import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp, seedOneBuild, type SheetValue, type StoredRecord } from './app-helpers';

async function shot(page: Page, name: string) {
  await page.screenshot({ path: `${SCREENSHOT_DIR}/${name}.png`, fullPage: true });
}

// Full charge of a LiPo cell: 4.20 V (common practice), so the seeded 4S pack reads 16.8 V.
test('a class is added with a limit picked from the figures, a vehicle is put in it from a list, and editing the limit re-checks its build', async ({ page, shell }) => {
  const { car, build } = await seedOneBuild(shell);
  await openApp(page, shell, '#/classes');
  await expect(page.getByTestId('classes-table')).toContainText('No classes yet');
  await page.getByRole('link', { name: 'Add class' }).click();

  const form = page.getByRole('form', { name: 'Add class' });
  await form.getByLabel('Class name').fill('Club 2S truck');
  await form.getByLabel('Notes').fill('Club rules: 2S LiPo only');
  await form.getByRole('button', { name: 'Add limit' }).click();
  // A limit with no figure or value is refused beside the row, and nothing is stored.
  await form.getByRole('button', { name: 'Add class' }).click();
  await expect(form.getByTestId('class-limit').getByRole('alert')).toContainText('pick the figure');
  expect(await shell.api<unknown[]>('classes.list', {})).toEqual([]);

  await form.getByLabel('Figure').selectOption({ label: 'Full-charge voltage (V)' });
  await form.getByLabel('At most (V)').fill('8.4');
  await form.getByRole('button', { name: 'Add class' }).click();
  const row = page.getByTestId('class-row').filter({ hasText: 'Club 2S truck' });
  await expect(row).toContainText('Full-charge voltage ≤ 8.4 V');
  const [stored] = await shell.api<(StoredRecord & { name: string; notes: string; limits: { figure: string; limit: number; unit: string }[] })[]>('classes.list', {});
  expect(stored).toMatchObject({ name: 'Club 2S truck', notes: 'Club rules: 2S LiPo only', limits: [{ figure: 'packVoltageFullV', limit: 8.4, unit: 'V' }] });

  // The vehicle's class is chosen from the stored classes.
  await page.evaluate((id) => (window.location.hash = `#/vehicles/${id}`), car.id);
  const vehicleForm = page.getByRole('form', { name: 'Edit vehicle' });
  await vehicleForm.getByLabel('Class').selectOption('Club 2S truck');
  await vehicleForm.getByRole('button', { name: 'Save changes' }).click();
  // Over the class's limit: the window asks before saving a change that makes a build over.
  await page.getByTestId('save-anyway').click();
  await expect(vehicleForm.getByRole('status')).toContainText('Saved');
  expect((await shell.api<SheetValue>('builds.get', { id: build.id })).verdict?.status).toBe('over');

  await page.evaluate((id) => (window.location.hash = `#/classes/${id}`), stored!.id);
  await expect(row).toContainText('1');
  const edit = page.getByRole('form', { name: 'Edit class Club 2S truck' });
  await expect(edit.getByLabel('At most (V)')).toHaveValue('8.4');
  await edit.getByLabel('At most (V)').fill('25.2');
  await edit.getByLabel('Reason for the change (kept in history)').fill('open to 6S this season');
  await edit.getByRole('button', { name: 'Save class' }).click();
  await expect(edit.getByRole('status')).toContainText('1 build of the class re-checked, 1 verdict changed');
  // The list follows the save.
  await expect(row).toContainText('Full-charge voltage ≤ 25.2 V');
  await shot(page, 'classes-edited');
  expect((await shell.api<SheetValue>('builds.get', { id: build.id })).verdict?.status).not.toBe('over');
  const [entry] = await shell.api<{ summary: string; reason: string }[]>('history.list', { entityKind: 'classes', entityId: stored!.id });
  expect(entry).toMatchObject({ reason: 'open to 6S this season' });
  expect(entry?.summary).toContain('limit Full-charge voltage at most 8.4 V → 25.2 V');
});
