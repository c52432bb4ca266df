import * as v from 'valibot';
import { sql } from 'kysely';
import { defineHandler } from '../define-handler';
import { record } from '../schemas/field-builders';
import { LATEST_MIGRATION } from '../../store/migration-provider';
import { backupFolderFor } from '../../store/backup';

const COUNTED = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles', 'builds'] as const;

export const storeInfo = defineHandler(v.optional(record({}), {}), async (ctx) => {
  const counts = {} as Record<(typeof COUNTED)[number], number>;
  for (const table of COUNTED) {
    const row = await ctx.db
      .selectFrom(table)
      .select(sql<number>`count(*)`.as('n'))
      .where('archivedAt', 'is', null)
      .executeTakeFirstOrThrow();
    counts[table] = Number(row.n);
  }
  // Where a backup asked for from the browser goes (the only folder it may write to); null when the store is not a file.
  const backupFolder = ctx.raw ? backupFolderFor(ctx.raw.name) : null;
  return { schemaVersion: LATEST_MIGRATION, counts, empty: Object.values(counts).every((n) => n === 0), backupFolder };
});
