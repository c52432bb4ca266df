import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { csvText, parseCsv } from '../../src-main/service/fleet/csv';
import { escapeFormula, unescapeFormula } from '../../src-main/service/fleet/csv-columns';
import { problemLine } from '../../src-main/service/fleet/fleet-problems';
import { dumpStore } from './store-dump';

describe('CSV text (RFC 4180)', () => {
  it('quotes cells holding a comma, a quote or a line break, doubles quotes, ends lines in CRLF', () => {
    // RFC 4180 §2: fields with commas, double quotes or line breaks are enclosed in double
    // quotes; a double quote inside is escaped by another one; records end in CRLF.
    expect(csvText([['a', 'b,c', 'say "hi"', 'two\nlines']])).toBe('a,"b,c","say ""hi""","two\nlines"\r\n');
  });

  it('reads back what it writes, and reads LF line ends, a byte-order mark and a missing final newline', () => {
    const rows = [
      ['id', 'name'],
      ['p1', 'Pack, "the big one"'],
      ['p2', 'line\r\nbreak'],
      ['p3', ''],
    ];
    expect(parseCsv(csvText(rows))).toEqual({ ok: true, rows });
    expect(parseCsv('\ufeffid,name\np1,A')).toEqual({
      ok: true,
      rows: [
        ['id', 'name'],
        ['p1', 'A'],
      ],
    });
  });

  it('names the line of a quote that is never closed or misplaced', () => {
    expect(parseCsv('id,name\r\np1,"open\r\n')).toEqual({ ok: false, reason: 'line 2: a quoted cell is never closed (the file may be cut off)' });
    expect(parseCsv('id,name\np1,ab"c\n')).toMatchObject({ ok: false, reason: expect.stringMatching(/^line 2: a quote in the middle/) });
  });
});

describe('formula escaping', () => {
  it.each([
    ['=SUM(A1:A9)', "'=SUM(A1:A9)"],
    ['+44 shop line', "'+44 shop line"],
    ['-4S pack', "'-4S pack"],
    ['@owner', "'@owner"],
    ['\tindented', "'\tindented"],
    ['\rreturn', "'\rreturn"],
    ["'=already quoted", "''=already quoted"],
    ["'Twas a pack", "'Twas a pack"],
    ['Plain name', 'Plain name'],
  ])('text %j is written as %j and read back unchanged', (text, cell) => {
    expect(escapeFormula(text)).toBe(cell);
    expect(unescapeFormula(cell)).toBe(text);
  });
});

let f: ServiceFixture;
beforeEach(async () => {
  f = await serviceFixture();
});
afterEach(async () => f.close());

describe('CSV export and import per part kind', () => {
  it('exports a header with the record field names, numbers plain, formula-like text escaped', async () => {
    await f.call('batteries.create', { id: 'p-neg', name: '=HYPERLINK("x")', chemistry: 'lipo', cellsSeries: 2, capacityMah: 5000, notes: '-20 °C storage test' });
    await f.call('classRules.create', { className: 'Spec', ruleId: 'class-min', figure: 'peakCurrentA', limit: -5, unit: 'A' });
    const out = await f.call('fleet.exportCsv', { kind: 'packs' });
    expect(out.kind).toBe('batteries');
    const read = parseCsv(out.text);
    if (!read.ok) throw new Error(read.reason);
    expect(read.rows[0]).toEqual([
      'id',
      'name',
      'chemistry',
      'cellsSeries',
      'cellsParallel',
      'capacityMah',
      'cRatingContinuous',
      'cRatingBurst',
      'cellResistanceOhm',
      'massKg',
      'wireGaugeAwg',
      'connectorRatingA',
      'cycleCount',
      'retired',
      'notes',
      'version',
      'archivedAt',
    ]);
    expect(read.rows[1]).toEqual(['p-neg', `'=HYPERLINK("x")`, 'lipo', '2', '1', '5000', '', '', '', '', '', '', '0', 'false', "'-20 °C storage test", '1', '']);
  });

  it('a negative number is data: numeric cells are never escaped', async () => {
    // Negative values reach a numeric column only through a file: motors' fields are all positive,
    // so the check is on the cell writer itself with a number column.
    const { toCell, csvColumns } = await import('../../src-main/service/fleet/csv-columns');
    const kv = csvColumns('motors').find((c) => c.name === 'kv')!;
    expect(toCell(kv, -1500)).toBe('-1500');
    const name = csvColumns('motors').find((c) => c.name === 'name')!;
    expect(toCell(name, '-1500')).toBe("'-1500");
  });

  it('round trip: export, edit a cell, import: the record is updated and its builds re-checked', async () => {
    const seed = await seedTwoBuggies(f);
    const { text } = await f.call('fleet.exportCsv', { kind: 'batteries' });
    const edited = text.replace(`${seed.pack2s.id},Test 2S,lipo,2,1,5000,50,100`, `${seed.pack2s.id},Test 2S,lipo,2,1,5000,1,2`);
    expect(edited).not.toBe(text);
    const report = await f.call('fleet.importCsv', { kind: 'packs', text: edited });
    expect(report.ok).toBe(true);
    expect(report.counts.batteries).toEqual({ added: 0, updated: 1, unchanged: 1 });
    expect((await f.call('batteries.get', { id: seed.pack2s.id })).cRatingContinuous).toBe(1);
    expect((await f.call('builds.get', { id: seed.onTwo.id })).verdict?.status).toBe('over');
    // Importing the export unchanged changes nothing.
    const again = await f.call('fleet.importCsv', { kind: 'batteries', text: (await f.call('fleet.exportCsv', { kind: 'batteries' })).text });
    expect(again.counts.batteries).toEqual({ added: 0, updated: 0, unchanged: 2 });
  });

  it('formula-like text survives a round trip exactly', async () => {
    await f.call('vehicles.create', { id: 'v1', name: '@home basher', kind: 'truck', notes: '+1 555 0100', className: '=B2' });
    const { text } = await f.call('fleet.exportCsv', { kind: 'vehicles' });
    await f.call('fleet.importCsv', { kind: 'vehicles', text: text.replace("'@home basher", 'Home basher') });
    const v = await f.call('vehicles.get', { id: 'v1' });
    expect(v).toMatchObject({ name: 'Home basher', notes: '+1 555 0100', className: '=B2' });
  });

  it.each([
    ['a missing column', (t: string) => t.replace(',cycleCount', '').replace(/,0,false,/g, ',false,'), ['row 1, column "cycleCount": this column is missing from the header']],
    [
      'an extra column',
      (t: string) => t.replace('archivedAt\r\n', 'archivedAt,colour\r\n').replace(/,1,\r\n/g, ',1,,red\r\n'),
      [
        'row 1, column "colour": column 18 is not a pack field Rigbook knows (the columns are: id, name, chemistry, cellsSeries, cellsParallel, capacityMah, cRatingContinuous, cRatingBurst, cellResistanceOhm, massKg, wireGaugeAwg, connectorRatingA, cycleCount, retired, notes, version, archivedAt)',
      ],
    ],
    [
      'a bad value',
      (t: string) => t.replace(',lipo,4,', ',lead,4,').replace(',lipo,2,1,5000,50', ',lipo,2,1,lots,50'),
      ['row 2, column "capacityMah": must be a number', 'row 3, column "chemistry": must be one of: lipo, lihv, lifepo4, liion, nimh'],
    ],
    ['a short row', (t: string) => t.replace(/,false,,1,\r\n$/, ',false,,1\r\n'), ['row 3: has 16 cells; the header has 17']],
    ['an empty required cell', (t: string) => t.replace('Test 4S', ''), ['row 3, column "name": is required']],
  ])('%s gets a report naming row and column, and the store is unchanged', async (_label, edit, expected) => {
    await seedTwoBuggies(f);
    const { text } = await f.call('fleet.exportCsv', { kind: 'batteries' });
    const broken = edit(text);
    expect(broken).not.toBe(text);
    const before = await dumpStore(f.db);
    const report = await f.call('fleet.importCsv', { kind: 'batteries', text: broken });
    expect(report.ok).toBe(false);
    expect(report.problems.map(problemLine)).toEqual(expected);
    expect(await dumpStore(f.db)).toEqual(before);
  });

  it('a file that is not CSV at all is unreadable', async () => {
    const report = await f.call('fleet.importCsv', { kind: 'motors', text: 'id,name\n"unclosed' });
    expect(report).toMatchObject({ ok: false, unreadable: true });
  });
});

describe('CSV files written before the safe-side fields', () => {
  it('a vehicles file without drive, driven share and water columns still imports, the fields not known', async () => {
    const { readCsvRecords } = await import('../../src-main/service/fleet/fleet-csv');
    const text = 'id,name,kind,massKg,dragAreaM2,rollingCoefficient,tractionCoefficient,owner,className,notes,version,archivedAt\r\nv1,Old buggy,car,1.6,0.03,0.03,1,,,,1,\r\n';
    const read = readCsvRecords('vehicles', text);
    expect(read.ok ? [] : read.problems).toEqual([]);
    expect(read.ok && read.records[0]).toMatchObject({ id: 'v1', driveLayout: null, drivenWeightShare: null, water: null });
  });

  it('a vehicles file with the older owner column imports, each owner text becoming a customer', async () => {
    const text =
      'id,name,kind,massKg,dragAreaM2,rollingCoefficient,tractionCoefficient,owner,className,notes,version,archivedAt\r\nv1,Old buggy,car,1.6,0.03,0.03,1,Dana Ó Briain,,,1,\r\nv2,Old truck,truck,3,0.05,0.04,1,Dana Ó Briain,,,1,\r\nv3,Shop truck,truck,3,0.05,0.04,1,,,,1,\r\n';
    const report = await f.call('fleet.importCsv', { kind: 'vehicles', text });
    expect(report.problems).toEqual([]);
    expect(report.counts.customers.added).toBe(1);
    const [customer] = await f.call('customers.list', {});
    expect(customer).toMatchObject({ name: 'Dana Ó Briain', contact: '' });
    const vehicles = await f.call('vehicles.list', {});
    expect(vehicles.map((v) => [v.id, v.customerId])).toEqual([
      ['v1', customer!.id],
      ['v2', customer!.id],
      ['v3', null],
    ]);
    // Exports write the customer's id, not the older column.
    const { text: exported } = await f.call('fleet.exportCsv', { kind: 'vehicles' });
    expect(exported.split('\r\n')[0]).toContain('customerId');
    expect(exported.split('\r\n')[0]).not.toContain('owner');
  });
});
