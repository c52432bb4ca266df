import { STATUSES, type Status } from '$core/domain';

/** The core's order, worst first: over, incomplete, tight, clear. */
export const STATUS_ORDER: readonly Status[] = STATUSES;

export const STATUS_WORD: Readonly<Record<Status, string>> = {
  over: 'Over',
  tight: 'Tight',
  incomplete: 'Incomplete',
  clear: 'Clear',
};

/** One line a technician can read on a tooltip or a legend. */
export const STATUS_MEANING: Readonly<Record<Status, string>> = {
  over: 'A figure passes a part rating',
  tight: 'Inside the ratings, but with less headroom than the threshold',
  incomplete: 'Not every rule could be checked: an input is missing',
  clear: 'Every rule checked, with headroom',
};

/** Worst first, unknown (never evaluated) last. */
export function statusRank(status: Status | null): number {
  return status === null ? STATUSES.length : STATUSES.indexOf(status);
}
