import type { ApiError } from '$service/contract';
import type { UnitSystem } from '$core/units';
import { asApiError } from '../api/client';
import { problemSummary, type Draft } from '../forms/draft';
import { placeError } from '../forms/placed-error';
import type { Problems } from '../forms/draft-problems';
import type { FieldDef } from '../parts/part-fields';
import type { PreviewRequest } from './over-confirm.svelte';

/**
 * The life of one record's form, the same on every screen that edits one: read it, keep what
 * the user types (as typed, through any failed save), check every field before anything is
 * sent, save at the version it was read at, and when another writer saved first, load their
 * version and put the user's own edits back on top. Nothing typed is lost on any path.
 *
 * A screen's form supplies what differs: how to read the record, how a record becomes a draft,
 * how its fields are checked, and any state beside the fields (a build's supplies).
 */
export abstract class FormState<R> {
  record = $state.raw<R | null>(null);
  /** The draft of the record as read: what `draft` is compared with. */
  base = $state<Draft>({});
  draft = $state<Draft>({});
  reason = $state('');
  errors = $state<Record<string, string>>({});
  formError = $state<ApiError | null>(null);
  saving = $state(false);
  notice = $state<string | null>(null);
  loaded = $state(false);
  /** Asked before a write that would make a build OVER (see over-confirm.svelte.ts); false keeps the form unsaved. */
  confirmWrite: ((request: PreviewRequest) => Promise<boolean>) | null = null;

  conflict = $derived(this.formError?.kind === 'conflict');
  dirty = $derived(Object.keys(this.draft).some((k) => this.draft[k] !== this.base[k]) || this.otherEdits());

  constructor(
    readonly fields: readonly FieldDef[],
    protected units: UnitSystem,
    /** False for a new record: there is nothing to read, and the form starts from its defaults. */
    private readonly stored: boolean,
  ) {}

  /** Reads the stored record (on opening, and its newest version after a conflict). */
  protected abstract read(): Promise<R>;
  /** The record as the form shows it; null gives a new record's defaults. */
  protected abstract draftOf(record: R | null): Draft;
  /** Every field that cannot be saved as typed, each with its own message. */
  abstract problems(): Problems;

  /** Edits held beside the fields (a build's supplies) that also make the form unsaved. */
  protected otherEdits(): boolean {
    return false;
  }
  /** Resets what is held beside the fields to the record as read. */
  protected resetOther(_record: R | null): void {}
  /** After a conflict: the newest record under what is held beside the fields, keeping the user's edits of it. */
  protected rebaseOther(_latest: R): void {}
  /** Labels for problem keys that are not fields (a build's `supplies`). */
  protected otherLabels(): Record<string, string> {
    return {};
  }
  /** Where a service error about `key` is shown; null shows it in the summary only. */
  protected errorSlot(key: string): string | null {
    return this.fields.some((f) => f.key === key) ? key : null;
  }

  /** Starts a new record's form from its defaults; a stored one waits for load(). */
  protected start(): void {
    if (!this.stored) this.reset(null);
  }

  protected reset(record: R | null): void {
    this.record = record;
    this.base = this.draftOf(record);
    this.draft = { ...this.base };
    this.resetOther(record);
    this.errors = {};
    this.formError = null;
    this.loaded = true;
  }

  async load(): Promise<void> {
    if (!this.stored) return;
    try {
      this.reset(await this.read());
    } catch (error) {
      this.formError = asApiError(error);
    }
  }

  /**
   * A newer stored record arrived from elsewhere (the same user on another screen): shown at
   * once on an untouched form; a form with edits keeps them as typed.
   */
  refresh(record: R): void {
    if (!this.dirty) this.reset(record);
  }

  /** Switches units while keeping unsaved edits out of harm's way: only an untouched form is re-read. */
  setUnits(units: UnitSystem): void {
    if (units === this.units) return;
    this.units = units;
    if (!this.dirty) this.reset(this.record);
  }

  /** What a leave guard asks about: a sentence when there are unsaved edits, else null. */
  unsavedMessage(subject: string): string | null {
    return this.dirty && !this.saving ? `${subject} has changes that are not saved.` : null;
  }

  /** A service error, placed beside the field it names and summarised with the field's label. */
  protected fail(error: unknown): void {
    const placed = placeError(error, (key) => this.fields.find((f) => f.key === key), this.units);
    const slot = placed.key ? this.errorSlot(placed.key) : null;
    this.errors = slot && placed.beside !== null ? { [slot]: placed.beside } : {};
    this.formError = placed.summary;
  }

  /**
   * One save: the fields are checked first (nothing is sent while any is refused), then `write`
   * runs; whatever it throws is shown by field and the draft stays as typed.
   */
  protected async submit<T>(write: () => Promise<T | null>): Promise<T | null> {
    this.errors = {};
    this.formError = null;
    this.notice = null;
    const problems = this.problems();
    if (Object.keys(problems).length > 0) {
      this.errors = problems;
      this.formError = { kind: 'invalid', message: problemSummary(problems, this.fields, this.units, this.otherLabels()) };
      return null;
    }
    this.saving = true;
    try {
      return await write();
    } catch (error) {
      this.fail(error);
      return null;
    } finally {
      this.saving = false;
    }
  }

  /** Asks before a write that would make a build OVER; false leaves a notice and writes nothing. */
  protected async confirmed(request: PreviewRequest): Promise<boolean> {
    if (!this.confirmWrite || (await this.confirmWrite(request))) return true;
    this.notice = 'Not saved: nothing was written.';
    return false;
  }

  /** After a write: the stored record becomes what the form shows and compares with. */
  protected saved(record: R): void {
    this.reason = '';
    this.reset(record);
  }

  /**
   * After a conflict: read the version someone else saved and put the user's own edits back
   * on top, so saving again applies exactly what they changed and keeps what the other
   * writer changed everywhere else.
   */
  async rebase(): Promise<void> {
    if (this.record === null) return;
    try {
      const latest = await this.read();
      const fresh = this.draftOf(latest);
      const merged: Draft = { ...fresh };
      for (const key of Object.keys(this.draft)) if (this.draft[key] !== this.base[key]) merged[key] = this.draft[key]!;
      this.rebaseOther(latest);
      this.record = latest;
      this.base = fresh;
      this.draft = merged;
      this.formError = null;
      this.errors = {};
      this.notice = 'Loaded the latest version; your changes are kept on top. Check them and save again.';
    } catch (error) {
      this.fail(error);
    }
  }
}
