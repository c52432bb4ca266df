import { homedir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { parseCsv } from '../../src-main/service/fleet/csv';
import { fleetText } from '../../src-main/service/fleet/export-fleet';
import { escapeFormula, unescapeFormula } from '../../src-main/service/fleet/csv-columns';
import { decodeFileBytes } from '../../src-main/service/fleet/decode-file-bytes';
import { numericTwin } from '../../src-main/service/fleet/fleet-csv';
import { problemLine } from '../../src-main/service/fleet/fleet-problems';
import { readJsonText, scanJson } from '../../src-main/service/fleet/read-fleet-text';
import { randomId } from '../../src-main/service/open-service-host';
import { ID_PREFIXES } from '../../src-main/service/record-labels';
import { defaultDataDir } from '../../src-main/store/data-location';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { dumpStore } from './store-dump';

let f: ServiceFixture;
beforeEach(async () => {
  f = await serviceFixture();
});
afterEach(async () => f.close());

/** Replaces one cell of the row whose id is `id` (numbers and plain text only, as the export writes them). */
function setCell(csv: string, id: string, column: string, value: string): string {
  const lines = csv.split('\r\n');
  const header = lines[0]!.split(',');
  const at = header.indexOf(column);
  const index = lines.findIndex((l) => l.startsWith(`${id},`));
  if (at < 0 || index < 0) throw new Error(`no cell ${id}/${column}`);
  const cells = lines[index]!.split(',');
  cells[at] = value;
  lines[index] = cells.join(',');
  return lines.join('\r\n');
}

describe('a spreadsheet that reads the decimal point as a thousands separator', () => {
  it('a scaled motor CSV is refused (past the plausible range, or by a factor of 100 or more), naming record, field, both values and the likely cause; the store is unchanged', async () => {
    const seed = await seedTwoBuggies(f);
    const { text } = await f.call('fleet.exportCsv', { kind: 'motors' });
    // What a round trip through a comma-decimal locale does to 0.012 Ω: the point groups thousands, so it reads 12.
    // 12 Ω is past any hobby motor's winding and is refused outright by the plausible range (core/plausibility.ts).
    const implausible = await f.call('fleet.importCsv', { kind: 'motors', text: setCell(text, seed.motor.id, 'resistanceOhm', '12') });
    expect(implausible.ok).toBe(false);
    expect(implausible.problems.map(problemLine).join('\n')).toContain('Winding resistance must be above 0 Ω and at most 10 Ω');
    // A scaled value the range still allows (0.012 → 1.2, a factor of 100) must be caught by the change guard.
    const damaged = setCell(text, seed.motor.id, 'resistanceOhm', '1.2');
    expect(damaged).not.toBe(text);
    const before = await dumpStore(f.db);
    const report = await f.call('fleet.importCsv', { kind: 'motors', text: damaged });
    expect(report.ok).toBe(false);
    expect(report.needsConfirmation).toBe(true);
    expect(report.problems).toHaveLength(1);
    const message = problemLine(report.problems[0]!);
    expect(message).toContain(`motor "Test 3300" [${seed.motor.id}]`);
    expect(message).toContain('the motor winding resistance (resistanceOhm) would change from 0.012 to 1.2');
    expect(message).toContain('factor of 100');
    expect(message).toMatch(/locale that uses the comma as the decimal mark/);
    expect(report.recordChanges).toEqual([
      { kind: 'motors', id: seed.motor.id, name: 'Test 3300', fields: [expect.objectContaining({ field: 'resistanceOhm', before: 0.012, after: 1.2, suspect: expect.stringContaining('factor of 100') })] },
    ]);
    expect(await dumpStore(f.db)).toEqual(before);

    // A dry run says the same: it is the import, rolled back.
    const dry = await f.call('fleet.importCsv', { kind: 'motors', text: damaged, dryRun: true });
    expect(dry).toMatchObject({ ok: false, needsConfirmation: true, suspectChangeCount: 1 });

    // Confirmed, it goes through: the person may really have meant it.
    const accepted = await f.call('fleet.importCsv', { kind: 'motors', text: damaged, acceptChanges: true });
    expect(accepted.ok).toBe(true);
    expect((await f.call('motors.get', { id: seed.motor.id })).resistanceOhm).toBe(1.2);
  });

  it('a whole fleet file scaled the same way is refused through fleet.import too; a value leaving its plausible range is refused even below a factor of 100', async () => {
    const seed = await seedTwoBuggies(f);
    const fleet = await f.call('fleet.export', {});
    const esc = fleet.controllers.find((c) => c.id === seed.esc.id)!;
    esc.resistanceOhm = 1; // 0.001 Ω read as 1 Ω
    const pack = fleet.batteries.find((b) => b.id === seed.pack2s.id)!;
    pack.cellResistanceOhm = 0.3; // 3 mΩ typed as 0.3 Ω: a factor of 100 exactly
    const vehicle = fleet.vehicles.find((v) => v.id === seed.vehicle.id)!;
    vehicle.tractionCoefficient = 4; // not a factor of 100, but no tyre grips at 4
    const report = await f.call('fleet.import', { fleet, mode: 'merge' });
    expect(report.ok).toBe(false);
    expect(report.problems.map((p) => p.message)).toEqual([
      expect.stringMatching(/^pack "Test 2S" .*cellResistanceOhm\) would change from 0\.003 to 0\.3, which grows by a factor of 100\./),
      expect.stringMatching(/^speed controller "Test 120A" .*the controller resistance \(resistanceOhm\) would change from 0\.001 to 1, which grows by a factor of 1000\./),
      expect.stringMatching(/^vehicle "Test buggy" .*tractionCoefficient\) would change from 1 to 4, which is outside the range such a part plausibly has \(0\.05 to 3\)/),
    ]);
  });

  it('the dry run lists every record and field that would change, before → after, and writes nothing', async () => {
    const seed = await seedTwoBuggies(f);
    const fleet = await f.call('fleet.export', {});
    fleet.motors[0]!.maxCurrentA = 130;
    fleet.motors[0]!.notes = 'rebuilt';
    fleet.builds.find((b) => b.id === seed.onTwo.id)!.gearing.pinionTeeth = 19;
    const before = await dumpStore(f.db);
    const report = await f.call('fleet.import', { fleet, mode: 'merge', dryRun: true });
    expect(report.ok).toBe(true);
    expect(report.changedRecordCount).toBe(2);
    expect(report.recordChanges).toEqual(
      expect.arrayContaining([
        {
          kind: 'motors',
          id: seed.motor.id,
          name: 'Test 3300',
          fields: [
            { field: 'maxCurrentA', label: 'the motor rated current (maxCurrentA)', before: 120, after: 130, suspect: null },
            { field: 'notes', label: 'notes', before: '', after: 'rebuilt', suspect: null },
          ],
        },
        { kind: 'builds', id: seed.onTwo.id, name: 'Buggy on 2S', fields: [{ field: 'gearing.pinionTeeth', label: 'the pinion tooth count (gearing.pinionTeeth)', before: 17, after: 19, suspect: null }] },
      ]),
    );
    expect(await dumpStore(f.db)).toEqual(before);
  });
});

describe('ids a spreadsheet cannot mangle', () => {
  it('ids Rigbook makes start with a letter', () => {
    for (const prefix of Object.values(ID_PREFIXES)) expect(randomId(prefix)).toMatch(/^[A-Za-z][A-Za-z0-9._-]*$/);
  });

  it('an imported id that starts with a digit is refused with its row and value', async () => {
    await seedTwoBuggies(f);
    const { text } = await f.call('fleet.exportCsv', { kind: 'batteries' });
    const header = text.split('\r\n')[0]!;
    const row = '001,Club pack,lipo,2,1,4000,,,,,,,0,false,,1,';
    const report = await f.call('fleet.importCsv', { kind: 'batteries', text: `${header}\r\n${row}\r\n` });
    expect(report.ok).toBe(false);
    expect(report.problems.map(problemLine)).toEqual([expect.stringMatching(/^row 2, column "id": must start with a letter \("001" does not\)/)]);
    const json = await f.refuse('batteries.create', { id: '1e5', name: 'x', chemistry: 'lipo', cellsSeries: 2, capacityMah: 1000 });
    expect(json.message).toMatch(/must start with a letter \("1e5" does not\)/);
  });

  it('a row whose id matches no record but equals a stored id as a number (001 vs 1) is refused with that hint, never added', async () => {
    const pack = await f.call('batteries.create', { name: 'Old club pack', chemistry: 'lipo', cellsSeries: 2, capacityMah: 4000 });
    // A store from before ids had to start with a letter.
    f.host.raw!.prepare('update batteries set id = ? where id = ?').run('001', pack.id);
    const { text } = await f.call('fleet.exportCsv', { kind: 'batteries' });
    expect(text).toContain('\r\n001,Old club pack,');
    const before = await dumpStore(f.db);
    const report = await f.call('fleet.importCsv', { kind: 'batteries', text: text.replace('\r\n001,', '\r\n1,') });
    expect(report.ok).toBe(false);
    expect(report.problems.map(problemLine)).toEqual([expect.stringMatching(/^row 2, column "id": "1" matches no pack in the store, but "001" is the same number written differently/)]);
    expect(await dumpStore(f.db)).toEqual(before);
    // The same in a fleet file a script rewrote.
    const fleet = await f.call('fleet.export', {});
    fleet.batteries[0]!.id = '1';
    const json = await f.call('fleet.import', { fleet, mode: 'merge' });
    expect(json.problems.map(problemLine)).toEqual([expect.stringMatching(/^batteries\[0\]\.id: "1" matches no pack in the store, but "001" is the same number written differently/)]);
    expect(await dumpStore(f.db)).toEqual(before);
  });

  it.each([
    ['1', '001'],
    ['1.5', '1.50'],
    ['1.00E+05', '100000'],
  ])('%s is the numeric twin of stored %s', (given, stored) => {
    expect(numericTwin(given, new Set(['pack-1', stored]))).toBe(stored);
    expect(numericTwin(stored, new Set([stored]))).toBeNull();
    expect(numericTwin('pack-1', new Set(['pack-1', stored]))).toBeNull();
  });
});

describe('CSV rows and cells as spreadsheets write them', () => {
  it('rows of bare commas are skipped and counted; row numbers stay those of the file', async () => {
    const seed = await seedTwoBuggies(f);
    const { text } = await f.call('fleet.exportCsv', { kind: 'batteries' });
    const lines = text.split('\r\n');
    const blank = ',,,,,,,,,,,,,,';
    const padded = [lines[0], blank, lines[1], blank, lines[2]!.replace(',lipo,', ',lead,'), ...lines.slice(3)].join('\r\n') + `${blank}\r\n`;
    const refused = await f.call('fleet.importCsv', { kind: 'batteries', text: padded });
    expect(refused.problems.map(problemLine)).toEqual(['row 5, column "chemistry": must be one of: lipo, lihv, lifepo4, liion, nimh']);
    const report = await f.call('fleet.importCsv', { kind: 'batteries', text: padded.replace(',lead,', ',lipo,') });
    expect(report).toMatchObject({ ok: true, skippedRows: 3 });
    expect(report.counts.batteries).toEqual({ added: 0, updated: 0, unchanged: 2 });
    expect(seed.pack2s.id).toBeTruthy();
  });

  it('a file separated by semicolons or tabs is refused with what to do, not a list of missing columns', async () => {
    await seedTwoBuggies(f);
    const { text } = await f.call('fleet.exportCsv', { kind: 'batteries' });
    for (const [sep, word] of [
      [';', 'semicolons'],
      ['\t', 'tabs'],
    ] as const) {
      const report = await f.call('fleet.importCsv', { kind: 'batteries', text: text.replace(/,/g, sep) });
      expect(report).toMatchObject({ ok: false, unreadable: true });
      expect(report.problems).toHaveLength(1);
      expect(report.problems[0]!.message).toContain(`separated by ${word}, not commas`);
    }
  });

  // OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): cells starting with
  // = + - @, tab (0x09), carriage return (0x0D) or line feed (0x0A) can run as formulas. Beyond
  // that list: characters spreadsheets strip or fold before reading a formula (NUL, NBSP,
  // zero-width space, byte-order mark, the full-width ＝＋－＠), from memory of published
  // spreadsheet-injection write-ups.
  it.each(['=', '+', '-', '@', '\t', '\r', '\n', '\u0000', '\u00a0', '\u200b', '\ufeff', ' ', '\u3000', '\uff1d', '\uff0b', '\uff0d', '\uff20', '\u2212'])('text starting with %j is escaped and read back exactly', (lead) => {
    const text = `${lead}HYPERLINK("http://127.0.0.1/")`;
    const cell = escapeFormula(text);
    expect(cell).toBe(`'${text}`);
    expect(unescapeFormula(cell)).toBe(text);
    expect(escapeFormula(`'${text}`)).toBe(`''${text}`);
    expect(unescapeFormula(`''${text}`)).toBe(`'${text}`);
  });

  it('through a real export, every such note comes back escaped and imports back unchanged', async () => {
    const leads = ['\u0000', '\n', '\u00a0', '\u200b', '\uff1d'];
    for (const [i, lead] of leads.entries()) await f.call('batteries.create', { id: `pack-${i}`, name: `Pack ${i}`, chemistry: 'lipo', cellsSeries: 2, capacityMah: 1000, notes: `${lead}=1+2` });
    const { text } = await f.call('fleet.exportCsv', { kind: 'batteries' });
    const read = parseCsv(text);
    if (!read.ok) throw new Error(read.reason);
    const notes = read.rows.slice(1).map((r) => r[read.rows[0]!.indexOf('notes')]);
    expect(notes).toEqual(leads.map((lead) => `'${lead}=1+2`));
    const report = await f.call('fleet.importCsv', { kind: 'batteries', text });
    expect(report.counts.batteries).toEqual({ added: 0, updated: 0, unchanged: leads.length });
  });

  it('the escaping apostrophe is removed even when a spreadsheet changed the character after it', async () => {
    await f.call('batteries.create', { id: 'pack-a', name: 'Pack A', chemistry: 'lipo', cellsSeries: 2, capacityMah: 1000, notes: '-20 °C storage test' });
    await f.call('batteries.create', { id: 'pack-b', name: 'Pack B', chemistry: 'lipo', cellsSeries: 2, capacityMah: 1000, notes: '\u200b=1' });
    const { text } = await f.call('fleet.exportCsv', { kind: 'batteries' });
    expect(text).toContain("'-20 °C");
    // Autocorrect turned the hyphen into an en dash; the zero-width space was trimmed away.
    const changed = text.replace("'-20 °C", "'\u201320 °C").replace("'\u200b=1", "'=1");
    const report = await f.call('fleet.importCsv', { kind: 'batteries', text: changed });
    expect(report.ok).toBe(true);
    expect((await f.call('batteries.get', { id: 'pack-a' })).notes).toBe('\u201320 °C storage test');
    expect((await f.call('batteries.get', { id: 'pack-b' })).notes).toBe('=1');
  });
});

describe('text encodings', () => {
  // "Müller;0,008" as Windows-1252 bytes: ü is 0xFC there (the code page's published table); 0xFC alone is not UTF-8.
  const cp1252 = new Uint8Array([0x4d, 0xfc, 0x6c, 0x6c, 0x65, 0x72]);

  it('UTF-8 with or without a byte-order mark is read; anything else is refused with how to save as UTF-8', () => {
    expect(decodeFileBytes(new TextEncoder().encode('Müller'))).toEqual({ ok: true, text: 'Müller' });
    expect(decodeFileBytes(new Uint8Array([0xef, 0xbb, 0xbf, ...new TextEncoder().encode('Müller')]))).toEqual({ ok: true, text: 'Müller' });
    const refused = decodeFileBytes(cp1252);
    expect(refused.ok).toBe(false);
    if (refused.ok) return;
    expect(refused.reason).toContain('byte 0xFC on line 1 is not valid UTF-8');
    expect(refused.reason).toContain('UTF-8 as its text encoding');
    expect(refused.reason).toContain('--encoding windows-1252');
    expect(decodeFileBytes(new Uint8Array([0xff, 0xfe, 0x41, 0x00]))).toMatchObject({ ok: false, reason: expect.stringContaining('UTF-16') });
  });

  it('text already decoded with its accents lost (U+FFFD) is refused by the handlers too, nothing written', async () => {
    await seedTwoBuggies(f);
    const { text } = await f.call('fleet.exportCsv', { kind: 'vehicles' });
    const before = await dumpStore(f.db);
    const csv = await f.call('fleet.importCsv', { kind: 'vehicles', text: text.replace('Test buggy', 'J\uFFFDrgen') });
    expect(csv).toMatchObject({ ok: false, unreadable: true });
    expect(csv.problems[0]!.message).toMatch(/replacement character \(U\+FFFD\) on line 2/);
    const json = await f.call('fleet.import', { text: fleetText(await f.call('fleet.export', {})).replace('Test buggy', 'M\uFFFDller') });
    expect(json).toMatchObject({ ok: false, unreadable: true });
    expect(await dumpStore(f.db)).toEqual(before);
  });

  it('Windows-1252 is read when asked for, accents intact', () => {
    expect(decodeFileBytes(cp1252, 'windows-1252')).toEqual({ ok: true, text: 'Müller' });
  });
});

describe('JSON as scripts write it', () => {
  it('a field named twice is refused with its path, at any level', async () => {
    expect(readJsonText('{"format":"rigbook-fleet","version":1,"batteries":[],"batteries":[{"id":"p"}]}')).toMatchObject({ ok: false, unreadable: false, place: 'batteries' });
    const example = '{"format":"rigbook-fleet","version":1,"motors":[{"id":"m1","name":"M","kv":3200,"kv":32000}]}';
    const report = await f.call('fleet.import', { text: example });
    expect(report).toMatchObject({ ok: false, unreadable: false });
    expect(report.problems.map(problemLine)).toEqual([expect.stringMatching(/^motors\[0\]\.kv: the field "kv" appears twice in one object \(the second at line 1, column 81\)/)]);
    expect((await f.call('motors.list', {})).length).toBe(0);
    // Equal names in different objects are fine; an escaped spelling of the same name is the same name.
    expect(readJsonText('{"a":{"x":1},"b":{"x":1}}').ok).toBe(true);
    expect(readJsonText('{"kv":1,"k\\u0076":2}')).toMatchObject({ ok: false, place: 'kv' });
  });

  it('a file with a field named twice and broken after it is unreadable, as JSON.parse finds it, not a repeated name', () => {
    // JSON.parse (ECMA-404's grammar) is the reference: it throws on this text.
    const text = '[{"":"a","":1 x}]';
    expect(() => JSON.parse(text)).toThrow();
    expect(scanJson(text)).toMatchObject({ kind: 'syntax' });
    expect(readJsonText(text)).toMatchObject({ ok: false, unreadable: true });
  });

  it('the syntax-error locator works 20 000 levels deep without recursion', () => {
    const depth = 20_000;
    expect(scanJson(`${'['.repeat(depth)}${']'.repeat(depth)}`)).toBeNull();
    const broken = `${'{"a":'.repeat(depth)}1${'}'.repeat(depth - 1)}]`;
    const read = readJsonText(broken);
    expect(read).toMatchObject({ ok: false, unreadable: true });
    if (read.ok) return;
    expect(read.reason).toBe(`The file is not JSON: unexpected "]" where "," or "}" should be, at line 1, column ${broken.length}.`);
    const cut = readJsonText('['.repeat(depth));
    expect(cut).toMatchObject({ ok: false, reason: expect.stringContaining('ends in the middle of a value') });
  });
});

describe('the data folder', () => {
  it('an empty or relative XDG_CONFIG_HOME is treated as unset (XDG Base Directory Specification)', () => {
    const fallback = join(homedir(), '.config', 'Rigbook');
    expect(defaultDataDir({ XDG_CONFIG_HOME: '' }, 'linux')).toBe(fallback);
    expect(defaultDataDir({ XDG_CONFIG_HOME: 'relative/dir' }, 'linux')).toBe(fallback);
    expect(defaultDataDir({}, 'linux')).toBe(fallback);
    expect(defaultDataDir({ XDG_CONFIG_HOME: '/srv/config' }, 'linux')).toBe(join('/srv/config', 'Rigbook'));
  });
});
