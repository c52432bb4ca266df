/** What a command may touch of the outside world; tests pass their own. */
export interface CliIo {
  out(text: string): void;
  err(text: string): void;
  env: NodeJS.ProcessEnv;
  cwd: string;
  /** A terminal on stderr gets a progress line redrawn in place. */
  errIsTty: boolean;
  now: () => Date;
  /** Everything on standard input (`-` as a file argument). */
  readStdin: () => Promise<Uint8Array>;
}

/**
 * A reader that stops early (`rigbook check f.json --json | head -1`) closes the pipe: the
 * write fails with EPIPE. The rest of the output is dropped quietly and the command still
 * ends with its own exit code, so a script is not told "over" about a clear fleet.
 */
function quietOnClosedPipe(stream: NodeJS.WriteStream): (text: string) => void {
  let closed = false;
  stream.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE' || error.code === 'ERR_STREAM_DESTROYED') closed = true;
    else throw error;
  });
  return (text) => {
    if (closed || stream.destroyed) return;
    try {
      stream.write(text);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EPIPE') throw error;
      closed = true;
    }
  };
}

async function readAll(stream: NodeJS.ReadStream): Promise<Uint8Array> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(typeof chunk === 'string' ? Buffer.from(chunk) : (chunk as Buffer));
  return Buffer.concat(chunks);
}

export function processIo(): CliIo {
  return {
    out: quietOnClosedPipe(process.stdout),
    err: quietOnClosedPipe(process.stderr),
    readStdin: () => readAll(process.stdin),
    env: process.env,
    cwd: process.cwd(),
    errIsTty: process.stderr.isTTY === true,
    now: () => new Date(),
  };
}

/** An error that ends the command with a message and an exit code. */
export class CliFailure extends Error {
  constructor(
    readonly code: number,
    message: string,
  ) {
    super(message);
    this.name = 'CliFailure';
  }
}
