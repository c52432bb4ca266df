import type { UnitSystem } from '../../../src-main/core/units';
import { DEFAULT_TIGHT_THRESHOLD } from '../../../src-main/core/domain';
import { asApiError, type Client } from '../api/client';
import type { ApiError } from '../../../src-main/service/contract';

/** The user's preferences as stored: unit system and the default tight threshold. */
export class SettingsState {
  units = $state<UnitSystem>('metric');
  tightThreshold = $state(DEFAULT_TIGHT_THRESHOLD);
  demoOffered = $state(false);
  loaded = $state(false);
  saving = $state(false);
  error = $state<ApiError | null>(null);

  constructor(private readonly client: Client) {}

  async load(): Promise<void> {
    const s = await this.client.call('settings.get', {});
    this.units = s.units;
    this.tightThreshold = s.tightThreshold;
    this.demoOffered = s.demoOffered;
    this.loaded = true;
  }

  /** Returns true when saved; on failure the stored values stay and the error says why. */
  async save(patch: { units?: UnitSystem; tightThreshold?: number; demoOffered?: boolean }): Promise<boolean> {
    this.saving = true;
    this.error = null;
    try {
      const s = await this.client.call('settings.update', patch);
      this.units = s.units;
      this.tightThreshold = s.tightThreshold;
      this.demoOffered = s.demoOffered;
      return true;
    } catch (error) {
      this.error = asApiError(error);
      return false;
    } finally {
      this.saving = false;
    }
  }
}
