import type { ApiInput, ApiOutput } from '$service/handlers';
import type { Client } from '../api/client';
import { Loader } from './loader.svelte';

export type HistoryEntry = ApiOutput<'history.list'>[number];
export type HistoryQuery = Omit<NonNullable<ApiInput<'history.list'>>, 'limit' | 'beforeId'>;

const NONE: HistoryEntry[] = [];

/** A timeline: the newest entries first, older ones paged in on request. */
export class HistoryState {
  /** The first page; a re-read starts the timeline again from it. */
  readonly source = new Loader<HistoryEntry[]>(
    () => this.client.call('history.list', { ...this.query, limit: this.pageSize }),
    (page) => {
      this.#older = NONE;
      this.more = page.length === this.pageSize;
    },
  );
  #older = $state.raw<HistoryEntry[]>(NONE);
  entries = $derived([...(this.source.value ?? NONE), ...this.#older]);
  loaded = $derived(this.source.loaded);
  error = $derived(this.source.error?.message ?? null);
  more = $state(false);

  constructor(
    private readonly client: Client,
    readonly query: HistoryQuery,
    readonly pageSize = 50,
  ) {}

  async load(): Promise<void> {
    await this.source.load();
  }

  async loadMore(): Promise<void> {
    const last = this.entries[this.entries.length - 1];
    if (!last) return;
    const page = await this.client.call('history.list', { ...this.query, limit: this.pageSize, beforeId: last.id });
    this.#older = [...this.#older, ...page];
    this.more = page.length === this.pageSize;
  }

  /** Every write appends history, and every write sends an event: re-read the first page. */
  follow(): () => void {
    return this.source.follow(this.client, (event) => event.type === 'records-changed' || event.type === 'verdicts-changed');
  }
}
