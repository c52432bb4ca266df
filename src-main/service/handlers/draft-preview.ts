import type * as v from 'valibot';
import type { DraftKind } from '../../core/catalogue/draft-fields';
import type { Build } from '../../core/domain';
import { getBuild, loadBuilds, updateBuildAtVersion, type BuildFields } from '../../store/repositories/builds';
import { insertPart } from '../../store/repositories/parts';
import type { PartFields } from '../../store/repositories/part-records';
import { ServiceError } from '../contract';
import { ID_PREFIXES } from '../record-labels';
import { runWrite, type WriteOutcome } from '../run-write';
import { draftPartSchemas, type draftPreviewSchema } from '../schemas/draft-schemas';
import { partSchemasByTable } from '../schemas/part-schemas-by-table';
import type { ServiceContext } from '../service-context';
import { validate } from '../validate';
import { conflict } from './part-handlers';

export type DraftPreviewInput = v.InferOutput<typeof draftPreviewSchema>;

export interface DraftTried {
  /** Builds the draft was fitted to. */
  tried: string[];
  /** Builds of the vehicle that have no pack at the place named, so the draft pack was not tried there. */
  skipped: string[];
}

/** The draft's fields, checked as a draft and then filled with the fallbacks of a new record. */
function draftFields(kind: DraftKind, part: Record<string, unknown>): Record<string, unknown> {
  const draft = validate(draftPartSchemas[kind], part, 'draft.part.');
  return validate(partSchemasByTable[kind].create, draft, 'draft.part.') as Record<string, unknown>;
}

/** The build's change that fits the draft, or null where a pack has no place to go. */
function fitted(build: Build, kind: DraftKind, draftId: string, packAt: { supply: number; pack: number }): Partial<BuildFields> | null {
  if (kind === 'motors') return { motorId: draftId };
  if (kind === 'controllers') return { controllerId: draftId };
  if (kind === 'propellers') return { propellerId: draftId };
  if (build.supplies[packAt.supply]?.batteryIds[packAt.pack] === undefined) return null;
  return {
    supplies: build.supplies.map((s, i) => ({ ...s, batteryIds: s.batteryIds.map((packId, j) => (i === packAt.supply && j === packAt.pack ? draftId : packId)) })),
  };
}

/**
 * Tries a part that is not in the inventory: it is added, fitted to the build (or to every
 * active build of the build's vehicle), the builds re-checked, and the whole transaction rolled
 * back, so nothing is written and the figures are the ones saving the part and fitting it would give.
 */
export async function previewDraft(ctx: ServiceContext, input: DraftPreviewInput): Promise<WriteOutcome<DraftTried>> {
  const fields = draftFields(input.kind, input.part);
  const packAt = input.packAt ?? { supply: 0, pack: 0 };
  return runWrite(
    ctx,
    async (trx, at) => {
      const build = await getBuild(trx, input.buildId);
      if (!build) throw new ServiceError('not-found', `draft.buildId: no build with id "${input.buildId}"`, 'draft.buildId');
      if (input.kind === 'batteries' && build.supplies[packAt.supply]?.batteryIds[packAt.pack] === undefined) {
        throw new ServiceError('invalid', `draft.packAt: this build has no pack ${packAt.pack + 1} in supply ${packAt.supply + 1}`, 'draft.packAt');
      }
      const others = input.scope === 'vehicle' && build.vehicleId !== null ? (await loadBuilds(trx, { by: 'part', kind: 'vehicles', id: build.vehicleId })).filter((b) => b.id !== build.id && b.archivedAt === null) : [];
      const draftId = ctx.newId(ID_PREFIXES[input.kind]);
      await insertPart(trx, input.kind, draftId, fields as unknown as PartFields<DraftKind>, at);
      const outcome: DraftTried = { tried: [], skipped: [] };
      for (const target of [build, ...others].sort((a, b) => (a.id === build.id ? -1 : b.id === build.id ? 1 : a.name.localeCompare(b.name)))) {
        const patch = fitted(target, input.kind, draftId, packAt);
        if (!patch) {
          outcome.skipped.push(target.id);
          continue;
        }
        if ((await updateBuildAtVersion(trx, target.id, target.version, patch, at)) === 0) throw conflict('builds', target, target.version);
        outcome.tried.push(target.id);
      }
      return { result: outcome, history: null, recheck: outcome.tried, changed: { kind: input.kind, ids: [] } };
    },
    { preview: true, messages: true },
  );
}
