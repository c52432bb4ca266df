import { ApiCallError, asApiError, type Client } from '../api/client';
import { Loader } from './loader.svelte';

/** Whether the store holds anything yet, and the first-start offer of the demo fleet. */
export class StoreInfoState {
  readonly source = new Loader(() => this.client.call('store.info', {}));
  empty = $derived(this.source.value?.empty ?? false);
  loaded = $derived(this.source.value !== null);
  counts = $derived(this.source.value?.counts ?? {});
  demoAvailable = $state(true);
  demoBusy = $state(false);
  demoMessage = $state<string | null>(null);

  constructor(private readonly client: Client) {}

  async load(): Promise<void> {
    await this.source.load();
  }

  follow(): () => void {
    return this.source.follow(this.client, (event) => event.type === 'records-changed');
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
