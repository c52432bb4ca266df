import { runCli } from '../../src-main/cli/run-cli';
import type { CliIo } from '../../src-main/cli/cli-io';

export interface CliRun {
  code: number;
  out: string;
  err: string;
}

/** Runs `rigbook ARGS` in-process with captured output, the way the real entry does. */
export async function rigbook(args: string[], options: { cwd?: string; env?: NodeJS.ProcessEnv; tty?: boolean; now?: Date; stdin?: string | Uint8Array } = {}): Promise<CliRun> {
  let out = '';
  let err = '';
  const io: CliIo = {
    out: (t) => {
      out += t;
    },
    err: (t) => {
      err += t;
    },
    // No RIGBOOK_DB from the machine running the tests, unless a test passes one.
    env: options.env ?? { HOME: process.env.HOME },
    cwd: options.cwd ?? process.cwd(),
    errIsTty: options.tty ?? false,
    now: () => options.now ?? new Date('2026-12-01T09:30:00Z'),
    readStdin: async () => (typeof options.stdin === 'string' ? new TextEncoder().encode(options.stdin) : (options.stdin ?? new Uint8Array())),
  };
  const code = await runCli(args, io);
  return { code, out, err };
}
