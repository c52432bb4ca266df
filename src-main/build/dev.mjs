// `npm run dev`: the renderer under Vite with hot reload, its API calls proxied to the loopback
// shell on a development store (.dev/rigbook-dev.sqlite, or RIGBOOK_DEV_DIR). Everything listens
// on 127.0.0.1 only. Main-side code is bundled once at start: restart after changing it.
import { spawn, spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';
import { createServer } from 'vite';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
const devDir = resolve(process.env.RIGBOOK_DEV_DIR ?? join(root, '.dev'));
mkdirSync(devDir, { recursive: true });
const dbPath = join(devDir, 'rigbook-dev.sqlite');

const bundled = spawnSync(process.execPath, [join(root, 'src-main', 'build', 'bundle-main.mjs')], { stdio: 'inherit' });
if (bundled.status !== 0) process.exit(bundled.status ?? 1);

// The shell's token is ours to choose, so the address printed below can carry it.
const token = randomBytes(24).toString('base64url');
const { RIGBOOK_PORT: _ignored, ...env } = process.env;
const shell = spawn(process.execPath, [join(root, 'dist-main', 'local-main.cjs'), '--db', dbPath], {
  env: { ...env, RIGBOOK_TOKEN: token },
  stdio: ['ignore', 'pipe', 'inherit'],
});

const shellUrl = await new Promise((resolveUrl, reject) => {
  const lines = createInterface({ input: shell.stdout });
  lines.on('line', (line) => {
    const match = /serving on (http:\/\/127\.0\.0\.1:\d+)\//.exec(line);
    if (match) resolveUrl(new URL(match[1]));
    // The shell's own address and store lines are said again below, with the page's address.
    else if (!/^(Open|Store):/.test(line)) process.stdout.write(`shell: ${line}\n`);
  });
  shell.once('exit', (code) => reject(new Error(`the loopback shell stopped before it was serving (exit ${code})`)));
});

const server = await createServer({
  configFile: join(root, 'vite.config.ts'),
  server: {
    host: '127.0.0.1',
    proxy: {
      '/api': {
        target: shellUrl.origin,
        changeOrigin: true,
        // The shell accepts calls only from its own origin; the dev page's calls arrive as if from it.
        configure: (proxy) => proxy.on('proxyReq', (request) => request.setHeader('origin', shellUrl.origin)),
      },
    },
  },
});
await server.listen();
const pageUrl = server.resolvedUrls?.local[0] ?? `http://127.0.0.1:${server.config.server.port}/`;
process.stdout.write(`Rigbook (development) on ${pageUrl}#token=${token}\nStore: ${dbPath}\nAPI: ${shellUrl.origin} (proxied under /api)\n`);

let stopping = false;
const stop = async () => {
  if (stopping) return;
  stopping = true;
  await server.close();
  shell.kill('SIGTERM');
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
shell.once('exit', (code) => {
  if (!stopping) process.stderr.write(`The loopback shell stopped (exit ${code}); stopping the dev server.\n`);
  void stop();
});
