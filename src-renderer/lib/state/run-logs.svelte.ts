import type { ApiOutput } from '$service/handlers';
import type { ColumnUse } from '$core/run-log-csv';
import { asApiError, type Client } from '../api/client';
import { Loader } from './loader.svelte';

export type RunLogInfo = ApiOutput<'runLogs.list'>[number];
export type RunLogFull = ApiOutput<'runLogs.get'>;
export type LogPreview = ApiOutput<'runLogs.preview'>;

/** The largest log the service reads; a bigger file is refused before it is sent. */
export const MAX_LOG_BYTES = 50 * 1024 * 1024;

/** One column's row in the mapping step: '' for a column left out. */
export interface MappingRow {
  column: number;
  header: string;
  quantity: ColumnUse['quantity'] | '';
  unit: string;
  examples: string[];
  problem: string | null;
}

/** A build's run logs, the one shown, and the import's steps (file → mapping with preview → import). */
export class RunLogsState {
  readonly list = new Loader(() => this.client.call('runLogs.list', { buildId: this.buildId }));
  shown = $state.raw<RunLogFull | null>(null);
  error = $state<string | null>(null);
  busy = $state(false);
  message = $state<string | null>(null);

  /** The import under way: the file's text, its preview and the mapping being settled. */
  fileName = $state('');
  text = $state<string | null>(null);
  preview = $state.raw<LogPreview | null>(null);
  mapping = $state<MappingRow[]>([]);
  name = $state('');
  /** Rows read so far by the service, for a long log. */
  progress = $state<{ done: number; total: number } | null>(null);

  constructor(
    private readonly client: Client,
    readonly buildId: string,
  ) {}

  async load(): Promise<void> {
    if (await this.list.load()) {
      const first = this.list.value?.[0];
      if (first && this.shown === null) await this.show(first.id);
    }
  }

  follow(): () => void {
    return this.client.onEvent((event) => {
      if (event.type === 'progress' && event.kind === 'runLog') this.progress = { done: event.done, total: event.total };
      if (event.type === 'records-changed' && event.kind === 'runLogs') void this.list.load();
    });
  }

  async show(id: string): Promise<void> {
    try {
      this.shown = await this.client.call('runLogs.get', { id });
    } catch (error) {
      this.error = asApiError(error).message;
    }
  }

  /** Reads a chosen file and asks for its preview; a file over the limit is refused here, unsent. */
  async choose(file: File): Promise<void> {
    this.error = null;
    this.message = null;
    this.preview = null;
    this.text = null;
    this.fileName = file.name;
    if (file.size > MAX_LOG_BYTES) {
      this.error = `The log is ${(file.size / (1024 * 1024)).toFixed(1)} MB; Rigbook reads logs up to 50.0 MB. Export a shorter stretch of the run, or split the file. Nothing was imported.`;
      return;
    }
    this.busy = true;
    try {
      const text = await file.text();
      const preview = await this.client.call('runLogs.preview', { text });
      this.text = text;
      this.preview = preview;
      this.name = file.name.replace(/\.[^.]*$/, '');
      this.mapping = preview.columns.map((c) => ({ column: c.index, header: c.header, quantity: c.quantity ?? '', unit: c.unit ?? '', examples: c.examples, problem: c.problem }));
    } catch (error) {
      this.error = asApiError(error).message;
    } finally {
      this.busy = false;
    }
  }

  cancel(): void {
    this.preview = null;
    this.text = null;
    this.error = null;
  }

  /** Imports by the mapping as it stands; all or nothing. */
  async import(supplyId: string): Promise<boolean> {
    if (this.text === null) return false;
    this.busy = true;
    this.error = null;
    this.progress = null;
    try {
      const mapping = this.mapping.filter((m) => m.quantity !== '').map((m) => ({ column: m.column, quantity: m.quantity as ColumnUse['quantity'], unit: m.unit }));
      const log = await this.client.call('runLogs.import', { buildId: this.buildId, supplyId, name: this.name, text: this.text, mapping });
      this.preview = null;
      this.text = null;
      this.message = `Imported "${log.name}": ${log.sampleCount} samples.`;
      await this.list.load();
      await this.show(log.id);
      return true;
    } catch (error) {
      this.error = asApiError(error).message;
      return false;
    } finally {
      this.busy = false;
      this.progress = null;
    }
  }

  /** Puts the shown log's peak and RMS currents in the build's measured figures for its supply. */
  async useFigures(expectedVersion: number): Promise<boolean> {
    const log = this.shown;
    if (!log) return false;
    this.busy = true;
    this.error = null;
    try {
      await this.client.call('runLogs.useFigures', { id: log.id, expectedVersion });
      this.message = `The build now uses the measured figures of "${log.name}" for this supply (recorded in its history).`;
      return true;
    } catch (error) {
      this.error = asApiError(error).message;
      return false;
    } finally {
      this.busy = false;
    }
  }
}
