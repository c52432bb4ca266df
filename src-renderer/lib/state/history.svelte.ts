import type { ApiInput, ApiOutput } from '$service/handlers';
import { asApiError, type Client } from '../api/client';

export type HistoryEntry = ApiOutput<'history.list'>[number];
export type HistoryQuery = Omit<NonNullable<ApiInput<'history.list'>>, 'limit' | 'beforeId'>;

/** A timeline: the newest entries first, older ones paged in on request. */
export class HistoryState {
  entries = $state.raw<HistoryEntry[]>([]);
  loaded = $state(false);
  more = $state(false);
  error = $state<string | null>(null);

  constructor(
    private readonly client: Client,
    readonly query: HistoryQuery,
    readonly pageSize = 50,
  ) {}

  async load(): Promise<void> {
    try {
      const page = await this.client.call('history.list', { ...this.query, limit: this.pageSize });
      this.entries = page;
      this.more = page.length === this.pageSize;
      this.error = null;
    } catch (error) {
      this.error = asApiError(error).message;
    } finally {
      this.loaded = true;
    }
  }

  async loadMore(): Promise<void> {
    const last = this.entries[this.entries.length - 1];
    if (!last) return;
    const page = await this.client.call('history.list', { ...this.query, limit: this.pageSize, beforeId: last.id });
    this.entries = [...this.entries, ...page];
    this.more = page.length === this.pageSize;
  }

  /** Every write appends history, and every write sends an event: re-read the first page. */
  follow(): () => void {
    return this.client.onEvent((event) => {
      if (event.type === 'records-changed' || event.type === 'verdicts-changed') void this.load();
    });
  }
}
