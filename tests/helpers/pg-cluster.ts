import { spawnSync, type SpawnSyncReturns } from 'node:child_process';
import { chmodSync, chownSync, existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

// A throwaway PostgreSQL cluster for the store tests: initdb into a fresh temp folder, a server
// that listens on a Unix socket in that folder only (no TCP at all), stopped and removed after.
// The server refuses to run as root, so as root it runs as the `postgres` OS user.

export interface PgCluster {
  /** The folder holding the socket: the `host` of a connection string. */
  socketDir: string;
  port: number;
  user: string;
  /** A connection string for one database of this cluster, over the socket. */
  urlFor: (database: string) => string;
  stop: () => void;
}

export type PgClusterStart = { ok: true; cluster: PgCluster } | { ok: false; reason: string };

/** Where the server programs are: RIGBOOK_PG_BIN, then Debian's and other usual places, then PATH. */
export function findPgBin(env: NodeJS.ProcessEnv = process.env): string | null {
  const candidates: string[] = [];
  if (env.RIGBOOK_PG_BIN) candidates.push(env.RIGBOOK_PG_BIN);
  const debian = '/usr/lib/postgresql';
  if (existsSync(debian)) {
    const versions = readdirSync(debian)
      .filter((v) => /^\d+$/.test(v))
      .sort((a, b) => Number(b) - Number(a));
    for (const v of versions) candidates.push(path.join(debian, v, 'bin'));
  }
  candidates.push('/usr/pgsql/bin', '/usr/local/pgsql/bin', '/usr/bin', '/usr/local/bin');
  return candidates.find((dir) => existsSync(path.join(dir, 'initdb')) && existsSync(path.join(dir, 'pg_ctl'))) ?? null;
}

function osUserId(name: string): { uid: number; gid: number } | null {
  const uid = spawnSync('id', ['-u', name], { encoding: 'utf8' });
  const gid = spawnSync('id', ['-g', name], { encoding: 'utf8' });
  if (uid.status !== 0 || gid.status !== 0) return null;
  return { uid: Number(uid.stdout.trim()), gid: Number(gid.stdout.trim()) };
}

function said(result: SpawnSyncReturns<string>): string {
  return (result.error?.message ?? `${result.stderr}${result.stdout}`).trim().split('\n').slice(-3).join(' / ');
}

/** Starts a cluster, or says why it could not. Never throws. */
export function startPgCluster(env: NodeJS.ProcessEnv = process.env): PgClusterStart {
  const bin = findPgBin(env);
  if (!bin) return { ok: false, reason: 'no PostgreSQL server programs (initdb, pg_ctl) were found; install the postgresql package or set RIGBOOK_PG_BIN' };
  const asRoot = process.getuid?.() === 0;
  const owner = asRoot ? osUserId('postgres') : null;
  if (asRoot && !owner) return { ok: false, reason: 'running as root and there is no `postgres` OS user to run the server as' };
  const user = asRoot ? 'postgres' : (env.USER ?? 'postgres');
  const dir = mkdtempSync(path.join(tmpdir(), 'rigbook-pg-'));
  const dataDir = path.join(dir, 'data');
  if (owner) {
    chownSync(dir, owner.uid, owner.gid);
    chmodSync(dir, 0o700);
  }
  const run = (program: string, args: string[]): SpawnSyncReturns<string> => {
    const full = path.join(bin, program);
    return asRoot ? spawnSync('runuser', ['-u', 'postgres', '--', full, ...args], { encoding: 'utf8' }) : spawnSync(full, args, { encoding: 'utf8' });
  };
  const remove = () => rmSync(dir, { recursive: true, force: true });
  // C locale and UTF-8: the same byte order for text as SQLite's, whatever this machine's locale.
  const init = run('initdb', ['-D', dataDir, '-U', user, '--auth=trust', '--no-locale', '--encoding=UTF8', '--no-sync']);
  if (init.status !== 0) {
    remove();
    return { ok: false, reason: `initdb failed: ${said(init)}` };
  }
  // Any free number will do for the port: with no TCP listener it only names the socket file.
  const port = 50000 + (process.pid % 10000);
  const options = `-k ${dir} -c listen_addresses='' -p ${port} -c fsync=off -c max_connections=200`;
  const start = run('pg_ctl', ['-D', dataDir, '-o', options, '-l', path.join(dir, 'server.log'), '-w', '-t', '60', 'start']);
  if (start.status !== 0) {
    remove();
    return { ok: false, reason: `pg_ctl start failed: ${said(start)}` };
  }
  let stopped = false;
  const stop = () => {
    if (stopped) return;
    stopped = true;
    run('pg_ctl', ['-D', dataDir, '-m', 'immediate', '-w', 'stop']);
    remove();
  };
  return {
    ok: true,
    cluster: {
      socketDir: dir,
      port,
      user,
      // The `host` parameter (the socket folder) wins over the URL's host name, which is there only
      // so the string parses as a URL.
      urlFor: (database) => `postgresql://${user}@localhost/${database}?host=${encodeURIComponent(dir)}&port=${port}`,
      stop,
    },
  };
}
