import type { UnitSystem } from '$core/units';
import { DEFAULT_TIGHT_THRESHOLD } from '$core/domain';
import { asApiError, type Client } from '../api/client';
import type { ApiError } from '$service/contract';
import type { NUMBER_LOCALE_TAGS } from '$core/number-text';
import { setNumberLocale } from '../format/number-locale.svelte';
import { Loader } from './loader.svelte';

type Settings = { units: UnitSystem; numberLocale: string; tightThreshold: number; demoOffered: boolean };

/** The user's preferences as stored: unit system and the default tight threshold. */
export class SettingsState {
  units = $state<UnitSystem>('metric');
  /** '' follows the system's locale. */
  numberLocale = $state('');
  tightThreshold = $state(DEFAULT_TIGHT_THRESHOLD);
  demoOffered = $state(false);
  readonly source = new Loader<Settings>(
    () => this.client.call('settings.get', {}),
    (s) => this.apply(s),
  );
  loaded = $derived(this.source.value !== null);
  saving = $state(false);
  error = $state<ApiError | null>(null);

  constructor(private readonly client: Client) {}

  async load(): Promise<void> {
    await this.source.load();
  }

  private apply(s: Settings): void {
    this.units = s.units;
    this.numberLocale = s.numberLocale;
    setNumberLocale(s.numberLocale);
    this.tightThreshold = s.tightThreshold;
    this.demoOffered = s.demoOffered;
  }

  /** Returns true when saved; on failure the stored values stay and the error says why. */
  async save(patch: { units?: UnitSystem; numberLocale?: (typeof NUMBER_LOCALE_TAGS)[number]; tightThreshold?: number; demoOffered?: boolean }): Promise<boolean> {
    this.saving = true;
    this.error = null;
    try {
      const s = await this.client.call('settings.update', patch);
      this.apply(s);
      return true;
    } catch (error) {
      this.error = asApiError(error);
      return false;
    } finally {
      this.saving = false;
    }
  }
}
