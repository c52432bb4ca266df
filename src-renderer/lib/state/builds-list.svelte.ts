import type { Status, VehicleKind } from '$core/domain';
import type { ServiceEvent } from '$service/contract';
import { decodeColumns } from '$core/column-table';
import type { Client } from '../api/client';
import { Loader } from './loader.svelte';
import { MAX_COMPARED } from '../compare/compare-limit';
import type { BuildSummary } from '../builds/build-summary';
import { DEFAULT_LIST_QUERY, type ListQuery } from '../builds/list-query';
import { countByStatus, filterKey, haystackOf, isEmptyFilter, matchingPositions, narrows, customersOf, ruleOptions, RuleFlags, sortSummaries, type BuildFilter, type SortDir, type SortKey } from '../builds/build-filter';

const NONE: BuildSummary[] = [];
/** Filters whose answers are kept (see #recent): a word typed and taken back, and a little more. */
const RECENT_FILTERS = 12;

/** Runs work when the page is idle (after the next frame where idle callbacks are missing). */
function later(work: (deadline?: { timeRemaining(): number }) => void): void {
  if (typeof requestIdleCallback === 'function') requestIdleCallback(work, { timeout: 1000 });
  else setTimeout(work, 16);
}

/**
 * Every build's summary, loaded once; sorting, filtering and search run here, on the client,
 * so typing stays under a frame. Service events re-read the list so a change made elsewhere
 * shows without a reload.
 */
export class BuildsListState {
  // The loader keeps them raw: 10 000 summaries must not become deep proxies. Only its newest
  // read answers (see loader.svelte.ts), so switching between the active and the archived list
  // never shows the list asked for before.
  readonly source = new Loader<BuildSummary[]>(
    // The compact column form: about a fifth of the row objects' size at 10 000 builds.
    async () => decodeColumns(await this.client.call('builds.listColumns', this.archived ? { includeArchived: true } : {})),
    (rows) => {
      // For the benchmark: the time from here to the first row on screen is a budget.
      performance.mark('rigbook:builds-data');
      this.#haystacks = new Map();
      this.#flags = new RuleFlags();
      this.#prepareSearch(rows);
    },
  );
  all = $derived(this.source.value ?? NONE);
  loaded = $derived(this.source.loaded);
  error = $derived(this.source.error?.message ?? null);
  sortKey = $state<SortKey>('status');
  sortDir = $state<SortDir>(1);
  text = $state('');
  statuses = $state<Status[]>([]);
  kinds = $state<VehicleKind[]>([]);
  /** '' every customer, '-' the shop's own, else a customer id. */
  customer = $state('');
  partId = $state('');
  /** '' any check, else a rule id: builds where that check is not clear (see chooseRule). */
  rule = $state('');
  /** Lists the archived builds instead of the active ones. */
  archived = $state(false);
  selectedId = $state<string | null>(null);
  /** Builds marked for comparing, in the order marked (two to four make a comparison). */
  compareIds = $state<string[]>([]);
  /** Said when a fifth build is marked: the marks stay as they were. */
  compareNote = $state<string | null>(null);
  /** Build ids whose rows changed by an event in the last moments, to draw the eye. */
  recentlyChanged = $state.raw<ReadonlySet<string>>(new Set());

  /**
   * The lower-cased text search looks in, by build id. Not reactive and not built with the
   * list: it is filled in idle time once the rows are on screen (see #prepareSearch), and the
   * filter works out any entry still missing itself, so the answer is the same either way.
   */
  #haystacks = new Map<string, string>();
  #preparing = 0;
  /** The same texts by position in `sorted`, for the sorted list they were laid out for: no lookup by id per keystroke. */
  #hayOf: readonly BuildSummary[] | null = null;
  #hay: (string | undefined)[] = [];
  /** The last filter and the positions it let through: a keystroke that only narrows it looks at those alone. */
  #lastFilter: { from: readonly BuildSummary[]; filter: BuildFilter; positions: number[] | null } | null = null;
  /**
   * The last few filters' answers on the sorted list they ran on, by filterKey: a deletion goes
   * back to a filter just typed through ('777' → '77'), and is answered here instead of by a pass
   * over every build.
   */
  #recent = new Map<string, { positions: number[]; rows: readonly BuildSummary[] }>();
  #recentOf: readonly BuildSummary[] | null = null;
  /** Each list's stored checks, decoded once per distinct text. */
  #flags = new RuleFlags();
  /** The builds of the list shown: the active ones, or the archived ones. */
  scoped = $derived(this.archived ? this.all.filter((s) => s.archivedAt !== null) : this.all);
  sorted = $derived(sortSummaries(this.scoped, this.sortKey, this.sortDir));
  /** The chosen check's status of each sorted row, by position: worked out when the list or the check changes, not per keystroke. */
  ruleStatuses = $derived(this.rule === '' ? null : this.#flags.statusesOf(this.sorted, this.rule));
  /** What the list is narrowed by, in one value: the filter, the address and "is anything filtered" all read it. */
  filter = $derived<BuildFilter>({ text: this.text, statuses: this.statuses, kinds: this.kinds, customer: this.customer, partId: this.partId, rule: this.rule });
  visible = $derived(this.#filter(this.sorted, this.filter));
  customers = $derived(customersOf(this.all));
  /** The check filter's options: the rule catalogue, and the class checks the list flags. */
  rules = $derived(ruleOptions(this.#flags.classRules(this.all), this.rule));
  counts = $derived(countByStatus(this.sorted, this.ruleStatuses ?? undefined));
  /** Everything the address keeps of the list (see list-query.ts). */
  query = $derived<ListQuery>({
    ...this.filter,
    sortKey: this.sortKey,
    sortDir: this.sortDir,
    archived: this.archived,
  });
  selectedIndex = $derived(this.selectedId === null ? -1 : this.visible.findIndex((s) => s.id === this.selectedId));
  filtering = $derived(!isEmptyFilter(this.filter));

  #pendingChanged = new Set<string>();
  #marking = new Set<string>();

  constructor(private readonly client: Client) {}

  async load(): Promise<void> {
    await this.source.load();
  }

  #filter(sorted: readonly BuildSummary[], filter: BuildFilter): readonly BuildSummary[] {
    if (this.#hayOf !== sorted) {
      this.#hayOf = sorted;
      this.#hay = new Array<string | undefined>(sorted.length);
    }
    const last = this.#lastFilter;
    if (isEmptyFilter(filter)) {
      this.#lastFilter = { from: sorted, filter, positions: null };
      return sorted;
    }
    if (this.#recentOf !== sorted) {
      this.#recentOf = sorted;
      this.#recent.clear();
    }
    const key = filterKey(filter);
    const known = this.#recent.get(key);
    if (known) {
      // Most recent last, so the oldest is the first to go.
      this.#recent.delete(key);
      this.#recent.set(key, known);
      this.#lastFilter = { from: sorted, filter, positions: known.positions };
      return known.rows;
    }
    const hay = this.#hay;
    const byId = this.#haystacks;
    const haystackAt = (i: number): string => (hay[i] ??= byId.get(sorted[i]!.id) ?? haystackOf(sorted[i]!));
    const within = last !== null && last.from === sorted && last.positions !== null && narrows(last.filter, filter) ? last.positions : undefined;
    const positions = matchingPositions(sorted, filter, haystackAt, within, this.ruleStatuses ?? undefined);
    this.#lastFilter = { from: sorted, filter, positions };
    const rows = positions.map((i) => sorted[i]!);
    this.#recent.set(key, { positions, rows });
    if (this.#recent.size > RECENT_FILTERS) this.#recent.delete(this.#recent.keys().next().value!);
    return rows;
  }

  /**
   * Builds the search texts a slice at a time when the page is idle, so the first rows are not
   * kept waiting for 10 000 of them and typing finds them ready. A newer load stops an older fill.
   */
  #prepareSearch(rows: readonly BuildSummary[]): void {
    const run = ++this.#preparing;
    const haystacks = this.#haystacks;
    let next = 0;
    const step = (deadline?: { timeRemaining(): number }) => {
      if (run !== this.#preparing) return;
      // Short slices: a key pressed meanwhile waits for the slice to end.
      const until = performance.now() + Math.max(2, Math.min(5, deadline?.timeRemaining() ?? 5));
      while (next < rows.length && performance.now() < until) {
        for (const end = Math.min(rows.length, next + 100); next < end; next++) {
          const s = rows[next]!;
          if (!haystacks.has(s.id)) haystacks.set(s.id, haystackOf(s));
        }
      }
      if (next < rows.length) later(step);
    };
    later(step);
  }

  /**
   * Follows the service's change events, one re-read for a burst of them (a fleet import sends
   * many); the builds whose verdicts changed are marked once it is shown. Returns the function that stops.
   */
  follow(): () => void {
    const stop = this.source.follow(this.client, (event) => this.#affects(event), {
      settleMs: 120,
      // The builds noted until the re-read starts are marked once it is shown; later ones wait for the next.
      before: () => {
        this.#marking = new Set(this.#pendingChanged);
        this.#pendingChanged.clear();
      },
      after: () => (this.recentlyChanged = this.#marking),
    });
    return () => {
      stop();
      this.#preparing += 1;
    };
  }

  /** Whether an event changes what the list shows; notes the builds whose verdicts changed. */
  #affects(event: ServiceEvent): boolean {
    if (event.type === 'verdicts-changed') {
      for (const id of event.buildIds) this.#pendingChanged.add(id);
      return true;
    }
    return event.type === 'records-changed' && ['builds', 'vehicles', 'batteries', 'motors', 'controllers', 'propellers'].includes(event.kind);
  }

  sortBy(key: SortKey): void {
    if (this.sortKey === key) this.sortDir = this.sortDir === 1 ? -1 : 1;
    else {
      this.sortKey = key;
      this.sortDir = 1;
    }
  }

  toggleStatus(status: Status): void {
    // A check filter lists the builds the check flags: none of them is clear on it.
    if (status === 'clear' && this.rule !== '' && !this.statuses.includes(status)) return;
    this.statuses = this.statuses.includes(status) ? this.statuses.filter((s) => s !== status) : [...this.statuses, status];
  }

  /** Filters by one check ('' any); the Clear verdict is let go, as no flagged build is clear on its check. */
  chooseRule(rule: string): void {
    this.rule = rule;
    if (rule !== '' && this.statuses.includes('clear')) this.statuses = this.statuses.filter((s) => s !== 'clear');
  }

  toggleKind(kind: VehicleKind): void {
    this.kinds = this.kinds.includes(kind) ? this.kinds.filter((k) => k !== kind) : [...this.kinds, kind];
  }

  clearFilters(): void {
    this.text = '';
    this.statuses = [];
    this.kinds = [];
    this.customer = '';
    this.partId = '';
    this.rule = '';
  }

  /** Sets the list to what an address asks for; reloads when it switches between active and archived builds. */
  applyQuery(q: ListQuery = DEFAULT_LIST_QUERY): void {
    this.text = q.text;
    this.statuses = [...q.statuses];
    this.kinds = [...q.kinds];
    this.customer = q.customer;
    this.partId = q.partId;
    this.chooseRule(q.rule);
    this.sortKey = q.sortKey;
    this.sortDir = q.sortDir;
    if (q.archived !== this.archived) this.showArchived(q.archived);
  }

  showArchived(archived: boolean): void {
    if (archived === this.archived) return;
    this.archived = archived;
    this.selectedId = null;
    void this.load();
  }

  /** Marks a build for comparing, or unmarks it; refuses a fifth and says why. */
  toggleCompare(id: string): void {
    if (this.compareIds.includes(id)) {
      this.compareIds = this.compareIds.filter((x) => x !== id);
      this.compareNote = null;
    } else if (this.compareIds.length >= MAX_COMPARED) {
      this.compareNote = `Up to ${MAX_COMPARED} builds can be compared: unmark one first.`;
    } else {
      this.compareIds = [...this.compareIds, id];
      this.compareNote = null;
    }
  }

  clearCompare(): void {
    this.compareIds = [];
    this.compareNote = null;
  }

  selectIndex(index: number): void {
    this.selectedId = this.visible[index]?.id ?? null;
  }
}
