import { readFileSync } from 'node:fs';

/**
 * The password for a PostgreSQL store kept in a file of its own (`?passwordfile=PATH` in the
 * URL), so that it is never typed on a command line, where shell history and process lists
 * would keep it. The file holds the password on its first line.
 */
export function readPasswordFile(path: string): string {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    const code = (error as { code?: unknown }).code;
    throw new Error(`the password file ${path} could not be read${typeof code === 'string' ? ` (${code})` : ''}`);
  }
  const first = text.split(/\r?\n/)[0] ?? '';
  if (first === '') throw new Error(`the password file ${path} is empty: put the password on its first line`);
  return first;
}
