// Finds a Chromium for the end-to-end tests without ever downloading one:
// RIGBOOK_CHROMIUM (or CHROMIUM_PATH), then Debian's /usr/bin/chromium, then a browser
// Playwright installed earlier on this machine.
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';

export const CHROMIUM_FLAGS = ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];

export function findBrowser(env = process.env) {
  const tried = [];
  for (const name of ['RIGBOOK_CHROMIUM', 'CHROMIUM_PATH']) {
    const value = env[name];
    if (value) {
      if (existsSync(value)) return { path: value, tried };
      tried.push(`${name}=${value} (no such file)`);
    }
  }
  for (const path of ['/usr/bin/chromium', '/usr/bin/chromium-browser']) {
    if (existsSync(path)) return { path, tried };
    tried.push(path);
  }
  try {
    const require = createRequire(import.meta.url);
    const { chromium } = require('playwright-core');
    const path = chromium.executablePath();
    if (path && existsSync(path)) return { path, tried };
    tried.push(`Playwright's own browser (${path})`);
  } catch {
    tried.push("Playwright's own browser (none)");
  }
  return { path: null, tried };
}
