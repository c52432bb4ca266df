import type { Status, VehicleKind } from '../../../src-main/core/domain';
import type { ServiceEvent } from '../../../src-main/service/contract';
import { asApiError, type Client } from '../api/client';
import type { BuildSummary } from '../builds/build-summary';
import { countByStatus, filterSummaries, haystackOf, ownersOf, sortSummaries, type SortDir, type SortKey } from '../builds/build-filter';

/**
 * Every build's summary, loaded once; sorting, filtering and search run here, on the client,
 * so typing stays under a frame. Service events re-read the list so a change made elsewhere
 * shows without a reload.
 */
export class BuildsListState {
  // Raw: 10 000 summaries must not become deep proxies.
  all = $state.raw<BuildSummary[]>([]);
  loaded = $state(false);
  error = $state<string | null>(null);
  sortKey = $state<SortKey>('status');
  sortDir = $state<SortDir>(1);
  text = $state('');
  statuses = $state<Status[]>([]);
  kinds = $state<VehicleKind[]>([]);
  owner = $state('');
  partId = $state('');
  selectedId = $state<string | null>(null);
  /** Build ids whose rows changed by an event in the last moments, to draw the eye. */
  recentlyChanged = $state.raw<ReadonlySet<string>>(new Set());

  haystacks = $derived(new Map(this.all.map((s) => [s.id, haystackOf(s)])));
  sorted = $derived(sortSummaries(this.all, this.sortKey, this.sortDir));
  visible = $derived(
    filterSummaries(this.sorted, { text: this.text, statuses: this.statuses, kinds: this.kinds, owner: this.owner, partId: this.partId }, this.haystacks),
  );
  owners = $derived(ownersOf(this.all));
  counts = $derived(countByStatus(this.all));
  selectedIndex = $derived(this.selectedId === null ? -1 : this.visible.findIndex((s) => s.id === this.selectedId));
  filtering = $derived(this.text.trim() !== '' || this.statuses.length > 0 || this.kinds.length > 0 || this.owner !== '' || this.partId !== '');

  #timer: ReturnType<typeof setTimeout> | null = null;
  #pendingChanged = new Set<string>();

  constructor(private readonly client: Client) {}

  async load(): Promise<void> {
    try {
      const rows = await this.client.call('builds.list', {});
      // For the benchmark: the time from here to the first row on screen is a budget.
      performance.mark('rigbook:builds-data');
      this.all = rows;
      this.error = null;
    } catch (error) {
      this.error = asApiError(error).message;
    } finally {
      this.loaded = true;
    }
  }

  /** Follows the service's change events; returns the function that stops. */
  follow(): () => void {
    const stop = this.client.onEvent((event) => this.onEvent(event));
    return () => {
      stop();
      if (this.#timer) clearTimeout(this.#timer);
    };
  }

  onEvent(event: ServiceEvent): void {
    if (event.type === 'verdicts-changed') for (const id of event.buildIds) this.#pendingChanged.add(id);
    else if (event.type !== 'records-changed' || !['builds', 'vehicles', 'batteries', 'motors', 'controllers', 'propellers'].includes(event.kind)) return;
    // One re-read for a burst of events (a fleet import sends many).
    if (this.#timer) clearTimeout(this.#timer);
    this.#timer = setTimeout(() => void this.refresh(), 120);
  }

  private async refresh(): Promise<void> {
    this.#timer = null;
    const changed = new Set(this.#pendingChanged);
    this.#pendingChanged.clear();
    await this.load();
    this.recentlyChanged = changed;
  }

  sortBy(key: SortKey): void {
    if (this.sortKey === key) this.sortDir = this.sortDir === 1 ? -1 : 1;
    else {
      this.sortKey = key;
      this.sortDir = 1;
    }
  }

  toggleStatus(status: Status): void {
    this.statuses = this.statuses.includes(status) ? this.statuses.filter((s) => s !== status) : [...this.statuses, status];
  }

  toggleKind(kind: VehicleKind): void {
    this.kinds = this.kinds.includes(kind) ? this.kinds.filter((k) => k !== kind) : [...this.kinds, kind];
  }

  clearFilters(): void {
    this.text = '';
    this.statuses = [];
    this.kinds = [];
    this.owner = '';
    this.partId = '';
  }

  selectIndex(index: number): void {
    this.selectedId = this.visible[index]?.id ?? null;
  }
}
