// The columns of each part kind's CSV and how a cell turns into a field and back.
//
// Number policy: numeric fields are written as plain numbers (JavaScript's shortest form that
// reads back to the same value) and never escaped: a spreadsheet reads a plain number as a
// number, not a formula, and a minus sign there is data. Text fields (names, notes, owner,
// class) that start with = + - @, a tab or a CR are written with a leading apostrophe so a
// spreadsheet shows them as text instead of running them; reading strips that one apostrophe.
// An empty cell is "not known" (null) for a field that may be unknown, and the form's default
// for a field that has one.

import type * as v from 'valibot';
import { FIELD_ORDER, fleetRecordSchemas } from './fleet-schemas';

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

interface SchemaLike {
  type: string;
  wrapped?: SchemaLike;
}

function cellKindOf(schema: SchemaLike): { kind: CellKind; nullable: boolean } {
  let s: SchemaLike = schema;
  let nullable = false;
  while (s.wrapped && (s.type === 'optional' || s.type === 'nullable')) {
    if (s.type === 'nullable') nullable = true;
    s = s.wrapped;
  }
  return { kind: s.type === 'number' ? 'number' : s.type === 'boolean' ? 'boolean' : 'text', nullable };
}

export interface CsvColumn {
  name: string;
  kind: CellKind;
  nullable: boolean;
}

export function csvColumns(kind: CsvKind): CsvColumn[] {
  const entries = fleetRecordSchemas[kind].entries as Record<string, v.GenericSchema>;
  return FIELD_ORDER[kind].map((name) => ({ name, ...cellKindOf(entries[name] as unknown as SchemaLike) }));
}

const FORMULA_START = /^'*[=+\-@\t\r]/;
const ESCAPED_FORMULA = /^''*[=+\-@\t\r]/;
const NUMBER = /^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$/;

/** Text a spreadsheet would run as a formula gets a leading apostrophe (and so does text that already looks escaped, so reading is exact). */
export function escapeFormula(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

export function unescapeFormula(text: string): string {
  return ESCAPED_FORMULA.test(text) ? text.slice(1) : text;
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
