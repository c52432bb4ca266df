import type { ApiOutput } from '$service/handlers';
import { asApiError, type Client } from '../api/client';
import { isLithium } from '$core/chemistry';
import { DEFAULT_TIGHT_THRESHOLD } from '$core/domain';
import { runTrace, type RunTrace } from '$core/run-trace';

export type BuildSheet = ApiOutput<'builds.get'>;

/** One build with its parts and stored verdict; re-read when the service re-checks it. */
export class BuildSheetState {
  sheet = $state.raw<BuildSheet | null>(null);
  error = $state<string | null>(null);
  notFound = $state(false);
  printing = $state(false);
  printMessage = $state<string | null>(null);

  packsById = $derived(new Map((this.sheet?.batteries ?? []).map((b) => [b.id, b] as const)));

  constructor(
    private readonly client: Client,
    readonly id: string,
  ) {}

  async load(): Promise<void> {
    try {
      this.sheet = await this.client.call('builds.get', { id: this.id });
      this.error = null;
    } catch (error) {
      const e = asApiError(error);
      this.notFound = e.kind === 'not-found';
      this.error = e.message;
    }
  }

  follow(): () => void {
    return this.client.onEvent((event) => {
      const mine =
        (event.type === 'verdicts-changed' && event.buildIds.includes(this.id)) ||
        (event.type === 'records-changed' && event.kind === 'builds' && event.ids.includes(this.id));
      if (mine) void this.load();
    });
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
      const result = (await this.client.callUntyped('desktop.printToPdf', { suggestedName })) as { saved?: boolean; path?: string } | null;
      if (result?.saved && result.path) this.printMessage = `Saved ${result.path}`;
    } catch (error) {
      this.printMessage = asApiError(error).message;
    } finally {
      this.printing = false;
    }
  }
}
