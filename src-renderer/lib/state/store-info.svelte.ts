import { ApiCallError, asApiError, type Client } from '../api/client';

/** Whether the store holds anything yet, and the first-start offer of the demo fleet. */
export class StoreInfoState {
  empty = $state(false);
  loaded = $state(false);
  counts = $state<Record<string, number>>({});
  demoAvailable = $state(true);
  demoBusy = $state(false);
  demoMessage = $state<string | null>(null);

  constructor(private readonly client: Client) {}

  async load(): Promise<void> {
    const info = await this.client.call('store.info', {});
    this.empty = info.empty;
    this.counts = info.counts;
    this.loaded = true;
  }

  follow(): () => void {
    return this.client.onEvent((event) => {
      if (event.type === 'records-changed') void this.load();
    });
  }

  /**
   * Loads the demo fleet through `demo.load` when this version has it; an older service
   * without it answers `unknown-handler` and the offer is withdrawn.
   */
  async loadDemo(): Promise<boolean> {
    this.demoBusy = true;
    this.demoMessage = null;
    try {
      await this.client.call('demo.load', {});
      await this.load();
      return true;
    } catch (error) {
      if (error instanceof ApiCallError && error.kind === 'unknown-handler') {
        this.demoAvailable = false;
        this.demoMessage = 'This version has no demo fleet yet. Start by adding a pack and a vehicle.';
      } else {
        this.demoMessage = asApiError(error).message;
      }
      return false;
    } finally {
      this.demoBusy = false;
    }
  }
}
