import { readFileSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import { decodeFileBytes, type FileEncoding } from '../service/fleet/decode-file-bytes';
import { CliFailure, type CliIo } from './cli-io';
import { EXIT } from '../shell-common/exit-codes';

export interface InputFile {
  /** How messages name it: the argument as the person typed it, or "standard input" for `-`. */
  label: string;
  text: string;
}

/** A file's text (or standard input's, for `-`), decoded strictly; exit 2 with the reason it could not be read. */
export async function readInputFile(io: CliIo, file: string, encoding: FileEncoding = 'utf-8'): Promise<InputFile> {
  const label = file === '-' ? 'standard input' : file;
  let bytes: Uint8Array;
  if (file === '-') {
    bytes = await io.readStdin();
  } else {
    const path = resolve(io.cwd, file);
    try {
      if (statSync(path).isDirectory()) throw new CliFailure(EXIT.unreadable, `Cannot read ${file}: it is a folder, not a file.`);
      bytes = readFileSync(path);
    } catch (error) {
      if (error instanceof CliFailure) throw error;
      const code = (error as { code?: string }).code;
      const why = code === 'ENOENT' ? 'there is no such file' : code === 'EACCES' || code === 'EPERM' ? 'permission denied' : (error as Error).message;
      throw new CliFailure(EXIT.unreadable, `Cannot read ${file}: ${why}.`);
    }
  }
  const decoded = decodeFileBytes(bytes, encoding);
  if (!decoded.ok) throw new CliFailure(EXIT.unreadable, `Cannot read ${label}: ${decoded.reason}`);
  return { label, text: decoded.text };
}
