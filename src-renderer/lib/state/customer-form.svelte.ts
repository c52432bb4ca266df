import type { Customer } from '$core/domain';
import type { ApiError } from '$service/contract';
import { asApiError, type Client } from '../api/client';

export interface CustomerDraft {
  name: string;
  contact: string;
  notes: string;
}

const EMPTY: CustomerDraft = { name: '', contact: '', notes: '' };

/** Adding or editing one customer: what was typed is what is sent; a refusal lands on its field. */
export class CustomerFormState {
  record = $state.raw<Customer | null>(null);
  draft = $state<CustomerDraft>({ ...EMPTY });
  error = $state<ApiError | null>(null);
  saving = $state(false);
  loaded = $state(false);
  notice = $state<string | null>(null);
  dirty = $derived(this.draft.name !== (this.record?.name ?? '') || this.draft.contact !== (this.record?.contact ?? '') || this.draft.notes !== (this.record?.notes ?? ''));

  constructor(
    private readonly client: Client,
    readonly id: string | null,
  ) {}

  async load(): Promise<void> {
    if (this.id !== null) {
      try {
        this.#take(await this.client.call('customers.get', { id: this.id }));
      } catch (error) {
        this.error = asApiError(error);
      }
    }
    this.loaded = true;
  }

  #take(record: Customer): void {
    this.record = record;
    this.draft = { name: record.name, contact: record.contact, notes: record.notes };
  }

  /** Field the last refusal named, for placing the message beside it. */
  errorOn(field: keyof CustomerDraft): string | null {
    return this.error?.field === field ? this.error.message.replace(new RegExp(`^${field}: `), '') : null;
  }

  async save(): Promise<Customer | null> {
    this.saving = true;
    this.error = null;
    this.notice = null;
    try {
      if (this.record === null) {
        const created = await this.client.call('customers.create', { ...this.draft });
        this.#take(created);
        return created;
      }
      const { record } = await this.client.call('customers.update', { id: this.record.id, expectedVersion: this.record.version, changes: { ...this.draft } });
      this.#take(record);
      this.notice = 'Saved.';
      return record;
    } catch (error) {
      this.error = asApiError(error);
      return null;
    } finally {
      this.saving = false;
    }
  }
}
