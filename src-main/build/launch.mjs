// `npm start` (after the build): opens the desktop shell when the Electron runtime is on this
// machine; otherwise tries once to fetch it, and failing that serves the same app to the
// browser through the loopback shell.
//
//   node src-main/build/launch.mjs [--browser] [shell args, e.g. --db ./fleet.sqlite]
//   --browser   skip the desktop runtime and use the loopback shell straight away
import { spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const require = createRequire(join(root, 'package.json'));
const FETCH_LIMIT_MS = 60_000;
const desktopMain = join(root, 'dist-main', 'desktop-main.cjs');
const localMain = join(root, 'dist-main', 'local-main.cjs');

const rawArgs = process.argv.slice(2);
const browserOnly = rawArgs.includes('--browser');
const shellArgs = rawArgs.filter((arg) => arg !== '--browser');

/** The Electron executable, or the reason there is none. */
function findElectron() {
  try {
    // The electron package exports the executable's path, and throws when it was never downloaded.
    const binary = require('electron');
    if (typeof binary === 'string' && existsSync(binary)) return { binary };
    return { reason: `the Electron runtime is not at ${binary}` };
  } catch {
    return { reason: 'the Electron runtime has not been downloaded (node_modules/electron/dist is missing)' };
  }
}

function tryFetchElectron() {
  console.log(`Desktop runtime not found; trying to download it (up to ${FETCH_LIMIT_MS / 1000} s)...`);
  const result = spawnSync(process.execPath, [join(root, 'node_modules', 'electron', 'install.js')], {
    cwd: root,
    timeout: FETCH_LIMIT_MS,
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  if (result.error?.code === 'ETIMEDOUT') return `the download did not finish within ${FETCH_LIMIT_MS / 1000} s`;
  if (result.error) return `the download could not start (${result.error.message})`;
  if (result.status !== 0) {
    const firstLine = `${result.stderr ?? ''}`.split('\n').map((line) => line.trim()).find((line) => line !== '');
    return `the download failed${firstLine ? ` (${firstLine})` : ''}`;
  }
  return null;
}

function forwardSignals(child) {
  for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => child.kill(signal));
  child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
}

function startDesktop(binary) {
  const env = { ...process.env };
  // With this set, Electron would run the script as plain Node instead of opening a window.
  delete env.ELECTRON_RUN_AS_NODE;
  const child = spawn(binary, [desktopMain, ...shellArgs], { cwd: root, env, stdio: 'inherit' });
  forwardSignals(child);
}

function startLocal(reason) {
  if (!existsSync(localMain)) {
    console.error(`Desktop runtime not available: ${reason}.`);
    console.error('The browser shell is not built either (dist-main/local-main.cjs is missing). Run `npm run build` and look for errors.');
    process.exit(1);
  }
  const child = spawn(process.execPath, [localMain, ...shellArgs], { cwd: root, stdio: ['inherit', 'pipe', 'inherit'] });
  let announced = false;
  let pending = '';
  let fallbackTimer;
  const announce = (url) => {
    if (announced) return;
    announced = true;
    clearTimeout(fallbackTimer);
    console.log(`\nDesktop runtime not available: ${reason}. Serving Rigbook in your browser instead at ${url}\n`);
  };
  child.stdout.setEncoding('utf8');
  child.stdout.on('data', (chunk) => {
    process.stdout.write(chunk);
    if (announced) return;
    pending += chunk;
    // The local shell prints the address to open (with its access token) on an "Open:" line;
    // if it never does, fall back to the first loopback address it printed.
    const openUrl = pending.match(/Open:\s*(https?:\/\/\S+)/)?.[1];
    if (openUrl) return announce(openUrl);
    const anyUrl = pending.match(/https?:\/\/(?:127\.0\.0\.1|localhost|\[::1\]):\d+\/?\S*/)?.[0];
    if (anyUrl && fallbackTimer === undefined) fallbackTimer = setTimeout(() => announce(anyUrl), 500);
  });
  child.on('exit', () => {
    clearTimeout(fallbackTimer);
    if (!announced) console.error(`Desktop runtime not available: ${reason}. The browser shell stopped before printing its address.`);
  });
  forwardSignals(child);
}

function main() {
  if (browserOnly) return startLocal('skipped because --browser was given');
  let found = findElectron();
  if (!found.binary) {
    const fetchProblem = tryFetchElectron();
    found = fetchProblem ? { reason: `${found.reason}, and ${fetchProblem}` } : findElectron();
  }
  if (!found.binary) return startLocal(found.reason);
  if (!existsSync(desktopMain)) return startLocal('dist-main/desktop-main.cjs was not built');
  console.log('Starting the Rigbook desktop window...');
  return startDesktop(found.binary);
}

main();
