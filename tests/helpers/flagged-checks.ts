import type { Finding, Status } from '../../src-main/core/domain';

// The checks of a build that are not clear, as `rule=status` text, worked out here apart from
// the store's encoder (core/rule-statuses.ts) so the tests compare the encoder with an
// independent reading of the same findings: each rule's worst status, sorted by rule id.

const RANK: Readonly<Record<Status, number>> = { over: 0, incomplete: 1, tight: 2, clear: 3 };

export function flaggedChecks(findings: readonly Finding[]): string {
  const worst = new Map<string, Status>();
  for (const f of findings) {
    const before = worst.get(f.rule);
    if (f.status !== 'clear' && (before === undefined || RANK[f.status] < RANK[before])) worst.set(f.rule, f.status);
  }
  return [...worst]
    .sort(([a], [b]) => (a < b ? -1 : 1))
    .map(([rule, status]) => `${rule}=${status}`)
    .join(',');
}
