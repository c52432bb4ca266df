import type { ServiceEvent } from '../service/contract';
import type { CliIo } from './cli-io';

const WORDS: Readonly<Record<string, string>> = {
  check: 'Checking records',
  write: 'Writing records',
  export: 'Reading records',
  backup: 'Copying pages',
};

/**
 * Prints progress events on stderr: one line redrawn in place on a terminal; elsewhere (a
 * log, a pipe) a line at each quarter, and only for tasks big enough to take a while.
 */
export function progressPrinter(io: CliIo): { onEvent: (event: ServiceEvent) => void; finish: () => void } {
  let open = false;
  const lastQuarter = new Map<string, number>();
  return {
    onEvent(event) {
      if (event.type !== 'progress' || event.total <= 0) return;
      const label = `${WORDS[event.task] ?? event.task}: ${event.done} of ${event.total}`;
      if (io.errIsTty) {
        io.err(`\r${label}\u001b[K`);
        open = true;
        if (event.done >= event.total) {
          io.err('\n');
          open = false;
        }
        return;
      }
      if (event.total < 1000) return;
      const quarter = Math.floor((event.done / event.total) * 4);
      if (quarter === (lastQuarter.get(event.task) ?? -1)) return;
      lastQuarter.set(event.task, quarter);
      io.err(`${label}\n`);
    },
    finish() {
      if (open) io.err('\n');
      open = false;
    },
  };
}
