import * as v from 'valibot';
import { listHistory } from '../../store/repositories/history';
import { defineHandler } from '../define-handler';
import { count, id, oneOf, record } from '../schemas/field-builders';

const ENTITY_KINDS = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles', 'classRules', 'builds', 'settings', 'fleet'] as const;

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
  async (ctx, input) => listHistory(ctx.db, input),
);
