import { sql, type Kysely } from 'kysely';

/** A SQLite table's column names, read from the table info: for migration tests, which look at a store between steps. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- any database: names are read from the table info
export async function columns(db: Kysely<any>, table: string): Promise<string[]> {
  const rows = await sql<{ name: string }>`select name from pragma_table_info(${table})`.execute(db);
  return rows.rows.map((r) => r.name);
}
