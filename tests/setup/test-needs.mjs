// What the tests need from the system beyond `npm install`: found, or installed where the
// system's package manager can be used without a question (Debian or Ubuntu, as root or with
// sudo that needs no password), or else a stop at once with the exact command to run.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { findBrowser, onPath } from '../e2e/find-browser.mjs';

/**
 * Each thing the tests need from the system: how to find it, which package provides it on each
 * family of Linux, and the command elsewhere. A database server joins this list the day tests
 * need one (a `find` that looks for its program, and its packages).
 */
export const NEEDS = [
  {
    id: 'chromium',
    label: 'Chromium',
    why: 'the browser tests drive the app in it',
    find: (sys) => findBrowser(sys.env, sys.platform),
    packages: { debian: 'chromium', ubuntu: 'chromium-browser', fedora: 'chromium', arch: 'chromium', suse: 'chromium', alpine: 'chromium' },
    commands: { darwin: 'brew install --cask chromium', win32: 'winget install --exact --id Google.Chrome' },
    pointAt: 'RIGBOOK_CHROMIUM',
  },
];

/**
 * The database server the store tests run their PostgreSQL half on (tests/helpers/pg-cluster.ts
 * starts a throwaway cluster from these programs). Kept apart from NEEDS, which the browser's
 * own tests pin, and checked by `npm test` after them.
 */
export const SERVER_NEEDS = [
  {
    id: 'postgresql',
    label: 'PostgreSQL',
    why: 'the store and service tests run on a throwaway PostgreSQL cluster as well as on SQLite',
    find: (sys) => findPgServer(sys.env),
    packages: { debian: 'postgresql', ubuntu: 'postgresql', fedora: 'postgresql-server', arch: 'postgresql', suse: 'postgresql-server', alpine: 'postgresql' },
    commands: { darwin: 'brew install postgresql' },
    pointAt: 'RIGBOOK_PG_BIN',
  },
];

/** initdb and pg_ctl: RIGBOOK_PG_BIN, then Debian's versioned folders, then the usual places. Same order as the test helper. */
export function findPgServer(env) {
  const dirs = [];
  if (env.RIGBOOK_PG_BIN) dirs.push(env.RIGBOOK_PG_BIN);
  const debian = '/usr/lib/postgresql';
  if (existsSync(debian)) {
    for (const v of readdirSync(debian)
      .filter((x) => /^\d+$/.test(x))
      .sort((a, b) => Number(b) - Number(a)))
      dirs.push(path.join(debian, v, 'bin'));
  }
  dirs.push('/usr/pgsql/bin', '/usr/local/pgsql/bin', '/usr/bin', '/usr/local/bin');
  const found = dirs.find((dir) => existsSync(path.join(dir, 'initdb')) && existsSync(path.join(dir, 'pg_ctl')));
  return { path: found ? path.join(found, 'initdb') : null, tried: dirs.map((d) => `${d}/initdb and pg_ctl`) };
}

/** The ID and ID_LIKE fields of an os-release file (os-release(5)). */
export function parseOsRelease(text) {
  const field = (name) => (new RegExp(`^${name}=(.*)$`, 'm').exec(text)?.[1] ?? '').replace(/^["']|["']$/g, '').toLowerCase();
  return { id: field('ID'), like: field('ID_LIKE').split(/\s+/).filter(Boolean) };
}

/** Which package family a Linux system belongs to, from its os-release; null when unknown. */
export function linuxFamily(osReleaseText) {
  const { id, like } = parseOsRelease(osReleaseText);
  const ids = [id, ...like];
  if (ids.includes('ubuntu')) return 'ubuntu';
  if (ids.includes('debian')) return 'debian';
  if (ids.some((x) => ['fedora', 'rhel', 'centos'].includes(x))) return 'fedora';
  if (ids.includes('arch')) return 'arch';
  if (ids.some((x) => x === 'suse' || x.startsWith('opensuse'))) return 'suse';
  if (ids.includes('alpine')) return 'alpine';
  return null;
}

const INSTALL_COMMAND = {
  debian: (pkg) => `apt-get update && {sudo}apt-get install -y ${pkg}`,
  ubuntu: (pkg) => `apt-get update && {sudo}apt-get install -y ${pkg}`,
  fedora: (pkg) => `dnf install -y ${pkg}`,
  arch: (pkg) => `pacman -S --needed --noconfirm ${pkg}`,
  suse: (pkg) => `zypper install -y ${pkg}`,
  alpine: (pkg) => `apk add ${pkg}`,
};

/** The exact command a person runs on this system to install what is missing, or null when we cannot name one. */
export function manualCommand(need, sys) {
  if (sys.platform === 'linux') {
    const family = linuxFamily(sys.osRelease);
    const pkg = family ? need.packages[family] : undefined;
    if (!family || !pkg) return null;
    const sudo = sys.uid === 0 ? '' : 'sudo ';
    return sudo + INSTALL_COMMAND[family](pkg).replaceAll('{sudo}', sudo);
  }
  return need.commands[sys.platform] ?? null;
}

/** Whether this process may install system packages itself, and how; or why not. */
export function installer(sys) {
  if (sys.env.RIGBOOK_NO_INSTALL === '1') return { reason: 'RIGBOOK_NO_INSTALL=1 is set' };
  const family = sys.platform === 'linux' ? linuxFamily(sys.osRelease) : null;
  if (family !== 'debian' && family !== 'ubuntu') return { reason: 'installing by itself is done on Debian and Ubuntu only' };
  const aptGet = onPath('apt-get', sys.env, sys.platform);
  if (!aptGet) return { reason: 'apt-get is not on PATH' };
  if (sys.uid === 0) return { family, how: 'as root', prefix: [], aptGet };
  const sudo = onPath('sudo', sys.env, sys.platform);
  if (!sudo) return { reason: 'this is not root and sudo is not installed' };
  // -n: fail at once instead of asking for a password.
  const probe = sys.run(sudo, ['-n', 'true'], { quiet: true });
  if (probe.status !== 0) return { reason: 'this is not root and sudo asks for a password' };
  return { family, how: 'with sudo', prefix: [sudo, '-n'], aptGet };
}

function runInstall(plan, pkg, sys, updated) {
  const env = { ...sys.env, DEBIAN_FRONTEND: 'noninteractive' };
  const step = (args) => {
    const [command, ...rest] = [...plan.prefix, plan.aptGet, ...args];
    return sys.run(command, rest, { env });
  };
  if (!updated.done) {
    const update = step(['update']);
    if (update.status !== 0) return `apt-get update failed (${update.error?.message ?? `exit ${update.status}`})`;
    updated.done = true;
  }
  const install = step(['install', '-y', pkg]);
  if (install.status !== 0) return `apt-get install failed (${install.error?.message ?? `exit ${install.status}`})`;
  return null;
}

/**
 * Finds every need; installs what is missing where it may; otherwise prints, for each missing
 * need, what was looked for and the exact command to run. `sys.run` is the only call that
 * starts a process.
 */
export function ensureTestNeeds(sys, needs = NEEDS) {
  const missing = [];
  for (const need of needs) {
    const found = need.find(sys);
    if (found.path) sys.log(`test needs: ${need.label} at ${found.path}`);
    else missing.push({ need, tried: found.tried });
  }
  if (missing.length === 0) return { ok: true };

  const plan = installer(sys);
  const updated = { done: false };
  let ok = true;
  for (const { need, tried } of missing) {
    let why = plan.reason;
    if (!why) {
      const pkg = need.packages[plan.family];
      sys.log(`test needs: ${need.label} is missing (${need.why}); installing the "${pkg}" package with apt-get ${plan.how}...`);
      why = runInstall(plan, pkg, sys, updated);
      if (!why) {
        const again = need.find(sys);
        if (again.path) {
          sys.log(`test needs: installed ${need.label} at ${again.path}`);
          continue;
        }
        why = `the "${pkg}" package installed, but no ${need.label} program was found afterwards`;
        tried.splice(0, tried.length, ...again.tried);
      }
    }
    ok = false;
    const command = manualCommand(need, sys);
    sys.error(
      [
        `The tests need ${need.label} (${need.why}), and this machine has none. Looked for:`,
        ...tried.map((t) => `  - ${t}`),
        `It was not installed automatically: ${why}.`,
        command ? `Install it with this command, then run npm test again:\n\n  ${command}\n` : `Install ${need.label} with this system's package manager, then run npm test again.`,
        `Or point ${need.pointAt} at a ${need.label} program you already have.`,
      ].join('\n'),
    );
  }
  return { ok };
}

/** This machine, as the functions above see it. */
export function realSystem() {
  const env = process.env;
  let osRelease = '';
  // RIGBOOK_OS_RELEASE lets a test present another system's os-release file.
  for (const file of [env.RIGBOOK_OS_RELEASE, '/etc/os-release', '/usr/lib/os-release']) {
    if (!file) continue;
    try {
      osRelease = readFileSync(file, 'utf8');
      break;
    } catch {
      // Try the next place.
    }
  }
  return {
    env,
    platform: process.platform,
    uid: typeof process.getuid === 'function' ? process.getuid() : null,
    osRelease,
    run: (command, args, options = {}) => spawnSync(command, args, { stdio: options.quiet ? 'ignore' : 'inherit', env: options.env ?? env }),
    log: (line) => console.log(line),
    error: (text) => console.error(text),
  };
}
