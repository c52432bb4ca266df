import { looksNumeric } from './csv-columns';

/**
 * A stored id that equals `id` as a number (`001` and `1`, `1.50` and `1.5`, `100000` and
 * `1e5`): the id a spreadsheet rewrote. Null when there is none, or when `id` is stored as it is.
 */
export function numericTwin(id: string, stored: ReadonlySet<string>): string | null {
  if (stored.has(id) || !looksNumeric(id)) return null;
  const value = Number(id);
  for (const s of stored) if (looksNumeric(s) && Number(s) === value) return s;
  return null;
}
