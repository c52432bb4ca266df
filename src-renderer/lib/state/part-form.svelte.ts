import type { UnitSystem } from '$core/units';
import type { Client } from '../api/client';
import { draftChanges, draftToRecord, toDraft, type Draft } from '../forms/draft';
import { PART_FIELDS } from '../parts/part-fields';
import { partApi, type PartRecord } from '../parts/part-api';
import { PART_KINDS, type PartTable } from '../parts/part-kinds';
import { draftProblems, type Problems } from '../forms/draft-problems';
import { partSchemasByTable } from '$service/schemas/part-schemas-by-table';
import { FormState } from './form.svelte';

const NEW_DEFAULTS: Readonly<Record<PartTable, Record<string, unknown>>> = {
  batteries: { chemistry: 'lipo', cellsSeries: 4, cellsParallel: 1, cycleCount: 0, retired: false, notes: '' },
  motors: { notes: '' },
  controllers: { notes: '' },
  propellers: { blades: 2, notes: '' },
  vehicles: { kind: 'car', customerId: null, className: '', notes: '' },
};

/** One part's or vehicle's form (see form.svelte.ts for what every form does). */
export class PartFormState extends FormState<PartRecord> {
  constructor(
    private readonly client: Client,
    readonly table: PartTable,
    readonly id: string | null,
    units: UnitSystem,
  ) {
    super(PART_FIELDS[table], units, id !== null);
    this.start();
  }

  protected read(): Promise<PartRecord> {
    return partApi.get(this.client, this.table, this.record?.id ?? this.id ?? '');
  }

  protected draftOf(record: PartRecord | null): Draft {
    return toDraft(this.fields, record ? { ...record } : null, this.units, NEW_DEFAULTS[this.table]);
  }

  problems(): Problems {
    return draftProblems(this.fields, this.draft, this.units, partSchemasByTable[this.table].create);
  }

  /** What the leave guard says while there are unsaved edits. */
  leaveMessage(): string | null {
    return this.unsavedMessage(this.record ? `“${this.record.name}”` : `The new ${PART_KINDS[this.table].one}`);
  }

  /** Creates or updates; returns the stored record, or null when the save failed (the draft stays). */
  save(): Promise<PartRecord | null> {
    return this.submit(async () => {
      if (this.record === null) {
        const stored = await partApi.create(this.client, this.table, draftToRecord(this.fields, this.draft, this.units));
        this.notice = `Added ${PART_KINDS[this.table].one} “${stored.name}”.`;
        this.saved(stored);
        return stored;
      }
      const changes = draftChanges(this.fields, this.draft, this.base, this.units);
      if (Object.keys(changes).length === 0) {
        this.notice = 'Nothing changed.';
        return this.record;
      }
      const reason = this.reason.trim();
      if (!(await this.confirmed({ part: { kind: this.table, id: this.record.id, expectedVersion: this.record.version, changes, reason } }))) return null;
      const result = await partApi.update(this.client, this.table, this.record.id, this.record.version, changes, reason);
      const changedVerdicts = result.verdictChanges.filter((c) => c.supplyId === null).length;
      this.notice = `Saved. ${result.rechecked === 0 ? 'No build uses it.' : `${result.rechecked} build${result.rechecked === 1 ? '' : 's'} re-checked${result.verdictChanges.length ? `, ${changedVerdicts} verdict${changedVerdicts === 1 ? '' : 's'} changed` : ''}.`}`;
      this.saved(result.record);
      return result.record;
    });
  }

  async setArchived(archived: boolean): Promise<boolean> {
    const record = this.record;
    if (record === null) return false;
    this.saving = true;
    this.formError = null;
    try {
      const result = await partApi.archive(this.client, this.table, record.id, record.version, archived, this.reason.trim());
      this.saved(result.record);
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
