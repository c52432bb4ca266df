import type { ApiError } from '$service/contract';
import type { Build, BuildVerdict } from '$core/domain';
import type { UnitSystem } from '$core/units';
import { asApiError, type Client } from '../api/client';
import { draftChanges, draftToRecord, errorFieldKey, fieldLabel, messageForField, problemSummary, toDraft, type Draft } from '../forms/draft';
import { draftProblems, type Problems } from '../forms/draft-problems';
import { buildCreateSchema } from '$service/schemas/build-schemas';
import type { PreviewRequest } from './over-confirm.svelte';
import { BUILD_FIELD_LIST, GEARING_KEYS, flattenBuild, nestBuild, suppliesEqual, type SupplyDraft } from '../builds/build-fields';

const copySupplies = (list: readonly SupplyDraft[]): SupplyDraft[] => list.map((s) => ({ ...(s.id ? { id: s.id } : {}), arrangement: s.arrangement, batteryIds: [...s.batteryIds] }));

const NEW_BUILD = {
  name: '',
  vehicleId: '',
  motorId: '',
  motorCount: 1,
  controllerId: '',
  propellerId: '',
  'gearing.internalRatio': 1,
  'gearing.drivetrainEfficiency': 0.9,
  tightThreshold: null,
  notes: '',
};

/** Creating or editing a build: every field, its supplies of packs, and the service's errors by field. */
export class BuildFormState {
  record = $state.raw<Build | null>(null);
  base = $state<Draft>({});
  draft = $state<Draft>({});
  supplies = $state<SupplyDraft[]>([]);
  baseSupplies = $state.raw<SupplyDraft[]>([]);
  reason = $state('');
  errors = $state<Record<string, string>>({});
  formError = $state<ApiError | null>(null);
  saving = $state(false);
  loaded = $state(false);
  notice = $state<string | null>(null);

  conflict = $derived(this.formError?.kind === 'conflict');
  /** Asked before a write that would make a build OVER (see over-confirm.svelte.ts); false keeps the form unsaved. */
  confirmWrite: ((request: PreviewRequest) => Promise<boolean>) | null = null;
  dirty = $derived(Object.keys(this.draft).some((k) => this.draft[k] !== this.base[k]) || !suppliesEqual(this.supplies, this.baseSupplies) || this.reason.trim() !== '');

  constructor(
    private readonly client: Client,
    readonly id: string | null,
    private readonly units: UnitSystem,
  ) {
    if (id === null) this.reset(null);
  }

  private reset(build: Build | null): void {
    this.record = build;
    this.base = toDraft(BUILD_FIELD_LIST, build ? flattenBuild(build) : null, this.units, NEW_BUILD);
    this.draft = { ...this.base };
    const supplies = build ? build.supplies.map((s) => ({ id: s.id, arrangement: s.arrangement, batteryIds: [...s.batteryIds] })) : [{ arrangement: 'series' as const, batteryIds: [''] }];
    this.baseSupplies = supplies.map((s) => ({ ...s, batteryIds: [...s.batteryIds] }));
    this.supplies = supplies;
    this.errors = {};
    this.formError = null;
    this.loaded = true;
  }

  async load(): Promise<void> {
    if (this.id === null) return;
    try {
      const sheet = await this.client.call('builds.get', { id: this.id });
      this.reset(sheet.build);
    } catch (error) {
      this.formError = asApiError(error);
    }
  }

  addSupply(): void {
    this.supplies.push({ arrangement: 'series', batteryIds: [''] });
  }

  removeSupply(index: number): void {
    this.supplies.splice(index, 1);
  }

  addPack(supply: number): void {
    this.supplies[supply]?.batteryIds.push('');
  }

  removePack(supply: number, pack: number): void {
    this.supplies[supply]?.batteryIds.splice(pack, 1);
  }

  /** Supplies as the service takes them; empty pack slots are left out rather than sent as bad ids. */
  private suppliesInput() {
    return this.supplies
      .map((s) => ({ ...(s.id ? { id: s.id } : {}), arrangement: s.arrangement, batteryIds: s.batteryIds.filter((id) => id !== '') }))
      .filter((s) => s.batteryIds.length > 0);
  }

  private fail(error: unknown): void {
    const e = asApiError(error);
    const key = errorFieldKey(e.field);
    const def = key ? BUILD_FIELD_LIST.find((f) => f.key === key) : undefined;
    this.errors = key ? { [key.startsWith('supplies') ? 'supplies' : key]: messageForField(e.message, e.field) } : {};
    this.formError = def ? { ...e, message: `${fieldLabel(def, this.units)}: ${messageForField(e.message, e.field)}` } : e;
  }

  /** Every field that cannot be saved as typed, each with its own message (supplies under `supplies`). */
  problems(): Problems {
    return draftProblems(
      BUILD_FIELD_LIST,
      this.draft,
      this.units,
      buildCreateSchema,
      (values) => ({ ...nestBuild(values), supplies: this.suppliesInput() }),
      (path) => (path.startsWith('supplies') ? 'supplies' : path),
    );
  }

  /** Saves; returns the build and its verdict, or null when the save failed (nothing typed is lost). */
  async save(): Promise<{ record: Build; verdict: BuildVerdict | null } | null> {
    this.errors = {};
    this.formError = null;
    this.notice = null;
    const problems = this.problems();
    if (Object.keys(problems).length > 0) {
      this.errors = problems;
      this.formError = { kind: 'invalid', message: problemSummary(problems, BUILD_FIELD_LIST, this.units, { supplies: 'Supplies' }) };
      return null;
    }
    this.saving = true;
    try {
      if (this.record === null) {
        const fields = nestBuild(draftToRecord(BUILD_FIELD_LIST, this.draft, this.units));
        const payload = { ...fields, supplies: this.suppliesInput() };
        if (this.confirmWrite && !(await this.confirmWrite({ create: payload }))) {
          this.notice = 'Not saved: nothing was written.';
          return null;
        }
        const result = (await this.client.callUntyped('builds.create', payload)) as { record: Build; verdict: BuildVerdict | null };
        this.reset(result.record);
        return result;
      }
      const flat = draftChanges(BUILD_FIELD_LIST, this.draft, this.base, this.units);
      // Gearing is replaced whole by a patch: send all of it when any part changed.
      if (GEARING_KEYS.some((k) => `gearing.${k}` in flat)) {
        for (const k of GEARING_KEYS) flat[`gearing.${k}`] ??= draftToRecord(BUILD_FIELD_LIST, this.draft, this.units)[`gearing.${k}`];
      }
      const changes = nestBuild(flat);
      if (!suppliesEqual(this.supplies, this.baseSupplies)) changes.supplies = this.suppliesInput();
      if (Object.keys(changes).length === 0) {
        this.notice = 'Nothing changed.';
        return { record: this.record, verdict: null };
      }
      const update = { id: this.record.id, expectedVersion: this.record.version, changes, reason: this.reason.trim() };
      if (this.confirmWrite && !(await this.confirmWrite({ build: update }))) {
        this.notice = 'Not saved: nothing was written.';
        return null;
      }
      const result = (await this.client.callUntyped('builds.update', update)) as {
        record: Build;
        verdict: BuildVerdict | null;
      };
      this.reason = '';
      this.reset(result.record);
      return result;
    } catch (error) {
      this.fail(error);
      return null;
    } finally {
      this.saving = false;
    }
  }

  /**
   * After a conflict: read the version someone else saved and put the user's own edits back on
   * top (fields they changed, and the supplies if they changed them), so saving again applies
   * exactly what they changed.
   */
  async rebase(): Promise<void> {
    if (this.record === null) return;
    try {
      const latest = (await this.client.call('builds.get', { id: this.record.id })).build;
      const fresh = toDraft(BUILD_FIELD_LIST, flattenBuild(latest), this.units, NEW_BUILD);
      const merged: Draft = { ...fresh };
      for (const key of Object.keys(this.draft)) if (this.draft[key] !== this.base[key]) merged[key] = this.draft[key]!;
      const theirSupplies = latest.supplies.map((s) => ({ id: s.id, arrangement: s.arrangement, batteryIds: [...s.batteryIds] }));
      const mySupplies = suppliesEqual(this.supplies, this.baseSupplies) ? theirSupplies : copySupplies(this.supplies);
      this.record = latest;
      this.base = fresh;
      this.draft = merged;
      this.baseSupplies = copySupplies(theirSupplies);
      this.supplies = copySupplies(mySupplies);
      this.formError = null;
      this.errors = {};
      this.notice = 'Loaded the latest version; your changes are kept on top. Check them and save again.';
    } catch (error) {
      this.fail(error);
    }
  }
}
