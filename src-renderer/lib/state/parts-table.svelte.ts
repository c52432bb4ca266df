import { asApiError, type Client } from '../api/client';
import { partApi, type PartRecord } from '../parts/part-api';
import type { PartTable } from '../parts/part-kinds';

/** One kind's records for the table, with or without the archived ones. */
export class PartsTableState {
  rows = $state.raw<PartRecord[]>([]);
  includeArchived = $state(false);
  loaded = $state(false);
  error = $state<string | null>(null);

  constructor(
    private readonly client: Client,
    readonly table: PartTable,
  ) {}

  async load(): Promise<void> {
    try {
      this.rows = await partApi.list(this.client, this.table, this.includeArchived);
      this.error = null;
    } catch (error) {
      this.error = asApiError(error).message;
    } finally {
      this.loaded = true;
    }
  }

  follow(): () => void {
    return this.client.onEvent((event) => {
      if (event.type === 'records-changed' && event.kind === this.table) void this.load();
    });
  }
}
