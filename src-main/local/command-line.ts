import { parseArgs } from 'node:util';
import { EXIT } from '../shell-common/exit-codes';

export const LOCAL_HELP = `Usage: node dist-main/local-main.cjs [--db PATH] [--port N]

Serves Rigbook to the browser on this computer only (127.0.0.1) and prints the address to open,
with a one-time token in it. Opening the address without its token shows how to get it.

Options:
  --db PATH   the store to open (else RIGBOOK_DB, else rigbook.sqlite in the data folder):
              a SQLite file, or a PostgreSQL database as postgres://USER@HOST/DATABASE
  --port N    the port to listen on (else RIGBOOK_PORT, else a free one)
  --help      this text

Environment:
  RIGBOOK_DB, RIGBOOK_PORT   as the options above
  RIGBOOK_TOKEN              the token to use instead of a fresh random one (for tests)

Exit codes: 0 stopped normally; 1 could not start (store or port); ${EXIT.usage} wrong command line.
`;

export type LocalCommand = { kind: 'help' } | { kind: 'refused'; message: string } | { kind: 'serve'; db: string | undefined; port: number };

const OPTIONS = { db: { type: 'string' }, port: { type: 'string' }, help: { type: 'boolean', short: 'h' } } as const;

function read(args: string[]) {
  return parseArgs({ args, options: OPTIONS, allowPositionals: true, strict: true });
}

/** Reads the loopback shell's command line; anything it does not know is refused, never ignored. */
export function parseLocalArgs(args: string[], env: NodeJS.ProcessEnv = process.env): LocalCommand {
  let parsed: ReturnType<typeof read>;
  try {
    parsed = read(args);
  } catch (error) {
    const text = (error as Error).message;
    const host = /'(--host|--bind|--address)'/.exec(text)?.[1];
    if (host) return { kind: 'refused', message: `there is no ${host} option: the browser shell listens on 127.0.0.1 only (this computer)` };
    return { kind: 'refused', message: text.replace(/\. To specify a positional argument starting with a '-'.*$/s, '') };
  }
  if (parsed.values.help) return { kind: 'help' };
  if (parsed.positionals.length > 0) return { kind: 'refused', message: `unexpected argument "${parsed.positionals[0]}" (the store is given with --db PATH)` };
  if (parsed.values.db === '') return { kind: 'refused', message: '--db needs a file path, e.g. --db ./fleet.sqlite' };
  const portText = parsed.values.port ?? env.RIGBOOK_PORT;
  const port = portText === undefined ? 0 : Number(portText);
  if (portText?.trim() === '' || !Number.isInteger(port) || port < 0 || port > 65535) {
    return { kind: 'refused', message: `${parsed.values.port === undefined ? 'RIGBOOK_PORT' : '--port'}: "${portText}" is not a port number (0 to 65535)` };
  }
  return { kind: 'serve', db: parsed.values.db, port };
}
