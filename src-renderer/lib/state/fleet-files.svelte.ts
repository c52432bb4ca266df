import type { ApiError } from '$service/contract';
import { asApiError, type Client } from '../api/client';
import { backupFileName, exportFileName, type ImportReport } from '../fleet/report-words';

export type ImportMode = 'merge' | 'replace';

/**
 * Fleet files from the window. The page never names a path: an import uploads the chosen
 * file's text, an export is handed to the browser as a download, and a backup goes either
 * through the desktop shell's own save dialog or, in the browser, into a new file in the
 * store's backups folder. An import is always checked first (a dry run that writes nothing),
 * and written only when the person confirms what the check reported.
 */
export class FleetFilesState {
  fileName = $state<string | null>(null);
  mode = $state<ImportMode>('merge');
  /** What the dry run reported for the chosen file; null before a check. */
  preview = $state.raw<ImportReport | null>(null);
  /** What the import wrote. */
  done = $state.raw<ImportReport | null>(null);
  /** The person confirms the changes the check flagged as a spreadsheet's likely damage. */
  acceptChanges = $state(false);
  busy = $state<'check' | 'import' | 'export' | 'backup' | null>(null);
  error = $state<ApiError | null>(null);
  exported = $state<string | null>(null);
  backedUp = $state<string | null>(null);
  #text: string | null = null;

  constructor(private readonly client: Client) {}

  /** Reads the chosen file and checks it at once; nothing is written. */
  async choose(file: File): Promise<void> {
    this.reset();
    this.fileName = file.name;
    try {
      this.#text = await file.text();
    } catch (error) {
      this.error = { kind: 'invalid', message: `Cannot read ${file.name}: ${error instanceof Error ? error.message : String(error)}` };
      return;
    }
    await this.check();
  }

  setMode(mode: ImportMode): void {
    this.mode = mode;
    if (this.#text !== null) void this.check();
  }

  /** Drops the checked file without writing anything. */
  cancel(): void {
    this.reset();
    this.#text = null;
    this.fileName = null;
  }

  private reset(): void {
    this.preview = null;
    this.done = null;
    this.error = null;
    this.acceptChanges = false;
  }

  /** The dry run: every problem, every change and every verdict that would move, rolled back. */
  async check(): Promise<void> {
    const text = this.#text;
    if (text === null) return;
    this.busy = 'check';
    this.error = null;
    this.done = null;
    try {
      this.preview = await this.client.call('fleet.import', { text, mode: this.mode, dryRun: true, acceptChanges: this.acceptChanges });
    } catch (error) {
      this.error = asApiError(error);
    } finally {
      this.busy = null;
    }
  }

  /** Writes what the check showed; a report that refuses writes nothing and stays on screen. */
  async importNow(): Promise<void> {
    const text = this.#text;
    if (text === null || !this.preview) return;
    this.busy = 'import';
    this.error = null;
    try {
      const report = await this.client.call('fleet.import', { text, mode: this.mode, dryRun: false, acceptChanges: this.acceptChanges, reason: `from the window: ${this.fileName ?? 'a file'}` });
      if (report.ok) {
        this.done = report;
        this.preview = null;
        this.#text = null;
      } else this.preview = report;
    } catch (error) {
      this.error = asApiError(error);
    } finally {
      this.busy = null;
    }
  }

  /** The whole store as a rigbook-fleet file, handed to the browser as a download. */
  async exportFile(save: (name: string, text: string) => void): Promise<void> {
    this.busy = 'export';
    this.error = null;
    this.exported = null;
    try {
      const fleet = await this.client.call('fleet.export', {});
      const name = exportFileName(new Date());
      // The same text as the command line's export: two-space indented, ending with a newline.
      save(name, `${JSON.stringify(fleet, null, 2)}\n`);
      this.exported = `${name}: ${fleet.builds.length} build${fleet.builds.length === 1 ? '' : 's'} and their parts, classes and limits.`;
    } catch (error) {
      this.error = asApiError(error);
    } finally {
      this.busy = null;
    }
  }

  /** A consistent copy of the store: the desktop asks where; the browser writes a new file into the backups folder. */
  async backUp(): Promise<void> {
    this.busy = 'backup';
    this.error = null;
    this.backedUp = null;
    try {
      if (this.client.kind === 'desktop') {
        const result = await this.client.call('desktop.backUp', {});
        if (result.saved && result.path) this.backedUp = `Backup written to ${result.path}.`;
        return;
      }
      const info = await this.client.call('store.info', {});
      if (info.backupFolder === null) {
        this.error = { kind: 'invalid', message: "This store is not a file Rigbook can copy (a PostgreSQL store is backed up with the server's own tools)." };
        return;
      }
      const written = await this.client.call('store.backup', { destination: `${info.backupFolder}/${backupFileName(new Date())}` });
      this.backedUp = `Backup written to ${written.destination} (${Math.max(1, Math.round(written.bytes / 1024))} KB).`;
    } catch (error) {
      this.error = asApiError(error);
    } finally {
      this.busy = null;
    }
  }
}
