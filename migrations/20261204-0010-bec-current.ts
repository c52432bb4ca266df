import type { Kysely } from 'kysely';
import { columnTypes } from './support/column-types';

// A controller's BEC rating and a build's receiver and servo load on it. Both nullable: records
// stored before this step read "not entered", and the check is then not made. A frozen
// snapshot; each body runs in a transaction of its own.

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const { real } = columnTypes(trx);
    await trx.schema.alterTable('controllers').addColumn('becCurrentA', real).execute();
    await trx.schema.alterTable('builds').addColumn('becLoadA', real).execute();
  });
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    await trx.schema.alterTable('builds').dropColumn('becLoadA').execute();
    await trx.schema.alterTable('controllers').dropColumn('becCurrentA').execute();
  });
}
