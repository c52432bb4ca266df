// Small helpers for timing: medians over runs, never a single lucky or unlucky sample.

export function median(values: readonly number[]): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/** The value that a share `p` (0–1) of the values do not exceed, nearest rank; NaN for none. */
export function percentile(values: readonly number[], p: number): number {
  if (values.length === 0) return Number.NaN;
  return [...values].sort((a, b) => a - b)[Math.min(values.length - 1, Math.floor(values.length * p))]!;
}

export function worst(values: readonly number[]): number {
  return values.length === 0 ? Number.NaN : Math.max(...values);
}

export function mean(values: readonly number[]): number {
  return values.length === 0 ? Number.NaN : values.reduce((a, b) => a + b, 0) / values.length;
}

/** Milliseconds since an arbitrary origin, with sub-millisecond resolution. */
export function nowMs(): number {
  return performance.now();
}

/** Runs `body` and returns its result with the time it took in ms. */
export async function timed<T>(body: () => Promise<T> | T): Promise<{ value: T; ms: number }> {
  const started = nowMs();
  const value = await body();
  return { value, ms: nowMs() - started };
}

/** Lets the event loop breathe and the collector run between runs, so one run's garbage is not billed to the next. */
export async function settle(): Promise<void> {
  (globalThis as { gc?: () => void }).gc?.();
  await new Promise((resolve) => setTimeout(resolve, 20));
}
