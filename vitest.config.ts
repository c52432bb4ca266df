import { defineConfig, type TestProjectInlineConfiguration } from 'vitest/config';
import { svelte } from '@sveltejs/vite-plugin-svelte';
import { RENDERER_ALIASES } from './vite.config';

/**
 * The slow project: fuzzing, crash, power-cut and store-file reliability, the history's growth
 * at scale, and every test that starts another process (the command line as a child, the
 * launcher, Electron).
 */
const SLOW = [
  'tests/fuzz/**/*.test.ts',
  'tests/reliability/**/*.test.ts',
  'tests/start/**/*.test.ts',
  'tests/store/history-growth.test.ts',
  'tests/desktop/electron-runtime.test.ts',
  'tests/setup/test-needs.test.ts',
  'tests/cli/check.test.ts',
  'tests/cli/files.test.ts',
];

// `npx vitest` (watch) is the inner loop and runs only the fast project; `vitest run`
// (npm test, test:unit) runs both, and `--project slow` asks for the slow one anywhere.
const argv = process.argv.slice(2);
const watching = !argv.includes('run') && !argv.includes('--run') && !argv.some((a) => a.startsWith('--project'));

export default defineConfig({
  plugins: [svelte({ configFile: false })],
  // Svelte 5 components resolve their browser build under test, not the server one.
  resolve: { conditions: ['browser'], alias: RENDERER_ALIASES },
  test: {
    environment: 'node',
    pool: 'forks',
    // A throwaway PostgreSQL cluster for the store matrix; see tests/helpers/store-engines.ts.
    globalSetup: ['tests/setup/pg-global-setup.ts'],
    // One fixed seed for every property test under npm test; npm run fuzz draws a random one.
    setupFiles: ['tests/setup/property-seed-setup.ts'],
    testTimeout: 30_000,
    hookTimeout: 30_000,
    projects: [
      { extends: true, test: { name: 'fast', include: ['tests/**/*.test.ts'], exclude: ['tests/e2e/**', 'node_modules/**', ...SLOW] } } satisfies TestProjectInlineConfiguration,
      ...(watching ? [] : [{ extends: true, test: { name: 'slow', include: SLOW } } satisfies TestProjectInlineConfiguration]),
    ],
  },
});
