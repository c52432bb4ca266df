import type { Client } from '../api/client';
import { partApi, type PartRecord } from '../parts/part-api';
import type { PartTable } from '../parts/part-kinds';
import { Loader } from './loader.svelte';

const NONE: PartRecord[] = [];

/** One kind's records for the table, with or without the archived ones. */
export class PartsTableState {
  includeArchived = $state(false);
  readonly source = new Loader(() => partApi.list(this.client, this.table, this.includeArchived));
  rows = $derived(this.source.value ?? NONE);
  loaded = $derived(this.source.loaded);
  error = $derived(this.source.error?.message ?? null);

  constructor(
    private readonly client: Client,
    readonly table: PartTable,
  ) {}

  async load(): Promise<void> {
    await this.source.load();
  }

  follow(): () => void {
    return this.source.follow(this.client, (event) => event.type === 'records-changed' && event.kind === this.table);
  }
}
