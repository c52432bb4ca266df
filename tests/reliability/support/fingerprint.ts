import type Database from 'better-sqlite3';
import { createHash } from 'node:crypto';

/** Every table of a SQLite file with its statements prepared once: row count, highest version, a hash of the rows. */
export function tableFingerprinter(raw: Database.Database): () => string {
  const tables = (raw.prepare("select name from sqlite_master where type = 'table' order by name").pluck().all() as string[]).map((table) => {
    const columns = (raw.prepare(`pragma table_info("${table}")`).all() as Array<{ name: string }>).map((c) => c.name);
    return {
      table,
      rows: raw.prepare(`select * from "${table}" order by rowid`).raw(),
      maxVersion: columns.includes('version') ? raw.prepare(`select max(version) from "${table}"`).pluck() : null,
    };
  });
  const schema = raw.prepare('select type, name, tbl_name, sql from sqlite_master order by type, name').raw();
  return () =>
    [
      `schema:${hash(schema.all())}`,
      ...tables.map(({ table, rows, maxVersion }) => {
        const all = rows.all() as unknown[][];
        return `${table}:${all.length}:${maxVersion ? String(maxVersion.get()) : '-'}:${hash(all)}`;
      }),
    ].join('|');
}

function hash(value: unknown): string {
  return createHash('sha1')
    .update(JSON.stringify(value, (_k, v: unknown) => (typeof v === 'bigint' ? v.toString() : Buffer.isBuffer(v) ? v.toString('hex') : v)))
    .digest('hex');
}
