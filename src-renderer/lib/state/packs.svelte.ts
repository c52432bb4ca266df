import type { Battery } from '../../../src-main/core/domain';
import type { ApiInput } from '../../../src-main/service/handlers';
import { ApiCallError, type Client } from '../api/client';

/** The packs on hand, and the add-pack form's last error (with the field it names). */
export class PacksState {
  list = $state<Battery[]>([]);
  error = $state<{ message: string; field: string | undefined } | null>(null);
  saving = $state(false);

  constructor(private readonly client: Client) {}

  async load(): Promise<void> {
    this.list = await this.client.call('batteries.list', {});
  }

  /** Returns true when saved; on failure the form keeps what the user typed. */
  async add(input: ApiInput<'batteries.create'>): Promise<boolean> {
    this.saving = true;
    this.error = null;
    try {
      await this.client.call('batteries.create', input);
      await this.load();
      return true;
    } catch (error) {
      this.error = error instanceof ApiCallError ? { message: error.message, field: error.field } : { message: String(error), field: undefined };
      return false;
    } finally {
      this.saving = false;
    }
  }
}
