import type { CallOutput, Client } from '../api/client';
import { partApi, type PartRecord } from '../parts/part-api';
import type { PartTable } from '../parts/part-kinds';
import type { SortDir } from '../parts/inventory';
import { Loader } from './loader.svelte';

const NONE: PartRecord[] = [];
type Usage = CallOutput<'inventory.usage'>;
const NO_USAGE: Usage = {};

/** One kind's records for the table, with or without the archived ones, and how builds use them. */
export class PartsTableState {
  includeArchived = $state(false);
  /** What the search box holds; every word must be found in a row. */
  query = $state('');
  /** The column the table is sorted by: a field key, or `usedBy` / `lastLog`. */
  sortKey = $state('name');
  sortDir = $state<SortDir>(1);
  readonly source = new Loader(() => partApi.list(this.client, this.table, this.includeArchived));
  readonly usageSource = new Loader(() => this.client.call('inventory.usage', { table: this.table }));
  rows = $derived(this.source.value ?? NONE);
  usage = $derived(this.usageSource.value ?? NO_USAGE);
  loaded = $derived(this.source.loaded);
  error = $derived(this.source.error?.message ?? this.usageSource.error?.message ?? null);

  constructor(
    private readonly client: Client,
    readonly table: PartTable,
  ) {}

  async load(): Promise<void> {
    await Promise.all([this.source.load(), this.usageSource.load()]);
  }

  /** A click on a column: sort by it, or turn its order round when it is already the one. */
  sortBy(key: string): void {
    if (this.sortKey === key) this.sortDir = this.sortDir === 1 ? -1 : 1;
    else {
      this.sortKey = key;
      this.sortDir = 1;
    }
  }

  follow(): () => void {
    const stopRows = this.source.follow(this.client, (event) => event.type === 'records-changed' && (event.kind === this.table || event.kind === 'fleet'));
    // A build added, changed or archived moves the counts.
    const stopUsage = this.usageSource.follow(this.client, (event) => event.type === 'verdicts-changed' || (event.type === 'records-changed' && ['builds', 'fleet', this.table].includes(event.kind)), { settleMs: 100 });
    return () => {
      stopRows();
      stopUsage();
    };
  }
}
