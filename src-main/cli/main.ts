// Entry of the `rigbook` command (bundled to dist-main/cli.cjs; `npm run rigbook -- ARGS`
// runs it from source). Everything else lives in run-cli.ts so tests can run it in-process.

import { processIo } from './cli-io';
import { runCli } from './run-cli';

runCli(process.argv.slice(2), processIo()).then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    process.stderr.write(`rigbook: ${error instanceof Error ? error.message : String(error)}\n`);
    process.exitCode = 4;
  },
);
