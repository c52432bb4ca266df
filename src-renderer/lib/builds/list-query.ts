// The builds list's filters, sort and search as the query of its address (`#/builds?v=over&q=4s`),
// so a reload, a bookmark or the browser's Back opens the list as it was left.
import { STATUSES, VEHICLE_KINDS, type Status, type VehicleKind } from '$core/domain';
import * as v from 'valibot';
import { id } from '$service/schemas/field-builders';
import { SORT_KEYS, type SortDir, type SortKey } from './build-filter';

export interface ListQuery {
  text: string;
  statuses: readonly Status[];
  kinds: readonly VehicleKind[];
  /** '' every customer, '-' the shop's own, else a customer id. */
  customer: string;
  partId: string;
  /** '' any check, else a rule id (built-in or class). */
  rule: string;
  sortKey: SortKey;
  sortDir: SortDir;
  /** Archived builds are listed instead of the active ones. */
  archived: boolean;
}

export const DEFAULT_LIST_QUERY: ListQuery = {
  text: '',
  statuses: [],
  kinds: [],
  customer: '',
  partId: '',
  rule: '',
  sortKey: 'status',
  sortDir: 1,
  archived: false,
};

const listOf = <T extends string>(raw: string | null, allowed: readonly T[]): T[] => {
  if (raw === null || raw === '') return [];
  const out: T[] = [];
  for (const part of raw.split(',')) if ((allowed as readonly string[]).includes(part) && !out.includes(part as T)) out.push(part as T);
  return out;
};

// A rule id as the service takes one; anything else in the address is no check at all.
const RULE_ID = id();

/** Reads the query part of the address; anything unknown or malformed falls back to the default. */
export function parseListQuery(search: string): ListQuery {
  const p = new URLSearchParams(search);
  const sort = p.get('sort');
  const check = p.get('check') ?? '';
  return {
    text: p.get('q') ?? '',
    statuses: listOf(p.get('v'), STATUSES),
    kinds: listOf(p.get('kind'), VEHICLE_KINDS),
    customer: p.get('customer') ?? '',
    partId: p.get('part') ?? '',
    rule: v.is(RULE_ID, check) ? check : '',
    sortKey: (SORT_KEYS as readonly string[]).includes(sort ?? '') ? (sort as SortKey) : DEFAULT_LIST_QUERY.sortKey,
    sortDir: p.get('dir') === 'desc' ? -1 : 1,
    archived: p.get('archived') === '1',
  };
}

/** Writes only what differs from the default, in a fixed order: the same list gives the same address. */
export function formatListQuery(q: ListQuery): string {
  const p = new URLSearchParams();
  if (q.text !== '') p.set('q', q.text);
  if (q.statuses.length > 0) p.set('v', q.statuses.join(','));
  if (q.kinds.length > 0) p.set('kind', q.kinds.join(','));
  if (q.customer !== '') p.set('customer', q.customer);
  if (q.partId !== '') p.set('part', q.partId);
  if (q.rule !== '') p.set('check', q.rule);
  if (q.sortKey !== DEFAULT_LIST_QUERY.sortKey) p.set('sort', q.sortKey);
  if (q.sortDir === -1) p.set('dir', 'desc');
  if (q.archived) p.set('archived', '1');
  return p.toString();
}

export function isDefaultListQuery(q: ListQuery): boolean {
  return formatListQuery(q) === '';
}
