import type { ParseArgsConfig } from 'node:util';
import type { CliIo } from './cli-io';

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
