// `npm run bench` runs the benchmark as one bundle made with the compiler dist-main/ is made with
// (esbuild, one file for Node 20, here an ES module for the bench's top-level awaits), not
// through tsx. tsx transforms each file on its own: every function it names gets a helper call,
// and every call across modules goes through a module object. On the rules engine that made an evaluation 15–25 % slower than the same code in the
// shipped bundle (measured, docs/performance.md), so the bench reported code that never ships.
//
//   node tests/bench/run-bundled.mjs tests/bench/bench.ts [args…]
//
// Packages stay outside the bundle and load from node_modules as they are; the bundle is written
// under node_modules/.cache/ so that they resolve. Each file keeps its own `import.meta.url` and
// `import.meta.dirname` (in one bundle they would all be the bundle's), so paths built from them
// mean what they did.
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { build } from 'esbuild';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const [entry, ...args] = process.argv.slice(2);
if (!entry) {
  console.error('usage: node tests/bench/run-bundled.mjs ENTRY.ts [args…]');
  process.exit(2);
}
const outDir = path.join(root, 'node_modules', '.cache', 'rigbook-bench');
const outfile = path.join(outDir, `${path.basename(entry).replace(/\.[cm]?[jt]s$/, '')}.mjs`);
mkdirSync(outDir, { recursive: true });

/** Replaces `import.meta.url` and `import.meta.dirname` in each of the project's files by that file's own. */
const ownImportMeta = {
  name: 'own-import-meta',
  setup(b) {
    b.onLoad({ filter: /\.(ts|mts|mjs)$/ }, (file) => {
      if (file.path.includes(`${path.sep}node_modules${path.sep}`)) return undefined;
      const source = readFileSync(file.path, 'utf8');
      if (!source.includes('import.meta')) return undefined;
      const contents = source.replaceAll('import.meta.dirname', JSON.stringify(path.dirname(file.path))).replaceAll('import.meta.url', JSON.stringify(pathToFileURL(file.path).href));
      return { contents, loader: file.path.endsWith('.mjs') ? 'js' : 'ts' };
    });
  },
};

await build({
  entryPoints: [path.resolve(root, entry)],
  outfile,
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'esm',
  packages: 'external',
  sourcemap: false,
  legalComments: 'none',
  logLevel: 'warning',
  plugins: [ownImportMeta],
});
const run = spawnSync(process.execPath, [outfile, ...args], { cwd: root, stdio: 'inherit', env: { ...process.env, RIGBOOK_BENCH_BUNDLED: '1' } });
process.exit(run.status ?? 1);
