import { defineConfig } from 'vite';
import { svelte } from '@sveltejs/vite-plugin-svelte';

export default defineConfig({
  root: 'src-renderer',
  base: './',
  plugins: [svelte({ configFile: false })],
  build: {
    outDir: '../dist-renderer',
    emptyOutDir: true,
    // One file per chart library chunk keeps the first paint small.
    chunkSizeWarningLimit: 800,
  },
  server: { host: '127.0.0.1' },
});
