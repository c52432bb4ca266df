import type { Page } from '@playwright/test';
import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp, type StoredRecord } from './app-helpers';
import { seedFleet } from './fleet-seed';
import { expectNoAxeViolations } from './axe-check';

// A shop takes a customer's vehicle from intake to a printed job sheet in the window: the
// customer, the work order opened with the complaint, the steps that link the changes they
// made, the status through to hand-over, and the sheet as it prints. Each screen is photographed.

async function shot(page: Page, name: string, rules = true) {
  await page.screenshot({ path: `${SCREENSHOT_DIR}/${name}.png`, fullPage: true });
  if (rules) await expectNoAxeViolations(page, name);
}

test('intake to a printed job sheet: customer, work order, steps with their changes, hand-over', async ({ page, shell }) => {
  test.setTimeout(240_000);
  const fleet = await seedFleet((name, args) => shell.api(name, args));
  await openApp(page, shell, '#/customers');
  const customers = page.getByTestId('customers-table');
  await expect(customers.getByRole('link', { name: 'Dana Okafor' })).toBeVisible();
  await expect(
    customers
      .getByRole('row', { name: /Dana Okafor/ })
      .locator('td')
      .nth(2),
  ).toHaveText('3');

  // A new customer: an empty name is refused beside the field and nothing is added.
  await page.getByRole('link', { name: 'Add customer' }).click();
  const form = page.getByRole('form', { name: 'Add customer' });
  await form.getByRole('button', { name: 'Add customer' }).click();
  await expect(form.getByText('is required')).toBeVisible();
  expect(await shell.api<StoredRecord[]>('customers.list', {})).toHaveLength(3);
  await form.getByLabel('Name').fill('Mika Sato');
  await form.getByLabel('Contact').fill('mika@example.net');
  await form.getByRole('button', { name: 'Add customer' }).click();
  await expect(page).toHaveURL(/#\/customers\/cust-/u);
  await expect(customers.getByRole('link', { name: 'Mika Sato' })).toBeVisible();
  await shot(page, 'customers');

  // Intake: Dana brings the short-course truck; the work order opens from her vehicles.
  await customers.getByRole('link', { name: 'Dana Okafor' }).click();
  const truck = page.getByRole('listitem').filter({ hasText: 'Short-course truck' });
  await truck.getByRole('link', { name: 'Open work order' }).click();
  await expect(page.getByRole('heading', { name: 'Open a work order' })).toBeVisible();
  await expect(page.getByLabel('Vehicle')).toHaveValue(fleet.vehicles.sct);
  await page.getByRole('button', { name: 'Open work order' }).click();
  await expect(page.getByText('complaint: is required')).toBeVisible();
  await page.getByLabel(/Complaint/).fill('Motor and speed controller too hot to touch after five minutes on the 4S pack.');
  await page.getByRole('button', { name: 'Open work order' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Work order · Short-course truck' })).toBeVisible();
  await expect(page.getByTestId('job-status')).toHaveText('Open');
  const verdicts = page.getByTestId('verdicts-before-after');
  await expect(verdicts.getByRole('row')).toHaveCount(3);
  await shot(page, 'work-order-open');

  // The bench re-gears the truck on its build (as the build form does); the change shows up to link.
  const sct = await shell.api<{ build: StoredRecord }>('builds.get', { id: fleet.builds.sct! });
  await shell.api('builds.update', {
    id: sct.build.id,
    expectedVersion: sct.build.version,
    changes: { gearing: { pinionTeeth: 12, spurTeeth: 50, internalRatio: 2.85, tireDiameterMm: 110, drivetrainEfficiency: 0.88 } },
    reason: 'work order: lower the current on 4S',
  });
  const link = page.getByRole('checkbox', { name: /Changed build "SC truck 4S"/ });
  await expect(link).toBeVisible();
  await page.getByLabel('Kind').selectOption('checked');
  await page.getByLabel('What was found or done').fill('Motor 96 °C after five minutes; pinion 14 on 4S for a 110 mm tyre.');
  await page.getByRole('button', { name: 'Add step' }).click();
  await expect(page.getByTestId('job-steps').getByRole('listitem')).toHaveCount(1);
  await page.getByLabel('Kind').selectOption('re-geared');
  await page.getByLabel('What was found or done').fill('Pinion 14 → 12.');
  await page.getByLabel(/^Why/).fill('the motor current was past its rating on 4S');
  await link.check();
  await page.getByRole('button', { name: 'Add step' }).click();
  const steps = page.getByTestId('job-steps').getByRole('listitem');
  await expect(steps).toHaveCount(2);
  await expect(steps.nth(1)).toContainText('Re-geared: Pinion 14 → 12.');
  await expect(steps.nth(1)).toContainText(/Record #\d+: Changed build "SC truck 4S"/u);

  // Only the statuses the job may go to are offered; straight to hand-over is not one of them.
  await expect(page.getByRole('button', { name: 'Mark handed over' })).toHaveCount(0);
  await page.getByRole('button', { name: 'Mark waiting for parts' }).click();
  await expect(page.getByTestId('job-status')).toHaveText('Waiting for parts');
  await page.getByRole('button', { name: 'Mark ready' }).click();
  await expect(page.getByTestId('job-status')).toHaveText('Ready');
  await page.getByLabel('Kind').selectOption('tested');
  await page.getByLabel('What was found or done').fill('Two 5-minute runs, motor 64 °C.');
  await page.getByRole('button', { name: 'Add step' }).click();
  await expect(steps).toHaveCount(3);
  await shot(page, 'work-order-ready');
  await page.getByLabel('Handed over by').fill('Tess at the bench');
  await page.getByRole('button', { name: 'Mark handed over' }).click();
  await expect(page.getByTestId('job-status')).toHaveText('Handed over');
  await expect(page.getByText(/Handed over by Tess at the bench on /u)).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Add a step' })).toHaveCount(0);
  await expect(verdicts.getByRole('columnheader', { name: 'At hand-over' })).toBeVisible();
  const stored = await shell.api<{ order: { status: string; steps: { historyIds: number[] }[] } }>('workOrders.get', { id: page.url().split('/').pop()! });
  expect(stored.order.status).toBe('handed-over');
  expect(stored.order.steps.map((s) => s.historyIds.length)).toEqual([0, 1, 0]);
  await shot(page, 'work-order-handed-over');

  // Printed: no navigation or controls; customer, vehicle, complaint, steps, verdicts, cautions and sign-off.
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('navigation', { name: 'Screens' })).toBeHidden();
  await expect(page.getByRole('button', { name: /Print job sheet/ })).toBeHidden();
  await expect(page.getByText('Rigbook job sheet')).toBeVisible();
  for (const heading of ['Customer', 'Vehicle', 'Complaint', 'What was found and what was changed', 'Verdicts before and after', 'Safety', 'Sign-off']) {
    await expect(page.getByRole('heading', { name: heading, exact: true })).toBeVisible();
  }
  await expect(page.getByText('Received by (customer)')).toBeVisible();
  await shot(page, 'job-sheet-print', false);
  // Greyscale, as a shop's laser printer gives it: the status and verdicts still read as words.
  await page.evaluate(() => (document.documentElement.style.filter = 'grayscale(1)'));
  await shot(page, 'job-sheet-print-greyscale', false);
  await page.evaluate(() => (document.documentElement.style.filter = ''));
  // One or two A4 pages: Chromium's own PDF of the printed page.
  const pdf = (await page.pdf({ format: 'A4', preferCSSPageSize: true })).toString('latin1');
  const pages = (pdf.match(/\/Type\s*\/Page(?!s)/gu) ?? []).length;
  expect(pages).toBeGreaterThanOrEqual(1);
  expect(pages).toBeLessThanOrEqual(2);
  await page.emulateMedia({ media: 'screen' });

  // Back on the customer: the work order is listed as handed over, and the builds list filters by her.
  await page.evaluate((h) => (window.location.hash = h), `#/customers/${fleet.customers.dana}`);
  await expect(page.getByRole('complementary', { name: 'customer details' }).getByTestId('work-orders').getByRole('row').nth(1)).toContainText('Handed over');
  await page.getByRole('link', { name: 'Their builds' }).click();
  await expect(page).toHaveURL(new RegExp(`customer=${fleet.customers.dana}`, 'u'));
  await expect(page.getByTestId('build-count')).toHaveText(/^\d+ of 11 shown$/u);
  await expect(page.getByLabel('Customer')).toHaveValue(fleet.customers.dana);
  await shot(page, 'builds-by-customer');
});
