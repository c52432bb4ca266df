import { mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { storeFileClash } from '../store/file-identity';
import { describeStorageError } from '../store/storage-errors';
import { CliFailure, type CliIo } from './cli-io';
import { EXIT } from './exit-codes';

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
    rmSync(partial, { force: true });
    if (error instanceof CliFailure) throw error;
    const storage = describeStorageError(error, dirname(path));
    if (storage && storage.problem !== 'in-use') {
      throw new CliFailure(EXIT.store, `Cannot write ${file}: ${storage.problem === 'disk-full' ? `the disk holding ${dirname(path)} is full` : `${dirname(path)} cannot be written (read-only, or another user's)`}. Nothing was written. (${storage.code}: ${(error as Error).message})`);
    }
    throw new CliFailure(EXIT.store, `Cannot write ${file}: ${(error as Error).message}`);
  }
}
