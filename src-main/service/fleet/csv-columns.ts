// The columns of each part kind's CSV (the fields of its catalogue, in the file's order) and how
// a cell turns into a field and back.
//
// Number policy: numeric fields are written as plain numbers (JavaScript's shortest form that
// reads back to the same value) and never escaped: a spreadsheet reads a plain number as a
// number, not a formula, and a minus sign there is data. Text fields (names, notes, owner,
// class) that start with a formula character or anything a spreadsheet strips before one
// (see LEAD) are written with a leading apostrophe so a spreadsheet shows them as text
// instead of running them; reading strips that one apostrophe.
// An empty cell is "not known" (null) for a field that may be unknown, and the form's default
// for a field that has one.

import type { FieldCatalogue, FieldSpec } from '../../core/catalogue/field-spec';
import { FIELD_CATALOGUES } from '../../core/catalogue/record-kinds';
import { FIELD_ORDER } from './fleet-schemas';

export const CSV_KINDS = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles'] as const;
export type CsvKind = (typeof CSV_KINDS)[number];

/** The words a caller may name a kind with: the trade's (`packs`) and the file's own (`batteries`). */
export const CSV_KIND_NAMES = ['packs', 'batteries', 'motors', 'controllers', 'propellers', 'vehicles'] as const;
export type CsvKindName = (typeof CSV_KIND_NAMES)[number];

export const CSV_KIND_ALIASES: Readonly<Record<CsvKindName, CsvKind>> = {
  packs: 'batteries',
  batteries: 'batteries',
  motors: 'motors',
  controllers: 'controllers',
  propellers: 'propellers',
  vehicles: 'vehicles',
};

type CellKind = 'number' | 'boolean' | 'text';

export interface CsvColumn {
  name: string;
  kind: CellKind;
  nullable: boolean;
}

/** The columns every kind's file carries besides its catalogue's fields. */
const BOOKKEEPING: Readonly<Record<string, Omit<CsvColumn, 'name'>>> = {
  id: { kind: 'text', nullable: false },
  version: { kind: 'number', nullable: false },
  archivedAt: { kind: 'text', nullable: true },
};

function cellOf(spec: FieldSpec): Omit<CsvColumn, 'name'> {
  const kind = spec.type === 'number' || spec.type === 'integer' ? 'number' : spec.type === 'flag' ? 'boolean' : 'text';
  return { kind, nullable: spec.nullable === true };
}

export function csvColumns(kind: CsvKind): CsvColumn[] {
  const fields: FieldCatalogue = FIELD_CATALOGUES[kind];
  return FIELD_ORDER[kind].map((name) => {
    const spec = fields[name];
    const cell = spec ? cellOf(spec) : BOOKKEEPING[name];
    if (!cell) throw new Error(`the ${kind} column "${name}" is in no catalogue`);
    return { name, ...cell };
  });
}

/**
 * What a spreadsheet may run as a formula, or strip before one: the formula starters
 * = + - @ (and their full-width, small and typographic forms, which some spreadsheets fold to
 * the ASCII ones, or which autocorrect may have put in place of a hyphen), and every control,
 * space and invisible character that may be trimmed off the front of a cell (NUL, tab, CR,
 * LF, NBSP, zero-width space, byte-order mark, ideographic space).
 */
const LEAD = /[=+\-@\uFF1D\uFF0B\uFF0D\uFF20\uFE66\uFE62\uFE63\u2212\u2010-\u2015\u0000-\u0020\u007F-\u00A0\u00AD\u1680\u180E\u2000-\u200F\u2028-\u202F\u205F-\u2064\u3000\uFEFF]/u.source;
const FORMULA_START = new RegExp(`^'*${LEAD}`, 'u');
const ESCAPED_FORMULA = new RegExp(`^''*${LEAD}`, 'u');
const NUMBER = /^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$/;

/**
 * Text a spreadsheet could run as a formula gets a leading apostrophe (and so does text that
 * already looks escaped, so reading is exact). Reading strips one apostrophe before any
 * character of the same set, so the escape is still recognised when a spreadsheet trimmed or
 * swapped the character after it (a zero-width space dropped, a hyphen turned into a dash).
 */
export function escapeFormula(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

export function unescapeFormula(text: string): string {
  return ESCAPED_FORMULA.test(text) ? text.slice(1) : text;
}

/** Whether a cell read as a number: for telling an id a spreadsheet rewrote (`001` → `1`). */
export function looksNumeric(text: string): boolean {
  return NUMBER.test(text.trim());
}

export function toCell(column: CsvColumn, value: unknown): string {
  if (value === null || value === undefined) return '';
  if (column.kind === 'number') return String(value);
  if (column.kind === 'boolean') return value ? 'true' : 'false';
  return escapeFormula(String(value));
}

/** A cell as the value the record schema should see; a cell that is not a number stays text, so the schema names the problem. */
export function fromCell(column: CsvColumn, cell: string): unknown {
  if (column.kind === 'number') {
    const t = cell.trim();
    if (t === '') return column.nullable ? null : undefined;
    return NUMBER.test(t) ? Number(t) : cell;
  }
  if (column.kind === 'boolean') {
    const t = cell.trim().toLowerCase();
    if (t === '') return undefined;
    return t === 'true' ? true : t === 'false' ? false : cell;
  }
  if (cell === '' && column.nullable) return null;
  return unescapeFormula(cell);
}
