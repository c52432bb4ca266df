import type { Client } from '../api/client';
import type { BuildSummary } from '../builds/build-summary';

/** The builds that use one part, as the service finds them through its part → builds index. */
export class UsedByState {
  builds = $state.raw<BuildSummary[]>([]);
  loaded = $state(false);

  constructor(
    private readonly client: Client,
    readonly partId: string,
  ) {}

  async load(): Promise<void> {
    this.builds = await this.client.call('builds.list', { partId: this.partId });
    this.loaded = true;
  }

  follow(): () => void {
    return this.client.onEvent((event) => {
      if (event.type === 'verdicts-changed' || (event.type === 'records-changed' && event.kind === 'builds')) void this.load();
    });
  }
}
