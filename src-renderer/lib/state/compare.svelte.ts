import type { ApiOutput } from '$service/handlers';
import type { UnitSystem } from '$core/units';
import { asApiError, type Client } from '../api/client';
import { compareRows, decidingSupply, type CompareColumn, type StageRows } from '../compare/compare-rows';
import { Loader } from './loader.svelte';
import { MAX_COMPARED } from '../compare/compare-limit';

type Sheet = ApiOutput<'builds.get'>;

export interface ComparedBuild {
  sheet: Sheet;
  /** The supply compared (the one that decides the verdict) and how many the build has. */
  supplyIndex: number;
  supplyCount: number;
  supplyName: string;
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
  const names = supply.batteryIds.map((id) => sheet.batteries.find((b) => b.id === id)?.name ?? id);
  return names.length === 0 ? 'no packs' : names.join(supply.arrangement === 'parallel' ? ' ∥ ' : ' + ');
}

/** Two to four builds read side by side; re-read when the service re-checks any of them. */
export class CompareState {
  readonly ids: readonly string[];
  readonly source = new Loader<CompareRead>(() => this.read());
  builds = $derived(this.source.value?.builds ?? []);
  missing = $derived(this.source.value?.missing ?? []);
  error = $derived(this.source.error?.message ?? null);
  columns = $derived<CompareColumn[]>(this.builds.map((b) => ({ id: b.sheet.build.id, name: b.sheet.build.name, kind: b.sheet.vehicle?.kind ?? null, verdict: b.sheet.verdict?.supplies[b.supplyIndex] ?? null })));
  /** More ids than fit were named: the first ones are compared. */
  truncated: boolean;

  constructor(
    private readonly client: Client,
    ids: readonly string[],
  ) {
    this.ids = ids.slice(0, MAX_COMPARED);
    this.truncated = ids.length > MAX_COMPARED;
  }

  rows(units: UnitSystem): StageRows[] {
    return compareRows(this.columns, units);
  }

  private async read(): Promise<CompareRead> {
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
