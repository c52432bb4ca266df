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
    rmSync(partial, { force: true });
    throw new CliFailure(EXIT.store, `Cannot write ${file}: ${(error as Error).message}`);
  }
}
