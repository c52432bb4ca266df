import { EventEmitter } from 'node:events';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import type { ChildProcess, SpawnOptions } from 'node:child_process';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { browserCommand, launch, STALL_MS, type LaunchSystem } from '../../src-main/build/launcher.mjs';
import { tempDir } from '../helpers/temp-dir';

// `npm start`'s real launcher on simulated machines: the environment and platform are the
// test's, and the one `spawn` that starts every process is a double that records each call and
// plays the child's part (the shell printing its address, the download failing or stalling, the
// browser opener starting or missing).

class FakeChild extends EventEmitter {
  stdout = Object.assign(new EventEmitter(), { setEncoding: () => undefined });
  stderr = new EventEmitter();
  killed: string[] = [];
  unref = () => undefined;
  kill = (signal = 'SIGTERM') => {
    this.killed.push(signal);
    return true;
  };
}

interface SpawnCall {
  command: string;
  args: string[];
  options: SpawnOptions;
  child: FakeChild;
}

const URL_WITH_TOKEN = 'http://127.0.0.1:45123/#token=abc123';
const SHELL_OUTPUT = `Rigbook is serving on http://127.0.0.1:45123/ (this computer only)\nStore: /tmp/x.sqlite\nOpen: ${URL_WITH_TOKEN}\n`;

let temp: ReturnType<typeof tempDir>;
beforeEach(() => {
  temp = tempDir('rigbook-launch-');
  mkdirSync(path.join(temp.dir, 'dist-main'));
  writeFileSync(path.join(temp.dir, 'dist-main', 'local-main.cjs'), '');
});
afterEach(() => {
  vi.useRealTimers();
  temp.remove();
});

function machine(over: Partial<LaunchSystem> = {}) {
  const calls: SpawnCall[] = [];
  const out: string[] = [];
  const err: string[] = [];
  const exits: number[] = [];
  const system: LaunchSystem = {
    env: { DISPLAY: ':0' },
    platform: 'linux',
    root: temp.dir,
    spawn: (command, args, options) => {
      const child = new FakeChild();
      calls.push({ command, args, options, child });
      return child as unknown as ChildProcess;
    },
    requireElectron: () => {
      throw new Error('Electron failed to install correctly');
    },
    log: (line) => out.push(line),
    error: (line) => err.push(line),
    write: (text) => out.push(text),
    exit: (code) => exits.push(code),
    onSignal: () => undefined,
    ...over,
  };
  return { system, calls, out, err, exits, text: () => out.join('\n') };
}

const isShell = (c: SpawnCall) => c.args[0]?.endsWith(path.join('dist-main', 'local-main.cjs'));
const isDownload = (c: SpawnCall) => c.args[0]?.endsWith(path.join('electron', 'install.js'));

describe('npm start with the browser shell', () => {
  it('--browser starts the shell at once and opens the default browser at the tokened address, saying so', async () => {
    const m = machine();
    await launch(['--browser', '--db', '/tmp/x.sqlite'], m.system);
    expect(m.calls).toHaveLength(1);
    const shell = m.calls[0]!;
    expect(shell.command).toBe(process.execPath);
    expect(shell.args.slice(1)).toEqual(['--db', '/tmp/x.sqlite']);
    shell.child.stdout.emit('data', SHELL_OUTPUT);
    expect(m.calls).toHaveLength(2);
    const opener = m.calls[1]!;
    expect([opener.command, ...opener.args]).toEqual(['xdg-open', URL_WITH_TOKEN]);
    expect(opener.options).toMatchObject({ detached: true, stdio: 'ignore' });
    opener.child.emit('spawn');
    expect(m.text()).toContain(`Desktop runtime not used: --browser was given. Serving Rigbook in your browser instead at ${URL_WITH_TOKEN}`);
    expect(m.text()).toContain('Opened Rigbook in your default browser (xdg-open).');
    // The shell's exit is the launcher's exit.
    shell.child.emit('exit', 0, null);
    expect(m.exits).toEqual([0]);
  });

  it('RIGBOOK_SHELL=browser is the lasting setting for the same thing', async () => {
    const m = machine({ env: { DISPLAY: ':0', RIGBOOK_SHELL: 'browser' } });
    await launch([], m.system);
    expect(m.calls.filter(isDownload)).toEqual([]);
    m.calls[0]!.child.stdout.emit('data', SHELL_OUTPUT);
    expect(m.text()).toContain('Desktop runtime not used: RIGBOOK_SHELL=browser is set.');
    expect(m.calls[1]!.args).toEqual([URL_WITH_TOKEN]);
  });

  it('refuses an unknown RIGBOOK_SHELL value and starts nothing', async () => {
    const m = machine({ env: { RIGBOOK_SHELL: 'window' } });
    await launch([], m.system);
    expect(m.calls).toEqual([]);
    expect(m.exits).toEqual([5]);
    expect(m.err).toEqual(['RIGBOOK_SHELL must be "browser" or "auto", not "window"']);
  });

  it.each([
    ['no display', { env: {} }, 'Not opening a browser: no display here (DISPLAY and WAYLAND_DISPLAY are not set). Open the address above yourself.'],
    ['BROWSER=none', { env: { DISPLAY: ':0', BROWSER: 'none' } }, 'Not opening a browser: BROWSER=none is set. Open the address above yourself.'],
  ])('opens nothing with %s, and says so', async (_label, over, line) => {
    const m = machine(over);
    await launch(['--browser'], m.system);
    m.calls[0]!.child.stdout.emit('data', SHELL_OUTPUT);
    expect(m.calls).toHaveLength(1);
    expect(m.out).toContain(line);
  });

  it('--no-open prints the address and opens nothing', async () => {
    const m = machine();
    await launch(['--browser', '--no-open'], m.system);
    m.calls[0]!.child.stdout.emit('data', SHELL_OUTPUT);
    expect(m.calls).toHaveLength(1);
    expect(m.calls[0]!.args.slice(1)).toEqual([]);
    expect(m.text()).toContain('--no-open was given');
  });

  it('says so when the opener is missing', async () => {
    const m = machine();
    await launch(['--browser'], m.system);
    m.calls[0]!.child.stdout.emit('data', SHELL_OUTPUT);
    m.calls[1]!.child.emit('error', Object.assign(new Error('spawn xdg-open ENOENT'), { code: 'ENOENT' }));
    expect(m.out).toContain('Could not open a browser with xdg-open (ENOENT). Open the address above yourself.');
  });

  it('uses the opener of each system, and the program BROWSER names', () => {
    expect(browserCommand(URL_WITH_TOKEN, {}, 'darwin')).toEqual({ command: 'open', args: [URL_WITH_TOKEN], options: {} });
    expect(browserCommand(URL_WITH_TOKEN, {}, 'win32')).toEqual({ command: 'cmd', args: ['/d', '/s', '/c', `start "" "${URL_WITH_TOKEN}"`], options: { windowsVerbatimArguments: true } });
    expect(browserCommand(URL_WITH_TOKEN, { BROWSER: 'firefox:chromium' }, 'linux')).toEqual({ command: 'firefox', args: [URL_WITH_TOKEN], options: {} });
    expect(browserCommand(URL_WITH_TOKEN, { BROWSER: 'chromium --new-window %s' }, 'linux')).toEqual({ command: 'chromium', args: ['--new-window', URL_WITH_TOKEN], options: {} });
  });
});

describe('npm start without the desktop runtime', () => {
  it('tries the download once; when it fails, gives the reason in one line, serves the browser shell and opens it', async () => {
    const m = machine();
    const started = launch([], m.system);
    const download = m.calls.find(isDownload)!;
    expect(download.options.env).toMatchObject({ DISPLAY: ':0' });
    download.child.stderr.emit('data', 'RequestError: getaddrinfo ENOTFOUND github.com\n    at ClientRequest.<anonymous> (got/source/core/index.js:1:1)\n');
    download.child.emit('exit', 1, null);
    await started;
    const shell = m.calls.find(isShell)!;
    shell.child.stdout.emit('data', SHELL_OUTPUT);
    const reasonLine = m.out.find((l) => l.includes('Desktop runtime not used'))!;
    expect(reasonLine.trim()).toBe(
      `Desktop runtime not used: the desktop runtime has not been downloaded, and the download failed (RequestError: getaddrinfo ENOTFOUND github.com). Serving Rigbook in your browser instead at ${URL_WITH_TOKEN}`,
    );
    expect(reasonLine.trim().includes('\n')).toBe(false);
    expect(m.calls.at(-1)!.command).toBe('xdg-open');
  });

  it('gives up a download that moves no data for a few seconds (a firewall that drops), and falls back', async () => {
    vi.useFakeTimers();
    const m = machine();
    const started = launch([], m.system);
    const download = m.calls.find(isDownload)!;
    // Some output now and then is progress: the download is left alone past the stall limit.
    for (let t = 0; t < 3; t++) {
      await vi.advanceTimersByTimeAsync(STALL_MS / 2);
      download.child.stdout.emit('data', 'Downloading electron...');
    }
    expect(download.child.killed).toEqual([]);
    await vi.advanceTimersByTimeAsync(STALL_MS + 1000);
    expect(download.child.killed).toEqual(['SIGTERM']);
    await started;
    const shell = m.calls.find(isShell)!;
    shell.child.stdout.emit('data', SHELL_OUTPUT);
    expect(m.text()).toContain(`the download moved no data for ${STALL_MS / 1000} s (offline, or a firewall drops the connection). Serving Rigbook in your browser instead`);
  });

  it('opens the desktop window where the runtime is, and no browser', async () => {
    const electron = path.join(temp.dir, 'electron');
    writeFileSync(electron, '');
    writeFileSync(path.join(temp.dir, 'dist-main', 'desktop-main.cjs'), '');
    const m = machine({ env: { DISPLAY: ':0', ELECTRON_RUN_AS_NODE: '1' }, requireElectron: () => electron });
    await launch(['--db', '/tmp/x.sqlite'], m.system);
    expect(m.calls).toHaveLength(1);
    expect(m.calls[0]!.command).toBe(electron);
    expect(m.calls[0]!.args.slice(1)).toEqual(['--db', '/tmp/x.sqlite']);
    expect(m.calls[0]!.options.env).not.toHaveProperty('ELECTRON_RUN_AS_NODE');
  });
});
