// Rows for a store at any schema version, shaped from the schema the engine reports, so an
// upgrade test covers a new migration's tables and columns the day it is added. The same rule
// makes the rows on SQLite and on PostgreSQL; each engine only says what its schema is and how
// a row goes in.

export interface ColumnShape {
  name: string;
  /** The declared type as the engine names it (`real`, `integer`, `double precision`, `text`). */
  type: string;
  /** Filled by the engine (an identity column): a real store never writes it, so neither does the test. */
  generated: boolean;
}

export interface ForeignKeyShape {
  from: string;
  table: string;
  to: string;
}

export interface TableShape {
  name: string;
  columns: ColumnShape[];
  keys: ForeignKeyShape[];
}

export type WrittenRows = Map<string, Array<Record<string, unknown>>>;

/** A plausible value for a column, by its name and declared type; the same rule for every schema version. */
export function valueFor(table: string, column: Pick<ColumnShape, 'name' | 'type'>, row: number): string | number {
  const name = column.name;
  const type = column.type.toLowerCase();
  const words: Record<string, string> = {
    chemistry: 'lipo',
    kind: 'car',
    status: 'clear',
    arrangement: 'series',
    action: 'create',
    entityKind: 'batteries',
    ruleId: `class-rule-${row}`,
    figure: 'packVoltageFullV',
    unit: 'V',
    className: 'club',
    verdictChanges: '[]',
    before: '{}',
    after: '{}',
    supplyStatuses: '',
    ruleStatuses: '',
    actor: 'upgrade-test',
    cellResistancesOhm: '[0.003, 0.004]',
    samples: '{"timeS":[0,1],"currentA":[10,20]}',
    mapping: '{}',
  };
  if (table === 'settings' && name === 'key') return ['units', 'tightThreshold', 'demoOffered'][row] ?? `key-${row}`;
  if (table === 'settings' && name === 'value') return ['"metric"', '0.2', 'true'][row] ?? '0';
  if (name in words) return words[name]!;
  if (name.endsWith('At')) return `2026-11-0${row + 1}T08:00:00.000Z`;
  if (type.includes('int')) return name === 'version' ? 1 + row : name === 'retired' ? 0 : name === 'position' ? row : row + 1;
  if (type.includes('real') || type.includes('double')) return 1.5 + row;
  return `${table}-${name}-${row}`;
}

/**
 * Fills every table with three rows, parents before children, foreign keys pointing at real
 * parent rows. `insert` writes one row and returns it as stored, generated columns included,
 * which is how a child finds the id the engine gave its parent.
 */
export async function fillEveryTable(tables: TableShape[], insert: (table: string, row: Record<string, unknown>) => Promise<Record<string, unknown>>): Promise<WrittenRows> {
  const order: TableShape[] = [];
  while (order.length < tables.length) {
    const next = tables.find((t) => !order.includes(t) && t.keys.every((k) => k.table === t.name || order.some((o) => o.name === k.table)));
    if (!next)
      throw new Error(
        `foreign keys form a cycle among ${tables
          .filter((t) => !order.includes(t))
          .map((t) => t.name)
          .join(', ')}`,
      );
    order.push(next);
  }
  const written: WrittenRows = new Map();
  for (const table of order) {
    const rows: Array<Record<string, unknown>> = [];
    for (let i = 0; i < 3; i++) {
      const row: Record<string, unknown> = {};
      for (const column of table.columns) {
        if (column.generated) continue;
        const key = table.keys.find((k) => k.from === column.name);
        row[column.name] = key ? written.get(key.table)![i]![key.to] : valueFor(table.name, column, i);
      }
      rows.push(await insert(table.name, row));
    }
    written.set(table.name, rows);
  }
  return written;
}
