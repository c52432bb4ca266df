import { test, expect } from './local-shell';
import { openApp } from './app-helpers';
import { generateFleet } from '../../demo-fixtures/generate-fleet';

// The builds list clips a cell (with an ellipsis) only where its text could be wider than its
// column, judged from each character's advance rather than by laying the text out. Chromium's
// own layout is the judge here: a cell left unclipped must never hold text wider than itself,
// for wide letters, narrow ones, accented and CJK text and an emoji, at a wide window and at
// one narrow enough to put every column at its least width.
const NAMES = ['WWWWWWWWWWWWWWWWWWWWWWWWW', 'Build 7', 'iiiiiiiiiiiiiiiiiiiiiiiiiiiiiiiiiiiiii', 'Mémé 测试 🚗 ÆØÅ', 'MMMMMMMMMMMM', '8888888888888', 'Wide-body 1:8 truggy'];

test('a cell left unclipped never holds text wider than its column, and a long name is cut with an ellipsis', async ({ page, shell }) => {
  const fleet = generateFleet({ builds: 30, seed: 11 });
  NAMES.forEach((name, i) => (fleet.builds[i]!.name = name));
  fleet.customers[0]!.name = 'Møller & Søn Racing Workshop';
  fleet.customers[1]!.name = 'Åsa Ng';
  await shell.api('fleet.import', { fleet, mode: 'replace', reason: 'cell fit test' });

  for (const width of [1280, 1000]) {
    await page.setViewportSize({ width, height: 1600 });
    await openApp(page, shell, '#/builds');
    const rows = page.getByTestId('build-row');
    await expect(rows.first()).toBeVisible({ timeout: 15_000 });
    // All 30 rows fit in this window, so every one is drawn.
    await expect.poll(() => rows.count()).toBe(30);
    const cells = await page
      .locator('[data-testid="build-row"] > [role="gridcell"]:is(.name, .text)')
      .evaluateAll((els) => els.map((el) => ({ text: el.textContent!.trim(), clipped: el.classList.contains('clip'), overflows: el.scrollWidth > el.clientWidth, title: el.getAttribute('title') })));
    expect(cells.length).toBe(30 * 4);
    // The judge: no unclipped cell overflows.
    expect(cells.filter((c) => !c.clipped && c.overflows)).toEqual([]);
    // The bound is not so loose that everything is clipped: short names are not.
    expect(cells.find((c) => c.text === 'Build 7')?.clipped).toBe(false);
    // Text that is wider than its column is clipped.
    const wide = cells.find((c) => c.text === NAMES[0]);
    expect(wide).toMatchObject({ clipped: true, overflows: true });
    // A cell that may be cut short gives its whole text on hover; the others need no tooltip.
    for (const c of cells) expect(c.title !== null).toBe(c.clipped);
    expect(wide!.title).toBe(NAMES[0]);
  }
});
