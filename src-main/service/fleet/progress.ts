/** A long task's progress: the command line prints it as a line, the service emits it as an event. */
export interface Progress {
  task: string;
  done: number;
  total: number;
}

export type OnProgress = (progress: Progress) => void;

/**
 * Reports at most about a hundred steps per task, always the first and the last, so a
 * ten-thousand-build import does not flood a window or a terminal.
 */
export function progressCounter(onProgress: OnProgress | undefined, task: string, total: number): (done: number) => void {
  if (!onProgress) return () => {};
  const step = Math.max(1, Math.floor(total / 100));
  let last = -1;
  return (done) => {
    if (done === last) return;
    if (done === 0 || done >= total || done - last >= step) {
      last = done;
      onProgress({ task, done, total });
    }
  };
}
