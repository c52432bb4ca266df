import type { Status } from './domain';

// A check that cannot be made is worse news than a known small margin.
const RANK: Readonly<Record<Status, number>> = { over: 0, incomplete: 1, tight: 2, clear: 3 };

/** Negative when `a` is worse than `b`: sorts worst first. */
export function compareStatus(a: Status, b: Status): number {
  return RANK[a] - RANK[b];
}

/** The worst of several verdicts: over, then incomplete, then tight, then clear. Nothing to judge reads clear. */
export function worstStatus(statuses: Iterable<Status>): Status {
  let worst: Status = 'clear';
  for (const s of statuses) if (RANK[s] < RANK[worst]) worst = s;
  return worst;
}

/** (limit − value) ÷ limit, kept finite so it survives JSON. Limit must be positive. */
export function marginOf(value: number, limit: number): number {
  const m = (limit - value) / limit;
  return Math.max(-Number.MAX_VALUE, Math.min(Number.MAX_VALUE, m));
}

/** Over when the value passes the limit, tight when the margin is under the threshold. */
export function statusOf(value: number, limit: number, tightThreshold: number): Exclude<Status, 'incomplete'> {
  if (value > limit) return 'over';
  return marginOf(value, limit) < tightThreshold ? 'tight' : 'clear';
}
