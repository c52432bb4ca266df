import type { Client } from '../api/client';
import type { BuildSummary } from '../builds/build-summary';
import { Loader } from './loader.svelte';

const NONE: BuildSummary[] = [];

/** The builds that use one part, as the service finds them through its part → builds index. */
export class UsedByState {
  readonly source = new Loader(() => this.client.call('builds.list', { partId: this.partId }));
  builds = $derived(this.source.value ?? NONE);
  loaded = $derived(this.source.value !== null);

  constructor(
    private readonly client: Client,
    readonly partId: string,
  ) {}

  async load(): Promise<void> {
    await this.source.load();
  }

  follow(): () => void {
    return this.source.follow(this.client, (event) => event.type === 'verdicts-changed' || (event.type === 'records-changed' && event.kind === 'builds'));
  }
}
