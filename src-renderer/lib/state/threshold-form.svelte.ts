import type { Client } from '../api/client';
import { ApiCallError } from '../api/client';
import { readDraftValue, toDraft, type Draft } from '../forms/draft';
import { draftProblems, type Problems } from '../forms/draft-problems';
import type { FieldDef } from '../parts/part-fields';
import { number, record } from '$service/schemas/field-builders';
import { FormState } from './form.svelte';
import type { SettingsState } from './settings.svelte';

type Threshold = { tightThreshold: number };

export const THRESHOLD: FieldDef = { key: 'tightThreshold', label: 'Tight below', unit: '% headroom', scale: 100, percent: true, type: 'number' };
// The same bounds the service checks (settings.update), said in percent.
const thresholdSchema = record({ tightThreshold: number({ min: 0, max: 0.9 }) });

/** The default tight threshold, typed in percent and kept as text so a bad entry is not lost. */
export class ThresholdFormState extends FormState<Threshold> {
  constructor(
    private readonly client: Client,
    private readonly settings: SettingsState,
  ) {
    super([THRESHOLD], settings.units, true);
    this.start();
  }

  protected async read(): Promise<Threshold> {
    const s = await this.client.call('settings.get', {});
    return { tightThreshold: s.tightThreshold };
  }

  protected draftOf(stored: Threshold | null): Draft {
    return toDraft(this.fields, stored, this.units);
  }

  problems(): Problems {
    const problems = draftProblems(this.fields, this.draft, this.units, thresholdSchema);
    const text = String(this.draft.tightThreshold ?? '');
    if (problems.tightThreshold && text.trim() === '') return { tightThreshold: 'is required: a number of percent, for example 15' };
    return problems;
  }

  /** The message beside the field: a refused entry's, or why the service did not save it. */
  get error(): string | null {
    return this.errors.tightThreshold ?? (this.formError ? this.formError.message.replace(/^tightThreshold: /, '') : null);
  }

  /** Saves through the settings (so every screen sees the new value); returns it, or null when not saved. */
  save(): Promise<number | null> {
    return this.submit(async () => {
      const reading = readDraftValue(THRESHOLD, this.draft.tightThreshold ?? '', this.units);
      if (!reading.ok || typeof reading.value !== 'number') return null;
      if (!(await this.settings.save({ tightThreshold: reading.value }))) throw new ApiCallError(this.settings.error ?? { kind: 'internal', message: 'not saved' });
      this.saved({ tightThreshold: reading.value });
      return reading.value;
    });
  }
}
