import * as v from 'valibot';
import type { DbHandle } from '../../store/db-handle';
import { listParts } from '../../store/repositories/parts';
import type { ServiceContext } from '../service-context';
import { canonicalRecord } from './canonical-record';
import { csvText, parseCsv } from './csv';
import { csvColumns, fromCell, toCell, type CsvKind } from './csv-columns';
import { FLEET_FORMAT, FLEET_VERSION, KIND_WORDS } from './fleet-format';
import { fleetRecordSchemas } from './fleet-schemas';
import type { FleetProblem } from './fleet-problems';
import { importFleet, refusedReport, type ImportReport } from './import-fleet';
import { progressCounter, type OnProgress } from './progress';

/** One kind's records as CSV, archived ones included, in the same order as the JSON export. */
export async function exportCsv(db: DbHandle, kind: CsvKind): Promise<string> {
  const columns = csvColumns(kind);
  const records = await listParts(db, kind, { includeArchived: true });
  const byNameThenId = (a: { name: string; id: string }, b: { name: string; id: string }) =>
    a.name < b.name ? -1 : a.name > b.name ? 1 : a.id < b.id ? -1 : a.id > b.id ? 1 : 0;
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

export type CsvRecords = { ok: true; records: unknown[] } | { ok: false; unreadable: boolean; problems: FleetProblem[] };

/**
 * Columns added after the first files were written: a file from before them may leave them
 * out, and the fields then take their defaults (not known).
 */
const LATER_COLUMNS: ReadonlySet<string> = new Set(['maxRpm', 'driveLayout', 'drivenWeightShare', 'water']);

/** Reads and checks a CSV of one kind: header, every row, every cell; every problem named by row and column. */
export function readCsvRecords(kind: CsvKind, text: string, onProgress?: OnProgress): CsvRecords {
  const parsed = parseCsv(text);
  if (!parsed.ok) return { ok: false, unreadable: true, problems: [{ place: '', message: `The file is not readable CSV: ${parsed.reason}.` }] };
  const [header, ...body] = parsed.rows;
  if (!header) return { ok: false, unreadable: true, problems: [{ place: '', message: 'The file is empty: it needs a header row naming the columns.' }] };
  const columns = csvColumns(kind);
  const byName = new Map(columns.map((c) => [c.name, c]));
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
  const firstRow = new Map<string, number>();
  const tick = progressCounter(onProgress, 'check', body.length);
  body.forEach((cells, index) => {
    const row = index + 2;
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
    const seen = firstRow.get(id);
    if (id !== '' && seen !== undefined) problems.push({ place: cellPlace(row, 'id'), message: `"${id}" is used twice in this file (also row ${seen})` });
    else if (id !== '') firstRow.set(id, row);
    const result = v.safeParse(schema, value, { abortPipeEarly: true });
    if (result.success) records.push(result.output);
    else {
      for (const issue of result.issues) {
        const key = issue.path?.[0]?.key;
        const column = typeof key === 'string' ? key : undefined;
        const missing = issue.received === 'undefined' && column !== undefined;
        problems.push({ place: cellPlace(row, column), message: missing ? 'is required (the cell is empty)' : issue.message });
      }
    }
    tick(index + 1);
  });
  if (problems.length > 0) return { ok: false, unreadable: false, problems };
  return { ok: true, records };
}

/** A CSV merged into the store: new ids added, stored ones updated, builds using them re-checked. */
export async function importCsv(
  ctx: ServiceContext,
  kind: CsvKind,
  text: string,
  options: { dryRun?: boolean; reason?: string; onProgress?: OnProgress },
): Promise<ImportReport> {
  const read = readCsvRecords(kind, text, options.onProgress);
  const base = { mode: 'merge' as const, source: 'csv', dryRun: options.dryRun ?? false, reason: options.reason ?? '', onProgress: options.onProgress };
  if (!read.ok) {
    // The same refusal shape as a fleet file's, with the CSV's own places.
    return refusedReport(base, read.problems, read.unreadable);
  }
  return importFleet(ctx, { format: FLEET_FORMAT, version: FLEET_VERSION, [kind]: read.records }, base);
}

