import Database from 'better-sqlite3';
import { Kysely, Migrator, SqliteDialect, type Migration } from 'kysely';
import { MIGRATIONS } from './migration-provider';

// What a store's schema is, read from SQLite itself, so that a file can be compared with the
// schema Rigbook's own migrations make. The reference is computed by running the migrations,
// never written down by hand, so it follows every migration added later.

export interface ColumnShape {
  name: string;
  type: string;
  notNull: boolean;
  defaultValue: string | null;
  primaryKeyPosition: number;
  hidden: number;
}

export interface IndexShape {
  table: string;
  unique: boolean;
  origin: string;
  partial: boolean;
  columns: string[];
}

export interface SchemaShape {
  tables: Map<string, ColumnShape[]>;
  /** Each table's CREATE statement, whitespace folded: foreign keys and checks live only there. */
  tableSql: Map<string, string>;
  indexes: Map<string, IndexShape>;
  /** Triggers and views by name, with their SQL. */
  others: Map<string, { type: string; sql: string }>;
}

const quoteName = (name: string): string => `"${name.replace(/"/g, '""')}"`;

/** SQLite's own tables (statistics, sequences) hold no schema of Rigbook's. */
const internal = (name: string): boolean => name.startsWith('sqlite_');

export function readSchemaShape(db: Database.Database): SchemaShape {
  const entries = db.prepare('select type, name, tbl_name as tbl, sql from sqlite_master order by name').all() as { type: string; name: string; tbl: string; sql: string | null }[];
  const shape: SchemaShape = { tables: new Map(), tableSql: new Map(), indexes: new Map(), others: new Map() };
  for (const e of entries) {
    if (internal(e.name) && e.type !== 'index') continue;
    if (e.type === 'table') {
      const columns = db.prepare(`pragma table_xinfo(${quoteName(e.name)})`).all() as { name: string; type: string; notnull: number; dflt_value: string | null; pk: number; hidden: number }[];
      shape.tableSql.set(e.name, (e.sql ?? '').replace(/\s+/g, ' ').trim());
      shape.tables.set(
        e.name,
        columns.map((c) => ({ name: c.name, type: c.type.toLowerCase(), notNull: c.notnull === 1, defaultValue: c.dflt_value, primaryKeyPosition: c.pk, hidden: c.hidden })),
      );
    } else if (e.type === 'index') {
      const list = db.prepare(`pragma index_list(${quoteName(e.tbl)})`).all() as { name: string; unique: number; origin: string; partial: number }[];
      const info = list.find((i) => i.name === e.name);
      const columns = (db.prepare(`pragma index_xinfo(${quoteName(e.name)})`).all() as { name: string | null; desc: number; coll: string; key: number }[])
        .filter((c) => c.key === 1)
        .map((c) => `${c.name ?? '<expression>'}${c.desc ? ' desc' : ''}${c.coll.toUpperCase() === 'BINARY' ? '' : ` collate ${c.coll}`}`);
      shape.indexes.set(e.name, { table: e.tbl, unique: info?.unique === 1, origin: info?.origin ?? 'c', partial: info?.partial === 1, columns });
      if (info?.partial === 1 || columns.includes('<expression>')) shape.others.set(`index ${e.name}`, { type: 'index', sql: (e.sql ?? '').replace(/\s+/g, ' ').trim() });
    } else {
      shape.others.set(e.name, { type: e.type, sql: e.sql ?? '' });
    }
  }
  return shape;
}

const describeColumn = (c: ColumnShape): string => `${c.type || 'untyped'}${c.notNull ? ' not null' : ''}${c.defaultValue === null ? '' : ` default ${c.defaultValue}`}${c.primaryKeyPosition > 0 ? ' primary key' : ''}`;

/** The first way `actual` differs from `expected`, in words; null when they are the same. */
export function firstSchemaDifference(actual: SchemaShape, expected: SchemaShape): string | null {
  for (const [name, { type }] of actual.others) {
    if (!expected.others.has(name)) return `it holds a ${type} "${name.replace(/^index /, '')}" that Rigbook does not make`;
  }
  for (const [table, columns] of expected.tables) {
    const got = actual.tables.get(table);
    if (!got) return `its table "${table}" is missing`;
    for (const column of columns) {
      const found = got.find((c) => c.name === column.name);
      if (!found) return `its table "${table}" lacks the column "${column.name}"`;
      if (describeColumn(found) !== describeColumn(column) || found.hidden !== column.hidden) {
        return `the column "${table}.${column.name}" is ${describeColumn(found)}, where Rigbook makes it ${describeColumn(column)}`;
      }
    }
    const extra = got.find((c) => !columns.some((e) => e.name === c.name));
    if (extra) return `its table "${table}" has a column "${extra.name}" that Rigbook does not make`;
    if (got.map((c) => c.name).join(',') !== columns.map((c) => c.name).join(',')) return `the columns of "${table}" are in another order than Rigbook makes them`;
    if (actual.tableSql.get(table) !== expected.tableSql.get(table)) return `its table "${table}" is not defined as Rigbook defines it (its keys, links or checks differ)`;
  }
  for (const table of actual.tables.keys()) if (!expected.tables.has(table)) return `it holds a table "${table}" that Rigbook does not make`;
  for (const [name, index] of expected.indexes) {
    const got = actual.indexes.get(name);
    if (!got) return `its index "${name}" is missing`;
    if (JSON.stringify(got) !== JSON.stringify(index)) return `its index "${name}" is not the one Rigbook makes (${got.unique ? 'unique ' : ''}on ${got.table}(${got.columns.join(', ')}))`;
  }
  for (const name of actual.indexes.keys()) if (!expected.indexes.has(name)) return `it holds an index "${name}" that Rigbook does not make`;
  for (const [name, other] of expected.others) {
    const got = actual.others.get(name);
    if (!got || got.sql.replace(/\s+/g, ' ') !== other.sql.replace(/\s+/g, ' ')) return `its ${other.type} "${name.replace(/^index /, '')}" is not the one Rigbook makes`;
  }
  return null;
}

/**
 * The schema Rigbook's migrations make when exactly `names` have run (in name order), built in
 * a database in memory. Throws when a name is not a migration this build knows.
 */
export async function referenceShape(names: readonly string[]): Promise<SchemaShape> {
  const chosen: Record<string, Migration> = {};
  for (const name of names) {
    if (!Object.hasOwn(MIGRATIONS, name)) throw new Error(`unknown migration ${name}`);
    chosen[name] = MIGRATIONS[name]!;
  }
  const raw = new Database(':memory:');
  const db = new Kysely<unknown>({ dialect: new SqliteDialect({ database: raw }) });
  try {
    const { error } = await new Migrator({ db, provider: { getMigrations: async () => chosen } }).migrateToLatest();
    if (error) throw error instanceof Error ? error : new Error(String(error));
    return readSchemaShape(raw);
  } finally {
    await db.destroy();
  }
}
