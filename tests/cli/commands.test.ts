import Database from 'better-sqlite3';
import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { generateFleet } from '../../demo-fixtures/generate-fleet';
import { fleetText } from '../../src-main/service/fleet/export-fleet';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { openStore } from '../../src-main/store/open-database';
import { dumpStore } from '../fleet/store-dump';
import { tempDirsPerTest } from '../helpers/temp-dir';
import { rigbook } from './run';

const EXAMPLE = join(process.cwd(), 'demo-fixtures', 'example-fleet.json');
const temp = tempDirsPerTest();

async function dumpOf(file: string) {
  const store = await openStore(file);
  try {
    return await dumpStore(store.db);
  } finally {
    await store.db.destroy();
  }
}

function rows(file: string, table: string): number {
  const db = new Database(file, { readonly: true });
  try {
    return (db.prepare(`select count(*) as n from ${table}`).get() as { n: number }).n;
  } finally {
    db.close();
  }
}

describe('rigbook demo, export and import', () => {
  it('demo → export → import --mode replace into another store → export: the same file', async () => {
    const t = temp();
    const a = t.file('a.sqlite');
    const demo = await rigbook(['demo', '--db', a]);
    expect(demo.code).toBe(0);
    expect(demo.out).toMatch(/Re-checked 16 builds: 7 over, 1 incomplete, 1 tight, 7 clear\./);
    const exported = await rigbook(['--db', a, 'export', 'one.json'], { cwd: t.dir });
    expect(exported.code).toBe(0);
    expect(exported.err).toMatch(/Wrote 16 builds, 24 packs/);

    const b = t.file('b.sqlite');
    const imported = await rigbook(['import', 'one.json', '--mode', 'replace', '--reason', 'moving shop'], { cwd: t.dir, env: { RIGBOOK_DB: b } });
    expect(imported.code).toBe(0);
    expect(imported.out).toMatch(/^Imported one\.json \(replace\): added 24 packs/);
    const again = await rigbook(['export', '--db', b]);
    expect(again.out).toBe(readFileSync(t.file('one.json'), 'utf8'));
  });

  it('demo refuses a store that holds records (exit 4), and --merge adds it', async () => {
    const t = temp();
    const db = t.file('s.sqlite');
    await rigbook(['import', EXAMPLE, '--db', db]);
    const before = await dumpOf(db);
    const refused = await rigbook(['demo', '--db', db]);
    expect(refused.code).toBe(4);
    expect(refused.err).toMatch(/already holds records \(2 packs, 1 motor, 1 speed controller, 1 customer, 1 vehicle, 2 builds\)/);
    expect(await dumpOf(db)).toEqual(before);
    expect((await rigbook(['demo', '--merge', '--db', db])).code).toBe(0);
    expect(rows(db, 'builds')).toBe(18);
  });

  it('--dry-run reports and writes nothing; --json prints the report', async () => {
    const t = temp();
    const db = t.file('s.sqlite');
    await rigbook(['demo', '--db', db]);
    const before = await dumpOf(db);
    const run = await rigbook(['import', EXAMPLE, '--dry-run', '--json', '--db', db]);
    expect(run.code).toBe(0);
    const report = JSON.parse(run.out) as { ok: boolean; dryRun: boolean; counts: { builds: { added: number } } };
    expect(report).toMatchObject({ ok: true, dryRun: true });
    expect(report.counts.builds.added).toBe(2);
    expect(await dumpOf(db)).toEqual(before);
  });

  it('an invalid file exits 3 with every problem, an unreadable one 2, and the store is unchanged', async () => {
    const t = temp();
    const db = t.file('s.sqlite');
    await rigbook(['demo', '--db', db]);
    const before = await dumpOf(db);
    const fleet = JSON.parse(readFileSync(EXAMPLE, 'utf8')) as { batteries: Record<string, unknown>[]; builds: Record<string, unknown>[] };
    fleet.batteries[0]!.cellsSeries = 0;
    fleet.builds.push({ ...fleet.builds[0]!, id: 'truck-on-3s' });
    writeFileSync(t.file('bad.json'), JSON.stringify(fleet));
    const bad = await rigbook(['import', t.file('bad.json'), '--mode', 'replace', '--db', db]);
    expect(bad.code).toBe(3);
    expect(bad.err).toContain('was not imported (2 problems; nothing was written)');
    expect(bad.err).toContain('batteries[0].cellsSeries: must be 1 or more');
    expect(bad.err).toContain('builds[2].id: "truck-on-3s" is used twice in this file (also builds[0])');
    writeFileSync(t.file('cut.json'), '{"format": "rigbook-fleet", "version": 1, "batteries": [');
    const cut = await rigbook(['import', t.file('cut.json'), '--db', db]);
    expect(cut.code).toBe(2);
    expect(cut.err).toMatch(/not complete JSON/);
    expect((await rigbook(['import', t.file('absent.json'), '--db', db])).code).toBe(2);
    expect(await dumpOf(db)).toEqual(before);
    // Refused files take no automatic copy (it would push an older one out); an import that writes does.
    expect(existsSync(join(t.dir, 'backups'))).toBe(false);
    expect((await rigbook(['import', EXAMPLE, '--db', db])).code).toBe(0);
    const copies = readdirSync(join(t.dir, 'backups'));
    expect(copies).toEqual(['auto-2026-12-01T09-30-00-000Z.sqlite']);
    expect(rows(join(t.dir, 'backups', copies[0]!), 'builds')).toBe(16);
  });

  it('CSV: export one kind to standard output, import it back with --csv', async () => {
    const t = temp();
    const db = t.file('s.sqlite');
    await rigbook(['demo', '--db', db]);
    const csv = await rigbook(['export', '--csv', 'packs', '--db', db]);
    expect(csv.code).toBe(0);
    expect(csv.out.split('\r\n')[0]).toBe('id,name,chemistry,cellsSeries,cellsParallel,capacityMah,cRatingContinuous,cRatingBurst,cellResistanceOhm,massKg,wireGaugeAwg,connectorRatingA,cycleCount,retired,notes,version,archivedAt');
    writeFileSync(t.file('packs.csv'), csv.out.replace('2S 5000 shorty A,lipo,2,1,5000,50,100,0.0025,0.23,,,84', '2S 5000 shorty A,lipo,2,1,5000,50,100,0.0025,0.23,,,85'));
    const run = await rigbook(['import', 'packs.csv', '--csv', 'packs', '--db', db], { cwd: t.dir });
    expect(run.code).toBe(0);
    expect(run.out).toMatch(/updated 1 pack; 23 unchanged/);
    writeFileSync(t.file('broken.csv'), 'id,name\r\np1,Pack\r\n');
    const broken = await rigbook(['import', 'broken.csv', '--csv', 'packs', '--db', db], { cwd: t.dir });
    expect(broken.code).toBe(3);
    expect(broken.err).toContain('row 1, column "chemistry": this column is missing from the header');
  });

  it('prints progress lines for a large import when stderr is not a terminal', async () => {
    const t = temp();
    writeFileSync(t.file('big.json'), fleetText(generateFleet({ builds: 1500, seed: 3 })));
    const run = await rigbook(['import', t.file('big.json'), '--db', t.file('s.sqlite')]);
    expect(run.code).toBe(0);
    expect(run.err).toMatch(/Checking records: 0 of \d+\n/);
    const total = /Writing records: (\d+) of \1\n/.exec(run.err);
    expect(total).not.toBeNull();
    expect(Number(total![1])).toBeGreaterThan(1500);
  });

  it('redraws one progress line in place on a terminal', async () => {
    const t = temp();
    const run = await rigbook(['import', EXAMPLE, '--db', t.file('s.sqlite')], { tty: true });
    expect(run.code).toBe(0);
    // Small tasks too: on a terminal every step is drawn over the last, and each task ends its line.
    expect(run.err).toMatch(/^\rChecking records: 0 of 8\u001b\[K/);
    expect(run.err).toContain('\rWriting records: 8 of 8\u001b[K\n');
    expect(run.err.split('\n').filter((l) => l !== '')).toHaveLength(2);
  });
});

describe('rigbook backup and restore', () => {
  it('backup without FILE writes into backups/ beside the store; restore swaps it back and keeps the replaced store', async () => {
    const t = temp();
    const db = t.file('rigbook.sqlite');
    await rigbook(['demo', '--db', db]);
    const backup = await rigbook(['backup', '--db', db, '--json']);
    expect(backup.code).toBe(0);
    const written = JSON.parse(backup.out) as { destination: string; bytes: number };
    expect(written.destination).toBe(join(t.dir, 'backups', 'rigbook-2026-12-01T09-30-00-000Z.sqlite'));
    expect(existsSync(written.destination)).toBe(true);

    // A change after the backup, that the restore takes back.
    const host = await openServiceHost({ dbPath: db });
    await host.call('batteries.create', { name: 'Bought after the backup', chemistry: 'lipo', cellsSeries: 2, capacityMah: 3000 });
    await host.close();
    expect(rows(db, 'batteries')).toBe(25);

    const restored = await rigbook(['restore', written.destination, '--db', db], { now: new Date('2026-12-02T08:00:00Z') });
    expect(restored.code).toBe(0);
    expect(rows(db, 'batteries')).toBe(24);
    const kept = join(t.dir, 'rigbook.replaced-2026-12-02T08-00-00-000Z.sqlite');
    expect(restored.out).toContain(kept);
    expect(rows(kept, 'batteries')).toBe(25);
  });

  it('restore refuses a non-Rigbook SQLite file (3), a text file (2) and an open store (4), replacing nothing', async () => {
    const t = temp();
    const db = t.file('rigbook.sqlite');
    await rigbook(['demo', '--db', db]);
    const before = readFileSync(db);
    const foreign = t.file('foreign.sqlite');
    const other = new Database(foreign);
    other.exec('create table laps (n integer)');
    other.close();
    const notRigbook = await rigbook(['restore', foreign, '--db', db]);
    expect(notRigbook.code).toBe(3);
    expect(notRigbook.err).toMatch(/not a Rigbook store.*Nothing was replaced/);
    writeFileSync(t.file('notes.txt'), 'plain text');
    const text = await rigbook(['restore', t.file('notes.txt'), '--db', db]);
    expect(text.code).toBe(2);
    expect(text.err).toMatch(/not a SQLite file/);
    expect(readFileSync(db).equals(before)).toBe(true);

    await rigbook(['backup', t.file('good.sqlite'), '--db', db]);
    const host = await openServiceHost({ dbPath: db });
    try {
      const busy = await rigbook(['restore', t.file('good.sqlite'), '--db', db]);
      expect(busy.code).toBe(4);
      expect(busy.err).toMatch(/open in Rigbook or another command/);
    } finally {
      await host.close();
    }
    expect(readdirSync(t.dir).filter((n) => n.includes('replaced'))).toEqual([]);
  });

  it('backup of a store that is not there exits 4 and creates nothing', async () => {
    const t = temp();
    const run = await rigbook(['backup', '--db', t.file('none.sqlite')]);
    expect(run.code).toBe(4);
    expect(run.err).toMatch(/There is no store at/);
    expect(readdirSync(t.dir)).toEqual([]);
  });
});

describe('the command line itself', () => {
  it('help for the whole command and for each subcommand', async () => {
    const top = await rigbook(['--help']);
    expect(top.code).toBe(0);
    for (const name of ['check', 'import', 'export', 'backup', 'restore', 'demo']) {
      expect(top.out).toMatch(new RegExp(`\\n  ${name} `));
      const help = await rigbook([name, '--help']);
      expect(help.code).toBe(0);
      expect(help.out).toMatch(new RegExp(`^Usage: rigbook ${name}`));
      expect((await rigbook(['help', name])).out).toBe(help.out);
    }
    expect(top.out).toContain('Exit codes:');
  });

  it.each([
    [[], /Usage: rigbook COMMAND/],
    [['launch'], /no command "launch"/],
    [['check'], /check: takes 1 file argument/],
    [['check', 'a.json', 'b.json'], /check: takes 1 file argument/],
    [['export', '--colour', 'red'], /Unknown option '--colour'/],
    [['import', 'x.json', '--mode', 'overwrite'], /--mode must be merge or replace/],
    [['import', 'x.json', '--csv', 'wheels'], /--csv must name a part kind/],
    [['import', 'x.csv', '--csv', 'packs', '--mode', 'replace'], /--csv imports always merge/],
  ])('rigbook %j is a usage error (5)', async (args, message) => {
    const run = await rigbook(args);
    expect(run.code).toBe(5);
    expect(run.err).toMatch(message);
  });

  it('--db wins over RIGBOOK_DB', async () => {
    const t = temp();
    const run = await rigbook(['import', EXAMPLE, '--db', t.file('flag.sqlite')], { env: { RIGBOOK_DB: t.file('env.sqlite') } });
    expect(run.code).toBe(0);
    expect(existsSync(t.file('flag.sqlite'))).toBe(true);
    expect(existsSync(t.file('env.sqlite'))).toBe(false);
  });
});
