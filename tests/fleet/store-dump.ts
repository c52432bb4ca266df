import { sql, type Kysely } from 'kysely';

/** Every row of every table, in a fixed order: two dumps are equal only if the store holds exactly the same data. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- any database: the names are read from sqlite_master
export async function dumpStore(db: Kysely<any>): Promise<Record<string, unknown[]>> {
  const tables = await sql<{ name: string }>`select name from sqlite_master where type = 'table' and name not like 'sqlite_%' order by name`.execute(db);
  const out: Record<string, unknown[]> = {};
  for (const { name } of tables.rows) {
    const rows = await sql<Record<string, unknown>>`select * from ${sql.table(name)}`.execute(db);
    out[name] = rows.rows.map((r) => JSON.stringify(r)).sort();
  }
  return out;
}
