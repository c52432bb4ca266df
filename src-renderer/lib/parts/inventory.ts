// The parts tables at shop scale: a search over every shown cell and a sort by any column,
// numbers by value and text in the order a person reads it. A cell with nothing in it sorts
// last whichever way the column is sorted, so the unknown ratings gather at the bottom.
import { collator } from '../builds/text-order';

export type CellValue = number | string | null;

export type SortDir = 1 | -1;

/** True when every word of the query is found in the row's text, ignoring case. */
export function matchesSearch(haystack: string, query: string): boolean {
  const words = query.toLowerCase().split(/\s+/).filter(Boolean);
  if (words.length === 0) return true;
  const text = haystack.toLowerCase();
  return words.every((w) => text.includes(w));
}

export function compareCells(a: CellValue, b: CellValue, dir: SortDir): number {
  const emptyA = a === null || a === '';
  const emptyB = b === null || b === '';
  if (emptyA || emptyB) return emptyA === emptyB ? 0 : emptyA ? 1 : -1;
  if (typeof a === 'number' && typeof b === 'number') return (a - b) * dir;
  return collator.compare(String(a), String(b)) * dir;
}

/** The rows matching the query, sorted by one column; ties keep the given order (by name). */
export function inventoryRows<R>(rows: readonly R[], options: { query: string; text: (row: R) => string; value: (row: R) => CellValue; dir: SortDir }): R[] {
  const kept = rows.filter((r) => matchesSearch(options.text(r), options.query));
  return kept
    .map((row, index) => ({ row, index, value: options.value(row) }))
    .sort((x, y) => compareCells(x.value, y.value, options.dir) || x.index - y.index)
    .map((x) => x.row);
}
