/** What a command may touch of the outside world; tests pass their own. */
export interface CliIo {
  out(text: string): void;
  err(text: string): void;
  env: NodeJS.ProcessEnv;
  cwd: string;
  /** A terminal on stderr gets a progress line redrawn in place. */
  errIsTty: boolean;
  now: () => Date;
}

export function processIo(): CliIo {
  return {
    out: (text) => process.stdout.write(text),
    err: (text) => process.stderr.write(text),
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
