import Database from 'better-sqlite3';
import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';
import type { Kysely, Migration, MigrationProvider } from 'kysely';
import { afterEach, describe, expect, it } from 'vitest';
import { MIGRATIONS } from '../../src-main/store/migration-provider';
import { openStore } from '../../src-main/store/open-database';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { tempDir } from '../helpers/temp-dir';
import { tableFingerprinter } from './support/fingerprint';
import { seededRandom } from './support/random';
import { seedSharedFleet } from './support/seed-fleet';
import { ok } from './support/store-audit';
import { fillEveryTable, type TableShape, type WrittenRows } from './support/schema-rows';

// A store written by every earlier release must open in this one, upgraded, with every row
// it held. The loop below takes each prefix of the static migration list, builds a store at
// that schema, fills every table with rows (shaped from the schema itself, so a new migration
// is covered the day it is added), and opens it with openStore. A migration that fails must
// leave the store as it was and the pre-migration backup whole.

const NAMES = Object.keys(MIGRATIONS).sort();
const temps: Array<ReturnType<typeof tempDir>> = [];
function fresh() {
  const t = tempDir('rigbook-upgrade-');
  temps.push(t);
  return t;
}
afterEach(() => temps.splice(0).forEach((t) => t.remove()));

const providerOf = (migrations: Record<string, Migration>): MigrationProvider => ({ getMigrations: async () => migrations });
const upTo = (count: number) => providerOf(Object.fromEntries(NAMES.slice(0, count).map((n) => [n, MIGRATIONS[n]!])));

interface Column {
  name: string;
  type: string;
  notnull: number;
  pk: number;
}
interface ForeignKey {
  table: string;
  from: string;
  to: string;
}

const userTables = (raw: Database.Database): string[] => raw.prepare("select name from sqlite_master where type = 'table' and name not like 'sqlite_%' and name not like 'kysely_%' order by name").pluck().all() as string[];

/** Every table's shape as SQLite reports it. */
function shapeOf(raw: Database.Database): TableShape[] {
  return userTables(raw).map((name) => ({
    name,
    columns: (raw.prepare(`pragma table_info("${name}")`).all() as Column[]).map((c) => ({ name: c.name, type: c.type, generated: false })),
    keys: raw.prepare(`pragma foreign_key_list("${name}")`).all() as ForeignKey[],
  }));
}

function fillEverySqliteTable(raw: Database.Database): Promise<WrittenRows> {
  return fillEveryTable(shapeOf(raw), async (table, row) => {
    const names = Object.keys(row);
    raw.prepare(`insert into "${table}" (${names.map((n) => `"${n}"`).join(', ')}) values (${names.map(() => '?').join(', ')})`).run(...names.map((n) => row[n]));
    return row;
  });
}

/** Rows as they were written, looked up again column by column (columns a later migration dropped are not asked for). */
function missingRows(raw: Database.Database, written: WrittenRows): string[] {
  const problems: string[] = [];
  for (const [table, rows] of written) {
    const present = new Set((raw.prepare(`pragma table_info("${table}")`).all() as Column[]).map((c) => c.name));
    for (const row of rows) {
      const names = Object.keys(row).filter((n) => present.has(n));
      const found = raw
        .prepare(`select count(*) from "${table}" where ${names.map((n) => `"${n}" is ?`).join(' and ')}`)
        .pluck()
        .get(...names.map((n) => row[n])) as number;
      if (found !== 1) problems.push(`${table}: row ${JSON.stringify(row)} is ${found === 0 ? 'gone or changed' : 'duplicated'}`);
    }
  }
  return problems;
}

function backupsOf(file: string): string[] {
  const folder = path.join(path.dirname(file), 'backups');
  return existsSync(folder)
    ? readdirSync(folder)
        .filter((n) => n.startsWith('before-migration-'))
        .map((n) => path.join(folder, n))
    : [];
}

describe('upgrading a store written at every earlier schema version', () => {
  it.each(NAMES.map((name, i) => [i + 1, name] as const))('opens a store at migration %i (%s) with every row intact', async (count, name) => {
    const t = fresh();
    const file = t.file('old.sqlite');
    const old = await openStore(file, { provider: upTo(count) });
    const written = await fillEverySqliteTable(old.raw);
    expect([...written.keys()].length).toBeGreaterThan(0);
    await old.db.destroy();

    const upgraded = await openStore(file);
    try {
      const applied = upgraded.raw.prepare('select name from kysely_migration order by name').pluck().all();
      expect(applied).toEqual(NAMES);
      expect(upgraded.raw.pragma('integrity_check', { simple: true })).toBe('ok');
      expect(upgraded.raw.pragma('foreign_key_check')).toEqual([]);
      expect(missingRows(upgraded.raw, written)).toEqual([]);
      if (count < NAMES.length) {
        // Pending migrations: the copy taken first holds the old schema and the old rows.
        expect(upgraded.preMigrationBackup).not.toBeNull();
        const copy = new Database(upgraded.preMigrationBackup!, { readonly: true });
        expect(copy.pragma('integrity_check', { simple: true })).toBe('ok');
        expect(copy.prepare('select name from kysely_migration order by name').pluck().all()).toEqual(NAMES.slice(0, count));
        expect(missingRows(copy, written)).toEqual([]);
        copy.close();
      } else {
        expect(upgraded.preMigrationBackup, `${name} is the latest: nothing to back up`).toBeNull();
      }
    } finally {
      await upgraded.db.destroy();
    }

    // And the service works on it: reads answer, and a write goes through.
    const host = await openServiceHost({ dbPath: file, actor: 'upgrade' });
    try {
      for (const handler of ['store.info', 'batteries.list', 'motors.list', 'vehicles.list', 'classRules.list', 'builds.list', 'history.list', 'settings.get']) {
        const result = await host.call(handler, {});
        expect(result.ok, `${handler}: ${JSON.stringify(result)}`).toBe(true);
      }
      const pack = await ok<{ id: string }>(host, 'batteries.create', { name: 'After upgrade', chemistry: 'lipo', cellsSeries: 2, capacityMah: 2000 });
      expect(pack.id).toBeTruthy();
    } finally {
      await host.close();
    }
  });

  it('upgrades a store full of real records through a later migration (a stand-in for the next one)', async () => {
    const t = fresh();
    const file = t.file('real.sqlite');
    const host = await openServiceHost({ dbPath: file, actor: 'seed' });
    await seedSharedFleet(host, 12, seededRandom(3));
    await host.close();
    const before = new Database(file, { readonly: true });
    const fingerprint = tableFingerprinter(before)();
    before.close();

    const next: Migration = {
      up: async (db: Kysely<unknown>) => {
        await db.transaction().execute(async (trx) => {
          await trx.schema
            .createTable('laterNotes')
            .addColumn('id', 'text', (c) => c.primaryKey())
            .addColumn('text', 'text')
            .execute();
          await trx.schema.createIndex('laterNotesTextIdx').on('laterNotes').column('text').execute();
        });
      },
    };
    const upgraded = await openStore(file, { provider: providerOf({ ...MIGRATIONS, '20991231-0001-later-notes': next }) });
    try {
      expect(upgraded.raw.pragma('integrity_check', { simple: true })).toBe('ok');
      const userFingerprint = (raw: Database.Database) =>
        tableFingerprinter(raw)()
          .split('|')
          .filter((p) => !/^(schema|laterNotes|kysely_migration):/.test(p));
      expect(userFingerprint(upgraded.raw)).toEqual(fingerprint.split('|').filter((p) => !/^(schema|kysely_migration):/.test(p)));
      const copy = new Database(upgraded.preMigrationBackup!, { readonly: true });
      expect(tableFingerprinter(copy)()).toBe(fingerprint);
      copy.close();
    } finally {
      await upgraded.db.destroy();
    }
  });
});

describe('a migration that fails', () => {
  async function realStore() {
    const t = fresh();
    const file = t.file('store.sqlite');
    const host = await openServiceHost({ dbPath: file, actor: 'seed' });
    await seedSharedFleet(host, 8, seededRandom(5));
    await host.close();
    const raw = new Database(file, { readonly: true });
    const fingerprint = tableFingerprinter(raw)();
    raw.close();
    return { file, fingerprint };
  }

  it('leaves the store exactly as it was, and the pre-migration backup whole and openable', async () => {
    const { file, fingerprint } = await realStore();
    const broken: Migration = {
      up: async (db: Kysely<unknown>) => {
        await db.transaction().execute(async (trx) => {
          await trx.schema.createTable('halfDone').addColumn('x', 'text').execute();
          await trx.schema.alterTable('batteries').addColumn('chargeNote', 'text').execute();
          await trx
            .updateTable('batteries' as never)
            .set({ name: 'rewritten' } as never)
            .execute();
          throw new Error('disk said no');
        });
      },
    };
    await expect(openStore(file, { provider: providerOf({ ...MIGRATIONS, '20991231-0002-broken': broken }) })).rejects.toThrow(/20991231-0002-broken failed: disk said no/);

    const after = new Database(file, { readonly: true });
    expect(tableFingerprinter(after)()).toBe(fingerprint);
    after.close();

    const [backup, ...more] = backupsOf(file);
    expect(more).toEqual([]);
    const copy = new Database(backup!, { readonly: true });
    expect(copy.pragma('integrity_check', { simple: true })).toBe('ok');
    expect(tableFingerprinter(copy)()).toBe(fingerprint);
    copy.close();

    // Both the store and its backup open in this release and serve their records.
    for (const target of [file, backup!]) {
      const host = await openServiceHost({ dbPath: target, actor: 'after-failure' });
      try {
        expect((await ok<unknown[]>(host, 'batteries.list', {})).length).toBeGreaterThan(0);
        expect((await ok<unknown[]>(host, 'builds.list', {})).length).toBe(8);
      } finally {
        await host.close();
      }
    }
  });

  it('that breaks the rule (DDL outside a transaction) leaves a half-done store, and the backup is what saves it', async () => {
    const { file, fingerprint } = await realStore();
    const careless: Migration = {
      up: async (db: Kysely<unknown>) => {
        await db.schema.createTable('halfDone').addColumn('x', 'text').execute();
        throw new Error('second step failed');
      },
    };
    await expect(openStore(file, { provider: providerOf({ ...MIGRATIONS, '20991231-0003-careless': careless }) })).rejects.toThrow(/careless failed/);
    const after = new Database(file, { readonly: true });
    // SQLite DDL outside a transaction is not rolled back (DESIGN §10): the store changed.
    expect(tableFingerprinter(after)()).not.toBe(fingerprint);
    after.close();
    const copy = new Database(backupsOf(file)[0]!, { readonly: true });
    expect(tableFingerprinter(copy)()).toBe(fingerprint);
    copy.close();
  });
});
