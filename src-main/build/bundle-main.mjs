// Bundles the main-side entries into dist-main/ (CommonJS for Node 20 and Electron's main
// process). An entry whose source file is not there yet is skipped with a warning, so the
// build keeps working while shells are being written.
//
//   node src-main/build/bundle-main.mjs            build dist-main/
//   node src-main/build/bundle-main.mjs --check    also fail if an entry was skipped
import { existsSync, mkdirSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const outDir = join(root, 'dist-main');
const strict = process.argv.includes('--check');

// Bundled code is CommonJS, where import.meta is empty; give `import.meta.url` its usual value.
const importMetaShim = "const __rigbookImportMetaUrl = require('node:url').pathToFileURL(__filename).href;";

const entries = [
  { source: 'src-main/desktop/main.ts', out: 'desktop-main.cjs' },
  // The sandboxed preload may require only 'electron' and a few web-safe modules: no shim.
  { source: 'src-main/desktop/preload.ts', out: 'preload.cjs', sandboxed: true },
  { source: 'src-main/local/main.ts', out: 'local-main.cjs' },
  { source: 'src-main/cli/main.ts', out: 'cli.cjs', shebang: true },
];

const common = {
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'cjs',
  // Electron is provided by the runtime; better-sqlite3 is a native module loaded from
  // node_modules (rebuilt for Electron's ABI in the packaged app).
  external: ['electron', 'better-sqlite3'],
  define: { 'import.meta.url': '__rigbookImportMetaUrl' },
  sourcemap: false,
  legalComments: 'none',
  logLevel: 'warning',
};

mkdirSync(outDir, { recursive: true });
const started = performance.now();
const skipped = [];

const results = await Promise.allSettled(
  entries.map(async (entry) => {
    const sourcePath = join(root, entry.source);
    if (!existsSync(sourcePath)) {
      skipped.push(entry.source);
      console.warn(`bundle-main: skipped ${entry.out}: ${entry.source} does not exist yet`);
      return;
    }
    await build({
      ...common,
      entryPoints: [sourcePath],
      outfile: join(outDir, entry.out),
      ...(entry.sandboxed ? { define: {} } : {}),
      banner: { js: `${entry.shebang ? '#!/usr/bin/env node\n' : ''}${entry.sandboxed ? '' : `"use strict";\n${importMetaShim}`}` },
    });
  }),
);

const failed = results.filter((r) => r.status === 'rejected');
// esbuild has already printed each error with its location.
if (failed.length > 0) console.error(`bundle-main: ${failed.length} entr${failed.length === 1 ? 'y' : 'ies'} failed to build`);
const built = entries.length - skipped.length - failed.length;
console.log(`bundle-main: ${built} of ${entries.length} entries into ${relative(process.cwd(), outDir) || '.'} in ${Math.round(performance.now() - started)} ms`);
if (failed.length > 0 || (strict && skipped.length > 0)) process.exit(1);
