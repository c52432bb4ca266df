import { mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { storeFileClash } from '../store/file-identity';
import { describeStorageError } from '../store/storage-errors';
import { CliFailure, type CliIo } from './cli-io';
import { EXIT } from '../shell-common/exit-codes';

/**
 * Writes beside the target and renames, so an interrupted export never leaves half a file.
 * Refuses a target that is the store (or a file SQLite keeps beside it) under any spelling.
 */
export function writeOutputFile(io: CliIo, file: string, text: string, storePath: string): string {
  const path = resolve(io.cwd, file);
  const clash = storeFileClash(path, storePath);
  if (clash) throw new CliFailure(EXIT.store, `Cannot write ${file}: it ${clash}. Nothing was written; name another file.`);
  const partial = join(dirname(path), `.${basename(path)}.partial-${process.pid}`);
  try {
    mkdirSync(dirname(path), { recursive: true });
    writeFileSync(partial, text, 'utf8');
    // Checked again just before the rename, which is what would replace the store.
    const late = storeFileClash(path, storePath);
    if (late) throw new CliFailure(EXIT.store, `Cannot write ${file}: it ${late}. Nothing was written; name another file.`);
    renameSync(partial, path);
    return path;
  } catch (error) {
    try {
      rmSync(partial, { force: true });
    } catch {
      // Nothing was made (the folder could not be): nothing to remove.
    }
    if (error instanceof CliFailure) throw error;
    // The system's message names the temporary file beside the target; the person only knows
    // their own, so the reason is worded here and only the system's code is kept.
    const code = (error as { code?: string }).code;
    throw new CliFailure(EXIT.store, `Cannot write ${file}: ${writeReason(error, dirname(path))}${code ? ` (${code})` : ''}`);
  }
}

function writeReason(error: unknown, folder: string): string {
  const storage = describeStorageError(error, folder);
  if (storage?.problem === 'disk-full') return `the disk holding ${folder} is full. Nothing was written; free some space and try again.`;
  switch ((error as { code?: string }).code) {
    case 'ENOENT':
    case 'ENOTDIR':
      return 'its folder cannot be made or is not a folder. Nothing was written.';
    case 'EACCES':
    case 'EPERM':
    case 'EROFS':
      return `${folder} cannot be written (read-only, or another user's). Nothing was written.`;
    case 'EISDIR':
      return 'it is a folder, not a file. Nothing was written.';
    default:
      return 'the system refused the write. Nothing was written.';
  }
}
