import type { WorkOrderStatus, WorkStepKind } from '$core/work-order';
import { WORK_ORDER_TRANSITIONS } from '$core/work-order';
import type { ApiError } from '$service/contract';
import type { ApiOutput } from '$service/handlers';
import { asApiError, type Client } from '../api/client';
import { printPage } from '../shop/print-page';
import { Loader } from './loader.svelte';

export type WorkOrderView = ApiOutput<'workOrders.get'>;

export interface StepDraft {
  kind: WorkStepKind;
  text: string;
  reason: string;
  /** History entries this step caused, ticked from the entries since opening. */
  historyIds: number[];
}

const EMPTY_STEP: StepDraft = { kind: 'checked', text: '', reason: '', historyIds: [] };

/** One work order: its record and sheet, adding steps, moving its status, printing its job sheet. */
export class WorkOrderState {
  readonly source = new Loader<WorkOrderView>(() => this.client.call('workOrders.get', { id: this.id }));
  view = $derived(this.source.value);
  step = $state<StepDraft>({ ...EMPTY_STEP, historyIds: [] });
  signedOffBy = $state('');
  error = $state<ApiError | null>(null);
  busy = $state(false);
  printMessage = $state<string | null>(null);
  /** The statuses the job may go to from where it is. */
  nextStatuses = $derived<readonly WorkOrderStatus[]>(this.view ? WORK_ORDER_TRANSITIONS[this.view.order.status] : []);
  closed = $derived(this.view?.order.status === 'handed-over');

  constructor(
    private readonly client: Client,
    readonly id: string,
  ) {}

  load(): Promise<boolean> {
    return this.source.load();
  }

  follow(): () => void {
    // Edits of the vehicle's builds and parts change the "now" verdicts and the entries a step may link.
    return this.source.follow(this.client, (e) => e.type === 'records-changed' || e.type === 'verdicts-changed', { settleMs: 150 });
  }

  toggleLink(historyId: number): void {
    this.step.historyIds = this.step.historyIds.includes(historyId) ? this.step.historyIds.filter((h) => h !== historyId) : [...this.step.historyIds, historyId];
  }

  async #write(work: () => Promise<unknown>): Promise<boolean> {
    this.busy = true;
    this.error = null;
    try {
      await work();
      await this.source.load();
      return true;
    } catch (error) {
      this.error = asApiError(error);
      return false;
    } finally {
      this.busy = false;
    }
  }

  async addStep(): Promise<boolean> {
    const step = { ...this.step, historyIds: [...this.step.historyIds] };
    const ok = await this.#write(() => this.client.call('workOrders.addStep', { id: this.id, ...step }));
    if (ok) this.step = { ...EMPTY_STEP, historyIds: [] };
    return ok;
  }

  setStatus(status: WorkOrderStatus): Promise<boolean> {
    const order = this.view?.order;
    if (!order) return Promise.resolve(false);
    const signedOffBy = status === 'handed-over' && this.signedOffBy.trim() !== '' ? { signedOffBy: this.signedOffBy } : {};
    return this.#write(() => this.client.call('workOrders.setStatus', { id: this.id, expectedVersion: order.version, status, ...signedOffBy }));
  }

  async print(): Promise<void> {
    this.printMessage = await printPage(this.client, `job-sheet-${this.id}.pdf`);
  }
}

/** Opening a work order: the vehicle (chosen, or given by the screen it was opened from) and the complaint. */
export class NewWorkOrderState {
  vehicleId = $state('');
  complaint = $state('');
  error = $state<ApiError | null>(null);
  saving = $state(false);

  constructor(
    private readonly client: Client,
    vehicleId: string | null,
  ) {
    this.vehicleId = vehicleId ?? '';
  }

  async open(): Promise<string | null> {
    this.saving = true;
    this.error = null;
    try {
      const order = await this.client.call('workOrders.open', { vehicleId: this.vehicleId, complaint: this.complaint });
      return order.id;
    } catch (error) {
      this.error = asApiError(error);
      return null;
    } finally {
      this.saving = false;
    }
  }
}
