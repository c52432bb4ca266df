import { mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { CliFailure, type CliIo } from './cli-io';
import { EXIT } from './exit-codes';

/** Writes beside the target and renames, so an interrupted export never leaves half a file. */
export function writeOutputFile(io: CliIo, file: string, text: string): string {
  const path = resolve(io.cwd, file);
  const partial = join(dirname(path), `.${basename(path)}.partial-${process.pid}`);
  try {
    mkdirSync(dirname(path), { recursive: true });
    writeFileSync(partial, text, 'utf8');
    renameSync(partial, path);
    return path;
  } catch (error) {
    try {
      rmSync(partial, { force: true });
    } catch {
      // Nothing was made (the folder could not be): nothing to remove.
    }
    // The system's message names the temporary file beside the target; the person only knows their own.
    throw new CliFailure(EXIT.store, `Cannot write ${file}: ${writeReason(error)}`);
  }
}

function writeReason(error: unknown): string {
  switch ((error as { code?: string }).code) {
    case 'ENOENT':
    case 'ENOTDIR':
      return 'its folder cannot be made or is not a folder.';
    case 'EACCES':
    case 'EPERM':
      return 'permission denied.';
    case 'EROFS':
      return 'the disk or folder is read-only.';
    case 'ENOSPC':
    case 'EDQUOT':
      return 'the disk is full (nothing was written; free some space and try again).';
    case 'EISDIR':
      return 'it is a folder, not a file.';
    default:
      return `the system refused the write (${(error as { code?: string }).code ?? 'unknown reason'}); nothing was written.`;
  }
}
