import type { ParseArgsConfig } from 'node:util';
import { FILE_ENCODINGS, type FileEncoding } from '../service/fleet/decode-file-bytes';
import { CliFailure, type CliIo } from './cli-io';
import { EXIT } from '../shell-common/exit-codes';

export type OptionSpec = NonNullable<ParseArgsConfig['options']>;

export interface CommandInput {
  positionals: string[];
  values: Record<string, string | boolean | undefined>;
  io: CliIo;
  /** The store this run uses (`--db`, RIGBOOK_DB or the data folder), as an absolute path. */
  dbPath: string;
}

export interface Command {
  name: string;
  summary: string;
  help: string;
  options: OptionSpec;
  /** How many file arguments it takes. */
  positionals: { min: number; max: number };
  run(input: CommandInput): Promise<number>;
}

export const flagValue = (values: CommandInput['values'], name: string): boolean => values[name] === true;
export const textValue = (values: CommandInput['values'], name: string): string | undefined => {
  const v = values[name];
  return typeof v === 'string' ? v : undefined;
};

export const ENCODING_HELP = `  --encoding E   the file's text encoding: utf-8 (the default; a byte-order mark is
                 fine) or windows-1252; any other bytes are refused, never guessed`;

/** `--encoding`, checked: UTF-8 unless the person names Windows-1252. */
export function encodingOption(values: CommandInput['values']): FileEncoding {
  const given = textValue(values, 'encoding');
  if (given === undefined) return 'utf-8';
  const e = given.toLowerCase() === 'utf8' ? 'utf-8' : given.toLowerCase() === 'cp1252' ? 'windows-1252' : given.toLowerCase();
  if (!(FILE_ENCODINGS as readonly string[]).includes(e)) throw new CliFailure(EXIT.usage, `--encoding must be ${FILE_ENCODINGS.join(' or ')} (not "${given}").`);
  return e as FileEncoding;
}
