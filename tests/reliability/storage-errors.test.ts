import Database from 'better-sqlite3';
import { spawnSync } from 'node:child_process';
import { chmodSync, writeFileSync } from 'node:fs';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { generateFleet } from '../../demo-fixtures/generate-fleet';
import { startLocalServer } from '../../src-main/local/local-server';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { dumpStore } from '../fleet/store-dump';
import { rigbook } from '../cli/run';
import { tempDir } from '../helpers/temp-dir';
import { apiCall } from '../local/support/local-shell';
import { bundleChild } from './support/child-process';
import { seededRandom } from './support/random';
import { seedSharedFleet } from './support/seed-fleet';
import { fileProblems, readRecords, verdictProblems } from './support/store-audit';

// A full disk, a store or folder that cannot be written, and a store another program holds:
// each must reach the person as what it is (over the API, on the command line, in the window),
// with nothing written or lost, and never as "something went wrong" or a stack trace.

type Host = Awaited<ReturnType<typeof openServiceHost>>;
const cleanup: (() => Promise<void> | void)[] = [];
afterEach(async () => {
  for (const c of cleanup.splice(0).reverse()) await c();
});
function temp() {
  const t = tempDir('rigbook-storage-');
  cleanup.push(() => t.remove());
  return t;
}

async function seeded(dbPath: string): Promise<Host> {
  const host = await openServiceHost({ dbPath, actor: 'tester' });
  cleanup.push(() => host.close());
  await seedSharedFleet(host, 10, seededRandom(21));
  return host;
}

async function soundAndUnchanged(host: Host, before: Record<string, unknown[]>): Promise<void> {
  expect(await fileProblems(host)).toEqual([]);
  expect(verdictProblems(await readRecords(host)).problems).toEqual([]);
  expect(await dumpStore(host.ctx.db)).toEqual(before);
}

/** Leaves the store a few pages to grow: SQLite then fails a large write with SQLITE_FULL, as on a full disk. */
function nearlyFull(host: Host): void {
  const pages = Number(host.raw!.pragma('page_count', { simple: true }));
  host.raw!.pragma(`max_page_count = ${pages + 4}`);
}

describe('disk full', () => {
  it('a large import on a full disk is refused as disk-full over the API and over HTTP, and the store is as it was', async () => {
    const t = temp();
    const host = await seeded(t.file('rigbook.sqlite'));
    const before = await dumpStore(host.ctx.db);
    nearlyFull(host);
    const fleet = generateFleet({ builds: 400, seed: 3 });
    const logged: string[] = [];
    const write = process.stderr.write.bind(process.stderr);
    process.stderr.write = ((chunk: string | Uint8Array) => {
      logged.push(String(chunk));
      return true;
    }) as typeof process.stderr.write;
    let direct;
    try {
      direct = await host.call('fleet.import', { fleet, mode: 'merge' });
    } finally {
      process.stderr.write = write;
    }
    expect(direct).toMatchObject({ ok: false, error: { kind: 'disk-full', message: expect.stringMatching(/is full\. Nothing was saved/) } });
    // The real cause is kept in the log.
    expect(logged.join('')).toMatch(/SQLITE_FULL/);

    const server = await startLocalServer({ host, rendererDir: t.dir });
    cleanup.push(() => server.close());
    const answer = JSON.parse((await apiCall(server.port, server.token, 'fleet.import', { fleet, mode: 'merge' })).body) as { ok: boolean; error: { kind: string; message: string } };
    expect(answer.error.kind).toBe('disk-full');
    expect(answer.error.message).not.toMatch(/Something went wrong/);
    await soundAndUnchanged(host, before);
  });
});

describe('read-only store', () => {
  it('a store SQLite may only read refuses each save as read-only, with a message that says so, and nothing changes', async () => {
    const t = temp();
    const host = await seeded(t.file('rigbook.sqlite'));
    const before = await dumpStore(host.ctx.db);
    // SQLite's own read-only switch: writes fail with SQLITE_READONLY, as on a read-only file.
    host.raw!.pragma('query_only = 1');
    const result = await host.call('batteries.create', { name: 'Not saved', chemistry: 'lipo', cellsSeries: 2, capacityMah: 2000 });
    expect(result).toMatchObject({ ok: false, error: { kind: 'read-only', message: expect.stringMatching(/cannot be written: the file or its folder is read-only/) } });
    host.raw!.pragma('query_only = 0');
    await soundAndUnchanged(host, before);
  });
});

describe('the command line as a user who may not write the store', () => {
  // Root writes through any permission, so the command runs as "nobody" (uid 65534) where the
  // tests run as root, and as the test's own user otherwise.
  const root = process.getuid?.() === 0;
  const setpriv = spawnSync('setpriv', ['--version']).status === 0;
  const canDrop = !root || setpriv;
  let script = '';
  const folder = tempDir('rigbook-readonly-');
  beforeAll(async () => {
    if (canDrop) script = await bundleChild('src-main/cli/main.ts', folder.dir);
  }, 60_000);
  afterAll(() => folder.remove());

  function asOtherUser(args: string[]) {
    const command = root ? ['setpriv', '--reuid=65534', '--regid=65534', '--clear-groups', process.execPath, script, ...args] : [process.execPath, script, ...args];
    const run = spawnSync(command[0]!, command.slice(1), { encoding: 'utf8', env: { PATH: process.env.PATH, HOME: folder.dir, NODE_PATH: `${process.cwd()}/node_modules` } });
    return { code: run.status, out: run.stdout, err: run.stderr };
  }

  it.skipIf(!canDrop)(
    'a read-only store file and a read-only folder: exit 4 with a clear message and no stack trace, the store unchanged',
    async () => {
      chmodSync(folder.dir, 0o755);
      const store = `${folder.dir}/rigbook.sqlite`;
      const host = await openServiceHost({ dbPath: store, actor: 'tester' });
      await seedSharedFleet(host, 4, seededRandom(4));
      const before = await dumpStore(host.ctx.db);
      await host.close();
      const fleetFile = `${folder.dir}/one-pack.json`;
      writeFileSync(fleetFile, JSON.stringify({ format: 'rigbook-fleet', version: 1, batteries: [{ id: 'ro-pack', name: 'Read-only test', chemistry: 'lipo', cellsSeries: 2, capacityMah: 2000 }] }));
      chmodSync(fleetFile, 0o644);

      chmodSync(store, 0o444);
      const file = asOtherUser(['import', fleetFile, '--db', store]);
      expect(file.code, file.err).toBe(4);
      expect(file.err).toMatch(/cannot be written: the file or its folder is read-only/);
      expect(file.err).not.toMatch(/\n\s+at /);

      chmodSync(store, 0o666);
      chmodSync(folder.dir, 0o555);
      const dir = asOtherUser(['import', fleetFile, '--db', store]);
      chmodSync(folder.dir, 0o755);
      expect(dir.code, dir.err).toBe(4);
      expect(dir.err).toMatch(/cannot be written: the file or its folder is read-only/);
      expect(dir.err).not.toMatch(/\n\s+at /);

      const check = await openServiceHost({ dbPath: store, actor: 'tester' });
      try {
        expect(await fileProblems(check)).toEqual([]);
        expect(await dumpStore(check.ctx.db)).toEqual(before);
      } finally {
        await check.close();
      }
    },
    60_000,
  );
});

describe('store in use', () => {
  it('an import while another program holds the store is refused with exit 4 and says the store is in use', async () => {
    const t = temp();
    const store = t.file('rigbook.sqlite');
    const host = await seeded(store);
    const before = await dumpStore(host.ctx.db);
    await host.close();
    cleanup.pop();
    const holder = new Database(store);
    holder.pragma('locking_mode = EXCLUSIVE');
    holder.exec('BEGIN EXCLUSIVE');
    holder.exec('COMMIT');
    const fleetFile = t.file('fleet.json');
    writeFileSync(fleetFile, JSON.stringify({ format: 'rigbook-fleet', version: 1, batteries: [{ id: 'busy-pack', name: 'Busy', chemistry: 'lipo', cellsSeries: 2, capacityMah: 2000 }] }));
    const run = await rigbook(['import', fleetFile, '--db', store]);
    holder.close();
    expect(run.code).toBe(4);
    expect(run.err).toMatch(/in use by another Rigbook window or command/);
    expect(run.err).not.toMatch(/\n\s+at /);
    const check = await openServiceHost({ dbPath: store, actor: 'tester' });
    try {
      expect(await dumpStore(check.ctx.db)).toEqual(before);
    } finally {
      await check.close();
    }
  }, 30_000);
});
