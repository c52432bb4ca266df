import type { Status } from '../../../src-main/core/domain';

export const STATUS_ORDER: readonly Status[] = ['over', 'tight', 'incomplete', 'clear'];

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

const RANK: Readonly<Record<Status, number>> = { over: 0, tight: 1, incomplete: 2, clear: 3 };

/** Worst first, unknown (never evaluated) last. */
export function statusRank(status: Status | null): number {
  return status === null ? 4 : RANK[status];
}
