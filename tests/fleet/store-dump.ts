import { PostgresAdapter, sql, type Kysely } from 'kysely';

/** Every row of every table, in a fixed order: two dumps are equal only if the store holds exactly the same data. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- any database: the names are read from sqlite_master
export async function dumpStore(db: Kysely<any>): Promise<Record<string, unknown[]>> {
  // The engine's own catalogue through Kysely, so the dump reads a SQLite file and a PostgreSQL
  // store alike; a PostgreSQL database may hold other stores in other schemas, left out here.
  const schema = db.getExecutor().adapter instanceof PostgresAdapter ? (await sql<{ s: string }>`select current_schema() as s`.execute(db)).rows[0]?.s : undefined;
  const tables = (await db.introspection.getTables({ withInternalKyselyTables: true }))
    .filter((t) => schema === undefined || t.schema === schema)
    .map((t) => t.name)
    .sort();
  const out: Record<string, unknown[]> = {};
  for (const name of tables) {
    const rows = await sql<Record<string, unknown>>`select * from ${sql.table(name)}`.execute(db);
    out[name] = rows.rows.map((r) => JSON.stringify(r)).sort();
  }
  return out;
}
