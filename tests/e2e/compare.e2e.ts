import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp } from './app-helpers';
import { seedFleet } from './fleet-seed';
import { expectNoAxeViolations } from './axe-check';

interface Finding {
  rule: string;
  margin: number | null;
}
interface Sheet {
  build: { name: string };
  verdict: { supplies: { findings: Finding[] }[] } | null;
}

// Three builds marked in the list (two by their boxes, one by the keyboard) and compared side
// by side: three columns, differing rows marked by a word, and the address survives a reload.
test('compare three builds from the list: a column each, differing rows marked, kept over a reload', async ({ page, shell }) => {
  const fleet = await seedFleet(shell.api);
  const ids = [fleet.builds.buggyBash!, fleet.builds.sct!, fleet.builds.sctAlt!];
  const sheets = await Promise.all(ids.map((id) => shell.api<Sheet>('builds.get', { id })));

  await openApp(page, shell, '#/builds');
  const rowOf = (id: string) => page.locator(`[data-testid="build-row"][data-build-id="${id}"]`);
  await expect(rowOf(ids[0]!)).toBeVisible({ timeout: 15_000 });

  await rowOf(ids[0]!).getByTestId('compare-pick').check();
  await rowOf(ids[1]!).getByTestId('compare-pick').check();
  // The third by the keyboard: select its row, then Space marks it.
  // On the verdict cell: the name is a link to the sheet.
  await rowOf(ids[2]!).click({ position: { x: 80, y: 10 } });
  await expect(rowOf(ids[2]!)).toHaveAttribute('aria-selected', 'true');
  await page.getByRole('grid', { name: 'Builds' }).focus();
  await page.keyboard.press('Space');
  await expect(rowOf(ids[2]!).getByTestId('compare-pick')).toBeChecked();

  const bar = page.getByTestId('compare-bar');
  await expect(bar).toContainText('3 marked');
  await bar.getByRole('button', { name: 'Compare 3' }).click();

  await expect(page).toHaveURL(new RegExp(`#/compare\\?ids=${ids.join(',')}$`, 'u'));
  const check = async () => {
    const view = page.getByTestId('compare');
    await expect(view.getByRole('heading', { level: 1, name: 'Compare 3 builds' })).toBeVisible();
    const checks = view.getByTestId('compare-checks');
    await expect(checks.getByTestId('compare-column')).toHaveCount(3);
    for (const [i, s] of sheets.entries()) await expect(checks.getByTestId('compare-column').nth(i)).toContainText(s.build.name);

    // The buggy and the trucks are geared differently: that row differs and says so.
    const figures = view.getByTestId('compare-figures');
    const ratio = figures.locator('[data-key="finalDriveRatio"]');
    await expect(ratio).toHaveAttribute('data-differs', 'true');
    await expect(ratio.getByRole('rowheader')).toContainText('differs');
    // All three run the same 4S pack type: the nominal voltage row is the same and unmarked.
    const nominal = figures.locator('[data-key="packVoltageNominalV"]');
    await expect(nominal).toHaveAttribute('data-differs', 'false');
    await expect(nominal.getByRole('rowheader')).not.toContainText('differs');

    // Each build's margin is its stored finding's, as the sheet words it.
    const packRow = checks.locator('[data-key="battery-continuous"]');
    for (const [i, s] of sheets.entries()) {
      const margin = s.verdict!.supplies[0]!.findings.find((f) => f.rule === 'battery-continuous')!.margin!;
      const words = margin < 0 ? `${Math.round(-margin * 100)} % over` : `${Math.round(margin * 100)} % headroom`;
      await expect(packRow.locator('td').nth(i)).toContainText(words);
    }
  };
  await check();
  await page.screenshot({ path: `${SCREENSHOT_DIR}/compare.png`, fullPage: true });
  await expectNoAxeViolations(page, 'compare');

  await page.reload();
  await check();

  // Printed: no navigation, the comparison kept.
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('navigation', { name: 'Breadcrumb' })).toBeHidden();
  await expect(page.getByTestId('compare-checks')).toBeVisible();
  await page.screenshot({ path: `${SCREENSHOT_DIR}/compare-print.png`, fullPage: true });
  await page.emulateMedia({ media: 'screen' });
});

test('a fifth build is refused with a reason, and one build alone cannot be compared', async ({ page, shell }) => {
  const fleet = await seedFleet(shell.api);
  const ids = Object.values(fleet.builds).slice(0, 5);
  await openApp(page, shell, '#/builds');
  const pick = (id: string) => page.locator(`[data-testid="build-row"][data-build-id="${id}"]`).getByTestId('compare-pick');
  await expect(pick(ids[0]!)).toBeVisible({ timeout: 15_000 });
  await pick(ids[0]!).check();
  const bar = page.getByTestId('compare-bar');
  await expect(bar.getByRole('button', { name: 'Compare 1' })).toBeDisabled();
  for (const id of ids.slice(1, 4)) await pick(id).check();
  await pick(ids[4]!).click();
  await expect(pick(ids[4]!)).not.toBeChecked();
  await expect(bar.getByRole('status')).toContainText('Up to 4 builds');
  await expect(bar).toContainText('4 marked');

  // An address naming one build says what a comparison needs.
  await page.evaluate((h) => (window.location.hash = h), `#/compare?ids=${ids[0]!}`);
  await expect(page.getByTestId('compare')).toContainText('A comparison needs two to four builds');
});
