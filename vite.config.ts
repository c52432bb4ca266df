import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import { svelte } from '@sveltejs/vite-plugin-svelte';

/** How the page names the core and the service contract (also in src-renderer/tsconfig.json). */
export const RENDERER_ALIASES = {
  $core: fileURLToPath(new URL('./src-main/core', import.meta.url)),
  $service: fileURLToPath(new URL('./src-main/service', import.meta.url)),
};

export default defineConfig({
  root: 'src-renderer',
  base: './',
  plugins: [svelte({ configFile: false })],
  resolve: { alias: RENDERER_ALIASES },
  build: {
    outDir: '../dist-renderer',
    emptyOutDir: true,
    // One file per chart library chunk keeps the first paint small.
    chunkSizeWarningLimit: 800,
  },
  server: { host: '127.0.0.1' },
});
