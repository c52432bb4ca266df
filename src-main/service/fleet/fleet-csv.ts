import * as v from 'valibot';
import type { DbHandle } from '../../store/db-handle';
import { listParts } from '../../store/repositories/parts';
import type { ServiceContext } from '../service-context';
import { canonicalRecord } from './canonical-record';
import { csvText, parseCsv } from './csv';
import { csvColumns, fromCell, toCell, type CsvColumn, type CsvKind } from './csv-columns';
import { numericTwin } from './numeric-twin';
import { lossyDecodingReason } from './decode-file-bytes';

export { numericTwin };
import { FLEET_FORMAT, FLEET_VERSION, KIND_WORDS } from './fleet-format';
import { fleetRecordSchemas } from './fleet-schemas';
import type { FleetProblem } from './fleet-problems';
import { importFleet, refusedReport, type ImportReport } from './import-fleet';
import { progressCounter, type OnProgress } from './progress';

/** One kind's records as CSV, archived ones included, in the same order as the JSON export. */
export async function exportCsv(db: DbHandle, kind: CsvKind): Promise<string> {
  const columns = csvColumns(kind);
  const records = await listParts(db, kind, { includeArchived: true });
  const byNameThenId = (a: { name: string; id: string }, b: { name: string; id: string }) => (a.name < b.name ? -1 : a.name > b.name ? 1 : a.id < b.id ? -1 : a.id > b.id ? 1 : 0);
  records.sort(byNameThenId);
  const rows = [columns.map((c) => c.name)];
  for (const record of records) {
    const fields = canonicalRecord(kind, record);
    rows.push(columns.map((c) => toCell(c, fields[c.name])));
  }
  return csvText(rows);
}

/** Where a problem is in a spreadsheet's terms: rows count from 1 with the header as row 1. */
function cellPlace(row: number, column?: string): string {
  return column === undefined ? `row ${row}` : `row ${row}, column "${column}"`;
}

export type CsvRecords = { ok: true; records: unknown[]; skippedRows: number } | { ok: false; unreadable: boolean; problems: FleetProblem[] };

/**
 * Columns added after the first files were written: a file from before them may leave them
 * out, and the fields then take their defaults (not known).
 */
const LATER_COLUMNS: ReadonlySet<string> = new Set([
  'maxRpm',
  'driveLayout',
  'drivenWeightShare',
  'water',
  // The wider checks' inputs.
  'surface',
  'typicalValuesConfirmed',
  'maxLossW',
  'maxErpm',
  'minVoltageV',
  'wireGaugeAwg',
  'connectorRatingA',
  'customerId',
  'becCurrentA',
]);

/** Columns older files carried and exports no longer write: read, and turned into what replaced them (a vehicle's owner text into a customer). */
const OLDER_COLUMNS: Readonly<Partial<Record<CsvKind, readonly CsvColumn[]>>> = { vehicles: [{ name: 'owner', kind: 'text', nullable: false }] };

/** A row of nothing but separators (and spaces): spreadsheets write them for formatted empty rows. */
function isBlankRow(cells: readonly string[]): boolean {
  return cells.every((c) => c.trim() === '');
}

/** A header that is one cell holding the column names split by another character: the file is not comma-separated. */
function otherSeparator(header: readonly string[], known: ReadonlySet<string>): string | null {
  if (header.length !== 1) return null;
  const only = header[0] ?? '';
  for (const [sep, word] of [
    [';', 'semicolons'],
    ['\t', 'tabs'],
  ] as const) {
    const names = only.split(sep).map((n) => n.trim());
    if (names.length > 1 && names.some((n) => known.has(n))) return word;
  }
  return null;
}

/** Reads and checks a CSV of one kind: header, every row, every cell; every problem named by row and column. `storedIds`, when given, are the ids of that kind already in the store. */
export function readCsvRecords(kind: CsvKind, text: string, onProgress?: OnProgress, storedIds?: ReadonlySet<string>): CsvRecords {
  const lossy = lossyDecodingReason(text);
  if (lossy !== null) return { ok: false, unreadable: true, problems: [{ place: '', message: `Cannot read the file: ${lossy}` }] };
  const parsed = parseCsv(text);
  if (!parsed.ok) return { ok: false, unreadable: true, problems: [{ place: '', message: `The file is not readable CSV: ${parsed.reason}.` }] };
  const blank = parsed.rows.map(isBlankRow);
  const firstRow = blank.indexOf(false);
  const header = firstRow < 0 ? undefined : parsed.rows[firstRow];
  if (!header) return { ok: false, unreadable: true, problems: [{ place: '', message: 'The file is empty: it needs a header row naming the columns.' }] };
  const body = parsed.rows.slice(firstRow + 1);
  const columns = csvColumns(kind);
  const byName = new Map([...columns, ...(OLDER_COLUMNS[kind] ?? [])].map((c) => [c.name, c]));
  const separator = otherSeparator(header, new Set(byName.keys()));
  if (separator !== null) {
    return {
      ok: false,
      unreadable: true,
      problems: [
        {
          place: '',
          message: `The file's columns are separated by ${separator}, not commas (spreadsheets do this where the comma is the decimal mark). Save it again as CSV with commas between columns and points in numbers (a spreadsheet set to a locale that writes 0.008, not 0,008), then import it.`,
        },
      ],
    };
  }
  const problems: FleetProblem[] = [];
  const seenColumns = new Set<string>();
  header.forEach((raw, i) => {
    const name = raw.trim();
    if (!byName.has(name)) {
      problems.push({ place: cellPlace(1, name), message: `column ${i + 1} is not a ${KIND_WORDS[kind].one} field Rigbook knows (the columns are: ${columns.map((c) => c.name).join(', ')})` });
    } else if (seenColumns.has(name)) {
      problems.push({ place: cellPlace(1, name), message: `column ${i + 1} repeats a column` });
    }
    seenColumns.add(name);
  });
  for (const c of columns) {
    if (!seenColumns.has(c.name) && !LATER_COLUMNS.has(c.name)) problems.push({ place: cellPlace(1, c.name), message: 'this column is missing from the header' });
  }
  if (problems.length > 0) return { ok: false, unreadable: false, problems };

  const schema = fleetRecordSchemas[kind];
  const names = header.map((h) => h.trim());
  const records: unknown[] = [];
  const seenAt = new Map<string, number>();
  let skippedRows = 0;
  const tick = progressCounter(onProgress, 'check', body.length);
  body.forEach((cells, index) => {
    // Rows count as a spreadsheet shows them: the header's own row number, plus one per row after it.
    const row = firstRow + index + 2;
    if (isBlankRow(cells)) {
      skippedRows++;
      return;
    }
    if (cells.length !== names.length) {
      problems.push({ place: cellPlace(row), message: `has ${cells.length} cells; the header has ${names.length}` });
      return;
    }
    const value: Record<string, unknown> = {};
    names.forEach((name, i) => {
      const cell = fromCell(byName.get(name)!, cells[i] ?? '');
      if (cell !== undefined) value[name] = cell;
    });
    const id = typeof value.id === 'string' ? value.id : '';
    const seen = seenAt.get(id);
    if (id !== '' && seen !== undefined) problems.push({ place: cellPlace(row, 'id'), message: `"${id}" is used twice in this file (also row ${seen})` });
    else if (id !== '') seenAt.set(id, row);
    const twin = storedIds ? numericTwin(id, storedIds) : null;
    if (twin !== null) {
      problems.push({
        place: cellPlace(row, 'id'),
        message: `"${id}" matches no ${KIND_WORDS[kind].one} in the store, but "${twin}" is the same number written differently: a spreadsheet probably rewrote the id. Nothing was added; put the id back as "${twin}" (format the id column as text before editing).`,
      });
    }
    const result = v.safeParse(schema, value, { abortPipeEarly: true });
    if (result.success) records.push(result.output);
    else {
      for (const issue of result.issues) {
        const key = issue.path?.[0]?.key;
        const column = typeof key === 'string' ? key : undefined;
        // The near-miss above already says what is wrong with this id.
        if (twin !== null && column === 'id') continue;
        const missing = issue.received === 'undefined' && column !== undefined;
        problems.push({ place: cellPlace(row, column), message: missing ? 'is required (the cell is empty)' : issue.message });
      }
    }
    tick(index + 1);
  });
  if (problems.length > 0) return { ok: false, unreadable: false, problems };
  return { ok: true, records, skippedRows };
}

/** A CSV merged into the store: new ids added, stored ones updated, builds using them re-checked. */
export async function importCsv(ctx: ServiceContext, kind: CsvKind, text: string, options: { dryRun?: boolean; acceptChanges?: boolean; reason?: string; onProgress?: OnProgress }): Promise<ImportReport> {
  // Read outside the import's transaction: only for the hint about rewritten ids; the import re-reads inside it.
  const stored = new Set((await ctx.db.selectFrom(kind).select('id').execute()).map((r) => r.id));
  const read = readCsvRecords(kind, text, options.onProgress, stored);
  const base = { mode: 'merge' as const, source: 'csv', dryRun: options.dryRun ?? false, acceptChanges: options.acceptChanges ?? false, reason: options.reason ?? '', onProgress: options.onProgress };
  if (!read.ok) {
    // The same refusal shape as a fleet file's, with the CSV's own places.
    return refusedReport(base, read.problems, read.unreadable);
  }
  const report = await importFleet(ctx, { format: FLEET_FORMAT, version: FLEET_VERSION, [kind]: read.records }, base);
  return { ...report, skippedRows: read.skippedRows };
}
