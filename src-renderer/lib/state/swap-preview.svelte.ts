import type { ApiError } from '$service/contract';
import type { BuildVerdict, Gearing } from '$core/domain';
import type { UnitSystem } from '$core/units';
import type { Client } from '../api/client';
import type { BuildSheet } from './build-sheet.svelte';
import { fromDraftValue, recordValue, toDraftValue, problemSummary } from '../forms/draft';
import { placeError } from '../forms/placed-error';
import { draftProblems, type Problems } from '../forms/draft-problems';
import type { ApiInput } from '$service/handlers';
import { typedInput } from '../api/typed-input';
import { buildPatchSchema, gearingSchema } from '$service/schemas/build-schemas';
import { partSchemasByTable } from '$service/schemas/part-schemas-by-table';
import { BUILD_FIELDS, GEARING_KEYS } from '../builds/build-fields';
import { PART_FIELDS, type FieldDef } from '../parts/part-fields';
import { Loader } from './loader.svelte';
import { partApi } from '../parts/part-api';
import type { PartTable } from '../parts/part-kinds';
import { DraftPart } from './draft-part.svelte';

export type SwapMode = 'part' | 'gearing' | 'record' | 'draft';

export interface PreviewResult {
  before: BuildVerdict[];
  after: BuildVerdict[];
  verdictChanges: { buildId: string; supplyId: string | null; from: BuildVerdict['status'] | null; to: BuildVerdict['status'] }[];
  /** Builds of the vehicle a draft pack had no place in. */
  skipped?: string[];
}

type DraftRequest = Extract<ApiInput<'builds.preview'>, { draft: unknown }>;

/** A slot of the build a replacement can go into: the motor, controller, propeller or one pack of a supply. */
export type Slot = 'motorId' | 'controllerId' | 'propellerId' | `pack:${number}:${number}`;

export const GEARING_DEFS: readonly FieldDef[] = GEARING_KEYS.map((k) => BUILD_FIELDS[k]);

/**
 * A what-if on one build: a part swapped, the gearing changed, or a shared part's record
 * edited. The preview runs the real write and rolls it back; nothing is stored until Save.
 */
export class SwapPreviewState {
  /** The build as read when the screen opened; the what-if is made against that version. */
  readonly source = new Loader<BuildSheet>(
    () => this.client.call('builds.get', { id: this.id }),
    (sheet) => {
      this.slot = sheet.build.supplies.length > 0 ? 'pack:0:0' : 'motorId';
    },
  );
  sheet = $derived(this.source.value);
  mode = $state<SwapMode>('part');
  slot = $state<Slot>('motorId');
  replacementId = $state('');
  gearing = $state<Record<string, string>>({});
  recordTarget = $state('');
  recordField = $state('');
  recordValue = $state('');
  reason = $state('');
  result = $state.raw<PreviewResult | null>(null);
  /** The request behind the preview on screen, as JSON: what the compare view previews again. */
  previewed = $state<string | null>(null);
  error = $state<ApiError | null>(null);
  fieldError = $state<string | null>(null);
  /** Problems of the typed values, by field key, each shown beside its input. */
  fieldErrors = $state<Problems>({});
  busy = $state(false);
  saved = $state(false);
  /** A part typed in on the spot (the "draft" mode). */
  readonly draft: DraftPart;
  /** The draft part once added to the inventory at the person's asking. */
  added = $state<{ table: PartTable; id: string; name: string } | null>(null);

  constructor(
    private readonly client: Client,
    readonly id: string,
    private readonly units: UnitSystem,
  ) {
    this.draft = new DraftPart(() => this.units);
  }

  async load(): Promise<void> {
    if (await this.source.load()) this.resetGearing();
    else this.error = this.source.error;
  }

  resetGearing(): void {
    const g = this.sheet?.build.gearing;
    const out: Record<string, string> = {};
    for (const def of GEARING_DEFS) out[def.key] = String(toDraftValue(def, g ? g[def.key.slice('gearing.'.length) as keyof Gearing] : null, this.units));
    this.gearing = out;
  }

  /** The id now in a slot, for showing what is being replaced. */
  currentIn(slot: Slot): string | null {
    const b = this.sheet?.build;
    if (!b) return null;
    if (slot === 'motorId' || slot === 'controllerId' || slot === 'propellerId') return b[slot];
    const [, s, p] = slot.split(':');
    return b.supplies[Number(s)]?.batteryIds[Number(p)] ?? null;
  }

  slotTable(slot: Slot): PartTable {
    if (slot === 'motorId') return 'motors';
    if (slot === 'controllerId') return 'controllers';
    if (slot === 'propellerId') return 'propellers';
    return 'batteries';
  }

  /** The build's parts whose records can be edited here, as `table:id`. */
  recordTargets(): { value: string; table: PartTable; id: string }[] {
    const s = this.sheet;
    if (!s) return [];
    const out: { value: string; table: PartTable; id: string }[] = [];
    for (const b of s.batteries) out.push({ value: `batteries:${b.id}`, table: 'batteries', id: b.id });
    if (s.motor) out.push({ value: `motors:${s.motor.id}`, table: 'motors', id: s.motor.id });
    if (s.controller) out.push({ value: `controllers:${s.controller.id}`, table: 'controllers', id: s.controller.id });
    if (s.propeller) out.push({ value: `propellers:${s.propeller.id}`, table: 'propellers', id: s.propeller.id });
    if (s.vehicle) out.push({ value: `vehicles:${s.vehicle.id}`, table: 'vehicles', id: s.vehicle.id });
    return out;
  }

  recordFields(): FieldDef[] {
    const [table] = this.recordTarget.split(':');
    const defs = PART_FIELDS[(table ?? '') as PartTable] ?? [];
    return defs.filter((d) => d.type === 'number' || d.type === 'integer');
  }

  private targetRecord(): { table: PartTable; record: { id: string; version: number } } | null {
    const [table, id] = this.recordTarget.split(':') as [PartTable, string];
    const s = this.sheet;
    if (!s || !id) return null;
    const all: { id: string; version: number }[] = [...s.batteries, ...[s.motor, s.controller, s.propeller, s.vehicle].filter((x) => x !== null)];
    const record = all.find((r) => r.id === id);
    return record ? { table, record } : null;
  }

  /** The current value of the chosen record field, in display units. */
  currentRecordValue(): string {
    const t = this.targetRecord();
    const def = this.recordFields().find((d) => d.key === this.recordField);
    if (!t || !def) return '';
    return String(toDraftValue(def, recordValue(t.record, def.key), this.units));
  }

  private buildChanges(): Record<string, unknown> | null {
    const b = this.sheet?.build;
    if (!b) return null;
    if (this.mode === 'part') {
      if (this.replacementId === '') return null;
      if (this.slot.startsWith('pack:')) {
        const [, s, p] = this.slot.split(':').map(Number) as [number, number, number];
        const supplies = b.supplies.map((sup, i) => ({
          id: sup.id,
          arrangement: sup.arrangement,
          batteryIds: sup.batteryIds.map((x, j) => (i === s && j === p ? this.replacementId : x)),
        }));
        return { supplies };
      }
      return { [this.slot]: this.replacementId };
    }
    const gearing: Record<string, unknown> = {};
    for (const def of GEARING_DEFS) gearing[def.key.slice('gearing.'.length)] = fromDraftValue(def, this.gearing[def.key] ?? '', this.units);
    return { gearing };
  }

  /** Where a draft pack goes: the pack chosen in the slot list, else the first pack. */
  draftPackAt(): { supply: number; pack: number } {
    if (!this.slot.startsWith('pack:')) return { supply: 0, pack: 0 };
    const [, supply, pack] = this.slot.split(':').map(Number) as [number, number, number];
    return { supply, pack };
  }

  /** What the preview or save call takes. */
  private request(): { build: ApiInput<'builds.update'> } | { part: { kind: PartTable; id: string; expectedVersion: number; changes: Record<string, unknown>; reason: string } } | DraftRequest | null {
    const b = this.sheet?.build;
    if (!b) return null;
    if (this.mode === 'draft') {
      const d = this.draft;
      return { draft: { kind: d.kind, part: d.record(), buildId: b.id, scope: d.scope, ...(d.kind === 'batteries' ? { packAt: this.draftPackAt() } : {}) } };
    }
    if (this.mode === 'record') {
      const t = this.targetRecord();
      const def = this.recordFields().find((d) => d.key === this.recordField);
      if (!t || !def) return null;
      return { part: { kind: t.table, id: t.record.id, expectedVersion: t.record.version, changes: { [def.key]: fromDraftValue(def, this.recordValue, this.units) }, reason: this.reason.trim() } };
    }
    const changes = this.buildChanges();
    return changes ? { build: { id: b.id, expectedVersion: b.version, changes: typedInput(buildPatchSchema, changes, 'build.changes.'), reason: this.reason.trim() } } : null;
  }

  private fail(error: unknown): void {
    // A gearing field is named `gearing.pinionTeeth` by a build change and `pinionTeeth` inside the gearing.
    const defOf = (key: string) => [...GEARING_DEFS, ...this.recordFields()].find((d) => d.key === key || d.key === `gearing.${key.replace(/^gearing\./, '')}`);
    if (this.mode === 'draft') {
      // The service names a draft's field `draft.part.<key>`.
      const placed = placeError(error, (key) => this.draft.defs.find((d) => d.key === key.replace(/^(draft\.part\.)/, '')), this.units);
      this.error = placed.summary;
      if (placed.key !== null && placed.beside !== null) this.draft.errors = { [placed.key.replace(/^(draft\.part\.)/, '')]: placed.beside };
      return;
    }
    const placed = placeError(error, defOf, this.units);
    this.error = placed.summary;
    this.fieldError = placed.key !== null && defOf(placed.key) ? placed.beside : null;
  }

  /** Every typed value that cannot be used, before anything is sent; true when all are fine. */
  private check(): boolean {
    if (this.mode === 'draft') {
      const summary = this.draft.check();
      if (summary !== null) this.error = { kind: 'invalid', message: summary };
      return summary === null;
    }
    let problems: Problems = {};
    let defs = GEARING_DEFS;
    if (this.mode === 'gearing') {
      problems = draftProblems(
        GEARING_DEFS,
        this.gearing,
        this.units,
        gearingSchema,
        (values) => Object.fromEntries(Object.entries(values).map(([k, x]) => [k.slice('gearing.'.length), x])),
        (path) => `gearing.${path}`,
      );
    } else if (this.mode === 'record') {
      const [table] = this.recordTarget.split(':') as [PartTable];
      const def = this.recordFields().find((d) => d.key === this.recordField);
      if (def) {
        defs = [def];
        problems = draftProblems([def], { [def.key]: this.recordValue }, this.units, partSchemasByTable[table].patch);
      }
    }
    this.fieldErrors = problems;
    if (Object.keys(problems).length === 0) return true;
    this.error = { kind: 'invalid', message: problemSummary(problems, defs, this.units) };
    return false;
  }

  /** The request, or undefined when the change was refused before sending (the error says why). */
  private checkedRequest(): ReturnType<SwapPreviewState['request']> | undefined {
    try {
      return this.request();
    } catch (error) {
      this.fail(error);
      return undefined;
    }
  }

  async preview(): Promise<void> {
    this.error = null;
    this.fieldError = null;
    if (!this.check()) return;
    const req = this.checkedRequest();
    if (req === undefined) return;
    if (!req) {
      this.error = { kind: 'invalid', message: this.mode === 'record' ? 'Pick a part, a field and a new value first.' : 'Pick a replacement first.' };
      return;
    }
    this.busy = true;
    try {
      this.result = await this.client.call('builds.preview', req);
      this.previewed = JSON.stringify(req);
    } catch (error) {
      this.result = null;
      this.fail(error);
    } finally {
      this.busy = false;
    }
  }

  /** Writes the change for real, with the reason, through the same operation an edit uses. */
  async save(): Promise<boolean> {
    if (!this.check()) return false;
    const req = this.checkedRequest();
    if (!req) return false;
    this.busy = true;
    this.error = null;
    try {
      if ('build' in req) {
        await this.client.call('builds.update', req.build);
      } else if ('part' in req) {
        const p = req.part;
        await partApi.update(this.client, p.kind, p.id, p.expectedVersion, p.changes, p.reason);
      } else {
        // A draft part is never saved into a build from here: it is added to the inventory on its own.
        return false;
      }
      this.saved = true;
      return true;
    } catch (error) {
      this.fail(error);
      return false;
    } finally {
      this.busy = false;
    }
  }

  /**
   * Adds the draft part to the inventory, only at the person's asking; it is fitted to no build
   * (that is a change of its own, previewed and saved as any other swap).
   */
  async addDraftToInventory(): Promise<boolean> {
    if (!this.check()) return false;
    this.busy = true;
    this.error = null;
    try {
      const stored = await partApi.create(this.client, this.draft.kind, this.draft.record());
      this.added = { table: this.draft.kind, id: stored.id, name: stored.name };
      return true;
    } catch (error) {
      this.fail(error);
      return false;
    } finally {
      this.busy = false;
    }
  }

  /** Turns to replacing a part, with the added part chosen in the draft's place. */
  fitAdded(): void {
    const added = this.added;
    if (!added) return;
    this.mode = 'part';
    if (added.table !== 'batteries') this.slot = added.table === 'motors' ? 'motorId' : added.table === 'controllers' ? 'controllerId' : 'propellerId';
    this.replacementId = added.id;
    this.added = null;
    this.clear();
  }

  /** Drops the preview; the store was never touched. */
  clear(): void {
    this.result = null;
    this.previewed = null;
    this.error = null;
    this.fieldError = null;
    this.fieldErrors = {};
  }
}
