import * as v from 'valibot';
import { FIGURES, type FigureKey } from '../../core/catalogue/figures';
import type { ClassRule, VehicleClass } from '../../core/domain';
import type { BuildSelector } from '../../store/build-selector';
import { classLimits, getClassByName, listClassSummaries, renameClassReferences } from '../../store/repositories/classes';
import { getPart, insertPart, updatePartAtVersion } from '../../store/repositories/parts';
import { ServiceError } from '../contract';
import { defineHandler } from '../define-handler';
import { runWrite } from '../run-write';
import { classSaveInput } from '../schemas/class-schemas';
import { flag, id, record } from '../schemas/field-builders';
import { conflict, requirePart } from './part-handlers';

/** The rule id a class limit on this figure reads as: one limit per figure in a class. */
export function classRuleId(figure: FigureKey): string {
  return `class-${figure.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`)}`;
}

function limitWords(r: Pick<ClassRule, 'figure' | 'limit' | 'unit'>): string {
  const spec = (FIGURES as Record<string, { label: string } | undefined>)[r.figure];
  return `${spec?.label ?? r.figure} at most ${r.limit} ${r.unit}`.trim();
}

/** What the history line says changed in the limits, figure by figure. */
function describeLimits(before: readonly ClassRule[], after: readonly ClassRule[]): string[] {
  const was = new Map(before.map((r) => [r.figure, r]));
  const now = new Map(after.map((r) => [r.figure, r]));
  const out: string[] = [];
  for (const r of after) {
    const old = was.get(r.figure);
    if (!old) out.push(`added limit ${limitWords(r)}`);
    else if (old.limit !== r.limit || (old.tightThreshold ?? null) !== (r.tightThreshold ?? null)) out.push(`limit ${limitWords(old)} → ${r.limit} ${r.unit}`);
  }
  for (const r of before) if (!now.has(r.figure)) out.push(`removed limit ${limitWords(r)}`);
  return out;
}

export const listClasses = defineHandler(v.optional(record({ includeArchived: v.optional(flag(), false) }), {}), async (ctx, input) => listClassSummaries(ctx.db, input.includeArchived));

export const getClass = defineHandler(record({ id: id() }), async (ctx, input) => {
  const found = await requirePart(ctx.db, 'classes', input.id);
  return { ...found, limits: await classLimits(ctx.db, found.name) };
});

/**
 * Saves a class as its editor shows it: name, notes and its limits, in one transaction with
 * the re-check of every build of the class and one history entry. A renamed class takes its
 * vehicles and limits along.
 */
export const saveClass = defineHandler(classSaveInput, async (ctx, input) => {
  const figures = new Map<string, number>();
  input.limits.forEach((l, i) => {
    const first = figures.get(l.figure);
    if (first !== undefined) throw new ServiceError('invalid', `limits[${i}].figure: the class already has a limit on ${FIGURES[l.figure].label} (limit ${first + 1}); keep one`, `limits[${i}].figure`);
    figures.set(l.figure, i);
  });
  const outcome = await runWrite(ctx, async (trx, at) => {
    let before: VehicleClass | null = null;
    if (input.id !== undefined) {
      before = await requirePart(trx, 'classes', input.id);
      if (input.expectedVersion === undefined) throw new ServiceError('invalid', 'expectedVersion: is required when changing a class', 'expectedVersion');
      if (before.version !== input.expectedVersion) throw conflict('classes', before, input.expectedVersion);
    }
    const holder = await getClassByName(trx, input.name);
    if (holder && holder.id !== before?.id) throw new ServiceError('conflict', `name: a class named "${input.name}" already exists; pick another name or edit that class`, 'name');
    const beforeLimits = before ? await classLimits(trx, before.name) : [];

    let classId: string;
    if (before) {
      classId = before.id;
      const n = await updatePartAtVersion(trx, 'classes', before.id, before.version, { name: input.name, notes: input.notes }, at);
      if (n === 0) throw conflict('classes', before, before.version);
      if (before.name !== input.name) await renameClassReferences(trx, before.name, input.name, at);
    } else {
      classId = input.newId ?? ctx.newId('cls');
      if (await getPart(trx, 'classes', classId)) throw new ServiceError('conflict', `newId: a class with id "${classId}" already exists`, 'newId');
      await insertPart(trx, 'classes', classId, { name: input.name, notes: input.notes }, at);
    }

    const stored = new Map((await classLimits(trx, input.name)).map((r) => [r.id, r]));
    for (const [i, l] of input.limits.entries()) {
      const fields = { className: input.name, ruleId: classRuleId(l.figure), figure: l.figure, limit: l.limit, unit: FIGURES[l.figure].unit, tightThreshold: l.tightThreshold };
      if (l.id === undefined) {
        await insertPart(trx, 'classRules', ctx.newId('rule'), { ...fields, notes: '' }, at);
        continue;
      }
      const existing = stored.get(l.id);
      if (!existing) throw new ServiceError('not-found', `limits[${i}].id: this class has no limit with id "${l.id}" (it may have been removed elsewhere); reload the class`, `limits[${i}].id`);
      stored.delete(l.id);
      const same = existing.figure === fields.figure && existing.limit === fields.limit && existing.unit === fields.unit && existing.ruleId === fields.ruleId && (existing.tightThreshold ?? null) === fields.tightThreshold;
      if (!same) await updatePartAtVersion(trx, 'classRules', l.id, existing.version, fields, at);
    }
    // A limit the editor no longer lists is archived, not deleted: history and old files still name it.
    for (const gone of stored.values()) await updatePartAtVersion(trx, 'classRules', gone.id, gone.version, { archivedAt: at }, at);

    const after = await requirePart(trx, 'classes', classId);
    const afterLimits = await classLimits(trx, input.name);
    const changes = [...(before && before.name !== input.name ? [`renamed from "${before.name}"`] : []), ...(before && before.notes !== input.notes ? ['notes changed'] : []), ...describeLimits(beforeLimits, afterLimits)];
    const recheck: BuildSelector = { by: 'class', className: input.name };
    return {
      result: { ...after, limits: afterLimits },
      history: {
        action: before ? 'update' : 'create',
        entityKind: 'classes',
        entityId: classId,
        summary: `${before ? 'Changed' : 'Added'} class "${input.name}"${changes.length > 0 ? `: ${changes.join('; ')}` : ''}; every build of the class re-checked`,
        reason: input.reason,
        before: before ? { ...before, limits: beforeLimits } : null,
        after: { ...after, limits: afterLimits },
      },
      recheck,
      changed: { kind: 'classes', ids: [classId] },
    };
  });
  return { record: outcome.result, verdictChanges: outcome.verdictChanges, rechecked: outcome.verdicts.length };
});
