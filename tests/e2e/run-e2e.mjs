// `npm run test:e2e`: makes sure a browser is here (installing it where it may), then runs the
// Playwright suite against the loopback shell.
import { spawnSync } from 'node:child_process';
import { findBrowser } from './find-browser.mjs';
import { ensureTestNeeds, realSystem } from '../setup/test-needs.mjs';

if (!ensureTestNeeds(realSystem()).ok) process.exit(1);
const found = findBrowser();
if (!found.path) process.exit(1);
const result = spawnSync('npx', ['playwright', 'test', '-c', 'tests/e2e/playwright.config.ts', ...process.argv.slice(2)], {
  stdio: 'inherit',
  env: { ...process.env, RIGBOOK_CHROMIUM: found.path },
});
process.exit(result.status ?? 1);
