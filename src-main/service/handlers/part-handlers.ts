import * as v from 'valibot';
import type { PartTableName } from '../../store/schema';
import { getPart, insertPart, listParts, updatePartAtVersion } from '../../store/repositories/parts';
import type { PartFields, PartRecords } from '../../store/repositories/part-records';
import type { BuildSelector } from '../../store/build-selector';
import type { DbHandle } from '../../store/db-handle';
import { ServiceError } from '../contract';
import { ensureClasses } from '../../store/repositories/classes';
import type { ServiceContext } from '../service-context';
import { defineHandler } from '../define-handler';
import { runWrite } from '../run-write';
import { describeChange } from '../record-diff';
import { ID_PREFIXES, RECORD_LABELS } from '../record-labels';
import { flag, id, record, text } from '../schemas/field-builders';

/** Class rules have no name of their own: their class and rule id say what they are. */
export function recordName(r: { name: string } | { className: string; ruleId: string }): string {
  return 'name' in r ? r.name : `${r.className} ${r.ruleId}`;
}

const idInput = record({ id: id() });
const listInput = v.optional(record({ includeArchived: v.optional(flag(), false) }), {});
export const reasonField = () => v.optional(text(500), '');

function affectedBuilds(table: PartTableName, record: { id: string; className?: string; name?: string }): BuildSelector {
  if (table === 'classRules') return { by: 'class', className: String(record.className) };
  if (table === 'classes') return { by: 'class', className: String(record.name) };
  // A customer's name and contact change no figure of any build.
  if (table === 'customers') return { by: 'ids', ids: [] };
  return { by: 'part', kind: table, id: record.id };
}

/** A vehicle or a limit naming a class with no record yet makes the record, so the Classes screen lists it. */
async function ensureClassOf(ctx: ServiceContext, db: DbHandle, record: object, at: string): Promise<void> {
  const className = (record as { className?: unknown }).className;
  if (typeof className === 'string' && className !== '') await ensureClasses(db, [className], at, () => ctx.newId(ID_PREFIXES.classes));
}

export async function requirePart<T extends PartTableName>(db: DbHandle, table: T, partId: string, field = 'id'): Promise<PartRecords[T]> {
  const found = await getPart(db, table, partId);
  if (!found) throw new ServiceError('not-found', `${field}: no ${RECORD_LABELS[table]} with id "${partId}"`, field);
  return found;
}

/** A vehicle's customer must be stored (archived customers too: their vehicles keep them). */
async function requireReferences(db: DbHandle, table: PartTableName, fields: Record<string, unknown>): Promise<void> {
  if (table === 'vehicles' && typeof fields.customerId === 'string') await requirePart(db, 'customers', fields.customerId, 'customerId');
}

export function conflict(kind: keyof typeof RECORD_LABELS, stored: { version: number }, expected: number): ServiceError {
  return new ServiceError('conflict', `This ${RECORD_LABELS[kind]} was changed elsewhere (now version ${stored.version}, you edited version ${expected}). Nothing was saved: reload it and apply your change again.`, 'expectedVersion');
}

export function listHandler<T extends PartTableName>(table: T) {
  return defineHandler(listInput, async (ctx, input) => listParts(ctx.db, table, input));
}

export function getHandler<T extends PartTableName>(table: T) {
  return defineHandler(idInput, async (ctx, input) => requirePart(ctx.db, table, input.id));
}

export function createHandler<T extends PartTableName, S extends v.GenericSchema<unknown, { id?: string | undefined }>>(table: T, schema: S) {
  return defineHandler(schema, async (ctx, input) => {
    const { id: given, ...fields } = input as { id?: string } & Record<string, unknown>;
    const newId = given ?? ctx.newId(ID_PREFIXES[table]);
    const outcome = await runWrite(ctx, async (trx, at) => {
      if (await getPart(trx, table, newId)) throw new ServiceError('conflict', `id: a ${RECORD_LABELS[table]} with id "${newId}" already exists`, 'id');
      await requireReferences(trx, table, fields);
      const stored = await insertPart(trx, table, newId, fields as unknown as PartFields<T>, at);
      await ensureClassOf(ctx, trx, stored, at);
      // A new pack or motor is used by no build yet; a new class rule applies to its class at once.
      const recheck: BuildSelector = table === 'classRules' ? affectedBuilds(table, stored) : { by: 'ids', ids: [] };
      return {
        result: stored,
        history: { action: 'create', entityKind: table, entityId: newId, summary: `Added ${RECORD_LABELS[table]} "${recordName(stored)}"`, reason: '', before: null, after: stored },
        recheck,
        changed: { kind: table, ids: [newId] },
      };
    });
    return outcome.result;
  });
}

/** Shared by update and archive: write at the read version, re-check every build using the part, log it. */
export async function writePartPatch<T extends PartTableName>(
  ctx: Parameters<Parameters<typeof defineHandler>[1]>[0],
  table: T,
  input: { id: string; expectedVersion: number; changes: Record<string, unknown>; reason: string },
  action: string,
  options: { preview?: boolean } = {},
) {
  return runWrite(
    ctx,
    async (trx, at) => {
      const before = await requirePart(trx, table, input.id);
      if (before.version !== input.expectedVersion) throw conflict(table, before, input.expectedVersion);
      await requireReferences(trx, table, input.changes);
      const written = await updatePartAtVersion(trx, table, input.id, input.expectedVersion, input.changes as Partial<PartFields<T>>, at);
      if (written === 0) throw conflict(table, before, input.expectedVersion);
      const after = await requirePart(trx, table, input.id);
      await ensureClassOf(ctx, trx, after, at);
      const beforeRecord: { id: string; className?: string } = before;
      const afterRecord: { id: string; className?: string } = after;
      // A class rule moved to another class re-checks both classes' builds.
      const recheck: BuildSelector =
        table === 'classRules' && beforeRecord.className !== afterRecord.className ? { by: 'any', of: [affectedBuilds(table, beforeRecord), affectedBuilds(table, afterRecord)] } : affectedBuilds(table, afterRecord);
      return {
        result: after,
        history: {
          action,
          entityKind: table,
          entityId: input.id,
          summary: `${action === 'archive' ? 'Archived' : 'Changed'} ${RECORD_LABELS[table]} "${recordName(after)}": ${describeChange(beforeRecord, afterRecord)}`,
          reason: input.reason,
          before,
          after,
        },
        recheck,
        changed: { kind: table, ids: [input.id] },
      };
    },
    options,
  );
}

export function updateInput<S extends v.GenericSchema>(patch: S) {
  return record({ id: id(), expectedVersion: v.pipe(v.number('must be a number'), v.integer('must be a whole number'), v.minValue(1, 'must be 1 or more')), changes: patch, reason: reasonField() });
}

export function updateHandler<T extends PartTableName, S extends v.GenericSchema>(table: T, patch: S) {
  return defineHandler(updateInput(patch), async (ctx, input) => {
    const outcome = await writePartPatch(ctx, table, input as never, 'update');
    return { record: outcome.result, verdictChanges: outcome.verdictChanges, rechecked: outcome.verdicts.length };
  });
}

const archiveInput = record({
  id: id(),
  expectedVersion: v.pipe(v.number('must be a number'), v.integer('must be a whole number'), v.minValue(1, 'must be 1 or more')),
  archived: v.optional(flag(), true),
  reason: reasonField(),
});

export function archiveHandler<T extends PartTableName>(table: T) {
  return defineHandler(archiveInput, async (ctx, input) => {
    const changes = { archivedAt: input.archived ? ctx.now().toISOString() : null };
    const outcome = await writePartPatch(ctx, table, { ...input, changes }, input.archived ? 'archive' : 'restore');
    return { record: outcome.result, verdictChanges: outcome.verdictChanges, rechecked: outcome.verdicts.length };
  });
}
