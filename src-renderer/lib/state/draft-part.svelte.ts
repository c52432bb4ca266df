import { DRAFT_KINDS, draftFieldKeys, type DraftKind } from '$core/catalogue/draft-fields';
import type { UnitSystem } from '$core/units';
import { draftPartSchemas, type DRAFT_SCOPES } from '$service/schemas/draft-schemas';
import { draftProblems, type Problems } from '../forms/draft-problems';
import { draftToRecord, problemSummary, toDraft, type Draft } from '../forms/draft';
import { PART_FIELDS, type FieldDef } from '../parts/part-fields';

export { DRAFT_KINDS, type DraftKind };
export type DraftScope = (typeof DRAFT_SCOPES)[number];

/** The form fields of a draft part: only those the checks read, in the part form's order. */
export function draftDefs(kind: DraftKind): FieldDef[] {
  const keys: readonly string[] = draftFieldKeys(kind);
  return PART_FIELDS[kind].filter((def) => keys.includes(def.key));
}

/**
 * A part typed in on the spot to try against a build before it is owned. Nothing is stored
 * until the person asks for the part to be added to the inventory.
 */
export class DraftPart {
  kind = $state<DraftKind>('motors');
  values = $state<Draft>({});
  scope = $state<DraftScope>('build');
  errors = $state<Problems>({});
  defs = $derived(draftDefs(this.kind));

  constructor(private readonly units: () => UnitSystem) {
    this.reset();
  }

  /** Empty fields, with a new record's fallbacks (one cell in parallel) and a first choice of chemistry. */
  reset(): void {
    this.values = toDraft(draftDefs(this.kind), null, this.units(), { chemistry: 'lipo', cellsParallel: 1 });
    this.errors = {};
  }

  setKind(kind: DraftKind): void {
    this.kind = kind;
    this.reset();
  }

  /** The part in stored units, as `builds.preview` and the kind's create take it. */
  record(): Record<string, unknown> {
    return draftToRecord(this.defs, this.values, this.units());
  }

  /** Every problem of the typed values, each by its field; null when the draft can be sent. */
  check(): string | null {
    this.errors = draftProblems(this.defs, this.values, this.units(), draftPartSchemas[this.kind]);
    return Object.keys(this.errors).length === 0 ? null : problemSummary(this.errors, this.defs, this.units());
  }
}
