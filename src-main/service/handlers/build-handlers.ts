import * as v from 'valibot';
import type { Build, Supply } from '../../core/domain';
import { evaluateBuild } from '../../core/evaluate';
import type { DbHandle } from '../../store/db-handle';
import { getBuild, insertBuild, updateBuildAtVersion, type BuildFields } from '../../store/repositories/builds';
import { BUILD_SUMMARY_GROUPS, BUILD_SUMMARY_KEYS, BUILD_SUMMARY_PLAIN, listBuildSummaries, type BuildSummary } from '../../store/repositories/build-list';
import { encodeColumns, type ColumnTable } from '../../core/column-table';
import { getPart, getParts } from '../../store/repositories/parts';
import { getEvaluatedAt } from '../../store/repositories/verdicts';
import { byIds } from '../../store/build-selector';
import { readSettings } from '../../store/repositories/settings';
import { ServiceError } from '../contract';
import { defineHandler } from '../define-handler';
import { validate } from '../validate';
import { describeChange } from '../record-diff';
import { loadBuildContexts } from '../recheck';
import { runWrite, type WriteOutcome } from '../run-write';
import { buildCreateSchema, buildPatchSchema } from '../schemas/build-schemas';
import { partSchemasByTable } from '../schemas/part-schemas-by-table';
import { flag, id, MAX_NAME, name, oneOf, record, text } from '../schemas/field-builders';
import { STATUSES, VEHICLE_KINDS } from '../../core/domain';
import { conflict, reasonField, updateInput, writePartPatch } from './part-handlers';
import type { ServiceContext } from '../service-context';
import { draftPreviewSchema } from '../schemas/draft-schemas';
import { previewDraft } from './draft-preview';

type SupplyInput = { id?: string | undefined; arrangement: Supply['arrangement']; batteryIds: string[] };

/** Every id a build names must exist; the message names the field the user filled. */
async function checkReferences(db: DbHandle, buildId: string, fields: Partial<BuildFields>): Promise<void> {
  const refs = [
    ['vehicleId', 'vehicles', fields.vehicleId, 'vehicle'],
    ['motorId', 'motors', fields.motorId, 'motor'],
    ['controllerId', 'controllers', fields.controllerId, 'speed controller'],
    ['propellerId', 'propellers', fields.propellerId, 'propeller'],
  ] as const;
  for (const [field, table, value, label] of refs) {
    if (value === undefined || value === null) continue;
    if (!(await getPart(db, table, value))) throw new ServiceError('invalid', `${field}: no ${label} with id "${value}"`, field);
  }
  if (fields.measuredSupplyId !== undefined && fields.measuredSupplyId !== null) {
    const supplyIds = fields.supplies?.map((s) => s.id) ?? (await getBuild(db, buildId))?.supplies.map((s) => s.id) ?? [];
    if (!supplyIds.includes(fields.measuredSupplyId)) {
      throw new ServiceError('invalid', `measuredSupplyId: the measured currents must name a supply of this build; there is no supply "${fields.measuredSupplyId}"`, 'measuredSupplyId');
    }
  }
  if (!fields.supplies) return;
  const packIds = fields.supplies.flatMap((s) => s.batteryIds);
  const packs = new Map((await getParts(db, 'batteries', packIds)).map((b) => [b.id, b]));
  // One physical pack can be in one place only: twice in a supply or in two supplies is refused.
  const placed = new Set<string>();
  fields.supplies.forEach((s, i) =>
    s.batteryIds.forEach((packId, j) => {
      const field = `supplies.${i}.batteryIds.${j}`;
      const pack = packs.get(packId);
      if (!pack) throw new ServiceError('invalid', `${field}: no pack with id "${packId}"`, field);
      if (placed.has(packId)) {
        throw new ServiceError('invalid', `${field}: pack "${pack.name}" is already in this build; one physical pack can be in one place only`, field);
      }
      placed.add(packId);
    }),
  );
  const supplyIds = fields.supplies.map((s) => s.id);
  if (new Set(supplyIds).size !== supplyIds.length) throw new ServiceError('invalid', 'supplies: two supplies share one id', 'supplies');
  // An empty IN list is an SQL syntax error on PostgreSQL (SQLite lets it through).
  const taken = supplyIds.length === 0 ? [] : await db.selectFrom('supplies').select(['id', 'buildId']).where('id', 'in', supplyIds).where('buildId', '!=', buildId).execute();
  if (taken[0]) throw new ServiceError('invalid', `supplies: supply id "${taken[0].id}" belongs to another build`, 'supplies');
}

function withSupplyIds(ctx: ServiceContext, supplies: readonly SupplyInput[]): Supply[] {
  return supplies.map((s) => ({ id: s.id ?? ctx.newId('sup'), arrangement: s.arrangement, batteryIds: [...s.batteryIds] }));
}

export async function requireBuild(db: DbHandle, buildId: string): Promise<Build> {
  const found = await getBuild(db, buildId);
  if (!found) throw new ServiceError('not-found', `id: no build with id "${buildId}"`, 'id');
  return found;
}

const listInput = v.optional(
  record({
    text: v.optional(text(200)),
    statuses: v.optional(v.array(oneOf(STATUSES), 'must be a list of verdicts')),
    kinds: v.optional(v.array(oneOf(VEHICLE_KINDS), 'must be a list of vehicle kinds')),
    customer: v.optional(v.pipe(text(64), v.regex(/^(-|[A-Za-z0-9][A-Za-z0-9._-]*)$/, "must be a customer's id, or - for the shop's own vehicles"))),
    partId: v.optional(id()),
    // Rule ids (built-in or class): builds where one of these checks is not clear.
    rules: v.optional(v.pipe(v.array(id(), 'must be a list of rule ids'), v.maxLength(100, 'must name at most 100 rules'))),
    includeArchived: v.optional(flag()),
    limit: v.optional(v.pipe(v.number('must be a number'), v.integer('must be a whole number'), v.minValue(1, 'must be 1 or more'), v.maxValue(100_000, 'must be 100000 or less'))),
  }),
  {},
);

export const listBuilds = defineHandler(listInput, async (ctx, input) => listBuildSummaries(ctx.db, input));

/**
 * The same list in its compact wire form (column by column, repeated values once): what the
 * window loads at start, about a fifth of the size of `builds.list` at 10 000 builds.
 */
export const listBuildColumns = defineHandler(listInput, async (ctx, input): Promise<ColumnTable<BuildSummary>> => encodeColumns(await listBuildSummaries(ctx.db, input), BUILD_SUMMARY_KEYS, BUILD_SUMMARY_GROUPS, BUILD_SUMMARY_PLAIN));

export const getBuildSheet = defineHandler(record({ id: id() }), async (ctx, input) => {
  const build = await requireBuild(ctx.db, input.id);
  const settings = await readSettings(ctx.db);
  const [context] = await loadBuildContexts(ctx.db, byIds([build.id]), settings.tightThreshold, ctx.now().toISOString());
  const evaluatedAt = await getEvaluatedAt(ctx.db, build.id);
  if (!context) throw new ServiceError('not-found', `id: no build with id "${input.id}"`, 'id');
  const verdict = evaluateBuild(context);
  return {
    build,
    vehicle: context.vehicle,
    motor: context.motor,
    controller: context.controller,
    propeller: context.propeller,
    batteries: build.supplies.flatMap((s) => s.batteryIds).flatMap((packId) => context.batteries.get(packId) ?? []),
    verdict: { status: verdict.status, supplies: verdict.supplies, evaluatedAt: evaluatedAt ?? '' },
  };
});

type BuildCreateInput = v.InferOutput<typeof buildCreateSchema>;

/** Adds a build (or, with `preview`, does so and rolls it back). */
async function writeNewBuild(ctx: ServiceContext, input: BuildCreateInput, options: { preview?: boolean } = {}): Promise<WriteOutcome<Build>> {
  const { id: given, supplies, ...rest } = input;
  const buildId = given ?? ctx.newId('build');
  const fields: BuildFields = { ...rest, supplies: withSupplyIds(ctx, supplies) };
  return runWrite(
    ctx,
    async (trx, at) => {
      if (await getBuild(trx, buildId)) throw new ServiceError('conflict', `id: a build with id "${buildId}" already exists`, 'id');
      await checkReferences(trx, buildId, fields);
      await insertBuild(trx, buildId, fields, at);
      const stored = await requireBuild(trx, buildId);
      return {
        result: stored,
        history: { action: 'create', entityKind: 'builds', entityId: buildId, summary: `Added build "${stored.name}"`, reason: '', before: null, after: stored },
        recheck: [buildId],
        changed: { kind: 'builds', ids: [buildId] },
      };
    },
    { ...options, messages: true },
  );
}

export const createBuild = defineHandler(buildCreateSchema, async (ctx, input) => {
  const outcome = await writeNewBuild(ctx, input);
  return { record: outcome.result, verdict: outcome.verdicts[0] ?? null };
});

/** "Name (copy)", cut to the longest name a record may have. */
function copyName(original: string): string {
  const suffix = ' (copy)';
  return original.length + suffix.length <= MAX_NAME ? original + suffix : original.slice(0, MAX_NAME - suffix.length) + suffix;
}

/**
 * A new build with every setting of another: same vehicle, parts, gearing, supplies (under new
 * supply ids), measured currents, threshold and notes. The copy is active even when the
 * original is archived, and its history entry names the original.
 */
export const duplicateBuild = defineHandler(record({ id: id(), newId: v.optional(id()), name: v.optional(name()) }), async (ctx, input) => {
  const newId = input.newId ?? ctx.newId('build');
  const outcome = await runWrite(
    ctx,
    async (trx, at) => {
      const source = await requireBuild(trx, input.id);
      if (await getBuild(trx, newId)) throw new ServiceError('conflict', `newId: a build with id "${newId}" already exists`, 'newId');
      const { id: _id, version: _version, archivedAt: _archived, supplies, ...rest } = source;
      const fields: BuildFields = {
        ...rest,
        name: input.name ?? copyName(source.name),
        supplies: withSupplyIds(
          ctx,
          supplies.map((s) => ({ arrangement: s.arrangement, batteryIds: s.batteryIds })),
        ),
      };
      await checkReferences(trx, newId, fields);
      await insertBuild(trx, newId, fields, at);
      const stored = await requireBuild(trx, newId);
      return {
        result: stored,
        history: {
          action: 'create',
          entityKind: 'builds',
          entityId: newId,
          summary: `Added build "${stored.name}" as a copy of "${source.name}"`,
          reason: '',
          before: null,
          after: stored,
        },
        recheck: [newId],
        changed: { kind: 'builds', ids: [newId] },
      };
    },
    { messages: true },
  );
  return { record: outcome.result, verdict: outcome.verdicts[0] ?? null };
});

export async function writeBuildPatch(
  ctx: ServiceContext,
  input: { id: string; expectedVersion: number; changes: Partial<Omit<BuildFields, 'supplies'>> & { supplies?: SupplyInput[]; archivedAt?: string | null }; reason: string },
  action: string,
  options: { preview?: boolean } = {},
): Promise<WriteOutcome<Build>> {
  // One build: its verdict goes back to the form with the findings' sentences.
  const writeOptions = { ...options, messages: true };
  const { supplies, ...rest } = input.changes;
  const patch = { ...rest, ...(supplies ? { supplies: withSupplyIds(ctx, supplies) } : {}) };
  return runWrite(
    ctx,
    async (trx, at) => {
      const before = await requireBuild(trx, input.id);
      if (before.version !== input.expectedVersion) throw conflict('builds', before, input.expectedVersion);
      await checkReferences(trx, input.id, patch);
      const written = await updateBuildAtVersion(trx, input.id, input.expectedVersion, patch, at);
      if (written === 0) throw conflict('builds', before, input.expectedVersion);
      const after = await requireBuild(trx, input.id);
      return {
        result: after,
        history: {
          action,
          entityKind: 'builds',
          entityId: input.id,
          summary: `${action === 'archive' ? 'Archived' : 'Changed'} build "${after.name}": ${describeChange(before, after)}`,
          reason: input.reason,
          before,
          after,
        },
        recheck: [input.id],
        changed: { kind: 'builds', ids: [input.id] },
      };
    },
    writeOptions,
  );
}

export const updateBuild = defineHandler(updateInput(buildPatchSchema), async (ctx, input) => {
  const outcome = await writeBuildPatch(ctx, input, 'update');
  return { record: outcome.result, verdict: outcome.verdicts[0] ?? null, verdictChanges: outcome.verdictChanges };
});

export const archiveBuild = defineHandler(record({ id: id(), expectedVersion: v.pipe(v.number('must be a number'), v.integer('must be a whole number')), archived: v.optional(flag(), true), reason: reasonField() }), async (ctx, input) => {
  const changes = { archivedAt: input.archived ? ctx.now().toISOString() : null };
  const outcome = await writeBuildPatch(ctx, { ...input, changes }, input.archived ? 'archive' : 'restore');
  return { record: outcome.result, verdictChanges: outcome.verdictChanges };
});

const PART_TABLES = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles'] as const;

const previewInput = v.union(
  [
    record({ build: updateInput(buildPatchSchema) }),
    record({ create: buildCreateSchema }),
    record({
      part: record({ kind: oneOf(PART_TABLES), id: id(), expectedVersion: v.pipe(v.number('must be a number'), v.integer('must be a whole number')), changes: v.record(v.string(), v.unknown()), reason: reasonField() }),
    }),
    record({ draft: draftPreviewSchema }),
  ],
  'must name a build change, a part change or a draft part',
);

/**
 * Before and after for every build a change would touch, computed by running the real write
 * and rolling it back: the preview cannot disagree with what saving does.
 */
export const previewChange = defineHandler(previewInput, async (ctx, input) => {
  let outcome: WriteOutcome<unknown>;
  let skipped: string[] = [];
  if ('draft' in input) {
    const tried = await previewDraft(ctx, input.draft);
    skipped = tried.result.skipped;
    outcome = tried;
  } else if ('build' in input) {
    outcome = await writeBuildPatch(ctx, input.build, 'update', { preview: true });
  } else if ('create' in input) {
    outcome = await writeNewBuild(ctx, input.create, { preview: true });
  } else {
    const { kind, changes } = input.part;
    // The record shape depends on `kind`, so the changes are parsed here, with the same rules as an update.
    const parsed = validate(partSchemasByTable[kind].patch, changes, 'part.changes.');
    outcome = await writePartPatch(ctx, kind, { ...input.part, changes: parsed as Record<string, unknown> }, 'update', { preview: true });
  }
  const ids = outcome.verdicts.map((x) => x.buildId);
  const settings = await readSettings(ctx.db);
  const before = (await loadBuildContexts(ctx.db, byIds(ids), settings.tightThreshold, ctx.now().toISOString())).map((context) => evaluateBuild(context));
  // `skipped`: builds of the vehicle a draft pack had no place in (none for other changes).
  return { before, after: outcome.verdicts, verdictChanges: outcome.verdictChanges, skipped };
});
