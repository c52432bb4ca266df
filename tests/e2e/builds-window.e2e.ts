import { test, expect } from './local-shell';
import { openApp } from './app-helpers';
import { generateFleet } from '../../demo-fixtures/generate-fleet';

// The builds list draws a window of rows into reused row elements. What a user and assistive
// technology meet must be the list itself: no row of an earlier search, seen, read out or
// clickable, whatever the keystrokes did to the elements behind it.
test('a search that matches nothing leaves no row to see, reach or click, and clearing it brings the same rows back', async ({ page, shell }) => {
  const fleet = generateFleet({ builds: 120, seed: 7 });
  await shell.api('fleet.import', { fleet, mode: 'replace', reason: 'list window test' });
  await openApp(page, shell, '#/builds');
  const rows = page.getByTestId('build-row');
  await expect(rows.first()).toBeVisible({ timeout: 15_000 });
  // The rows below the view follow the first frame: more rows than fit are drawn once settled.
  // The grid scrolls under its 30 px column headings.
  const grid = page.getByRole('grid', { name: 'Builds' });
  const fit = Math.ceil(((await grid.evaluate((el) => el.clientHeight)) - 30) / 32);
  await expect.poll(() => rows.count()).toBeGreaterThan(fit);
  const before = await rows.evaluateAll((els) => els.map((el) => el.getAttribute('data-build-id')));

  const search = page.getByLabel('Search builds');
  await search.fill('nothing-has-this-name');
  await expect(page.getByTestId('build-count')).toContainText('0 of 120 shown');
  await expect(rows).toHaveCount(0);
  // Nothing of the rows held behind is exposed as a row, and nothing in the list takes a click.
  await expect(page.getByRole('row')).toHaveCount(1); // the column headings
  const box = (await grid.boundingBox())!;
  const hit = await page.evaluate(({ x, y }) => document.elementFromPoint(x, y)?.closest('[role="row"]')?.getAttribute('data-build-id') ?? null, { x: box.x + box.width / 2, y: box.y + 30 + 40 });
  expect(hit).toBeNull();
  await page.mouse.dblclick(box.x + box.width / 3, box.y + 30 + 16);
  await page.waitForTimeout(300);
  expect(new URL(page.url()).hash).toMatch(/^#\/builds(\?[^/]*)?$/);

  await search.fill('');
  await expect(page.getByTestId('build-count')).toContainText('120 builds');
  await expect.poll(() => rows.evaluateAll((els) => els.map((el) => el.getAttribute('data-build-id')))).toEqual(before);
  await expect(rows.first()).toHaveAttribute('aria-rowindex', '2');
});

test('a narrowing search numbers its rows from the top, and no element left from a wider list shows inside the list', async ({ page, shell }) => {
  await shell.api('fleet.import', { fleet: generateFleet({ builds: 120, seed: 7 }), mode: 'replace', reason: 'list window test' });
  await openApp(page, shell, '#/builds');
  const rows = page.getByTestId('build-row');
  await expect(rows.first()).toBeVisible({ timeout: 15_000 });
  const fit = Math.floor(((await page.getByRole('grid', { name: 'Builds' }).evaluate((el) => el.clientHeight)) - 30) / 32);
  const search = page.getByLabel('Search builds');
  for (const text of ['1', '11', '111', '11', '']) {
    await search.fill(text);
    const count = page.getByTestId('build-count');
    const shown = Number(/^([\d,]+)/.exec((await count.textContent())!.trim())![1]!.replace(/,/g, ''));
    // A short list has exactly its rows; a long one at least a screenful.
    if (shown <= fit) await expect(rows).toHaveCount(shown);
    else await expect.poll(() => rows.count()).toBeGreaterThanOrEqual(fit);
    const indexes = await rows.evaluateAll((els) => els.map((el) => Number(el.getAttribute('aria-rowindex'))));
    expect(indexes).toEqual(indexes.map((_, i) => i + 2));
    // The elements behind the list (no build-row test id) lie outside the list's box.
    const strays = await page.locator('.rows > .row:not([data-testid])').evaluateAll((els) => {
      const view = els[0]?.closest('[role="grid"]')?.getBoundingClientRect();
      return view
        ? els.filter((el) => {
            const r = el.getBoundingClientRect();
            return r.bottom > view.top + 30 && r.top < view.bottom;
          }).length
        : 0;
    });
    expect(strays).toBe(0);
  }
});

// The body rows place their cells at the places read from the column headings rather than
// laying out a grid each: the cells must stay under their headings, and follow them when the
// window is resized without reloading.
test('every cell of a row lies under its column heading, before and after the window is resized', async ({ page, shell }) => {
  await shell.api('fleet.import', { fleet: generateFleet({ builds: 40, seed: 7 }), mode: 'replace', reason: 'list window test' });
  await page.setViewportSize({ width: 1280, height: 800 });
  await openApp(page, shell, '#/builds');
  const rows = page.getByTestId('build-row');
  await expect(rows.first()).toBeVisible({ timeout: 15_000 });
  const places = () =>
    page.evaluate(() => {
      const box = (el: Element) => {
        const r = el.getBoundingClientRect();
        return [Math.round(r.left * 4) / 4, Math.round(r.width * 4) / 4];
      };
      const heads = [...document.querySelector('[role="columnheader"]')!.parentElement!.children].map(box);
      const rowCells = [...document.querySelectorAll('[data-testid="build-row"]')].slice(0, 5).map((row) => [...row.children].map(box));
      return { heads, rowCells };
    });
  for (const width of [1280, 1000, 1440]) {
    await page.setViewportSize({ width, height: 800 });
    // The headings' widths depend on the window's: at each size they differ from the last.
    await expect
      .poll(async () => {
        const { heads, rowCells } = await places();
        return rowCells.every((cells) => JSON.stringify(cells) === JSON.stringify(heads)) && heads.length === 9;
      })
      .toBe(true);
    const { heads } = await places();
    expect(heads[2]![1], `the Build column at ${width} px`).toBeGreaterThanOrEqual(150);
  }
});

// Every column has a least width. A window narrower than all of them together must let the list
// scroll sideways: the current against its limit, the last column, is never cut off out of reach.
test('in a window too narrow for every column the list scrolls sideways to the current column, and in a wide one it does not', async ({ page, shell }) => {
  await shell.api('fleet.import', { fleet: generateFleet({ builds: 40, seed: 7 }), mode: 'replace', reason: 'list window test' });
  await page.setViewportSize({ width: 1000, height: 800 });
  await openApp(page, shell, '#/builds');
  const rows = page.getByTestId('build-row');
  await expect(rows.first()).toBeVisible({ timeout: 15_000 });
  const grid = page.getByRole('grid', { name: 'Builds' });
  const heading = page.getByRole('columnheader', { name: 'Current / limit' });
  const cell = rows.first().getByTestId('current-cell');
  // Whether a box lies wholly inside the grid's visible box.
  const inView = async (box: typeof heading) => {
    const [g, b] = [(await grid.boundingBox())!, (await box.boundingBox())!];
    return b.x >= g.x - 0.5 && b.x + b.width <= g.x + g.width + 0.5;
  };
  // What can be seen and clicked at a box's centre: a clipped cell is not what is there.
  const atCentre = (box: typeof heading) =>
    box.evaluate((el) => {
      const r = el.getBoundingClientRect();
      return el.contains(document.elementFromPoint(r.left + r.width / 2, r.top + r.height / 2));
    });
  await expect.poll(() => grid.evaluate((el) => el.scrollWidth > el.clientWidth)).toBe(true);
  expect(await inView(heading)).toBe(false);
  // Sideways as a user scrolls: the wheel (or a trackpad) over the list.
  const box = (await grid.boundingBox())!;
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  await page.mouse.wheel(2000, 0);
  await expect.poll(() => inView(heading)).toBe(true);
  expect(await inView(cell)).toBe(true);
  expect(await atCentre(cell)).toBe(true);
  await expect(cell).toContainText('A');

  await page.setViewportSize({ width: 1440, height: 800 });
  await expect.poll(() => grid.evaluate((el) => el.scrollWidth <= el.clientWidth)).toBe(true);
  expect(await inView(heading)).toBe(true);
});
