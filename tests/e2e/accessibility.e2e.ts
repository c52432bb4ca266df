import type { Page } from '@playwright/test';
import { test, expect } from './local-shell';
import { openApp, type StoredRecord } from './app-helpers';
import { seedFleet, type SeededFleet } from './fleet-seed';
import { expectNoAxeViolations } from './axe-check';

// Every screen and state of the app, each checked against the WCAG 2.0/2.1 A and AA rules of
// the axe-core engine once it has settled. Each visit first waits for what the screen must show,
// so the rules judge the screen and not a half-loaded one.

const go = (page: Page, hash: string) => page.evaluate((h) => (window.location.hash = h), hash);

test('the rule check itself fails on a violation and names the rule, the element and the screen', async ({ browser }) => {
  // A page of our own with one known failure: grey #999 on white is 2.85:1, under the 4.5:1
  // that WCAG 2.1 success criterion 1.4.3 asks of normal-size text.
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.setContent('<!doctype html><html lang="en"><head><title>Check</title></head><body><main><p id="faint" style="color:#999;background:#fff">faint text</p></main></body></html>');
  const failure = await expectNoAxeViolations(page, 'contrast sample').then(
    () => null,
    (e: unknown) => (e instanceof Error ? e.message : String(e)),
  );
  await context.close();
  expect(failure).toContain('[color-contrast] (serious) #faint');
  expect(failure).toContain('screen "contrast sample"');
});

test('empty start: the demo offer, a parts table with nothing in it, a pack that is not there', async ({ page, shell }) => {
  await openApp(page, shell, '#/builds');
  await expect(page.getByRole('heading', { name: 'Nothing on the books yet' })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Load the demo fleet' })).toBeVisible();
  await expectNoAxeViolations(page, 'empty start');
  await go(page, '#/parts/packs');
  await expect(page.getByTestId('parts-table')).toContainText('No packs yet');
  await expectNoAxeViolations(page, 'packs, none yet');
  await go(page, '#/parts/packs/pack-that-does-not-exist');
  await expect(page.locator('aside').getByRole('alert')).toBeVisible();
  await expectNoAxeViolations(page, 'pack detail, not found');
});

test.describe('on the invented fleet', () => {
  // Seeding the fleet and a dozen rule runs take a while on a busy two-core machine.
  test.describe.configure({ timeout: 180_000 });
  let fleet: SeededFleet;
  test.beforeEach(async ({ shell }) => {
    fleet = await seedFleet((name, args) => shell.api(name, args));
  });

  test('builds list: every verdict, a selected row, filtered, nothing matching', async ({ page, shell }) => {
    await openApp(page, shell, '#/builds');
    await expect(page.getByTestId('build-count')).toHaveText('11 builds');
    await expectNoAxeViolations(page, 'builds list');
    await page.locator(`[data-build-id="${fleet.builds.sct}"]`).click();
    await expect(page.locator('[data-testid="build-row"][aria-selected="true"]')).toHaveCount(1);
    await expectNoAxeViolations(page, 'builds list, a row selected');
    // The selected row is filtered out: the grid must not point at a row that is not drawn.
    await page.getByRole('button', { name: /Incomplete/ }).click();
    await expect(page.getByTestId('build-count')).toHaveText(/of 11 shown/);
    await expectNoAxeViolations(page, 'builds list, filtered by verdict');
    await page.getByLabel('Check').selectOption({ label: 'Controller continuous current' });
    await expect(page.getByRole('group', { name: 'Verdict' }).getByRole('button', { name: /^Clear/ })).toBeDisabled();
    await expectNoAxeViolations(page, 'builds list, filtered by check');
    await page.getByLabel('Check').selectOption({ label: 'Any check' });
    await page.getByLabel('Search builds').fill('no build is called this');
    await expect(page.getByTestId('build-row')).toHaveCount(0);
    await expectNoAxeViolations(page, 'builds list, nothing matches');
  });

  test('compare: builds marked in the list, four of mixed kinds side by side, one build alone', async ({ page, shell }) => {
    await openApp(page, shell, '#/builds');
    await expect(page.getByTestId('build-count')).toHaveText('11 builds');
    await page.locator(`[data-build-id="${fleet.builds.sct}"]`).getByTestId('compare-pick').check();
    await expect(page.getByTestId('compare-bar')).toContainText('1 marked');
    await expectNoAxeViolations(page, 'builds list, one build marked for comparing');
    const ids = [fleet.builds.buggyRace, fleet.builds.crawlerNoEsc, fleet.builds.boat, fleet.builds.quad].join(',');
    await page.evaluate((h) => (window.location.hash = h), `#/compare?ids=${ids}`);
    await expect(page.getByTestId('compare-checks').getByTestId('compare-column')).toHaveCount(4);
    await expectNoAxeViolations(page, 'compare, four builds of mixed kinds');
    await page.evaluate((h) => (window.location.hash = h), `#/compare?ids=${fleet.builds.sct}`);
    await expect(page.getByTestId('compare')).toContainText('A comparison needs two to four builds');
    await expectNoAxeViolations(page, 'compare, one build');
  });

  test('the build sheet of each vehicle kind, an incomplete one, print, and a build that is not there', async ({ page, shell }) => {
    const sheets: [string, string, string][] = [
      ['car', fleet.builds.buggyRace!, 'Buggy club race'],
      ['truck', fleet.builds.monster6s!, 'Monster 6S'],
      ['boat', fleet.builds.boat!, 'Deep-V 6S'],
      ['multirotor', fleet.builds.quad!, 'Freestyle 6S'],
      ['plane', fleet.builds.glider!, 'Glider climb'],
      ['truck, no controller (incomplete)', fleet.builds.crawlerNoEsc!, 'Crawler rebuild'],
    ];
    await openApp(page, shell, '#/builds');
    for (const [kind, id, name] of sheets) {
      await go(page, `#/builds/${id}`);
      const sheet = page.getByTestId('build-sheet');
      await expect(sheet.getByRole('heading', { name })).toBeVisible();
      await expect(sheet.getByTestId('supply').first()).toBeVisible();
      await expectNoAxeViolations(page, `build sheet: ${kind}`);
    }
    await page.emulateMedia({ media: 'print' });
    await expect(page.getByText(/^Rigbook build sheet/)).toBeVisible();
    await expectNoAxeViolations(page, 'build sheet, printed');
    await page.emulateMedia({ media: 'screen' });

    await go(page, '#/builds/build-that-does-not-exist');
    await expect(page.getByRole('alert')).toBeVisible();
    await expect(page.getByRole('link', { name: 'Back to the builds' })).toBeVisible();
    await expectNoAxeViolations(page, 'build sheet, not found');
  });

  test('build form: new, refused with errors beside the fields, editing', async ({ page, shell }) => {
    await openApp(page, shell, '#/builds/new');
    const form = page.getByRole('form', { name: 'New build' });
    await expect(form.getByLabel('Build name')).toBeVisible();
    await expectNoAxeViolations(page, 'new build form');
    await form.getByLabel('Pinion (teeth)').fill('-3');
    await form.getByRole('button', { name: 'Add build' }).click();
    await expect(form.getByRole('alert').first()).toBeVisible();
    await expect(form.locator('[aria-invalid="true"]').first()).toBeVisible();
    await expectNoAxeViolations(page, 'new build form, with errors');
    // Leaving a form with unsaved edits asks first; this test means to leave.
    page.once('dialog', (d) => void d.accept());
    await go(page, `#/builds/${fleet.builds.monster8s}/edit`);
    const edit = page.getByRole('form', { name: 'Edit build' });
    await expect(edit.getByLabel('Pinion (teeth)')).toHaveValue('13');
    await expectNoAxeViolations(page, 'edit build form');
  });

  test('swap preview: each way of changing, its result, and a refused value', async ({ page, shell }) => {
    await openApp(page, shell, `#/builds/${fleet.builds.monster6s}/swap`);
    await expect(page.getByRole('heading', { name: 'Swap preview' })).toBeVisible();
    await expect(page.getByLabel('Part to replace')).toBeVisible();
    await expectNoAxeViolations(page, 'swap preview, replace a part');
    await page.getByLabel('Part to replace').selectOption({ label: 'Motor: Shop 2050 4-pole 2200Kv' });
    await page.getByLabel('Replacement').selectOption({ label: 'Stadium 3660 3300Kv' });
    await page.getByRole('button', { name: 'Preview' }).click();
    await expect(page.getByTestId('preview-result')).toBeVisible();
    await expectNoAxeViolations(page, 'swap preview, a part replaced');

    await page.getByRole('tab', { name: 'Change gearing' }).click();
    await page.locator('input[name="gearing.pinionTeeth"]').fill('not a number');
    await page.getByRole('button', { name: 'Preview' }).click();
    await expect(page.getByRole('alert').filter({ hasText: 'Pinion' }).first()).toBeVisible();
    await expectNoAxeViolations(page, 'swap preview, gearing refused');

    await page.getByRole('tab', { name: "Edit a shared part's ratings" }).click();
    await page.getByLabel('Part record').selectOption({ label: 'motor: Shop 2050 4-pole 2200Kv' });
    await page.getByLabel('Field').selectOption({ label: 'Rated power (W)' });
    await page.getByLabel('New value').fill('2000');
    await page.getByRole('button', { name: 'Preview' }).click();
    await expect(page.getByTestId('preview-other').first()).toBeVisible();
    await expectNoAxeViolations(page, "swap preview, a shared part's rating");

    await page.getByRole('tab', { name: "Try a part you don't own" }).click();
    await page.getByTestId('draft-part').getByLabel('Kind of draft part').selectOption({ label: 'pack' });
    await page.getByRole('button', { name: 'Preview' }).click();
    await expect(page.getByTestId('draft-part').locator('[data-field="name"] .error')).toBeVisible();
    await expectNoAxeViolations(page, 'swap preview, a draft pack refused');
  });

  const PART_KINDS = [
    { slug: 'packs', one: 'pack', pick: (f: SeededFleet) => f.packs.shop4s1, name: 'Shop 4S 5000 #1' },
    { slug: 'motors', one: 'motor', pick: (f: SeededFleet) => f.motors.shop2050, name: 'Shop 2050 4-pole 2200Kv' },
    { slug: 'controllers', one: 'speed controller', pick: (f: SeededFleet) => f.controllers.shop150, name: 'Shop 150A 2-6S' },
    { slug: 'propellers', one: 'propeller', pick: (f: SeededFleet) => f.propellers.quad, name: '5.1 × 4.5 tri-blade' },
  ] as const;
  for (const k of PART_KINDS) {
    test(`${k.slug}: the table, a new record refused with errors, a stored record and its builds`, async ({ page, shell }) => {
      await openApp(page, shell, `#/parts/${k.slug}`);
      await expect(page.getByTestId('part-row').first()).toBeVisible();
      await expectNoAxeViolations(page, `${k.slug} table`);

      await go(page, `#/parts/${k.slug}/new`);
      const form = page.getByRole('form', { name: `Add ${k.one}` });
      await expect(form.getByLabel('Name')).toBeVisible();
      await expectNoAxeViolations(page, `new ${k.one} form`);
      await form.locator('button[type="submit"]').click();
      await expect(form.getByRole('alert').first()).toBeVisible();
      await expectNoAxeViolations(page, `new ${k.one} form, with errors`);

      await go(page, `#/parts/${k.slug}/${k.pick(fleet)}`);
      await expect(page.getByRole('form', { name: `Edit ${k.one}` })).toBeVisible();
      await expect(page.locator('aside').getByRole('heading', { name: k.name })).toBeVisible();
      await expect(page.getByTestId('used-by').first()).toBeVisible();
      await expectNoAxeViolations(page, `${k.one} detail`);
    });
  }

  test('retired and archived tags on the selected row, archived rows shown', async ({ page, shell }) => {
    await openApp(page, shell, `#/parts/packs/${fleet.packs.old3s}`);
    await page.getByRole('button', { name: 'Archive pack' }).click();
    await expect(page.getByRole('button', { name: 'Restore' })).toBeVisible();
    await page.getByLabel('show archived').check();
    await expect(page.getByTestId('part-row').filter({ hasText: 'Old 3S 2200' })).toContainText('archived');
    await expectNoAxeViolations(page, 'packs table with archived rows, an archived pack selected');
  });

  test('a part edit that lost the race to another writer', async ({ page, shell }) => {
    const pack = await shell.api<StoredRecord>('batteries.get', { id: fleet.packs.shop4s2 });
    await openApp(page, shell, `#/parts/packs/${pack.id}`);
    const form = page.getByRole('form', { name: 'Edit pack' });
    await form.getByLabel('Cycles (count)').fill('80');
    await shell.api('batteries.update', { id: pack.id, expectedVersion: pack.version, changes: { cycleCount: 72 }, reason: 'other bench' });
    await form.getByRole('button', { name: 'Save changes' }).click();
    await expect(form.getByRole('alert').first()).toContainText('changed elsewhere');
    await expectNoAxeViolations(page, 'pack form, conflict');
  });

  test('vehicles, history and settings', async ({ page, shell }) => {
    await openApp(page, shell, '#/vehicles');
    await expect(page.getByTestId('part-row').first()).toBeVisible();
    await expectNoAxeViolations(page, 'vehicles table');
    await go(page, `#/vehicles/${fleet.vehicles.monster}`);
    await expect(page.getByRole('form', { name: 'Edit vehicle' }).getByLabel('Drag area Cd·A (m²)')).toHaveValue('0.06');
    await expectNoAxeViolations(page, 'vehicle detail');
    await go(page, '#/vehicles/new');
    await expect(page.getByRole('form', { name: 'Add vehicle' })).toBeVisible();
    await expectNoAxeViolations(page, 'new vehicle form');

    const pack = await shell.api<StoredRecord>('batteries.get', { id: fleet.packs.shop4s1 });
    await shell.api('batteries.update', { id: pack.id, expectedVersion: pack.version, changes: { cRatingContinuous: 5 }, reason: 'bench test: pack puffed' });
    await go(page, '#/history');
    await expect(page.getByTestId('history-entry').first()).toContainText('bench test: pack puffed');
    await expectNoAxeViolations(page, 'history, every record');
    await go(page, `#/history/batteries/${pack.id}`);
    await expect(page.getByTestId('history-entry').first()).toContainText('bench test: pack puffed');
    await expectNoAxeViolations(page, 'history of one pack');

    await go(page, '#/settings');
    await expect(page.getByRole('radio', { name: /Metric/ })).toBeChecked();
    await expectNoAxeViolations(page, 'settings');
    await page.getByLabel('Tight below (% headroom)').fill('95');
    await page.getByRole('button', { name: 'Save' }).click();
    await expect(page.locator('#threshold-error')).toBeVisible();
    await expectNoAxeViolations(page, 'settings, refused threshold');
  });
});
