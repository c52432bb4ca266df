import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { SCREENSHOT_DIR, expect, test } from './local-shell';

// The loopback address opened without its one-time token (typed by hand, from history, from a
// bookmark) or with the token of an earlier start: the page says how to open Rigbook and shows
// no store at all, empty or otherwise.

test('opened without the token, the page explains how to open Rigbook and shows no store', async ({ page, shell }) => {
  await shell.api('batteries.create', { name: 'Kept pack 3S', chemistry: 'lipo', cellsSeries: 3, capacityMah: 2200 });
  await page.goto(shell.url);
  const heading = page.getByRole('heading', { name: 'Open Rigbook from where it started' });
  await expect(heading).toBeVisible();
  await expect(heading).toBeFocused();
  const origin = new URL(shell.url).origin;
  await expect(page.getByRole('listitem').filter({ hasText: 'Open:' })).toContainText(`${origin}/#token=`);
  await expect(page.getByText('it needs the one-time key')).toBeVisible();
  // Neither the empty-store greeting nor any screen of the app.
  await expect(page.getByRole('heading', { name: 'Nothing on the books yet' })).toHaveCount(0);
  await expect(page.getByRole('navigation')).toHaveCount(0);
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'open-without-token.png'), fullPage: true });

  // The printed address still opens the store as before, pasted as a fresh load (from the
  // same page it would be a fragment change only). Wait for the app itself before moving on:
  // the heading's absence alone can be read in the moment before the app has taken the token.
  await page.goto('about:blank');
  await page.goto(shell.openUrl);
  await expect(page.getByRole('navigation').first()).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Open Rigbook from where it started' })).toHaveCount(0);
  await page.evaluate(() => (window.location.hash = '#/parts/packs'));
  await expect(page.getByText('Kept pack 3S').first()).toBeVisible();
});

test('a token from an earlier start is dropped, and the page says so instead of showing an empty store', async ({ page, shell, consoleErrors }) => {
  await page.goto(`${shell.url}#token=fromAnEarlierStart`);
  await expect(page.getByRole('heading', { name: 'Open Rigbook from where it started' })).toBeVisible();
  await expect(page.getByText('This tab holds the key of an earlier start of Rigbook.')).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Nothing on the books yet' })).toHaveCount(0);
  expect(await page.evaluate(() => window.sessionStorage.getItem('rigbook.token'))).toBeNull();
  await page.reload();
  await expect(page.getByText('it needs the one-time key')).toBeVisible();
  // The refused calls are the browser's own 401 lines in the console; nothing else may be there.
  const others = consoleErrors.filter((line) => !/status of 401/.test(line));
  consoleErrors.splice(0, consoleErrors.length, ...others);
});

test('the built shell prints its help and refuses options it does not know', () => {
  const run = (args: string[]) => spawnSync(process.execPath, ['dist-main/local-main.cjs', ...args], { encoding: 'utf8', env: { ...process.env, RIGBOOK_DB: path.join('/nonexistent-folder', 'never.sqlite') } });
  const help = run(['--help']);
  expect(help.status, help.stderr).toBe(0);
  expect(help.stdout).toContain('Usage: node dist-main/local-main.cjs [--db PATH] [--port N]');
  expect(help.stdout).toContain('--db PATH');
  const wrong = run(['--dbfile', 'x.sqlite']);
  // 5: a wrong command line, as for the rigbook command.
  expect(wrong.status).toBe(5);
  expect(wrong.stdout).toBe('');
  expect(wrong.stderr).toBe("Rigbook did not start: Unknown option '--dbfile'. See node dist-main/local-main.cjs --help.\n");
});
