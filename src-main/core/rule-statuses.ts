// The checks of a build that are not clear, as one short text: `rule=status` pairs sorted by
// rule id, joined by commas (`battery-continuous=over,motor-heat=tight`). The store keeps it on
// the verdict row, where a re-check compares it as one string, and the builds list filters by
// check on it. Rule ids hold only letters, digits, dot, dash and underscore, so the separators
// never occur inside one.

import { STATUSES, type BuildVerdict, type Status } from './domain';
import { compareStatus } from './status';

/** Each rule's worst status over every supply of the verdict, clear ones left out, as text. */
export function encodeRuleStatuses(verdict: BuildVerdict): string {
  const worst = new Map<string, Status>();
  for (const supply of verdict.supplies) {
    for (const finding of supply.findings) {
      if (finding.status === 'clear') continue;
      const before = worst.get(finding.rule);
      if (before === undefined || compareStatus(finding.status, before) < 0) worst.set(finding.rule, finding.status);
    }
  }
  if (worst.size === 0) return '';
  // Code-unit order, not a locale's: the same findings always give the same text.
  return [...worst.keys()]
    .sort((a, b) => (a < b ? -1 : a > b ? 1 : 0))
    .map((rule) => `${rule}=${worst.get(rule)!}`)
    .join(',');
}

const STATUS_OF: ReadonlyMap<string, Status> = new Map(STATUSES.map((s) => [s, s]));

/** The text back as rule → status; a pair that does not read as one is skipped. */
export function decodeRuleStatuses(text: string): Map<string, Status> {
  const out = new Map<string, Status>();
  if (text === '') return out;
  for (const pair of text.split(',')) {
    const at = pair.lastIndexOf('=');
    const status = at > 0 ? STATUS_OF.get(pair.slice(at + 1)) : undefined;
    if (status !== undefined) out.set(pair.slice(0, at), status);
  }
  return out;
}
