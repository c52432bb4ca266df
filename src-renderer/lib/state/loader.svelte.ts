import type { ApiError, ServiceEvent } from '$service/contract';
import { asApiError, type Client } from '../api/client';

/**
 * One thing a screen reads from the service: the last value that came back, whether a read is
 * under way, and the error of the last read. A re-read keeps the value on screen until the new
 * one arrives, and a failed re-read keeps it too (with the error beside it), so a change made
 * elsewhere never blanks a screen. Only the newest read may answer: an older one that returns
 * late is dropped.
 */
export class Loader<T> {
  value = $state.raw<T | null>(null);
  error = $state<ApiError | null>(null);
  loading = $state(false);
  /** A first read has answered, with a value or an error. */
  loaded = $state(false);
  /** A value is shown while a newer one is being read. */
  reloading = $derived(this.loading && this.value !== null);

  #run = 0;
  #timer: ReturnType<typeof setTimeout> | null = null;

  constructor(
    private readonly read: () => Promise<T>,
    /** Runs with each new value before it is shown, for work that belongs with the value (indexes, marks). */
    private readonly onValue: (value: T) => void = () => undefined,
  ) {}

  /** Reads; true when this read's value is now shown. */
  async load(): Promise<boolean> {
    const run = ++this.#run;
    this.loading = true;
    try {
      const value = await this.read();
      if (run !== this.#run) return false;
      this.onValue(value);
      this.value = value;
      this.error = null;
      return true;
    } catch (error) {
      if (run === this.#run) this.error = asApiError(error);
      return false;
    } finally {
      if (run === this.#run) {
        this.loading = false;
        this.loaded = true;
      }
    }
  }

  /** After an error: the same read again. */
  retry(): Promise<boolean> {
    return this.load();
  }

  /**
   * Re-reads on the store-change events `affects` picks out. With `settleMs`, a burst of events
   * (a fleet import sends many) becomes one read, made once they stop. `before` runs as that
   * read starts and `after` once it is done. Returns the function that stops following.
   */
  follow(client: Pick<Client, 'onEvent'>, affects: (event: ServiceEvent) => boolean, options: { settleMs?: number; before?: () => void; after?: () => void } = {}): () => void {
    const { settleMs = 0, before, after } = options;
    const reread = () => {
      this.#timer = null;
      before?.();
      void this.load().then(() => after?.());
    };
    const stop = client.onEvent((event) => {
      if (!affects(event)) return;
      if (settleMs === 0) return reread();
      if (this.#timer) clearTimeout(this.#timer);
      this.#timer = setTimeout(reread, settleMs);
    });
    return () => {
      stop();
      if (this.#timer) clearTimeout(this.#timer);
      this.#timer = null;
    };
  }
}
