import type { FigureKey } from '$core/catalogue/figures';
import type { UnitSystem } from '$core/units';
import type { ApiError } from '$service/contract';
import { asApiError, type CallOutput, type Client } from '../api/client';
import { isLimitFigure, limitField } from '../classes/limit-figures';
import { readDraftValue, toDraftValue } from '../forms/draft';

type StoredClass = CallOutput<'classes.get'>;

/** One limit row as typed: the figure picked and the limit as text in the unit shown. */
export interface LimitDraft {
  /** The stored limit this row edits; null for a new row. */
  id: string | null;
  figure: FigureKey | '';
  limit: string;
  /** A stored limit on a figure this Rigbook does not compute: kept as it is unless removed. */
  unknownFigure: string | null;
}

let rowSeq = 0;

/** A class's editor: name, notes and limits, saved as one write that re-checks the class's builds. */
export class ClassFormState {
  record = $state.raw<StoredClass | null>(null);
  name = $state('');
  notes = $state('');
  reason = $state('');
  limits = $state<(LimitDraft & { key: number })[]>([]);
  errors = $state<Record<string, string>>({});
  formError = $state<ApiError | null>(null);
  notice = $state<string | null>(null);
  saving = $state(false);
  loaded = $state(false);
  conflict = $derived(this.formError?.kind === 'conflict' && this.formError.field === 'expectedVersion');

  constructor(
    private readonly client: Client,
    readonly id: string | null,
    private readonly units: UnitSystem,
  ) {}

  async load(): Promise<void> {
    if (this.id === null) {
      this.loaded = true;
      return;
    }
    try {
      this.fill(await this.client.call('classes.get', { id: this.id }));
    } catch (error) {
      this.formError = asApiError(error);
    } finally {
      this.loaded = true;
    }
  }

  private fill(stored: StoredClass): void {
    this.record = stored;
    this.name = stored.name;
    this.notes = stored.notes;
    this.limits = stored.limits.map((l): LimitDraft & { key: number } => {
      const figure = l.figure;
      if (isLimitFigure(figure)) return { key: ++rowSeq, id: l.id, figure, limit: String(toDraftValue(limitField(figure), l.limit, this.units)), unknownFigure: null };
      return { key: ++rowSeq, id: l.id, figure: '', limit: String(l.limit), unknownFigure: figure };
    });
  }

  addLimit(): void {
    this.limits = [...this.limits, { key: ++rowSeq, id: null, figure: '', limit: '', unknownFigure: null }];
  }

  removeLimit(key: number): void {
    this.limits = this.limits.filter((l) => l.key !== key);
  }

  /** Reads every row; a row that cannot be read is named, and nothing is sent. */
  private readLimits(): { figure: FigureKey; limit: number; id?: string }[] | null {
    const errors: Record<string, string> = {};
    const out: { figure: FigureKey; limit: number; id?: string }[] = [];
    const seen = new Set<string>();
    this.limits.forEach((row, i) => {
      if (row.unknownFigure !== null) {
        errors[`limits[${i}].figure`] = `names "${row.unknownFigure}", a figure this Rigbook does not compute: pick a figure or remove the limit`;
        return;
      }
      if (row.figure === '') {
        errors[`limits[${i}].figure`] = 'pick the figure this limit applies to';
        return;
      }
      if (seen.has(row.figure)) {
        errors[`limits[${i}].figure`] = 'the class already has a limit on this figure; keep one';
        return;
      }
      seen.add(row.figure);
      const reading = readDraftValue(limitField(row.figure), row.limit, this.units);
      if (!reading.ok) errors[`limits[${i}].limit`] = reading.message;
      else if (typeof reading.value !== 'number' || !(reading.value > 0)) errors[`limits[${i}].limit`] = 'is required: a limit above zero';
      else out.push({ figure: row.figure, limit: reading.value, ...(row.id !== null ? { id: row.id } : {}) });
    });
    if (this.name.trim() === '') errors.name = 'is required';
    this.errors = errors;
    return Object.keys(errors).length > 0 ? null : out;
  }

  /** Saves; returns the class's id, or null when nothing was saved (the draft stays as typed). */
  async save(): Promise<string | null> {
    this.notice = null;
    this.formError = null;
    const limits = this.readLimits();
    if (limits === null) {
      this.formError = { kind: 'invalid', message: 'Some entries cannot be saved yet: see the fields marked below.' };
      return null;
    }
    this.saving = true;
    try {
      const record = this.record;
      const result = await this.client.call('classes.save', {
        ...(record ? { id: record.id, expectedVersion: record.version } : {}),
        name: this.name,
        notes: this.notes,
        limits,
        reason: this.reason.trim(),
      });
      const changed = result.verdictChanges.filter((c) => c.supplyId === null).length;
      this.fill(result.record);
      this.reason = '';
      this.notice = `Saved. ${result.rechecked === 0 ? 'No build is in this class yet.' : `${result.rechecked} build${result.rechecked === 1 ? '' : 's'} of the class re-checked, ${changed} verdict${changed === 1 ? '' : 's'} changed.`}`;
      return result.record.id;
    } catch (error) {
      const e = asApiError(error);
      this.formError = e;
      if (e.field && e.field !== 'expectedVersion') this.errors = { [e.field]: e.message.replace(/^[^:]*: /, '') };
      return null;
    } finally {
      this.saving = false;
    }
  }

  /** After a conflict: the stored class again, keeping nothing typed (the message said what clashed). */
  async reload(): Promise<void> {
    this.formError = null;
    const id = this.record?.id ?? this.id;
    if (id !== null) this.fill(await this.client.call('classes.get', { id }));
  }
}
