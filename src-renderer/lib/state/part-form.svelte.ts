import type { ApiError } from '$service/contract';
import type { UnitSystem } from '$core/units';
import { asApiError, type Client } from '../api/client';
import { draftChanges, draftToRecord, errorFieldKey, fieldLabel, messageForField, problemSummary, toDraft, type Draft } from '../forms/draft';
import { PART_FIELDS, type FieldDef } from '../parts/part-fields';
import { partApi, type PartRecord, type PartWriteResult } from '../parts/part-api';
import { PART_KINDS, type PartTable } from '../parts/part-kinds';
import type { PreviewRequest } from './over-confirm.svelte';
import { draftProblems, type Problems } from '../forms/draft-problems';
import { partSchemasByTable } from '$service/schemas/part-schemas-by-table';

const NEW_DEFAULTS: Readonly<Record<PartTable, Record<string, unknown>>> = {
  batteries: { chemistry: 'lipo', cellsSeries: 4, cellsParallel: 1, cycleCount: 0, retired: false, notes: '' },
  motors: { notes: '' },
  controllers: { notes: '' },
  propellers: { blades: 2, notes: '' },
  vehicles: { kind: 'car', owner: '', className: '', notes: '' },
};

/**
 * One record's form: what the user typed (kept through any failed save), the version it was
 * read at, and the service's errors placed beside the fields they name.
 */
export class PartFormState {
  record = $state.raw<PartRecord | null>(null);
  base = $state<Draft>({});
  draft = $state<Draft>({});
  reason = $state('');
  errors = $state<Record<string, string>>({});
  formError = $state<ApiError | null>(null);
  saving = $state(false);
  notice = $state<string | null>(null);
  loaded = $state(false);
  /** Asked before an edit that would make a build OVER (see over-confirm.svelte.ts); false keeps the form unsaved. */
  confirmWrite: ((request: PreviewRequest) => Promise<boolean>) | null = null;

  readonly fields: readonly FieldDef[];
  dirty = $derived(Object.keys(this.draft).some((k) => this.draft[k] !== this.base[k]));
  conflict = $derived(this.formError?.kind === 'conflict');

  constructor(
    private readonly client: Client,
    readonly table: PartTable,
    readonly id: string | null,
    private units: UnitSystem,
  ) {
    this.fields = PART_FIELDS[table];
    if (id === null) this.reset(null);
  }

  private reset(record: PartRecord | null): void {
    this.record = record;
    this.base = toDraft(this.fields, record as Record<string, unknown> | null, this.units, NEW_DEFAULTS[this.table]);
    this.draft = { ...this.base };
    this.errors = {};
    this.formError = null;
    this.loaded = true;
  }

  async load(): Promise<void> {
    if (this.id === null) return;
    try {
      this.reset(await partApi.get(this.client, this.table, this.id));
    } catch (error) {
      this.formError = asApiError(error);
    }
  }

  /** Switches units while keeping unsaved edits out of harm's way: only an untouched form is re-read. */
  setUnits(units: UnitSystem): void {
    if (units === this.units) return;
    this.units = units;
    if (!this.dirty) this.reset(this.record);
  }

  private fail(error: unknown): void {
    const e = asApiError(error);
    const key = errorFieldKey(e.field);
    const def = key ? this.fields.find((f) => f.key === key) : undefined;
    this.errors = key && def ? { [key]: messageForField(e.message, e.field) } : {};
    // The summary names the field by its label, as the user sees it.
    this.formError = def ? { ...e, message: `${fieldLabel(def, this.units)}: ${messageForField(e.message, e.field)}` } : e;
  }

  /** Every field that cannot be saved as typed, each with its own message; nothing is sent while any remain. */
  problems(): Problems {
    return draftProblems(this.fields, this.draft, this.units, partSchemasByTable[this.table].create);
  }

  private refuse(problems: Problems): void {
    this.errors = problems;
    this.formError = { kind: 'invalid', message: problemSummary(problems, this.fields, this.units) };
  }

  /** Creates or updates; returns the stored record, or null when the save failed (the draft stays). */
  async save(): Promise<PartRecord | null> {
    this.errors = {};
    this.formError = null;
    this.notice = null;
    const problems = this.problems();
    if (Object.keys(problems).length > 0) {
      this.refuse(problems);
      return null;
    }
    this.saving = true;
    try {
      let stored: PartRecord;
      if (this.record === null) {
        stored = await partApi.create(this.client, this.table, draftToRecord(this.fields, this.draft, this.units));
        this.notice = `Added ${PART_KINDS[this.table].one} “${stored.name}”.`;
      } else {
        const changes = draftChanges(this.fields, this.draft, this.base, this.units);
        if (Object.keys(changes).length === 0) {
          this.notice = 'Nothing changed.';
          return this.record;
        }
        if (this.confirmWrite && !(await this.confirmWrite({ part: { kind: this.table, id: this.record.id, expectedVersion: this.record.version, changes, reason: this.reason.trim() } }))) {
          this.notice = 'Not saved: nothing was written.';
          return null;
        }
        const result: PartWriteResult = await partApi.update(this.client, this.table, this.record.id, this.record.version, changes, this.reason.trim());
        stored = result.record;
        this.notice = `Saved. ${result.rechecked === 0 ? 'No build uses it.' : `${result.rechecked} build${result.rechecked === 1 ? '' : 's'} re-checked${result.verdictChanges.length ? `, ${result.verdictChanges.filter((c) => c.supplyId === null).length} verdict${result.verdictChanges.filter((c) => c.supplyId === null).length === 1 ? '' : 's'} changed` : ''}.`}`;
      }
      this.reason = '';
      this.reset(stored);
      return stored;
    } catch (error) {
      this.fail(error);
      return null;
    } finally {
      this.saving = false;
    }
  }

  /**
   * After a conflict: read the version someone else saved and put the user's own edits back
   * on top, so saving again applies exactly what they changed.
   */
  async rebase(): Promise<void> {
    if (this.record === null) return;
    const latest = await partApi.get(this.client, this.table, this.record.id);
    const fresh = toDraft(this.fields, latest as unknown as Record<string, unknown>, this.units, NEW_DEFAULTS[this.table]);
    const merged: Draft = { ...fresh };
    for (const key of Object.keys(this.draft)) if (this.draft[key] !== this.base[key]) merged[key] = this.draft[key]!;
    this.record = latest;
    this.base = fresh;
    this.draft = merged;
    this.formError = null;
    this.errors = {};
    this.notice = 'Loaded the latest version; your changes are kept on top. Check them and save again.';
  }

  async setArchived(archived: boolean): Promise<boolean> {
    if (this.record === null) return false;
    this.saving = true;
    this.formError = null;
    try {
      const result = await partApi.archive(this.client, this.table, this.record.id, this.record.version, archived, this.reason.trim());
      this.reason = '';
      this.reset(result.record);
      this.notice = archived ? 'Archived: it stays in history and in the builds that use it.' : 'Restored.';
      return true;
    } catch (error) {
      this.fail(error);
      return false;
    } finally {
      this.saving = false;
    }
  }
}
