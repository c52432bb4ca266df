import type { Build, BuildVerdict } from '$core/domain';
import type { UnitSystem } from '$core/units';
import type { Client } from '../api/client';
import { typedInput } from '../api/typed-input';
import { draftChanges, draftToRecord, toDraft, type Draft } from '../forms/draft';
import { draftProblems, type Problems } from '../forms/draft-problems';
import { buildCreateSchema, buildPatchSchema } from '$service/schemas/build-schemas';
import { BUILD_FIELD_LIST, GEARING_KEYS, flattenBuild, nestBuild, suppliesEqual, type SupplyDraft } from '../builds/build-fields';
import { FormState } from './form.svelte';

const copySupplies = (list: readonly SupplyDraft[]): SupplyDraft[] => list.map((s) => ({ ...(s.id ? { id: s.id } : {}), arrangement: s.arrangement, batteryIds: [...s.batteryIds] }));
const suppliesOf = (build: Build): SupplyDraft[] => build.supplies.map((s) => ({ id: s.id, arrangement: s.arrangement, batteryIds: [...s.batteryIds] }));

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

/**
 * Creating or editing a build: every field, and beside them its supplies of packs (see
 * form.svelte.ts for what every form does).
 */
export class BuildFormState extends FormState<Build> {
  supplies = $state<SupplyDraft[]>([]);
  baseSupplies = $state.raw<SupplyDraft[]>([]);

  constructor(
    private readonly client: Client,
    readonly id: string | null,
    units: UnitSystem,
  ) {
    super(BUILD_FIELD_LIST, units, id !== null);
    this.start();
  }

  protected async read(): Promise<Build> {
    return (await this.client.call('builds.get', { id: this.record?.id ?? this.id ?? '' })).build;
  }

  protected draftOf(build: Build | null): Draft {
    return toDraft(BUILD_FIELD_LIST, build ? flattenBuild(build) : null, this.units, NEW_BUILD);
  }

  // A typed reason is an edit too: leaving would lose it.
  protected override otherEdits(): boolean {
    return !suppliesEqual(this.supplies, this.baseSupplies) || this.reason.trim() !== '';
  }

  protected override resetOther(build: Build | null): void {
    const supplies = build ? suppliesOf(build) : [{ arrangement: 'series' as const, batteryIds: [''] }];
    this.baseSupplies = copySupplies(supplies);
    this.supplies = supplies;
  }

  /** The newest supplies, unless the user changed them: then theirs stay, whole. */
  protected override rebaseOther(latest: Build): void {
    const theirs = suppliesOf(latest);
    const mine = suppliesEqual(this.supplies, this.baseSupplies) ? theirs : copySupplies(this.supplies);
    this.baseSupplies = copySupplies(theirs);
    this.supplies = copySupplies(mine);
  }

  protected override otherLabels(): Record<string, string> {
    return { supplies: 'Supplies' };
  }

  protected override errorSlot(key: string): string {
    return key.startsWith('supplies') ? 'supplies' : key;
  }

  /** What the leave guard says while there are unsaved edits. */
  leaveMessage(): string | null {
    return this.unsavedMessage(this.record ? `“${this.record.name}”` : 'This new build');
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
    return this.supplies.map((s) => ({ ...(s.id ? { id: s.id } : {}), arrangement: s.arrangement, batteryIds: s.batteryIds.filter((id) => id !== '') })).filter((s) => s.batteryIds.length > 0);
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
  save(): Promise<{ record: Build; verdict: BuildVerdict | null } | null> {
    return this.submit(async () => {
      if (this.record === null) {
        const fields = nestBuild(draftToRecord(BUILD_FIELD_LIST, this.draft, this.units));
        const payload = typedInput(buildCreateSchema, { ...fields, supplies: this.suppliesInput() });
        if (!(await this.confirmed({ create: payload }))) return null;
        const result = await this.client.call('builds.create', payload);
        this.saved(result.record);
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
      const update = { id: this.record.id, expectedVersion: this.record.version, changes: typedInput(buildPatchSchema, changes, 'changes.'), reason: this.reason.trim() };
      if (!(await this.confirmed({ build: update }))) return null;
      const result = await this.client.call('builds.update', update);
      this.saved(result.record);
      return result;
    });
  }
}
