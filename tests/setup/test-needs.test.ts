import { spawnSync } from 'node:child_process';
import { chmodSync, mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { ensureTestNeeds, findPgServer, linuxFamily, manualCommand, SERVER_NEEDS, type RunResult, type TestSystem } from './test-needs.mjs';
import { tempDir } from '../helpers/temp-dir';

// The test command's finder and installer on simulated machines: a PATH, HOME and os-release of
// the test's own, and a double for the one call that starts a process. Nothing here installs or
// downloads anything.

const DEBIAN = 'PRETTY_NAME="Debian GNU/Linux 12 (bookworm)"\nNAME="Debian GNU/Linux"\nID=debian\n';
const UBUNTU = 'NAME="Ubuntu"\nID=ubuntu\nID_LIKE=debian\n';
const FEDORA = 'NAME="Fedora Linux"\nID=fedora\n';

let temp: ReturnType<typeof tempDir>;
let bin: string;
beforeEach(() => {
  temp = tempDir('rigbook-needs-');
  bin = path.join(temp.dir, 'bin');
  mkdirSync(bin);
});
afterEach(() => temp.remove());

/** A program file in the simulated PATH; the double below never runs it. */
function program(name: string): string {
  const file = path.join(bin, name);
  writeFileSync(file, '#!/bin/sh\nexit 1\n');
  chmodSync(file, 0o755);
  return file;
}

interface Call {
  command: string;
  args: string[];
  env?: NodeJS.ProcessEnv;
}

function machine(over: Partial<TestSystem> & { answer?: (call: Call) => RunResult } = {}) {
  const calls: Call[] = [];
  const out: string[] = [];
  const err: string[] = [];
  const sys: TestSystem = {
    env: { PATH: bin, HOME: temp.dir },
    platform: 'linux',
    uid: 0,
    osRelease: DEBIAN,
    run: (command, args, options) => {
      const call = { command, args, env: options?.env };
      calls.push(call);
      return over.answer ? over.answer(call) : { status: 0 };
    },
    log: (line) => out.push(line),
    error: (text) => err.push(text),
    ...over,
  };
  return { sys, calls, out, err };
}

describe('the test command finds what the tests need', () => {
  it('uses a browser already on PATH and starts nothing', () => {
    const chromium = program('chromium');
    const m = machine();
    expect(ensureTestNeeds(m.sys).ok).toBe(true);
    expect(m.calls).toEqual([]);
    expect(m.out).toEqual([`test needs: Chromium at ${chromium}`]);
  });

  it('honours RIGBOOK_CHROMIUM, and says when it names no program', () => {
    const own = program('my-chrome');
    const m = machine({ env: { PATH: '', HOME: temp.dir, RIGBOOK_CHROMIUM: own } });
    expect(ensureTestNeeds(m.sys).ok).toBe(true);
    const wrong = machine({ env: { PATH: '', HOME: temp.dir, RIGBOOK_CHROMIUM: path.join(temp.dir, 'nothing') }, platform: 'darwin' });
    expect(ensureTestNeeds(wrong.sys).ok).toBe(false);
    expect(wrong.err.join('\n')).toContain(`RIGBOOK_CHROMIUM=${path.join(temp.dir, 'nothing')} (no such program)`);
  });
});

describe('where the browser is missing', () => {
  it('installs it with apt-get as root on Debian, saying so, and finds it afterwards', () => {
    const aptGet = program('apt-get');
    const m = machine({
      answer: (call) => {
        if (call.args[0] === 'install') program('chromium');
        return { status: 0 };
      },
    });
    expect(ensureTestNeeds(m.sys).ok).toBe(true);
    expect(m.calls.map((c) => [c.command, ...c.args])).toEqual([
      [aptGet, 'update'],
      [aptGet, 'install', '-y', 'chromium'],
    ]);
    expect(m.calls.every((c) => c.env?.DEBIAN_FRONTEND === 'noninteractive')).toBe(true);
    expect(m.out[0]).toBe('test needs: Chromium is missing (the browser tests drive the app in it); installing the "chromium" package with apt-get as root...');
    expect(m.out[1]).toBe(`test needs: installed Chromium at ${path.join(bin, 'chromium')}`);
    expect(m.err).toEqual([]);
  });

  it('installs through sudo when sudo needs no password, and asks for the Ubuntu package on Ubuntu', () => {
    const aptGet = program('apt-get');
    const sudo = program('sudo');
    const m = machine({
      uid: 1000,
      osRelease: UBUNTU,
      answer: (call) => {
        if (call.args.includes('install')) program('chromium-browser');
        return { status: 0 };
      },
    });
    expect(ensureTestNeeds(m.sys).ok).toBe(true);
    expect(m.calls.map((c) => [c.command, ...c.args])).toEqual([
      [sudo, '-n', 'true'],
      [sudo, '-n', aptGet, 'update'],
      [sudo, '-n', aptGet, 'install', '-y', 'chromium-browser'],
    ]);
    expect(m.out[0]).toContain('with apt-get with sudo');
  });

  it('stops at once with the exact command when sudo would ask for a password', () => {
    program('apt-get');
    const sudo = program('sudo');
    const m = machine({ uid: 1000, answer: () => ({ status: 1 }) });
    expect(ensureTestNeeds(m.sys).ok).toBe(false);
    expect(m.calls.map((c) => [c.command, ...c.args])).toEqual([[sudo, '-n', 'true']]);
    const text = m.err.join('\n');
    expect(text).toContain('It was not installed automatically: this is not root and sudo asks for a password.');
    expect(text).toContain('\n  sudo apt-get update && sudo apt-get install -y chromium\n');
    expect(text).toContain('Or point RIGBOOK_CHROMIUM at a Chromium program');
  });

  it('reports a failed install with its exit status and the command to run by hand', () => {
    program('apt-get');
    const m = machine({ answer: (call) => ({ status: call.args[0] === 'install' ? 100 : 0 }) });
    expect(ensureTestNeeds(m.sys).ok).toBe(false);
    const text = m.err.join('\n');
    expect(text).toContain('It was not installed automatically: apt-get install failed (exit 100).');
    expect(text).toContain('\n  apt-get update && apt-get install -y chromium\n');
  });

  it.each([
    ['Fedora', { osRelease: FEDORA, uid: 1000 }, 'sudo dnf install -y chromium'],
    ['macOS', { platform: 'darwin' as const }, 'brew install --cask chromium'],
    ['Windows', { platform: 'win32' as const, env: { Path: '', LOCALAPPDATA: 'C:\\Users\\x\\AppData\\Local' } }, 'winget install --exact --id Google.Chrome'],
  ])('on %s it starts nothing and names the command for that system', (_label, over, command) => {
    const m = machine(over);
    expect(ensureTestNeeds(m.sys).ok).toBe(false);
    expect(m.calls).toEqual([]);
    expect(m.err.join('\n')).toContain(`\n  ${command}\n`);
  });

  it('reads the family from os-release, derivatives included (os-release(5) ID and ID_LIKE)', () => {
    expect(linuxFamily(DEBIAN)).toBe('debian');
    expect(linuxFamily(UBUNTU)).toBe('ubuntu');
    // A derivative names its parents in ID_LIKE (from memory: Linux Mint lists "ubuntu debian").
    expect(linuxFamily('ID=linuxmint\nID_LIKE="ubuntu debian"\n')).toBe('ubuntu');
    expect(linuxFamily('ID="rocky"\nID_LIKE="rhel centos fedora"\n')).toBe('fedora');
    expect(linuxFamily('ID=nixos\n')).toBeNull();
  });
});

describe('the test command on a machine without a browser (simulated by its environment)', () => {
  it('stops at once, before any test, printing what it looked for and the exact command', () => {
    const osRelease = path.join(temp.dir, 'os-release');
    writeFileSync(osRelease, DEBIAN);
    // An empty PATH (no browser, no apt-get, no sudo) and a HOME of its own (no Playwright browser).
    const result = spawnSync(process.execPath, ['tests/setup/ensure-test-needs.mjs'], {
      env: { PATH: bin, HOME: temp.dir, RIGBOOK_OS_RELEASE: osRelease },
      encoding: 'utf8',
    });
    expect(result.status).toBe(1);
    // The database server may be found (its place does not depend on PATH); the browser is not.
    expect(result.stdout).not.toContain('Chromium');
    const sudo = process.getuid?.() === 0 ? '' : 'sudo ';
    expect(result.stderr).toContain('The tests need Chromium (the browser tests drive the app in it), and this machine has none.');
    expect(result.stderr).toContain('chromium, chromium-browser, google-chrome-stable, google-chrome, chrome on PATH');
    expect(result.stderr).toContain('It was not installed automatically: apt-get is not on PATH.');
    expect(result.stderr).toContain(`\n  ${sudo}apt-get update && ${sudo}apt-get install -y chromium\n`);
  });

  it('passes with a browser on PATH', () => {
    const chromium = program('chromium');
    const result = spawnSync(process.execPath, ['tests/setup/ensure-test-needs.mjs'], { env: { PATH: bin, HOME: temp.dir }, encoding: 'utf8' });
    expect(result.status, result.stderr).toBe(0);
    expect(result.stdout.split('\n').filter((line) => !line.includes('PostgreSQL'))).toEqual([`test needs: Chromium at ${chromium}`, '']);
  });
});

describe('the database server the store tests need', () => {
  it('finds initdb and pg_ctl where RIGBOOK_PG_BIN points, before any usual place', () => {
    program('initdb');
    program('pg_ctl');
    expect(findPgServer({ RIGBOOK_PG_BIN: bin }).path).toBe(path.join(bin, 'initdb'));
  });

  it('does not take a folder with initdb but no pg_ctl', () => {
    program('initdb');
    const found = findPgServer({ RIGBOOK_PG_BIN: bin });
    expect(found.path).not.toBe(path.join(bin, 'initdb'));
    expect(found.tried[0]).toBe(`${bin}/initdb and pg_ctl`);
  });

  it.each([
    ['Debian', { osRelease: DEBIAN, uid: 0 }, 'apt-get update && apt-get install -y postgresql'],
    ['Fedora', { osRelease: FEDORA, uid: 1000 }, 'sudo dnf install -y postgresql-server'],
  ])('names the server package on %s', (_label, over, command) => {
    const need = SERVER_NEEDS.find((n) => n.id === 'postgresql')!;
    expect(manualCommand(need, machine(over).sys)).toBe(command);
  });
});
