// What `npm start` does, with the operating system passed in (environment, platform, and the
// one `spawn` that starts every process), so that each path can be tried on a simulated machine.
//
//   desktop runtime here        → the desktop window
//   not here                    → try to fetch it; a download that moves no data for a few
//                                 seconds (offline, a firewall that drops) is given up
//   not fetched, or --browser,  → the loopback shell, and the default browser opened at its
//   or RIGBOOK_SHELL=browser      tokened address (not with BROWSER=none or without a display)
import { existsSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** A download that moves no data for this long is given up (connecting counts as no data). */
export const STALL_MS = 8_000;
const STALL_CHECK_MS = 500;

export const LAUNCH_HELP = `Usage: npm start [-- options]

Opens Rigbook: the desktop window where the desktop runtime is (or can be fetched), else the
same app in your default browser through a server on this computer only.

Options:
  --browser    use the browser straight away, without trying the desktop runtime
               (the setting RIGBOOK_SHELL=browser does the same every time)
  --no-open    with the browser, print the address but do not open a browser
  --db PATH    the store to open (else RIGBOOK_DB, else the data folder)
  --port N     the browser shell's port (else a free one)
  --help       this text

The environment variable BROWSER names the browser program to open; BROWSER=none opens none.
`;

/** Splits the launcher's own options from those passed on to the shell. */
export function parseLaunchArgs(argv, env) {
  const problems = [];
  let shell = 'auto';
  let why = '';
  const setting = (env.RIGBOOK_SHELL ?? '').trim().toLowerCase();
  if (setting === 'browser') {
    shell = 'browser';
    why = 'RIGBOOK_SHELL=browser is set';
  } else if (setting !== '' && setting !== 'auto') {
    problems.push(`RIGBOOK_SHELL must be "browser" or "auto", not "${env.RIGBOOK_SHELL}"`);
  }
  let open = true;
  let help = false;
  const shellArgs = [];
  for (const arg of argv) {
    if (arg === '--browser') {
      shell = 'browser';
      why = '--browser was given';
    } else if (arg === '--no-open') open = false;
    else if (arg === '--help' || arg === '-h') help = true;
    else shellArgs.push(arg);
  }
  return { shell, why, open, help, shellArgs, problems };
}

/** How to open `url` in the default browser here, or why not to. */
export function browserCommand(url, env, platform) {
  const chosen = (env.BROWSER ?? '').trim();
  if (chosen.toLowerCase() === 'none') return { skip: 'BROWSER=none is set' };
  if (chosen !== '') {
    // BROWSER may list several programs; the first one is used, with the address added (or put where %s is).
    const first = chosen.split(platform === 'win32' ? ';' : ':')[0].trim();
    const parts = first.split(/\s+/);
    const args = parts.slice(1);
    return { command: parts[0], args: args.includes('%s') ? args.map((a) => (a === '%s' ? url : a)) : [...args, url], options: {} };
  }
  if (platform === 'darwin') return { command: 'open', args: [url], options: {} };
  if (platform === 'win32') {
    // `start` is built into cmd; the empty "" is the window title it would otherwise take the address for.
    return { command: 'cmd', args: ['/d', '/s', '/c', `start "" "${url}"`], options: { windowsVerbatimArguments: true } };
  }
  if (!env.DISPLAY && !env.WAYLAND_DISPLAY) return { skip: 'no display here (DISPLAY and WAYLAND_DISPLAY are not set)' };
  return { command: 'xdg-open', args: [url], options: {} };
}

/** Opens the default browser at `url`, saying so; says why not where it does not. */
export function openBrowser(url, { env, platform, spawn, log }) {
  const how = browserCommand(url, env, platform);
  if (how.skip) {
    log(`Not opening a browser: ${how.skip}. Open the address above yourself.`);
    return;
  }
  let child;
  try {
    child = spawn(how.command, how.args, { ...how.options, detached: true, stdio: 'ignore' });
  } catch (error) {
    log(`Could not open a browser with ${how.command} (${error.message}). Open the address above yourself.`);
    return;
  }
  child.once('spawn', () => log(`Opened Rigbook in your default browser (${how.command}).`));
  child.once('error', (error) => log(`Could not open a browser with ${how.command} (${error.code ?? error.message}). Open the address above yourself.`));
  child.unref?.();
}

/** The Electron executable, or the reason there is none. */
export function findElectron(requireElectron, exists = existsSync) {
  try {
    // The electron package exports the executable's path, and throws when it was never downloaded.
    const binary = requireElectron();
    if (typeof binary === 'string' && exists(binary)) return { binary };
    return { reason: `the desktop runtime is not at ${binary}` };
  } catch {
    return { reason: 'the desktop runtime has not been downloaded' };
  }
}

function bytesUnder(dir) {
  let total = 0;
  let entries;
  try {
    entries = readdirSync(dir, { withFileTypes: true });
  } catch {
    return 0;
  }
  for (const entry of entries) {
    const full = join(dir, entry.name);
    if (entry.isDirectory()) total += bytesUnder(full);
    else {
      try {
        total += statSync(full).size;
      } catch {
        // Moved away between listing and reading: counted on the next look.
      }
    }
  }
  return total;
}

/**
 * Runs the electron package's own download in a child, watching for progress: output, or bytes
 * arriving in its temporary folder or the runtime folder. Resolves null when it finished, or
 * the reason it did not, in a few words.
 */
export function fetchElectron({ root, env, spawn, stallMs = STALL_MS }) {
  const scratch = mkdtempSync(join(tmpdir(), 'rigbook-runtime-'));
  const watched = [scratch, join(root, 'node_modules', 'electron', 'dist')];
  return new Promise((resolve) => {
    let settled = false;
    let stderr = '';
    let lastBytes = watched.reduce((sum, dir) => sum + bytesUnder(dir), 0);
    let lastProgress = Date.now();
    const finish = (reason) => {
      if (settled) return;
      settled = true;
      clearInterval(watch);
      rmSync(scratch, { recursive: true, force: true });
      resolve(reason);
    };
    let child;
    try {
      // The download library puts its partial file in the temporary folder; point that at ours to see it grow.
      child = spawn(process.execPath, [join(root, 'node_modules', 'electron', 'install.js')], {
        cwd: root,
        env: { ...env, TMPDIR: scratch, TMP: scratch, TEMP: scratch },
        stdio: ['ignore', 'pipe', 'pipe'],
      });
    } catch (error) {
      finish(`the download could not start (${error.message})`);
      return;
    }
    const progressed = () => (lastProgress = Date.now());
    child.stdout?.on('data', progressed);
    child.stderr?.on('data', (chunk) => {
      stderr += chunk.toString();
      progressed();
    });
    child.once('error', (error) => finish(`the download could not start (${error.message})`));
    child.once('exit', (code) => {
      if (code === 0) return finish(null);
      const firstLine = stderr
        .split('\n')
        .map((line) => line.trim())
        .find((line) => line !== '');
      finish(`the download failed${firstLine ? ` (${firstLine})` : ''}`);
    });
    const watch = setInterval(() => {
      const bytes = watched.reduce((sum, dir) => sum + bytesUnder(dir), 0);
      if (bytes !== lastBytes) {
        lastBytes = bytes;
        progressed();
      }
      if (Date.now() - lastProgress >= stallMs) {
        child.kill();
        finish(`the download moved no data for ${stallMs / 1000} s (offline, or a firewall drops the connection)`);
      }
    }, STALL_CHECK_MS);
  });
}

/**
 * `npm start`. `os` carries everything outside Rigbook: env, platform, spawn, requireElectron,
 * exists, log, error, exit, onSignal.
 */
export async function launch(argv, os) {
  const { env, platform, spawn, root, log, error, exit } = os;
  const desktopMain = join(root, 'dist-main', 'desktop-main.cjs');
  const localMain = join(root, 'dist-main', 'local-main.cjs');
  const exists = os.exists ?? existsSync;
  const args = parseLaunchArgs(argv, env);
  if (args.help) {
    log(LAUNCH_HELP);
    return exit(0);
  }
  if (args.problems.length > 0) {
    for (const problem of args.problems) error(problem);
    // 5: a wrong command line, as the rigbook command and the browser shell exit.
    return exit(5);
  }

  const forward = (child) => {
    for (const signal of ['SIGINT', 'SIGTERM']) os.onSignal(signal, () => child.kill(signal));
    child.on('exit', (code, signal) => exit(code ?? (signal ? 1 : 0)));
  };

  const startLocal = (reason) => {
    if (!exists(localMain)) {
      error(`Desktop runtime not used: ${reason}.`);
      error('The browser shell is not built either (dist-main/local-main.cjs is missing). Run `npm run build` and look for errors.');
      return exit(1);
    }
    const child = spawn(process.execPath, [localMain, ...args.shellArgs], { cwd: root, stdio: ['inherit', 'pipe', 'inherit'] });
    let announced = false;
    let pending = '';
    const announce = (url) => {
      if (announced) return;
      announced = true;
      log(`\nDesktop runtime not used: ${reason}. Serving Rigbook in your browser instead at ${url}`);
      if (args.open) openBrowser(url, { env, platform, spawn, log });
      else log('Not opening a browser: --no-open was given. Open the address above yourself.');
    };
    child.stdout.setEncoding?.('utf8');
    child.stdout.on('data', (chunk) => {
      os.write(chunk);
      if (announced) return;
      pending += chunk;
      // The shell prints the address to open, with its access token, on an "Open:" line.
      const openUrl = /Open:\s*(http:\/\/127\.0\.0\.1:\d+\/\S*)/.exec(pending)?.[1];
      if (openUrl) announce(openUrl);
    });
    child.on('exit', (code) => {
      if (!announced && code !== 0) error(`The browser shell stopped before printing its address (${reason}).`);
    });
    forward(child);
  };

  if (args.shell === 'browser') return startLocal(args.why);
  let found = findElectron(os.requireElectron, exists);
  if (!found.binary) {
    log('Desktop runtime not found; trying to download it...');
    const problem = await fetchElectron({ root, env, spawn, stallMs: os.stallMs ?? STALL_MS });
    found = problem ? { reason: `${found.reason}, and ${problem}` } : findElectron(os.requireElectron, exists);
  }
  if (!found.binary) return startLocal(found.reason);
  if (!exists(desktopMain)) return startLocal('dist-main/desktop-main.cjs was not built');
  log('Starting the Rigbook desktop window...');
  const desktopEnv = { ...env };
  // With this set, Electron would run the script as plain Node instead of opening a window.
  delete desktopEnv.ELECTRON_RUN_AS_NODE;
  forward(spawn(found.binary, [desktopMain, ...args.shellArgs], { cwd: root, env: desktopEnv, stdio: 'inherit' }));
}
