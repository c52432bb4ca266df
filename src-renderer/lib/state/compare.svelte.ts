import type { ApiOutput } from '$service/handlers';
import type { UnitSystem } from '$core/units';
import type { ApiInput } from '$service/handlers';
import { ApiCallError, asApiError, type Client } from '../api/client';
import { compareRows, decidingSupply, type CompareColumn, type StageRows } from '../compare/compare-rows';
import { Loader } from './loader.svelte';
import { MAX_COMPARED } from '../compare/compare-limit';
import type { CompareOf } from '../router/routes';

type Sheet = ApiOutput<'builds.get'>;

export interface ComparedBuild {
  sheet: Sheet;
  /** The supply compared (the one that decides the verdict) and how many the build has. */
  supplyIndex: number;
  supplyCount: number;
  supplyName: string;
  /** The column's own title where it is not the build's name ("Supply 2", "With the change"). */
  label?: string;
  /** False where the column is a supply other than the one that decides the build's verdict. */
  deciding?: boolean;
}

export interface CompareRead {
  builds: ComparedBuild[];
  /** Ids named in the address that could not be read, with the reason. */
  missing: { id: string; message: string }[];
}

function supplyNameOf(sheet: Sheet, index: number): string {
  const sv = sheet.verdict?.supplies[index];
  const supply = sheet.build.supplies.find((s) => s.id === sv?.supplyId) ?? sheet.build.supplies[index];
  if (!supply) return 'no packs';
  // A pack the sheet does not hold is the one a change brings in.
  const names = supply.batteryIds.map((id) => sheet.batteries.find((b) => b.id === id)?.name ?? 'the new pack');
  return names.length === 0 ? 'no packs' : names.join(supply.arrangement === 'parallel' ? ' ∥ ' : ' + ');
}

/** Two to four builds read side by side; re-read when the service re-checks any of them. */
export class CompareState {
  readonly ids: readonly string[];
  readonly source = new Loader<CompareRead>(() => this.read());
  builds = $derived(this.source.value?.builds ?? []);
  missing = $derived(this.source.value?.missing ?? []);
  error = $derived(this.source.error?.message ?? null);
  columns = $derived<CompareColumn[]>(this.builds.map((b) => ({ id: b.sheet.build.id, name: b.label ?? b.sheet.build.name, kind: b.sheet.vehicle?.kind ?? null, verdict: b.sheet.verdict?.supplies[b.supplyIndex] ?? null })));
  /** More ids than fit were named: the first ones are compared. */
  truncated: boolean;

  constructor(
    private readonly client: Client,
    ids: readonly string[],
    /** One build's supplies, or one build with a change, instead of several builds. */
    readonly of: CompareOf | null = null,
  ) {
    this.ids = ids.slice(0, of ? 1 : MAX_COMPARED);
    this.truncated = ids.length > this.ids.length;
  }

  rows(units: UnitSystem): StageRows[] {
    return compareRows(this.columns, units);
  }

  private async read(): Promise<CompareRead> {
    if (this.of && 'supplies' in this.of) return this.readSupplies();
    if (this.of) return this.readChange(this.of.change, this.of.title);
    const answers = await Promise.allSettled(this.ids.map((id) => this.client.call('builds.get', { id })));
    const out: CompareRead = { builds: [], missing: [] };
    answers.forEach((a, i) => {
      if (a.status === 'rejected') {
        const e = asApiError(a.reason);
        out.missing.push({ id: this.ids[i]!, message: e.kind === 'not-found' ? 'no such build' : e.message });
        return;
      }
      const sheet = a.value;
      const supplies = sheet.verdict?.supplies ?? [];
      const supplyIndex = decidingSupply(supplies);
      out.builds.push({ sheet, supplyIndex, supplyCount: supplies.length, supplyName: supplyNameOf(sheet, supplyIndex) });
    });
    return out;
  }

  /** Every supply of one build, a column each. */
  private async readSupplies(): Promise<CompareRead> {
    const id = this.ids[0] ?? '';
    const sheet = await this.client.call('builds.get', { id });
    const supplies = sheet.verdict?.supplies ?? [];
    const deciding = decidingSupply(supplies);
    return {
      builds: supplies.map((_, i) => ({ sheet, supplyIndex: i, supplyCount: supplies.length, supplyName: supplyNameOf(sheet, i), label: `Supply ${i + 1}`, deciding: i === deciding })),
      missing: [],
    };
  }

  /**
   * The build as it is beside the build with a change, previewed afresh (the write rolled back),
   * both on the supply that decides the verdict with the change.
   */
  private async readChange(change: string, title: string): Promise<CompareRead> {
    const id = this.ids[0] ?? '';
    let request: ApiInput<'builds.preview'>;
    try {
      request = JSON.parse(change) as ApiInput<'builds.preview'>;
    } catch {
      throw new ApiCallError({ kind: 'invalid', message: 'The change named in the address cannot be read; open the swap preview and try the change again' });
    }
    const [sheet, preview] = await Promise.all([this.client.call('builds.get', { id }), this.client.call('builds.preview', request)]);
    const after = preview.after.find((a) => a.buildId === id);
    if (!after) throw new ApiCallError({ kind: 'invalid', message: 'The change does not touch this build' });
    const at = decidingSupply(after.supplies);
    const changed: Sheet = { ...sheet, verdict: { status: after.status, supplies: after.supplies, evaluatedAt: '' } };
    const count = after.supplies.length;
    // The sheet holds the packs as built: where the change swaps a pack, the column names the change instead.
    const packChange = ('draft' in request && request.draft.kind === 'batteries') || ('build' in request && request.build.changes.supplies !== undefined);
    return {
      builds: [
        { sheet, supplyIndex: at, supplyCount: count, supplyName: supplyNameOf(sheet, at), label: 'As built', deciding: at === decidingSupply(sheet.verdict?.supplies ?? []) },
        { sheet: changed, supplyIndex: at, supplyCount: count, supplyName: packChange ? `as changed (${title || 'a pack swapped'})` : supplyNameOf(sheet, at), label: 'With the change' },
      ],
      missing: [],
    };
  }

  async load(): Promise<void> {
    await this.source.load();
  }

  follow(): () => void {
    return this.source.follow(
      this.client,
      (event) => (event.type === 'verdicts-changed' && event.buildIds.some((id) => this.ids.includes(id))) || (event.type === 'records-changed' && event.kind === 'builds' && event.ids.some((id) => this.ids.includes(id))),
      { settleMs: 120 },
    );
  }
}
