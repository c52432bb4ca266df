import type { Page } from '@playwright/test';
import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp, seedOneBuild, type SheetValue, type StoredRecord } from './app-helpers';

// The receiver supply as a technician enters it: the controller's BEC rating on the part, the
// receiver and servo load on the build, the check and its caution on the sheet.
test('a BEC load typed on the build is checked against the controller BEC rating, with the receiver caution', async ({ page, shell }) => {
  const { build, esc } = await seedOneBuild(shell);
  await shell.api('controllers.update', { id: esc.id, expectedVersion: esc.version, changes: { becCurrentA: 3 }, reason: 'BEC rating from the manual' });

  // No load entered: the rating alone claims nothing, so the sheet has no BEC check.
  await openApp(page, shell, `#/builds/${build.id}`);
  await expect(page.getByTestId('build-sheet')).toBeVisible();
  await expect(page.locator('[data-testid="finding"][data-rule="bec-current"]')).toHaveCount(0);

  await openApp(page, shell, `#/builds/${build.id}/edit`);
  const form = page.getByRole('form', { name: 'Edit build' });
  await form.getByLabel('BEC load (A)').fill('3.5');
  await form.getByRole('button', { name: 'Save build' }).click();
  // 3.5 A on a 3 A BEC is over: where the save asks first, say yes.
  await saveThrough(page);
  const finding = page.locator('[data-testid="finding"][data-rule="bec-current"]');
  await expect(finding).toHaveClass(/over/);
  await expect(finding).toContainText('BEC current');
  await expect(finding).toContainText('3.5');
  await expect(page.getByTestId('build-sheet')).toContainText('Receiver supply: a BEC asked for more than it gives');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/sheet-bec-over.png`, fullPage: true });
  expect((await shell.api<SheetValue>('builds.get', { id: build.id })).build.becLoadA).toBe(3.5);

  // A lighter servo set: 2 A of 3 A leaves a third of the rating (more than the default tight
  // threshold), so the check reads clear.
  await openApp(page, shell, `#/builds/${build.id}/edit`);
  await form.getByLabel('BEC load (A)').fill('2');
  await form.getByRole('button', { name: 'Save build' }).click();
  await saveThrough(page);
  await expect(finding).toHaveClass(/clear/);
  expect((await shell.api<StoredRecord & { becCurrentA: number }>('controllers.get', { id: esc.id })).becCurrentA).toBe(3);
});

/** After a build save: the sheet, answering the over question where the save asks it. */
async function saveThrough(page: Page): Promise<void> {
  const sheet = page.getByTestId('build-sheet');
  const saveAnyway = page.getByTestId('save-anyway');
  await expect(sheet.or(saveAnyway)).toBeVisible();
  if (await saveAnyway.isVisible()) await saveAnyway.click();
  await expect(sheet).toBeVisible();
}
