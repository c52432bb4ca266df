import { defineConfig } from 'vitest/config';
import { svelte } from '@sveltejs/vite-plugin-svelte';

export default defineConfig({
  plugins: [svelte({ configFile: false })],
  // Svelte 5 components resolve their browser build under test, not the server one.
  resolve: { conditions: ['browser'] },
  test: {
    include: ['tests/**/*.test.ts'],
    exclude: ['tests/e2e/**', 'node_modules/**'],
    environment: 'node',
    pool: 'forks',
    // A throwaway PostgreSQL cluster for the store matrix; see tests/helpers/store-engines.ts.
    globalSetup: ['tests/setup/pg-global-setup.ts'],
    testTimeout: 30_000,
    hookTimeout: 30_000,
  },
});
