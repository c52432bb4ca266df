import { test, expect } from './local-shell';
import { openApp, seedOneBuild, type StoredRecord } from './app-helpers';

test('an edit that lost the race shows the conflict, keeps the typing, and saves on top of the newer version', async ({ page, shell }) => {
  const { pack } = await seedOneBuild(shell);
  await openApp(page, shell, `#/parts/packs/${pack.id}`);
  const form = page.getByRole('form', { name: 'Edit pack' });
  await expect(form.getByLabel('Capacity (mAh)')).toHaveValue('5000');
  await form.getByLabel('Cycles (count)').fill('77');

  // Someone else saves first.
  await shell.api('batteries.update', { id: pack.id, expectedVersion: pack.version, changes: { cRatingBurst: 90 }, reason: 'other bench' });

  await form.getByRole('button', { name: 'Save changes' }).click();
  await expect(form.getByRole('alert').first()).toContainText('changed elsewhere');
  await expect(form.getByLabel('Cycles (count)')).toHaveValue('77');
  await form.getByRole('button', { name: 'Load their version, keep my edits' }).click();
  await expect(form.getByLabel('Burst C rating (C)')).toHaveValue('90');
  await expect(form.getByLabel('Cycles (count)')).toHaveValue('77');
  await form.getByRole('button', { name: 'Save changes' }).click();
  await expect(form.getByRole('status')).toContainText('Saved');
  const stored = await shell.api<StoredRecord>('batteries.get', { id: pack.id });
  expect(stored.cycleCount).toBe(77);
  expect(stored.cRatingBurst).toBe(90);
  expect(stored.version).toBe(pack.version + 2);
});

test('retiring and archiving a pack, and its used-by list', async ({ page, shell }) => {
  const { pack, build } = await seedOneBuild(shell);
  await openApp(page, shell, `#/parts/packs/${pack.id}`);
  await expect(page.getByTestId('used-by')).toHaveCount(1);
  await expect(page.getByTestId('used-by').first()).toContainText('Test truck 4S');
  const form = page.getByRole('form', { name: 'Edit pack' });
  await form.getByLabel('Retired (no longer used in new builds)').check();
  await form.getByLabel('Reason for the change (kept in history)').fill('puffed after a crash');
  await form.getByRole('button', { name: 'Save changes' }).click();
  // A retired pack makes every build that still uses it read OVER, so the save asks first and says why.
  const dialog = page.getByRole('dialog');
  await expect(dialog).toContainText('Test truck 4S');
  await expect(dialog).toContainText(/retired/i);
  await page.getByTestId('save-anyway').click();
  await expect(page.getByTestId('part-row').filter({ hasText: 'Test 4S 5000' })).toContainText('retired');
  expect((await shell.api<StoredRecord>('batteries.get', { id: pack.id })).retired).toBe(true);

  await page.getByRole('button', { name: 'Archive pack' }).click();
  await expect(page.getByRole('button', { name: 'Restore' })).toBeVisible();
  const archived = await shell.api<StoredRecord>('batteries.get', { id: pack.id });
  expect(archived.archivedAt).not.toBeNull();
  // Archived packs leave the table unless asked for.
  await expect(page.getByTestId('part-row').filter({ hasText: 'Test 4S 5000' })).toHaveCount(0);
  await page.getByLabel('show archived').check();
  await expect(page.getByTestId('part-row').filter({ hasText: 'Test 4S 5000' })).toContainText('archived');
  // The build that uses it is untouched.
  expect((await shell.api<{ id: string }[]>('builds.list', {})).map((b) => b.id)).toEqual([build.id]);
});

test('imperial units show in the list, the sheet and the form labels, and convert back when saved', async ({ page, shell }) => {
  const { build, car } = await seedOneBuild(shell);
  await openApp(page, shell, '#/settings');
  await page.getByRole('radio', { name: /Imperial/ }).check();
  await expect(page.getByRole('status')).toContainText('imperial');
  expect((await shell.api<{ units: string }>('settings.get', {})).units).toBe('imperial');

  await page.evaluate(() => (window.location.hash = '#/builds'));
  // 66.3 km/h theoretical ÷ 1.609344 = 41.2 mph (NIST SP 811: mile = 1609.344 m).
  await expect(page.locator(`[data-build-id="${build.id}"]`)).toContainText('mph');

  await page.evaluate((id) => (window.location.hash = `#/vehicles/${id}`), car.id);
  const form = page.getByRole('form', { name: 'Edit vehicle' });
  // 3.2 kg ÷ 0.45359237 = 7.05479 lb (NIST SP 811: pound = 0.45359237 kg exactly), shown rounded for people.
  await expect(form.getByLabel('Mass (lb)')).toHaveValue('7.05');
  await form.getByLabel('Mass (lb)').fill('10');
  await form.getByRole('button', { name: 'Save changes' }).click();
  await expect(form.getByRole('status')).toContainText('Saved');
  const stored = await shell.api<{ massKg: number }>('vehicles.get', { id: car.id });
  // 10 lb = 4.5359237 kg.
  expect(stored.massKg).toBeCloseTo(4.5359237, 9);

  await page.evaluate(() => (window.location.hash = '#/settings'));
  await page.getByLabel('Tight below (% headroom)').fill('30');
  await page.getByRole('button', { name: 'Save' }).click();
  await expect(page.getByRole('status')).toContainText('30 %');
  expect((await shell.api<{ tightThreshold: number }>('settings.get', {})).tightThreshold).toBeCloseTo(0.3, 12);
  await page.getByLabel('Tight below (% headroom)').fill('95');
  await page.getByRole('button', { name: 'Save' }).click();
  await expect(page.locator('#threshold-error')).toHaveText('must be 90 % or less');
  expect((await shell.api<{ tightThreshold: number }>('settings.get', {})).tightThreshold).toBeCloseTo(0.3, 12);
});

test('a fresh store greets with an empty state and can load the demo fleet', async ({ page, shell }) => {
  await openApp(page, shell, '#/builds');
  await expect(page.getByRole('heading', { name: 'Nothing on the books yet' })).toBeVisible();
  await page.getByRole('button', { name: 'Load the demo fleet' }).click();
  await expect(page.getByTestId('build-row').first()).toBeVisible({ timeout: 15_000 });
  const builds = await shell.api<unknown[]>('builds.list', {});
  expect(builds.length).toBeGreaterThan(0);
  await expect(page.getByTestId('build-count')).toHaveText(`${builds.length} builds`);
});
