import Database from 'better-sqlite3';
import { Migrator } from 'kysely';
import { copyFileSync, existsSync, linkSync, mkdirSync, readdirSync, readFileSync, symlinkSync, unlinkSync } from 'node:fs';
import { basename, join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { startLocalServer } from '../../src-main/local/local-server';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { restoreStore } from '../../src-main/service/restore-store';
import { backUpStore, checkStoreFile } from '../../src-main/store/backup';
import { MIGRATIONS, staticMigrationProvider } from '../../src-main/store/migration-provider';
import { openStore } from '../../src-main/store/open-database';
import { RestoreRefused } from '../../src-main/store/restore-file';
import { pageCallRefusal } from '../../src-main/service/page-call-policy';
import { dumpStore } from '../fleet/store-dump';
import { rigbook } from '../cli/run';
import { tempDir } from '../helpers/temp-dir';
import { apiCall } from '../local/support/local-shell';
import { seededRandom } from './support/random';
import { seedSharedFleet } from './support/seed-fleet';
import { fileProblems, historyByVersion, historyChainProblems, ok, readHistory, readRecords, verdictProblems } from './support/store-audit';

// One test per way the store file used to be lost or made to lie: restore, backup, export and
// a file deleted under a running shell. Each ends by opening the store and checking that
// SQLite finds it sound, that every record is there, and that every stored verdict is what
// the engine says of the stored records.

type Host = Awaited<ReturnType<typeof openServiceHost>>;
const cleanup: (() => Promise<void> | void)[] = [];
afterEach(async () => {
  for (const c of cleanup.splice(0).reverse()) await c();
});
function temp() {
  const t = tempDir('rigbook-storefile-');
  cleanup.push(() => t.remove());
  return t;
}
async function open(dbPath: string): Promise<Host> {
  const host = await openServiceHost({ dbPath, actor: 'tester' });
  let closed = false;
  cleanup.push(async () => {
    if (!closed) await host.close();
  });
  const close = host.close;
  host.close = async () => {
    closed = true;
    await close();
  };
  return host;
}

/** A store with a shared-part fleet; returns its path. */
async function seededStore(dbPath: string, builds = 12, seed = 5): Promise<void> {
  const host = await open(dbPath);
  await seedSharedFleet(host, builds, seededRandom(seed));
  await host.close();
}

/** Opens the store and returns its rows, after checking it is sound and tells the truth. */
async function auditedDump(dbPath: string): Promise<Record<string, unknown[]>> {
  const host = await open(dbPath);
  try {
    expect(await fileProblems(host)).toEqual([]);
    const records = await readRecords(host);
    const history = await readHistory(host);
    expect(historyChainProblems(records, historyByVersion(history), history)).toEqual([]);
    expect(verdictProblems(records).problems).toEqual([]);
    return await dumpStore(host.ctx.db);
  } finally {
    await host.close();
  }
}

/** The records of a dump without history and verdict times, which a restore adds to. */
function recordsOf(dump: Record<string, unknown[]>): Record<string, unknown[]> {
  const { history: _h, historyBuilds: _hb, historySelectors: _hs, verdicts: _v, settings: _s, ...rest } = dump;
  return rest;
}

async function backupOf(dbPath: string, destination: string): Promise<void> {
  const db = new Database(dbPath);
  try {
    await backUpStore(db, destination);
  } finally {
    db.close();
  }
}

describe('restore', () => {
  it('moves aside a -wal left beside the store (by a crash or from another store) instead of replaying it into the restored records', async () => {
    const t = temp();
    const target = t.file('rigbook.sqlite');
    await seededStore(target);
    const backup = t.file('backup.sqlite');
    await backupOf(target, backup);
    const expected = recordsOf(await auditedDump(backup));

    // The session to undo: edits that stay in the write-ahead log (no checkpoint), caught as a
    // crash would leave them, then the store file itself removed by the person.
    const session = t.file('session.sqlite');
    copyFileSync(target, session);
    const live = new Database(session);
    live.pragma('journal_mode = WAL');
    live.pragma('wal_autocheckpoint = 0');
    live.exec("update batteries set name = 'Session pack', version = version + 1");
    live.exec('update motors set maxCurrentA = 1');
    copyFileSync(`${session}-wal`, `${target}-wal`);
    live.close();
    unlinkSync(target);
    expect(readFileSync(`${target}-wal`).length).toBeGreaterThan(32);

    const result = await restoreStore(backup, target, { now: new Date('2026-12-02T09:00:00Z') });
    const after = await auditedDump(target);
    expect(JSON.stringify(after.batteries)).not.toContain('Session pack');
    expect(recordsOf(after)).toEqual(expected);
    expect(result.setAside).toEqual([join(t.dir, 'rigbook.set-aside-2026-12-02T09-00-00-000Z.sqlite-wal')]);
  });

  it('restores a backup made before the later migrations: its records come back, migrated, re-checked and sound', async () => {
    const t = temp();
    const source = t.file('old.sqlite');
    await seededStore(source, 20, 11);
    const expected = recordsOf(await auditedDump(source));
    // The backup as a store of the first layout would have written it: the later migrations'
    // downs take it back, real records and all.
    const backup = t.file('backup.sqlite');
    await backupOf(source, backup);
    const old = await openStore(backup);
    const { error } = await new Migrator({ db: old.db, provider: staticMigrationProvider }).migrateTo('20261202-0001-initial');
    await old.db.destroy();
    expect(error).toBeUndefined();
    const target = t.file('rigbook.sqlite');
    await seededStore(target, 6, 3);

    const outcome = await restoreStore(backup, target);
    expect(outcome.rechecked).toBe(20);
    const after = await auditedDump(target);
    expect((after.kysely_migration ?? []).map((row) => (JSON.parse(row as string) as { name: string }).name)).toEqual(Object.keys(MIGRATIONS).sort());
    for (const kind of ['batteries', 'motors', 'controllers', 'vehicles', 'builds'] as const) {
      const ids = (rows: unknown[] | undefined) => (rows ?? []).map((row) => (JSON.parse(row as string) as { id: string }).id).sort();
      expect(ids(after[kind]), kind).toEqual(ids(expected[kind]));
    }
  });

  it('refuses a backup carrying a trigger that rewrites verdicts, and replaces nothing', async () => {
    const t = temp();
    const target = t.file('rigbook.sqlite');
    await seededStore(target);
    const before = await auditedDump(target);
    const backup = t.file('backup.sqlite');
    await backupOf(target, backup);
    const db = new Database(backup);
    db.exec("create trigger keep_clear after update on verdicts begin update verdicts set status = 'clear' where buildId = new.buildId; end");
    db.close();

    const run = await rigbook(['restore', backup, '--db', target]);
    expect(run.code).toBe(3);
    expect(run.err).toMatch(/trigger "keep_clear" that Rigbook does not make/);
    expect(await auditedDump(target)).toEqual(before);
    expect(readdirSync(t.dir).sort()).toEqual(['backup.sqlite', 'backups', 'rigbook.sqlite'].filter((n) => existsSync(join(t.dir, n))).sort());
  });

  /** A seeded store restored from its own backup after `lie` (SQL) edited the backup's verdict rows. */
  async function restoreAfterLie(lie: string): Promise<{ target: string; changed: number; out: { rechecked: number; verdictChanges: number } }> {
    const t = temp();
    const target = t.file('rigbook.sqlite');
    await seededStore(target, 20, 7);
    const backup = t.file('backup.sqlite');
    await backupOf(target, backup);
    const db = new Database(backup);
    const changed = db.prepare(lie).run().changes;
    db.close();
    const run = await rigbook(['restore', backup, '--db', target, '--json']);
    expect(run.code, run.err).toBe(0);
    return { target, changed, out: JSON.parse(run.out) as { rechecked: number; verdictChanges: number } };
  }

  it('re-checks every build of a restored file whose stored verdicts were edited, and records it in history', async () => {
    const { target, changed: lied, out } = await restoreAfterLie("update verdicts set status = 'clear', supplyStatuses = '' where status <> 'clear'");
    expect(lied).toBeGreaterThan(0);
    expect(out).toMatchObject({ rechecked: 20 });
    expect(out.verdictChanges).toBeGreaterThanOrEqual(lied);
    await auditedDump(target);
    const host = await open(target);
    const history = await readHistory(host);
    await host.close();
    expect(history.at(-1)).toMatchObject({ action: 'restore', entityKind: 'store' });
  });

  it('corrects a restored file whose stored check lists were emptied, though its verdicts were left as they were', async () => {
    // Only the checks the list filters on are emptied: a build would drop out of "every build
    // whose controller check is over" while its badge still says over.
    const { target, changed: hidden, out } = await restoreAfterLie("update verdicts set ruleStatuses = '' where ruleStatuses <> ''");
    expect(hidden).toBeGreaterThan(0);
    expect(out).toMatchObject({ rechecked: 20 });
    // The audit compares every stored check list with a fresh evaluation.
    await auditedDump(target);
  });

  it('refuses a backup whose table lost columns, naming the first difference, and replaces nothing', async () => {
    const t = temp();
    const target = t.file('rigbook.sqlite');
    await seededStore(target);
    const before = await auditedDump(target);
    const backup = t.file('backup.sqlite');
    await backupOf(target, backup);
    const db = new Database(backup);
    db.exec('alter table motors drop column maxRpm');
    db.exec('alter table motors drop column poles');
    db.close();
    const refusal = await restoreStore(backup, target).catch((e: unknown) => e);
    expect(refusal).toBeInstanceOf(RestoreRefused);
    expect((refusal as Error).message).toMatch(/its table "motors" lacks the column "maxRpm"/);
    expect(await auditedDump(target)).toEqual(before);
  });

  it('refuses a file that records a migration named like a built-in property ("toString")', async () => {
    const t = temp();
    const file = t.file('odd.sqlite');
    await seededStore(file, 2);
    const db = new Database(file);
    db.prepare('insert into kysely_migration (name, timestamp) values (?, ?)').run('toString', new Date().toISOString());
    db.close();
    expect(checkStoreFile(file)).toMatchObject({ ok: false, reason: expect.stringMatching(/newer Rigbook \(schema toString\)/) });
    const target = t.file('rigbook.sqlite');
    await expect(restoreStore(file, target)).rejects.toBeInstanceOf(RestoreRefused);
    expect(existsSync(target)).toBe(false);
  });

  it('never leaves the store path empty: a crash at the moment of the swap leaves the old store in place', async () => {
    const t = temp();
    const target = t.file('rigbook.sqlite');
    await seededStore(target);
    const before = await auditedDump(target);
    const backup = t.file('backup.sqlite');
    await seededStore(backup, 3, 99);
    // The restoring process dies (SIGKILL) just before any rename onto the store path.
    const { bundleChild, ChildLines } = await import('./support/child-process');
    const script = await bundleChild('tests/reliability/children/restore-crash.ts', t.dir);
    const child = new ChildLines(script, [backup, target]);
    const exit = await child.exited;
    expect(exit.signal, child.stderr).toBe('SIGKILL');
    expect(child.lines).toContain('renaming onto the store');
    expect(existsSync(target)).toBe(true);
    expect(await auditedDump(target)).toEqual(before);
  });

  it('a shell opening the store while a restore runs either holds the restore off or is refused its writes: no acknowledged write is lost', async () => {
    const t = temp();
    const target = t.file('rigbook.sqlite');
    await seededStore(target, 6, 3);
    const backup = t.file('backup.sqlite');
    await seededStore(backup, 400, 4);
    const restoring = restoreStore(backup, target).then(
      () => 'restored',
      (e: unknown) => (e instanceof RestoreRefused && e.reason === 'in-use' ? 'refused' : Promise.reject(e)),
    );
    // The shell starts while the restore copies and re-checks the backup.
    await new Promise((r) => setTimeout(r, 30));
    const shell = await open(target);
    const acknowledged: string[] = [];
    const refused: string[] = [];
    for (let i = 0; i < 40; i++) {
      const result = await shell.call('batteries.create', { name: `Written during restore ${i}`, chemistry: 'lipo', cellsSeries: 2, capacityMah: 2000 });
      if (result.ok) acknowledged.push((result.value as { id: string }).id);
      else {
        expect(result.error.kind).toBe('store-changed');
        refused.push(result.error.message);
      }
      await new Promise((r) => setImmediate(r));
    }
    const outcome = await restoring;
    // After the restore settled, the shell either still writes into the live store or is refused.
    const late = await shell.call('batteries.create', { name: 'Written after restore', chemistry: 'lipo', cellsSeries: 2, capacityMah: 2000 });
    if (late.ok) acknowledged.push((late.value as { id: string }).id);
    else expect(late.error.kind).toBe('store-changed');
    await shell.close();
    const after = await auditedDump(target);
    const packs = after.batteries!.map((row) => (JSON.parse(row as string) as { id: string }).id);
    for (const id of acknowledged) expect(packs, `acknowledged pack ${id} (restore ${outcome})`).toContain(id);
    // A shell that opened the replaced file and kept writing would lose its acknowledged writes,
    // which the loop above catches; one that waited for the restore's lock and opened the
    // restored file may write on (its writes are then in the store).
    console.log(`restore with a shell starting meanwhile: ${outcome}, ${acknowledged.length} writes acknowledged, ${refused.length + (late.ok ? 0 : 1)} refused as store-changed`);
  });
});

describe('backup and export destinations', () => {
  it('refuses store.backup onto the live store through a symlinked folder, a hard link and its -wal, and loses no acknowledged write', async () => {
    const t = temp();
    const folder = join(t.dir, 'data');
    mkdirSync(folder);
    const target = join(folder, 'rigbook.sqlite');
    const host = await open(target);
    await seedSharedFleet(host, 8, seededRandom(2));
    symlinkSync(folder, join(t.dir, 'alias'));
    linkSync(target, join(t.dir, 'hard-link.sqlite'));
    const acknowledged = await ok<{ id: string }>(host, 'batteries.create', { name: 'Acknowledged before the backup', chemistry: 'lipo', cellsSeries: 3, capacityMah: 4000 });
    for (const destination of [join(t.dir, 'alias', 'rigbook.sqlite'), join(t.dir, 'hard-link.sqlite'), join(t.dir, 'alias', 'rigbook.sqlite-wal'), join(t.dir, 'alias', 'RIGBOOK.sqlite-shm')]) {
      const result = await host.call('store.backup', { destination });
      expect(result, destination).toMatchObject({ ok: false, error: { kind: 'invalid', field: 'destination' } });
    }
    const after = await ok<{ id: string }>(host, 'batteries.create', { name: 'Acknowledged after the backups', chemistry: 'lipo', cellsSeries: 3, capacityMah: 4000 });
    await host.close();
    const dump = await auditedDump(target);
    expect(JSON.stringify(dump.batteries)).toContain(acknowledged.id);
    expect(JSON.stringify(dump.batteries)).toContain(after.id);
  });

  it('refuses `rigbook export FILE` when FILE is the store, under its own name or through a symlinked folder', async () => {
    const t = temp();
    const target = t.file('rigbook.sqlite');
    await seededStore(target);
    const before = await auditedDump(target);
    symlinkSync(t.dir, t.file('alias'));
    for (const file of [target, join(t.dir, 'alias', 'rigbook.sqlite')]) {
      const run = await rigbook(['export', file, '--db', target]);
      expect(run.code, run.err).toBe(4);
      expect(run.err).toMatch(/is the store itself/);
    }
    const csv = await rigbook(['export', `${target}-wal`, '--csv', 'packs', '--db', target]);
    expect(csv.code).toBe(4);
    expect(await auditedDump(target)).toEqual(before);
  });

  it('store.backup from the page: the desktop window cannot call it, the loopback API writes only new files in the backups folder', async () => {
    const t = temp();
    const target = t.file('rigbook.sqlite');
    const host = await open(target);
    await seedSharedFleet(host, 4, seededRandom(8));
    expect(pageCallRefusal('desktop', target, 'store.backup', { destination: t.file('x.sqlite') })).toMatchObject({ kind: 'invalid', field: 'destination' });
    const server = await startLocalServer({ host, rendererDir: t.dir });
    cleanup.push(() => server.close());
    const call = async (destination: string) => JSON.parse((await apiCall(server.port, server.token, 'store.backup', { destination })).body) as { ok: boolean; error?: { message: string } };
    const elsewhere = t.file('elsewhere.sqlite');
    expect(await call(elsewhere)).toMatchObject({ ok: false, error: { message: expect.stringMatching(/backups folder/) } });
    expect(existsSync(elsewhere)).toBe(false);
    expect(await call(target)).toMatchObject({ ok: false });
    const inFolder = join(t.dir, 'backups', 'from-the-page.sqlite');
    mkdirSync(join(t.dir, 'backups'), { recursive: true });
    expect(await call(inFolder)).toMatchObject({ ok: true });
    expect(checkStoreFile(inFolder)).toMatchObject({ ok: true });
    // Never over an existing file, even its own earlier backup.
    expect(await call(inFolder)).toMatchObject({ ok: false, error: { message: expect.stringMatching(/already in the backups folder/) } });
    expect(await call(join(t.dir, 'backups', '..', 'rigbook.sqlite'))).toMatchObject({ ok: false });
    await server.close();
    await host.close();
    await auditedDump(target);
  });
});

describe('a store file deleted or replaced under a running shell', () => {
  it('refuses writes with a message saying the file was deleted, and the next start holds every acknowledged write', async () => {
    const t = temp();
    const target = t.file('rigbook.sqlite');
    const host = await open(target);
    await seedSharedFleet(host, 6, seededRandom(12));
    const acknowledged = await ok<{ id: string }>(host, 'batteries.create', { name: 'Before the delete', chemistry: 'lipo', cellsSeries: 2, capacityMah: 2200 });
    await host.close();
    const before = await auditedDump(target);

    const running = await open(target);
    for (const suffix of ['', '-wal', '-shm']) if (existsSync(target + suffix)) unlinkSync(target + suffix);
    const refused = await running.call('batteries.create', { name: 'After the delete', chemistry: 'lipo', cellsSeries: 2, capacityMah: 2200 });
    expect(refused).toMatchObject({ ok: false, error: { kind: 'store-changed', message: expect.stringMatching(/was deleted or moved while Rigbook was running\. Nothing was saved/) } });
    await running.close();
    expect(before.batteries!.join()).toContain(acknowledged.id);
  });

  it('refuses writes when another file was put at the store path, and that file is left as it was', async () => {
    const t = temp();
    const target = t.file('rigbook.sqlite');
    await seededStore(target, 6, 13);
    const other = t.file('other.sqlite');
    await seededStore(other, 3, 14);
    const running = await open(target);
    // What a sync tool or a copy in a file manager does: a new file renamed over the path.
    const { renameSync } = await import('node:fs');
    const staged = t.file('incoming.sqlite');
    copyFileSync(other, staged);
    const otherDump = await auditedDump(staged);
    renameSync(staged, target);
    const refused = await running.call('motors.create', { name: 'After the swap', kv: 2000 });
    expect(refused).toMatchObject({ ok: false, error: { kind: 'store-changed', message: expect.stringMatching(/was replaced by another file/) } });
    await running.close();
    expect(await auditedDump(target)).toEqual(otherDump);
    expect(basename(target)).toBe('rigbook.sqlite');
  });
});
