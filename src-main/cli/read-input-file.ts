import { readFileSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import { CliFailure, type CliIo } from './cli-io';
import { EXIT } from './exit-codes';

/** A file's text, or exit 2 with the reason it could not be read. */
export function readInputFile(io: CliIo, file: string): { path: string; text: string } {
  const path = resolve(io.cwd, file);
  try {
    if (statSync(path).isDirectory()) throw new CliFailure(EXIT.unreadable, `Cannot read ${file}: it is a folder, not a file.`);
    return { path, text: readFileSync(path, 'utf8') };
  } catch (error) {
    if (error instanceof CliFailure) throw error;
    const code = (error as { code?: string }).code;
    const why = code === 'ENOENT' ? 'there is no such file' : code === 'EACCES' || code === 'EPERM' ? 'permission denied' : (error as Error).message;
    throw new CliFailure(EXIT.unreadable, `Cannot read ${file}: ${why}.`);
  }
}
