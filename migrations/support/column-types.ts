import { PostgresAdapter, sql, type Expression, type Kysely } from 'kysely';

// The one place where a migration's column types differ between the engines. SQLite's `real` is
// a 64-bit float and its text compares byte by byte; on PostgreSQL `real` is only 32 bits (a
// 12.6 V limit would read back as 12.600000381) and text sorts by the database's locale, so a
// list would come out in another order than on SQLite. Frozen like the migrations that use it:
// change a type here only together with a new migration that converts existing columns.

export interface ColumnTypes {
  real: 'real' | 'double precision';
  text: 'text' | Expression<unknown>;
  integer: 'integer';
  postgres: boolean;
}

export function columnTypes(db: Kysely<unknown>): ColumnTypes {
  const postgres = db.getExecutor().adapter instanceof PostgresAdapter;
  return postgres ? { real: 'double precision', text: sql`text collate "C"`, integer: 'integer', postgres } : { real: 'real', text: 'text', integer: 'integer', postgres };
}
