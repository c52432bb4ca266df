// `npm run test:e2e`: finds a browser, then runs the Playwright suite against the loopback shell.
import { spawnSync } from 'node:child_process';
import { findBrowser } from './find-browser.mjs';

const found = findBrowser();
if (!found.path) {
  console.error(
    [
      'No Chromium found for the end-to-end tests. Looked for:',
      ...found.tried.map((t) => `  - ${t}`),
      'Install one and run again, for example:',
      '  Debian/Ubuntu:  sudo apt-get install -y chromium',
      '  or point RIGBOOK_CHROMIUM at any Chromium or Chrome binary.',
    ].join('\n'),
  );
  process.exit(1);
}
console.log(`e2e: using ${found.path}`);
const result = spawnSync('npx', ['playwright', 'test', '-c', 'tests/e2e/playwright.config.ts', ...process.argv.slice(2)], {
  stdio: 'inherit',
  env: { ...process.env, RIGBOOK_CHROMIUM: found.path },
});
process.exit(result.status ?? 1);
