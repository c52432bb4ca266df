import type { Kysely } from 'kysely';
import { columnTypes } from './support/column-types';

// The builds list filters by check ("every build whose controller-continuous is over or tight").
// The verdict row gains the checks that are not clear, as `rule=status` pairs sorted by rule id
// and joined by commas, so a re-check compares it as one text. Rows written before this
// migration hold '' until the next re-check; the engine version bump re-checks every build once.
// A frozen snapshot: no imports of the live schema or repositories.

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const { text } = columnTypes(trx);
    await trx.schema
      .alterTable('verdicts')
      .addColumn('ruleStatuses', text, (c) => c.notNull().defaultTo(''))
      .execute();
  });
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    await trx.schema.alterTable('verdicts').dropColumn('ruleStatuses').execute();
  });
}
