import { sql } from 'kysely';
import type { DbHandle } from '../db-handle';
import type { PartTableName } from '../schema';
import { fieldsToColumns, rowToRecord, type PartFields, type PartRecords } from './part-records';
import { chunks } from '../db-handle';

// One repository for the six tables of the same shape (packs, motors, controllers,
// propellers, vehicles, class rules). Kysely cannot type a table chosen at run time, so
// the table name is narrowed to one literal inside and the row typed by PartRecords.
type AnyTable = 'batteries';

export interface ListOptions {
  includeArchived?: boolean;
}

export async function getPart<T extends PartTableName>(db: DbHandle, table: T, id: string): Promise<PartRecords[T] | undefined> {
  const row = await db
    .selectFrom(table as AnyTable)
    .selectAll()
    .where('id', '=', id)
    .executeTakeFirst();
  return row ? rowToRecord(table, row) : undefined;
}

export async function getParts<T extends PartTableName>(db: DbHandle, table: T, ids: readonly string[]): Promise<PartRecords[T][]> {
  const out: PartRecords[T][] = [];
  for (const part of chunks([...new Set(ids)])) {
    if (part.length === 0) continue;
    const rows = await db
      .selectFrom(table as AnyTable)
      .selectAll()
      .where('id', 'in', part)
      .execute();
    for (const row of rows) out.push(rowToRecord(table, row));
  }
  return out;
}

export async function listParts<T extends PartTableName>(db: DbHandle, table: T, options: ListOptions = {}): Promise<PartRecords[T][]> {
  let query = db.selectFrom(table as AnyTable).selectAll();
  // Class rules have no name column: their class and rule id are what a person reads.
  query = table === 'classRules' ? query.orderBy(sql.ref('className')).orderBy(sql.ref('ruleId')) : query.orderBy('name');
  query = query.orderBy('id');
  if (!options.includeArchived) query = query.where('archivedAt', 'is', null);
  const rows = await query.execute();
  return rows.map((row) => rowToRecord(table, row));
}

export async function insertPart<T extends PartTableName>(db: DbHandle, table: T, id: string, fields: PartFields<T>, now: string): Promise<PartRecords[T]> {
  const values = { ...fieldsToColumns(table, fields), id, version: 1, archivedAt: null, createdAt: now, updatedAt: now };
  await db
    .insertInto(table as AnyTable)
    .values(values as never)
    .execute();
  const stored = await getPart(db, table, id);
  if (!stored) throw new Error(`insert into ${table} did not store ${id}`);
  return stored;
}

/**
 * Writes the patch only where the stored version is the one the caller read; returns the
 * number of rows written (0 means someone else wrote first, or the record is gone).
 */
export async function updatePartAtVersion<T extends PartTableName>(db: DbHandle, table: T, id: string, expectedVersion: number, patch: Partial<PartFields<T>> & { archivedAt?: string | null }, now: string): Promise<number> {
  const result = await db
    .updateTable(table as AnyTable)
    .set({ ...fieldsToColumns(table, patch), updatedAt: now } as never)
    .set((eb) => ({ version: eb('version', '+', 1) }))
    .where('id', '=', id)
    .where('version', '=', expectedVersion)
    .executeTakeFirst();
  return Number(result.numUpdatedRows);
}
