import Database from 'better-sqlite3';
import { existsSync, readdirSync, readFileSync, writeFileSync, copyFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { demoFleet } from '../../demo-fixtures/demo-fleet';
import { backUpStore, checkStoreFile, rollingBackup } from '../../src-main/store/backup';
import { lockStore, RestoreRefused } from '../../src-main/store/restore-file';
import { restoreStore } from '../../src-main/service/restore-store';
import { openStore } from '../../src-main/store/open-database';
import { serviceFixture, type ServiceFixture } from '../helpers/service-fixture';
import { tempDir } from '../helpers/temp-dir';
import { dumpStore } from './store-dump';
import { generateFleet } from '../../demo-fixtures/generate-fleet';

const cleanup: (() => Promise<void> | void)[] = [];
afterEach(async () => {
  for (const c of cleanup.splice(0).reverse()) await c();
});
async function fixture(): Promise<ServiceFixture> {
  const f = await serviceFixture();
  cleanup.push(() => f.close());
  return f;
}
function temp() {
  const t = tempDir();
  cleanup.push(() => t.remove());
  return t;
}

function count(file: string, table: string): number {
  const db = new Database(file, { readonly: true });
  try {
    return (db.prepare(`select count(*) as n from ${table}`).get() as { n: number }).n;
  } finally {
    db.close();
  }
}

describe('store.backup', () => {
  it('copies the open store while it is being written, and the copy is a complete store', async () => {
    const f = await fixture();
    // A store of several megabytes, so the copy takes many steps and writes land in between.
    expect((await f.call('fleet.import', { fleet: generateFleet({ builds: 4000, seed: 9 }), mode: 'replace' })).ok).toBe(true);
    const t = temp();
    const destination = t.file('copy.sqlite');
    const order: string[] = [];
    f.host.subscribe((e) => {
      if (e.type === 'progress' && e.kind === 'store') order.push(e.done < e.total ? 'copying' : 'copied');
      if (e.type === 'records-changed' && e.kind === 'batteries') order.push('write');
    });
    const backup = f.call('store.backup', { destination });
    const writes: Promise<unknown>[] = [];
    for (let i = 0; i < 20; i++) {
      await new Promise((r) => setImmediate(r));
      writes.push(f.call('batteries.create', { name: `During backup ${i}`, chemistry: 'lipo', cellsSeries: 2, capacityMah: 3000 }));
    }
    const [result] = await Promise.all([backup, ...writes]);
    // Writes went on while pages were being copied.
    const firstCopy = order.indexOf('copying');
    const done = order.indexOf('copied');
    expect(firstCopy).toBeGreaterThanOrEqual(0);
    expect(order.slice(firstCopy, done).filter((x) => x === 'write').length).toBeGreaterThan(0);

    expect(result.destination).toBe(destination);
    expect(result.bytes).toBeGreaterThan(2_000_000);
    expect(checkStoreFile(destination)).toMatchObject({ ok: true });
    const packs = count(destination, 'batteries');
    expect(packs).toBeGreaterThanOrEqual(1000);
    expect(packs).toBeLessThanOrEqual(1020);
    expect(count(destination, 'builds')).toBe(4000);
    // No half-written file is left beside the copy.
    expect(readdirSync(t.dir)).toEqual(['copy.sqlite']);
    expect((await f.call('batteries.list', {})).length).toBe(1020);
  });

  it('refuses a relative path, the store itself and a folder, naming the field', async () => {
    const f = await fixture();
    const t = temp();
    expect(await f.refuse('store.backup', { destination: 'copy.sqlite' })).toMatchObject({ kind: 'invalid', field: 'destination' });
    expect((await f.refuse('store.backup', { destination: f.dbPath })).message).toMatch(/is the store itself/);
    expect((await f.refuse('store.backup', { destination: t.dir })).message).toMatch(/is a folder/);
    expect((await f.refuse('store.backup', { destination: join(t.dir, 'no', 'such', '\u0000bad') })).field).toBe('destination');
  });
});

describe('restore', () => {
  async function storeWithRecords(file: string) {
    const host = await openServiceHost({ demoFleet, dbPath: file, actor: 'tester' });
    await host.call('demo.load', {});
    await host.close();
  }

  it('checks the file, keeps the replaced store with a timestamp, and swaps the backup in', async () => {
    const t = temp();
    const backup = t.file('backup.sqlite');
    await storeWithRecords(backup);
    const target = t.file('rigbook.sqlite');
    const host = await openServiceHost({ demoFleet, dbPath: target, actor: 'tester' });
    await host.call('batteries.create', { name: 'Only in the old store', chemistry: 'lipo', cellsSeries: 2, capacityMah: 3000 });
    await host.close();

    const result = await restoreStore(backup, target, { now: new Date('2026-12-01T10:00:00Z') });
    expect(result.keptAs).toBe(join(t.dir, 'rigbook.replaced-2026-12-01T10-00-00-000Z.sqlite'));
    expect(count(result.keptAs!, 'batteries')).toBe(1);
    expect(count(target, 'batteries')).toBe(24);
    expect(existsSync(backup)).toBe(true);
    const reopened = await openStore(target);
    expect((await reopened.db.selectFrom('builds').select('id').execute()).length).toBe(16);
    await reopened.db.destroy();
  });

  it('refuses a SQLite file that is not a Rigbook store, and replaces nothing', async () => {
    const t = temp();
    const target = t.file('rigbook.sqlite');
    await storeWithRecords(target);
    const before = readFileSync(target);
    const foreign = t.file('foreign.sqlite');
    const db = new Database(foreign);
    db.exec('create table recipes (id integer primary key, name text)');
    db.close();
    await expect(restoreStore(foreign, target)).rejects.toThrow(/not a Rigbook store/);
    expect(readFileSync(target).equals(before)).toBe(true);
    expect(readdirSync(t.dir).sort()).toEqual(['foreign.sqlite', 'rigbook.sqlite']);
  });

  it('refuses a damaged file and a file that is not SQLite at all', async () => {
    const t = temp();
    const target = t.file('rigbook.sqlite');
    await storeWithRecords(target);
    const before = readFileSync(target);

    const damaged = t.file('damaged.sqlite');
    copyFileSync(target, damaged);
    const bytes = readFileSync(damaged);
    // Overwrite the pages past the schema with noise: the header still says SQLite.
    for (let i = 8192; i < bytes.length; i++) bytes[i] = (i * 131) % 251;
    writeFileSync(damaged, bytes);
    const check = checkStoreFile(damaged);
    expect(check.ok).toBe(false);
    await expect(restoreStore(damaged, target)).rejects.toThrow(/damaged/);

    const text = t.file('notes.sqlite');
    writeFileSync(text, 'these are not records');
    const refusal = await restoreStore(text, target).catch((e: unknown) => e);
    expect(refusal).toBeInstanceOf(RestoreRefused);
    expect((refusal as RestoreRefused).reason).toBe('unreadable');
    expect(readFileSync(target).equals(before)).toBe(true);
  });

  it('refuses a store from a newer Rigbook (a schema version this build does not know)', async () => {
    const t = temp();
    const newer = t.file('newer.sqlite');
    await storeWithRecords(newer);
    const db = new Database(newer);
    db.prepare('insert into kysely_migration (name, timestamp) values (?, ?)').run('20991231-9999-future', new Date().toISOString());
    db.close();
    expect(checkStoreFile(newer)).toMatchObject({ ok: false, reason: expect.stringMatching(/newer Rigbook \(schema 20991231-9999-future\)/) });
  });

  it('refuses while the store is open elsewhere', async () => {
    const t = temp();
    const backup = t.file('backup.sqlite');
    await storeWithRecords(backup);
    const f = await fixture();
    expect(() => lockStore(f.dbPath)).toThrow(RestoreRefused);
    const before = await dumpStore(f.db);
    await expect(restoreStore(backup, f.dbPath)).rejects.toMatchObject({ reason: 'in-use' });
    expect(await dumpStore(f.db)).toEqual(before);
  });
});

describe('rolling backup at start', () => {
  it('keeps the newest few copies in backups/ beside the store and removes only older automatic ones', async () => {
    const t = temp();
    const file = t.file('rigbook.sqlite');
    const first = await openServiceHost({ demoFleet, dbPath: file, autoBackup: { keep: 3 } });
    // A store created just now is not copied.
    expect(first.autoBackupPath).toBeNull();
    expect(await first.call('demo.load', {})).toMatchObject({ ok: true });
    await first.close();
    const store = await openStore(file);
    const manual = join(t.dir, 'backups', 'rigbook-manual.sqlite');
    await rollingBackup(store.raw, join(t.dir, 'backups'), 3, new Date('2026-01-01T00:00:00Z'));
    await backUpStore(store.raw, manual);
    for (let day = 2; day <= 6; day++) await rollingBackup(store.raw, join(t.dir, 'backups'), 3, new Date(`2026-01-0${day}T00:00:00Z`));
    await store.db.destroy();
    const names = readdirSync(join(t.dir, 'backups')).sort();
    expect(names).toEqual(['auto-2026-01-04T00-00-00-000Z.sqlite', 'auto-2026-01-05T00-00-00-000Z.sqlite', 'auto-2026-01-06T00-00-00-000Z.sqlite', 'rigbook-manual.sqlite']);
    expect(count(join(t.dir, 'backups', names[0]!), 'builds')).toBe(16);

    const again = await openServiceHost({ demoFleet, dbPath: file, autoBackup: { keep: 3 } });
    expect(again.autoBackupPath).not.toBeNull();
    expect(checkStoreFile(again.autoBackupPath!)).toMatchObject({ ok: true });
    await again.close();
  });

  it('takes at most one automatic copy in twelve hours, however often the app starts', async () => {
    const t = temp();
    const file = t.file('rigbook.sqlite');
    let clock = new Date('2026-12-02T08:00:00Z');
    const open = () => openServiceHost({ demoFleet, dbPath: file, autoBackup: { keep: 5 }, now: () => clock });
    const first = await open();
    expect(await first.call('demo.load', {})).toMatchObject({ ok: true });
    await first.close();
    const morning = await open();
    expect(morning.autoBackupPath).not.toBeNull();
    await morning.close();
    clock = new Date('2026-12-02T11:00:00Z');
    const lunch = await open();
    expect(lunch.autoBackupPath).toBeNull();
    await lunch.close();
    clock = new Date('2026-12-02T20:30:00Z');
    const evening = await open();
    expect(evening.autoBackupPath).toMatch(/auto-2026-12-02T20-30-00-000Z\.sqlite$/);
    await evening.close();
    expect(readdirSync(join(t.dir, 'backups')).filter((n) => n.startsWith('auto-'))).toHaveLength(2);
  });
});
