import { sql, type Expression, type ExpressionBuilder, type SelectQueryBuilder, type SqlBool } from 'kysely';
import type { DbHandle } from './db-handle';
import type { Db } from './schema';

/**
 * Which builds a write touches, said as a query rather than a list of ids: loading, re-checking
 * and linking history for 10 000 builds then costs one indexed subquery per table instead of
 * thousands of bound parameters.
 */
export type BuildSelector =
  | { by: 'ids'; ids: readonly string[] }
  | { by: 'part'; kind: 'batteries' | 'motors' | 'controllers' | 'propellers' | 'vehicles'; id: string }
  | { by: 'class'; className: string }
  | { by: 'all' }
  | { by: 'any'; of: readonly BuildSelector[] };

export const byIds = (ids: readonly string[]): BuildSelector => ({ by: 'ids', ids });

// Literal conditions rather than bound booleans: SQLite binds no booleans, and `1 = 1` is portable.
const EVERYTHING = sql<SqlBool>`1 = 1`;
const NOTHING = sql<SqlBool>`1 = 0`;

const PART_COLUMN = { motors: 'motorId', controllers: 'controllerId', propellers: 'propellerId', vehicles: 'vehicleId' } as const;

/** A query selecting the `id` of every selected build. */
export function selectedBuildIds(db: DbHandle, selector: BuildSelector): SelectQueryBuilder<Db, 'builds', { id: string }> {
  const base = db.selectFrom('builds').select('builds.id');
  return base.where((eb) => selectorCondition(db, eb, selector));
}

/** The selector as a condition on the `builds` table itself (no subquery when reading builds). */
export function selectorCondition(db: DbHandle, eb: ExpressionBuilder<Db, 'builds'>, selector: BuildSelector): Expression<SqlBool> {
  switch (selector.by) {
    case 'ids':
      return selector.ids.length === 0 ? NOTHING : eb('builds.id', 'in', [...selector.ids]);
    case 'all':
      return EVERYTHING;
    case 'class':
      return eb('builds.vehicleId', 'in', db.selectFrom('vehicles').select('vehicles.id').where('vehicles.className', '=', selector.className));
    case 'part':
      if (selector.kind === 'batteries') {
        return eb('builds.id', 'in', db.selectFrom('supplyPacks').innerJoin('supplies', 'supplies.id', 'supplyPacks.supplyId').select('supplies.buildId').where('supplyPacks.batteryId', '=', selector.id));
      }
      return eb(`builds.${PART_COLUMN[selector.kind]}`, '=', selector.id);
    case 'any':
      return selector.of.length === 0 ? NOTHING : eb.or(selector.of.map((s) => selectorCondition(db, eb, s)));
  }
}

/** True when the selector can be seen to select nothing without asking the store. */
export function selectsNothing(selector: BuildSelector): boolean {
  if (selector.by === 'ids') return selector.ids.length === 0;
  if (selector.by === 'any') return selector.of.every(selectsNothing);
  return false;
}
