import { parseArgs } from 'node:util';
import { CliFailure, type CliIo } from './cli-io';
import type { Command } from './command';
import { backupCommand } from './commands/backup';
import { checkCommand } from './commands/check';
import { demoCommand } from './commands/demo';
import { exportCommand } from './commands/export';
import { importCommand } from './commands/import';
import { restoreCommand } from './commands/restore';
import { EXIT, EXIT_CODES_HELP } from '../shell-common/exit-codes';
import { storePath } from './open-store';
import { describeStorageError } from '../store/storage-errors';
import { RIGBOOK_VERSION } from './version';
import { ENGINE_VERSION } from '../core/engine-version';
import { FLEET_VERSION } from '../service/fleet/fleet-format';

export const COMMANDS: readonly Command[] = [checkCommand, importCommand, exportCommand, backupCommand, restoreCommand, demoCommand];

const GLOBAL_OPTIONS = {
  db: { type: 'string' },
  json: { type: 'boolean' },
  help: { type: 'boolean', short: 'h' },
} as const;

function usage(): string {
  const width = Math.max(...COMMANDS.map((c) => c.name.length)) + 2;
  return `Usage: rigbook COMMAND [options]

Build records and rating checks for electric RC vehicles, from the command line.

Commands:
${COMMANDS.map((c) => `  ${c.name.padEnd(width)}${c.summary}`).join('\n')}

Options for every command:
  --db PATH    the store to use (else RIGBOOK_DB, else the app's data folder); a SQLite file,
               or a PostgreSQL database as postgres://USER@HOST/DATABASE (see DEVELOPERS.md)
  --json       print data as JSON where the command prints data
  -h, --help   help for a command: rigbook COMMAND --help
  --version    print the version of rigbook, of its rules engine and of the file format

${EXIT_CODES_HELP}
`;
}

/** The command's name: the first argument that is neither an option nor the value of --db. */
function splitCommand(argv: readonly string[]): { name: string | undefined; rest: string[] } {
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === '--db') {
      i++;
      continue;
    }
    if (a === '--') break;
    if (!a.startsWith('-')) return { name: a, rest: [...argv.slice(0, i), ...argv.slice(i + 1)] };
  }
  return { name: undefined, rest: [...argv] };
}

/** Runs one `rigbook` command line; returns the exit code. Never throws for a person's mistake. */
export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  if (argv.length === 1 && (argv[0] === '--version' || argv[0] === '-V')) {
    io.out(`rigbook ${RIGBOOK_VERSION} (rules engine ${ENGINE_VERSION}, fleet file version ${FLEET_VERSION})\n`);
    return EXIT.ok;
  }
  const { name, rest } = splitCommand(argv);
  if (name === undefined || name === 'help') {
    const topic = name === 'help' ? rest.find((a) => !a.startsWith('-')) : undefined;
    const command = COMMANDS.find((c) => c.name === topic);
    if (command) {
      io.out(`${command.help}\n`);
      return EXIT.ok;
    }
    const asked = name === 'help' || rest.includes('--help') || rest.includes('-h');
    (asked ? io.out : io.err)(usage());
    return asked ? EXIT.ok : EXIT.usage;
  }
  const command = COMMANDS.find((c) => c.name === name);
  if (!command) {
    io.err(`rigbook: there is no command "${name}". The commands are: ${COMMANDS.map((c) => c.name).join(', ')}. See rigbook --help.\n`);
    return EXIT.usage;
  }
  let parsed: ReturnType<typeof parseArgs>;
  try {
    parsed = parseArgs({ args: rest, options: { ...GLOBAL_OPTIONS, ...command.options }, allowPositionals: true, strict: true });
  } catch (error) {
    io.err(`rigbook ${command.name}: ${(error as Error).message}. See rigbook ${command.name} --help.\n`);
    return EXIT.usage;
  }
  const values = parsed.values as Record<string, string | boolean | undefined>;
  if (values.help === true) {
    io.out(`${command.help}\n`);
    return EXIT.ok;
  }
  const { min, max } = command.positionals;
  if (parsed.positionals.length < min || parsed.positionals.length > max) {
    const want = min === max ? `${min === 0 ? 'no' : min} file argument${min === 1 ? '' : 's'}` : `at most ${max} file argument${max === 1 ? '' : 's'}`;
    io.err(`rigbook ${command.name}: takes ${want}. See rigbook ${command.name} --help.\n`);
    return EXIT.usage;
  }
  if (values.db === '') {
    io.err(`rigbook ${command.name}: --db needs a file path or a PostgreSQL URL, e.g. --db ./fleet.sqlite\n`);
    return EXIT.usage;
  }
  try {
    return await command.run({ positionals: parsed.positionals, values, io, dbPath: storePath(io, values.db as string | undefined) });
  } catch (error) {
    if (error instanceof CliFailure) {
      io.err(`rigbook ${command.name}: ${error.message}\n`);
      return error.code;
    }
    const storage = describeStorageError(error);
    if (storage) {
      // A person's problem to fix (space, permissions, another program): the message and SQLite's own words, no stack.
      io.err(`rigbook ${command.name}: ${storage.message}\n  (${storage.code}: ${error instanceof Error ? error.message : String(error)})\n`);
      return EXIT.store;
    }
    io.err(`rigbook ${command.name}: something went wrong: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
    return EXIT.store;
  }
}
