// Reading a telemetry CSV: the header names each column's quantity and (in brackets, after an
// underscore or a space) its unit; a person confirms or changes that in the column-mapping
// step. Rows are read strictly: a cell that is not a number, an empty cell in a used column, or
// time that goes backwards is reported with its line number, never guessed. Pure.

import { LOG_QUANTITIES, SAMPLE_KEYS, type LogQuantity, type LogSamples } from './run-log';

/** The units each quantity may be given in, and how each converts to the stored unit (s, V, A, rpm, °C, %). */
export const LOG_UNITS: Readonly<Record<LogQuantity, Readonly<Record<string, (x: number) => number>>>> = {
  time: { s: (x) => x, ms: (x) => x / 1000, us: (x) => x / 1e6, µs: (x) => x / 1e6, min: (x) => x * 60 },
  voltage: { V: (x) => x, mV: (x) => x / 1000 },
  current: { A: (x) => x, mA: (x) => x / 1000 },
  rpm: { rpm: (x) => x },
  // Exact conversions (NIST SP 811): °F → °C is (x − 32) × 5/9, K → °C is x − 273.15.
  temperature: { '°C': (x) => x, '°F': (x) => ((x - 32) * 5) / 9, K: (x) => x - 273.15 },
  throttle: { '%': (x) => x },
};

/** The unit a quantity is stored in. */
export const STORED_UNIT: Readonly<Record<LogQuantity, string>> = { time: 's', voltage: 'V', current: 'A', rpm: 'rpm', temperature: '°C', throttle: '%' };

export const QUANTITY_LABELS: Readonly<Record<LogQuantity, string>> = { time: 'Time', voltage: 'Voltage', current: 'Current', rpm: 'Motor rpm', temperature: 'Temperature', throttle: 'Throttle' };

// Header words per quantity, lower case, spaces and underscores folded to one space. Where a
// word carries its own unit ("amps", "volts", "rpm"), the unit is read from it.
const NAMES: Readonly<Record<LogQuantity, readonly string[]>> = {
  time: ['time', 't', 'timestamp', 'elapsed', 'elapsed time', 'seconds', 'secs', 'sec', 'millis', 'ms'],
  voltage: ['voltage', 'volt', 'volts', 'v', 'vbat', 'v bat', 'battery voltage', 'pack voltage', 'battery', 'input voltage', 'u', 'bat voltage'],
  current: ['current', 'amps', 'amp', 'i', 'ibat', 'i bat', 'battery current', 'pack current', 'input current', 'bat current'],
  rpm: ['rpm', 'motor rpm', 'speed rpm', 'motor speed', 'revs'],
  temperature: ['temperature', 'temp', 'esc temp', 'esc temperature', 'motor temp', 'motor temperature', 'pack temp', 'battery temp', 'fet temp'],
  throttle: ['throttle', 'thr', 'throttle in', 'throttle input', 'power'],
};

const IMPLIED_UNIT: Readonly<Record<string, string>> = { volts: 'V', volt: 'V', amps: 'A', amp: 'A', rpm: 'rpm', 'motor rpm': 'rpm', 'speed rpm': 'rpm', revs: 'rpm', seconds: 's', secs: 's', sec: 's', millis: 'ms', ms: 'ms' };

// Unit spellings as headers write them, mapped to the units above.
const UNIT_SPELLINGS: Readonly<Record<string, string>> = {
  s: 's',
  sec: 's',
  secs: 's',
  seconds: 's',
  ms: 'ms',
  msec: 'ms',
  millis: 'ms',
  us: 'us',
  µs: 'µs',
  μs: 'µs',
  min: 'min',
  v: 'V',
  volt: 'V',
  volts: 'V',
  mv: 'mV',
  a: 'A',
  amp: 'A',
  amps: 'A',
  ma: 'mA',
  rpm: 'rpm',
  '1/min': 'rpm',
  c: '°C',
  '°c': '°C',
  degc: '°C',
  'deg c': '°C',
  celsius: '°C',
  '°f': '°F',
  f: '°F',
  degf: '°F',
  fahrenheit: '°F',
  k: 'K',
  kelvin: 'K',
  '%': '%',
  pct: '%',
  percent: '%',
};

export interface ColumnGuess {
  index: number;
  /** The header cell as written. */
  header: string;
  quantity: LogQuantity | null;
  /** A unit of LOG_UNITS[quantity]; null where the header gives none Rigbook reads. */
  unit: string | null;
  /** The unit text the header gave, as written (for a message when it is unknown). */
  unitText: string | null;
  /** Why the column cannot be used as it stands (unknown unit, no unit); null when it can. */
  problem: string | null;
}

/** One column's use, as the mapping step settles it. */
export interface ColumnUse {
  column: number;
  quantity: LogQuantity;
  unit: string;
}

const fold = (s: string): string =>
  s
    .toLowerCase()
    .replace(/[_\s]+/g, ' ')
    .trim();

/** "Current (A)", "Current [A]", "current_a", "Current A", "I" → name and unit text. */
export function splitHeader(header: string): { name: string; unitText: string | null } {
  const h = header.trim();
  const bracket = /^(.*?)\s*[([{]\s*([^)\]}]*)\s*[)\]}]\s*$/.exec(h);
  if (bracket) return { name: fold(bracket[1] ?? ''), unitText: (bracket[2] ?? '').trim() || null };
  const folded = fold(h);
  for (const quantity of LOG_QUANTITIES) if (NAMES[quantity].includes(folded)) return { name: folded, unitText: null };
  // A trailing word that is a unit: "current a", "time ms", "temp c".
  const last = folded.lastIndexOf(' ');
  if (last > 0) {
    const tail =
      h
        .replace(/[_\s]+/g, ' ')
        .trim()
        .split(' ')
        .at(-1) ?? '';
    if (Object.hasOwn(UNIT_SPELLINGS, tail.toLowerCase())) return { name: folded.slice(0, last), unitText: tail };
  }
  return { name: folded, unitText: null };
}

function unitOf(quantity: LogQuantity, unitText: string): string | null {
  const spelled = UNIT_SPELLINGS[unitText.toLowerCase()] ?? unitText;
  return Object.hasOwn(LOG_UNITS[quantity], spelled) ? spelled : null;
}

/** What each header column is taken to be, before the person confirms it. */
export function guessColumns(headers: readonly string[]): ColumnGuess[] {
  const taken = new Set<LogQuantity>();
  return headers.map((header, index) => {
    const { name, unitText } = splitHeader(header);
    const quantity = LOG_QUANTITIES.find((q) => NAMES[q].includes(name)) ?? null;
    if (quantity === null || taken.has(quantity)) return { index, header, quantity: null, unit: null, unitText, problem: null };
    taken.add(quantity);
    const text = unitText ?? IMPLIED_UNIT[name] ?? (quantity === 'rpm' ? 'rpm' : quantity === 'throttle' ? '%' : null);
    if (text === null) return { index, header, quantity, unit: null, unitText, problem: `no unit in the header; choose one (${Object.keys(LOG_UNITS[quantity]).join(', ')})` };
    const unit = unitOf(quantity, text);
    if (unit === null) return { index, header, quantity, unit: null, unitText, problem: `unit "${text}" is not one Rigbook reads for ${QUANTITY_LABELS[quantity].toLowerCase()} (${Object.keys(LOG_UNITS[quantity]).join(', ')})` };
    return { index, header, quantity, unit, unitText, problem: null };
  });
}

/** The field separator: whichever of comma, semicolon and tab splits the header into the most cells. */
export function detectDelimiter(headerLine: string): ',' | ';' | '\t' {
  let best: ',' | ';' | '\t' = ',';
  let most = 0;
  for (const d of [',', ';', '\t'] as const) {
    const n = splitLine(headerLine, d).length;
    if (n > most) {
      most = n;
      best = d;
    }
  }
  return best;
}

/** One line's cells; double quotes enclose a cell that holds the separator ("" is a quote). */
export function splitLine(line: string, delimiter: string): string[] {
  if (!line.includes('"')) return line.split(delimiter);
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  for (let k = 0; k < line.length; k++) {
    const ch = line[k];
    if (quoted) {
      if (ch === '"' && line[k + 1] === '"') {
        cell += '"';
        k++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === delimiter) {
      cells.push(cell);
      cell = '';
    } else cell += ch;
  }
  cells.push(cell);
  return cells;
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** A cell as a number, or null where it is not one; with a decimal comma (semicolon or tab files) "3,7" reads 3.7. */
export function readNumber(cell: string, decimalComma: boolean): number | null {
  let s = cell.trim();
  if (decimalComma) s = s.replace(',', '.');
  if (!NUMBER.test(s)) return null;
  const x = Number(s);
  return Number.isFinite(x) ? x : null;
}

export interface LogRowProblem {
  /** Line of the file, counting the header as line 1. */
  line: number;
  message: string;
}

/** The refusal of a whole log: every problem found, the first few listed by line. */
export interface LogReadState {
  samples: { [K in keyof LogSamples]-?: number[] };
  problems: LogRowProblem[];
  /** Problems beyond the ones kept in the list. */
  moreProblems: number;
  lastTime: number | null;
  /** Non-blank lines read, and per used column how many of them had it empty (a column empty on every line is reported once). */
  dataRows: number;
  emptyCells: Map<number, number>;
}

export const LISTED_PROBLEMS = 20;

export function startReading(): LogReadState {
  return { samples: { timeS: [], voltageV: [], currentA: [], rpm: [], temperatureC: [], throttlePct: [] }, problems: [], moreProblems: 0, lastTime: null, dataRows: 0, emptyCells: new Map() };
}

function report(state: LogReadState, line: number, message: string): void {
  if (state.problems.length < LISTED_PROBLEMS) state.problems.push({ line, message });
  else state.moreProblems++;
}

/**
 * Reads lines [from, to) of the file (0-based indices into `lines`, the header being line 0)
 * into the state, by the mapping. Blank lines are skipped; every other line must give a number
 * in every used column, with time never going backwards.
 */
export function readRows(state: LogReadState, lines: readonly string[], from: number, to: number, uses: readonly ColumnUse[], headers: readonly string[], delimiter: string): void {
  const decimalComma = delimiter !== ',';
  const convert = uses.map((u) => LOG_UNITS[u.quantity][u.unit] ?? ((x: number) => x));
  for (let k = from; k < to; k++) {
    const raw = lines[k] ?? '';
    if (raw.trim() === '') continue;
    const line = k + 1;
    state.dataRows++;
    const cells = splitLine(raw.endsWith('\r') ? raw.slice(0, -1) : raw, delimiter);
    const values: number[] = [];
    let bad = false;
    for (let u = 0; u < uses.length; u++) {
      const use = uses[u]!;
      const cell = cells[use.column];
      const name = headers[use.column] ?? `column ${use.column + 1}`;
      if (cell === undefined || cell.trim() === '') {
        state.emptyCells.set(use.column, (state.emptyCells.get(use.column) ?? 0) + 1);
        report(state, line, `"${name}" is empty`);
        bad = true;
        continue;
      }
      const x = readNumber(cell, decimalComma);
      if (x === null) {
        report(state, line, `"${name}" holds "${cell.trim().slice(0, 40)}", not a number`);
        bad = true;
        continue;
      }
      const value = convert[u]!(x);
      if (use.quantity === 'time') {
        // Judged even where another cell of the row is bad, so the next row is compared with this one.
        if (state.lastTime !== null && value < state.lastTime) {
          report(state, line, `time goes backwards (${value} s after ${state.lastTime} s)`);
          bad = true;
        } else state.lastTime = value;
      }
      values.push(value);
    }
    if (bad) continue;
    uses.forEach((use, u) => state.samples[SAMPLE_KEYS[use.quantity]].push(values[u] ?? 0));
  }
}

/** The samples of the used quantities only. */
export function finishedSamples(state: LogReadState, uses: readonly ColumnUse[]): LogSamples {
  // Columns in one fixed order, whatever the file's: a log exported and read again is the same text.
  const out: LogSamples = { timeS: state.samples.timeS };
  for (const quantity of LOG_QUANTITIES) if (quantity !== 'time' && uses.some((u) => u.quantity === quantity)) out[SAMPLE_KEYS[quantity]] = state.samples[SAMPLE_KEYS[quantity]];
  return out;
}

/** Problems with a mapping as a whole (no time column, a quantity twice, an unknown unit, a column that is not there). */
export function mappingProblems(uses: readonly ColumnUse[], columnCount: number): string[] {
  const out: string[] = [];
  const seen = new Set<LogQuantity>();
  for (const use of uses) {
    if (use.column < 0 || use.column >= columnCount) out.push(`column ${use.column + 1} is not in the file (it has ${columnCount})`);
    if (seen.has(use.quantity)) out.push(`${QUANTITY_LABELS[use.quantity]} is mapped to two columns`);
    seen.add(use.quantity);
    if (!Object.hasOwn(LOG_UNITS[use.quantity], use.unit)) out.push(`unit "${use.unit}" is not one Rigbook reads for ${QUANTITY_LABELS[use.quantity].toLowerCase()} (${Object.keys(LOG_UNITS[use.quantity]).join(', ')})`);
  }
  if (!seen.has('time')) out.push('no column is mapped to time');
  if (!seen.has('current') && !seen.has('voltage') && !seen.has('rpm')) out.push('no column is mapped to current, voltage or rpm');
  return out;
}
