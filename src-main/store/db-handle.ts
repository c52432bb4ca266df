import type { Kysely, Transaction } from 'kysely';
import type { Db } from './schema';

/** Repositories take either, so the same function runs alone or inside a caller's transaction. */
export type DbHandle = Kysely<Db> | Transaction<Db>;

/** Large IN lists are split so no statement passes SQLite's bound-parameter limit. */
export const IN_CHUNK = 900;

export function chunks<T>(items: readonly T[], size = IN_CHUNK): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < items.length; i += size) out.push(items.slice(i, i + size));
  return out;
}
