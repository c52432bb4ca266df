import * as v from 'valibot';
import { buildNamesFor, listHistory, NAMED_BUILDS_PER_ENTRY } from '../../store/repositories/history';
import { defineHandler } from '../define-handler';
import { count, id, oneOf, record } from '../schemas/field-builders';

const ENTITY_KINDS = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles', 'classes', 'classRules', 'builds', 'settings', 'fleet', 'customers', 'workOrders'] as const;

export const listHistoryEntries = defineHandler(
  v.optional(
    record({
      entityKind: v.optional(oneOf(ENTITY_KINDS)),
      entityId: v.optional(id()),
      buildId: v.optional(id()),
      beforeId: v.optional(count(1, Number.MAX_SAFE_INTEGER)),
      limit: v.optional(count(1, 1000), 200),
    }),
    { limit: 200 },
  ),
  async (ctx, input) => {
    const entries = await listHistory(ctx.db, input);
    const names = await buildNamesFor(ctx.db, entries);
    // Each entry carries the names of the builds it speaks of, archived ones too.
    return entries.map((e) => {
      const buildNames: Record<string, string> = {};
      const add = (id: string) => {
        const n = names.get(id);
        if (n !== undefined) buildNames[id] = n;
      };
      if (e.entityKind === 'builds') add(e.entityId);
      for (const c of e.verdictChanges.slice(0, NAMED_BUILDS_PER_ENTRY * 2)) add(c.buildId);
      return { ...e, buildNames };
    });
  },
);
