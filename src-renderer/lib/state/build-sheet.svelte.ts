import type { ApiOutput } from '$service/handlers';
import { asApiError, type Client } from '../api/client';
import { isLithium } from '$core/chemistry';
import { DEFAULT_TIGHT_THRESHOLD } from '$core/domain';
import { runTrace, type RunTrace } from '$core/run-trace';
import { Loader } from './loader.svelte';

export type BuildSheet = ApiOutput<'builds.get'>;

/** One build with its parts and stored verdict; re-read when the service re-checks it. */
export class BuildSheetState {
  readonly source = new Loader(() => this.client.call('builds.get', { id: this.id }));
  /** The last sheet read: it stays on screen while a newer one is read, and after a failed re-read. */
  sheet = $derived(this.source.value);
  error = $derived(this.source.error?.message ?? null);
  notFound = $derived(this.source.error?.kind === 'not-found');
  printing = $state(false);
  printMessage = $state<string | null>(null);

  packsById = $derived(new Map((this.sheet?.batteries ?? []).map((b) => [b.id, b] as const)));

  constructor(
    private readonly client: Client,
    readonly id: string,
  ) {}

  async load(): Promise<void> {
    await this.source.load();
  }

  follow(): () => void {
    return this.source.follow(this.client, (event) => (event.type === 'verdicts-changed' && event.buildIds.includes(this.id)) || (event.type === 'records-changed' && event.kind === 'builds' && event.ids.includes(this.id)));
  }

  /** The full-throttle run of one supply of a car or truck, from the same core the verdict came from. */
  runOf(supplyId: string): RunTrace | null {
    const sheet = this.sheet;
    if (!sheet) return null;
    return runTrace(
      {
        build: sheet.build,
        vehicle: sheet.vehicle,
        motor: sheet.motor,
        controller: sheet.controller,
        propeller: sheet.propeller,
        batteries: this.packsById,
        classRules: [],
        defaultTightThreshold: DEFAULT_TIGHT_THRESHOLD,
      },
      supplyId,
    );
  }

  busy = $state(false);
  actionMessage = $state<string | null>(null);

  /** Archives the build (kept with its history, left out of the list) or restores it. */
  async setArchived(archived: boolean): Promise<boolean> {
    const b = this.sheet?.build;
    if (!b) return false;
    this.busy = true;
    this.actionMessage = null;
    try {
      await this.client.call('builds.archive', { id: b.id, expectedVersion: b.version, archived, reason: '' });
      await this.load();
      this.actionMessage = archived ? 'Archived.' : 'Restored to the builds list.';
      return true;
    } catch (error) {
      this.actionMessage = asApiError(error).message;
      return false;
    } finally {
      this.busy = false;
    }
  }

  /** A new build with this one's settings; returns its id. */
  async duplicate(): Promise<string | null> {
    const b = this.sheet?.build;
    if (!b) return null;
    this.busy = true;
    this.actionMessage = null;
    try {
      const made = await this.client.call('builds.duplicate', { id: b.id });
      return made.record.id;
    } catch (error) {
      this.actionMessage = asApiError(error).message;
      return null;
    } finally {
      this.busy = false;
    }
  }

  /** Pack names of a supply, joined the way they are wired. */
  supplyName(batteryIds: readonly string[], arrangement: 'series' | 'parallel' | undefined): string {
    const names = batteryIds.map((id) => this.packsById.get(id)?.name ?? id);
    return names.join(arrangement === 'parallel' ? ' ∥ ' : ' + ');
  }

  /** Whether any pack of the supply is lithium: its cautions then name fire. */
  supplyIsLithium(batteryIds: readonly string[]): boolean {
    return batteryIds.some((id) => {
      const pack = this.packsById.get(id);
      return pack ? isLithium(pack.chemistry) : true;
    });
  }

  /** In the desktop shell, a PDF through the shell's own call; in a browser, the print dialog. */
  async print(suggestedName: string): Promise<void> {
    this.printMessage = null;
    if (this.client.kind !== 'desktop') {
      window.print();
      return;
    }
    this.printing = true;
    try {
      const result = await this.client.call('desktop.printToPdf', { suggestedName });
      if (result.saved && result.path) this.printMessage = `Saved ${result.path}`;
    } catch (error) {
      this.printMessage = asApiError(error).message;
    } finally {
      this.printing = false;
    }
  }
}
