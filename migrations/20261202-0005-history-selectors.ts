import { sql, type Kysely, type SelectQueryBuilder, type Transaction } from 'kysely';
import { columnTypes } from './support/column-types';

// History used to link every re-checked build to the entry, one row each: an edit of a part
// shared by 10 000 builds wrote 10 000 rows. From here an entry keeps the selector that named
// its builds (a part, a class, or every build) in `historySelectors`, and links by id only the
// builds whose verdict it changed (and builds a write named by id). A build's timeline resolves
// the selectors against what the build is made of, for entries not older than the build.
//
// Up converts old entries: a part or class entry that linked builds gets its selector, and the
// links the selector now names again (and whose verdict the entry did not change) are dropped;
// links the selector no longer names (the build has left the part since) stay, so no timeline
// loses an entry. Down writes a link for every build each selector names, then drops the table.
// A frozen snapshot: no imports of the live schema or repositories.

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- a migration sees the tables as they are at this step
type AnyDb = Kysely<any> | Transaction<any>;

interface SelectorRow {
  historyId: number;
  selects: 'part' | 'class' | 'all';
  partKind: string;
  target: string;
}

const PART_KINDS = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles'] as const;
const PART_COLUMN: Record<string, string> = { motors: 'motorId', controllers: 'controllerId', propellers: 'propellerId', vehicles: 'vehicleId' };

/** The ids of the builds a selector row names, among builds added no later than `at`. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- see AnyDb
function namedBuilds(db: AnyDb, row: Omit<SelectorRow, 'historyId'>, at: string): SelectQueryBuilder<any, any, { id: string }> {
  const builds = db.selectFrom('builds').select('builds.id as id').where('builds.createdAt', '<=', at);
  if (row.selects === 'all') return builds;
  if (row.selects === 'class') {
    return builds.where('builds.vehicleId', 'in', db.selectFrom('vehicles').select('vehicles.id').where('vehicles.className', '=', row.target));
  }
  if (row.partKind === 'batteries') {
    return builds.where('builds.id', 'in', db.selectFrom('supplyPacks').innerJoin('supplies', 'supplies.id', 'supplyPacks.supplyId').select('supplies.buildId').where('supplyPacks.batteryId', '=', row.target));
  }
  return builds.where(`builds.${PART_COLUMN[row.partKind]}`, '=', row.target);
}

function classNamesOf(json: string | null): string[] {
  if (json === null) return [];
  try {
    const record = JSON.parse(json) as { className?: unknown };
    return typeof record.className === 'string' && record.className !== '' ? [record.className] : [];
  } catch {
    return [];
  }
}

/** The selectors an old entry's links came from, judged by what the entry was about. */
function selectorsOf(entry: { entityKind: string; entityId: string; before: string | null; after: string | null }): Omit<SelectorRow, 'historyId'>[] {
  if ((PART_KINDS as readonly string[]).includes(entry.entityKind)) return [{ selects: 'part', partKind: entry.entityKind, target: entry.entityId }];
  if (entry.entityKind === 'classRules') {
    return [...new Set([...classNamesOf(entry.before), ...classNamesOf(entry.after)])].map((target) => ({ selects: 'class', partKind: '', target }));
  }
  // A settings entry that linked builds re-checked every build (threshold change, engine upgrade).
  if (entry.entityKind === 'settings') return [{ selects: 'all', partKind: '', target: '' }];
  return [];
}

const DELETE_CHUNK = 500;

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const { text, integer } = columnTypes(trx);
    await trx.schema
      .createTable('historySelectors')
      .addColumn('historyId', integer, (c) => c.notNull().references('history.id').onDelete('cascade'))
      .addColumn('selects', text, (c) => c.notNull())
      .addColumn('partKind', text, (c) => c.notNull().defaultTo(''))
      .addColumn('target', text, (c) => c.notNull().defaultTo(''))
      .execute();
    await trx.schema.createIndex('historySelectorsTargetIdx').on('historySelectors').columns(['selects', 'partKind', 'target', 'historyId']).execute();
    await trx.schema.createIndex('historySelectorsEntryIdx').on('historySelectors').column('historyId').execute();

    const t = trx as Transaction<any>; // eslint-disable-line @typescript-eslint/no-explicit-any -- see AnyDb
    const linked = (await t
      .selectFrom('history')
      .select(['history.id', 'history.at', 'history.entityKind', 'history.entityId', 'history.before', 'history.after', 'history.verdictChanges'])
      .where('history.id', 'in', t.selectFrom('historyBuilds').select('historyBuilds.historyId'))
      .execute()) as { id: number; at: string; entityKind: string; entityId: string; before: string | null; after: string | null; verdictChanges: string }[];

    for (const entry of linked) {
      const selectors = selectorsOf(entry);
      if (selectors.length === 0) continue;
      const historyId = Number(entry.id);
      await t
        .insertInto('historySelectors')
        .values(selectors.map((s) => ({ ...s, historyId })))
        .execute();
      const changed = new Set((JSON.parse(entry.verdictChanges) as { buildId: string }[]).map((c) => c.buildId));
      const named = new Set<string>();
      for (const s of selectors) for (const r of (await namedBuilds(t, s, entry.at).execute()) as { id: string }[]) named.add(r.id);
      const links = (await t.selectFrom('historyBuilds').select('buildId').where('historyId', '=', historyId).execute()) as { buildId: string }[];
      const redundant = links.map((l) => l.buildId).filter((id) => named.has(id) && !changed.has(id));
      for (let i = 0; i < redundant.length; i += DELETE_CHUNK) {
        await t
          .deleteFrom('historyBuilds')
          .where('historyId', '=', historyId)
          .where('buildId', 'in', redundant.slice(i, i + DELETE_CHUNK))
          .execute();
      }
    }
  });
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const t = trx as Transaction<any>; // eslint-disable-line @typescript-eslint/no-explicit-any -- see AnyDb
    const rows = (await t
      .selectFrom('historySelectors')
      .innerJoin('history', 'history.id', 'historySelectors.historyId')
      .select(['historySelectors.historyId', 'historySelectors.selects', 'historySelectors.partKind', 'historySelectors.target', 'history.at'])
      .execute()) as (SelectorRow & { at: string })[];
    for (const row of rows) {
      const historyId = Number(row.historyId);
      await t
        .insertInto('historyBuilds')
        .columns(['historyId', 'buildId'])
        // A bare parameter in a select list has no type on PostgreSQL (it would be text); the cast names it.
        .expression(
          namedBuilds(t, row, row.at)
            .clearSelect()
            .select([sql<number>`cast(${historyId} as integer)`.as('historyId'), 'builds.id as buildId']),
        )
        .onConflict((oc) => oc.columns(['historyId', 'buildId']).doNothing())
        .execute();
    }
    await t.schema.dropTable('historySelectors').execute();
  });
}
