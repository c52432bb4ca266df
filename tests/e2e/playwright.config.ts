import { defineConfig } from '@playwright/test';
import { CHROMIUM_FLAGS } from './find-browser.mjs';

export default defineConfig({
  testDir: '.',
  testMatch: /.*\.e2e\.ts$/,
  outputDir: '../artifacts/e2e-results',
  // Two cores: one browser at a time keeps timings steady.
  workers: 1,
  fullyParallel: false,
  retries: 0,
  timeout: 60_000,
  reporter: [['list']],
  use: {
    headless: true,
    viewport: { width: 1280, height: 800 },
    launchOptions: { executablePath: process.env.RIGBOOK_CHROMIUM ?? '/usr/bin/chromium', args: CHROMIUM_FLAGS },
    trace: 'off',
    screenshot: 'only-on-failure',
  },
});
