import { summarize, thin, type LogSamples, type RunLogSummary } from '../core/run-log';
import { detectDelimiter, finishedSamples, guessColumns, mappingProblems, readNumber, readRows, splitLine, startReading, type ColumnGuess, type ColumnUse, type LogRowProblem } from '../core/run-log-csv';
import { ServiceError } from './contract';
import type { ServiceContext } from './service-context';

/** The largest log Rigbook reads (the loopback shell's request limit is a little above it). */
export const MAX_LOG_BYTES = 50 * 1024 * 1024;

/** Rows read between two pauses, so a long log does not hold up the window or the server. */
const ROWS_PER_STEP = 20_000;

const mb = (bytes: number): string => `${(bytes / (1024 * 1024)).toFixed(1)} MB`;

export function checkLogSize(text: string): void {
  const bytes = Buffer.byteLength(text, 'utf8');
  if (bytes > MAX_LOG_BYTES) throw new ServiceError('invalid', `text: the log is ${mb(bytes)}; Rigbook reads logs up to ${mb(MAX_LOG_BYTES)}. Export a shorter stretch of the run, or split the file.`, 'text');
}

interface SplitLog {
  lines: string[];
  headers: string[];
  delimiter: ',' | ';' | '\t';
  /** Index of the header line (blank lines and a byte-order mark before it are skipped). */
  headerAt: number;
}

function splitLog(text: string): SplitLog {
  const lines = text.replace(/^\uFEFF/, '').split('\n');
  const headerAt = lines.findIndex((l) => l.trim() !== '');
  if (headerAt < 0) throw new ServiceError('invalid', 'text: the file is empty', 'text');
  const headerLine = (lines[headerAt] ?? '').replace(/\r$/, '');
  const delimiter = detectDelimiter(headerLine);
  const headers = splitLine(headerLine, delimiter).map((h) => h.trim());
  // A header whose cells are all numbers is a first row of data: the columns need names.
  if (headers.every((h) => readNumber(h, delimiter !== ',') !== null)) throw new ServiceError('invalid', 'text: line 1: the first line holds numbers, not column names; the log needs a header line (time, current, voltage…)', 'text');
  return { lines, headers, delimiter, headerAt };
}

export interface LogPreview {
  columns: (ColumnGuess & { examples: string[] })[];
  /** The mapping taken from the header, where every recognised column has a unit. */
  suggested: ColumnUse[];
  delimiter: string;
  /** Up to ten rows of the file as cells. */
  rows: { line: number; cells: string[] }[];
  /** Data lines in the file (not counting blank ones). */
  rowCount: number;
}

/** What the file looks like and what the header says, for the mapping step; reads only the first rows. */
export function previewLog(text: string): LogPreview {
  checkLogSize(text);
  const { lines, headers, delimiter, headerAt } = splitLog(text);
  const guesses = guessColumns(headers);
  const rows: LogPreview['rows'] = [];
  let rowCount = 0;
  for (let k = headerAt + 1; k < lines.length; k++) {
    const raw = (lines[k] ?? '').replace(/\r$/, '');
    if (raw.trim() === '') continue;
    rowCount++;
    if (rows.length < 10) rows.push({ line: k + 1, cells: splitLine(raw, delimiter).map((c) => c.trim()) });
  }
  return {
    columns: guesses.map((g) => ({ ...g, examples: rows.slice(0, 5).map((r) => r.cells[g.index] ?? '') })),
    suggested: guesses.flatMap((g) => (g.quantity !== null && g.unit !== null ? [{ column: g.index, quantity: g.quantity, unit: g.unit }] : [])),
    delimiter: delimiter === '\t' ? 'tab' : delimiter,
    rows,
    rowCount,
  };
}

export interface ReadLog {
  samples: LogSamples;
  kept: LogSamples;
  summary: RunLogSummary;
  sampleCount: number;
  mapping: ColumnUse[];
}

function refusal(problems: readonly LogRowProblem[], more: number): ServiceError {
  const listed = problems.map((p) => `line ${p.line}: ${p.message}`).join('; ');
  const tail = more > 0 ? `; and ${more} more` : '';
  return new ServiceError('invalid', `text: the log was not imported, nothing was saved. ${problems.length + more} row${problems.length + more === 1 ? '' : 's'} could not be read: ${listed}${tail}.`, 'text');
}

/**
 * Reads the whole log by the mapping (or the header's own, where none is given), all or
 * nothing: any problem refuses the log, listing the first LISTED_PROBLEMS by line. Reads in
 * steps, reporting progress and letting other work run between steps.
 */
export async function readLog(ctx: ServiceContext, text: string, mapping: readonly ColumnUse[] | undefined): Promise<ReadLog> {
  checkLogSize(text);
  const { lines, headers, delimiter, headerAt } = splitLog(text);
  const guesses = guessColumns(headers);
  let uses: ColumnUse[];
  if (mapping) uses = [...mapping];
  else {
    const unusable = guesses.filter((g) => g.problem !== null);
    if (unusable.length > 0) throw new ServiceError('invalid', `mapping: ${unusable.map((g) => `column ${g.index + 1} "${g.header}": ${g.problem}`).join('; ')}`, 'mapping');
    uses = guesses.flatMap((g) => (g.quantity !== null && g.unit !== null ? [{ column: g.index, quantity: g.quantity, unit: g.unit }] : []));
  }
  const wrong = mappingProblems(uses, headers.length);
  if (wrong.length > 0) throw new ServiceError('invalid', `mapping: ${wrong.join('; ')}`, 'mapping');
  // Time first, so each row's time is known when the others are read.
  uses.sort((a, b) => (a.quantity === 'time' ? -1 : b.quantity === 'time' ? 1 : 0));
  const state = startReading();
  const total = lines.length - headerAt - 1;
  for (let from = headerAt + 1; from < lines.length; from += ROWS_PER_STEP) {
    readRows(state, lines, from, Math.min(lines.length, from + ROWS_PER_STEP), uses, headers, delimiter);
    ctx.emit({ type: 'progress', kind: 'runLog', task: 'check', done: Math.min(total, from + ROWS_PER_STEP - headerAt - 1), total });
    await new Promise((resolve) => setTimeout(resolve, 0));
  }
  const emptyColumns = uses.filter((u) => state.dataRows > 0 && (state.emptyCells.get(u.column) ?? 0) === state.dataRows);
  if (emptyColumns.length > 0) {
    throw new ServiceError(
      'invalid',
      `mapping: the log was not imported, nothing was saved. ${emptyColumns.map((u) => `column ${u.column + 1} "${headers[u.column] ?? ''}" is empty on every row`).join('; ')}: map it to nothing, or pick the column that holds the ${emptyColumns.map((u) => u.quantity).join(' and ')}.`,
      'mapping',
    );
  }
  if (state.problems.length > 0) throw refusal(state.problems, state.moreProblems);
  const samples = finishedSamples(state, uses);
  if (samples.timeS.length < 2) throw new ServiceError('invalid', `text: the log holds ${samples.timeS.length} row${samples.timeS.length === 1 ? '' : 's'} of data; a run needs at least two`, 'text');
  return { samples, kept: thin(samples), summary: summarize(samples), sampleCount: samples.timeS.length, mapping: uses };
}
