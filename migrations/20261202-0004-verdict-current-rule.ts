import type { Kysely } from 'kysely';
import { columnTypes } from './support/column-types';

// The builds list shows one current against one limit. These columns say which check that pair
// comes from (a rule id) and whether the current was modelled or measured, so the list can say
// "peak" or "continuous" and name the part whose rating it is. Rows written before this
// migration hold nulls until the next re-check (the engine version bump re-checks every build).

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const { text } = columnTypes(trx);
    await trx.schema.alterTable('verdicts').addColumn('currentRule', text).execute();
    await trx.schema.alterTable('verdicts').addColumn('currentSource', text).execute();
  });
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    await trx.schema.alterTable('verdicts').dropColumn('currentSource').execute();
    await trx.schema.alterTable('verdicts').dropColumn('currentRule').execute();
  });
}
