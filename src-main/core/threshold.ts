import { DEFAULT_TIGHT_THRESHOLD, type ClassRule } from './domain';

const usable = (t: number | null | undefined): t is number => typeof t === 'number' && Number.isFinite(t) && t >= 0 && t < 1;

/**
 * The margin under which a rule reads tight: the build's own, else its class's (the largest
 * any of the class's rules sets, so the most cautious), else the given default.
 */
export function tightThresholdFor(buildThreshold: number | null, classRules: readonly ClassRule[], defaultThreshold: number): number {
  if (usable(buildThreshold)) return buildThreshold;
  let fromClass: number | null = null;
  for (const r of classRules) {
    const t = r.tightThreshold;
    if (usable(t) && (fromClass === null || t > fromClass)) fromClass = t;
  }
  if (fromClass !== null) return fromClass;
  return usable(defaultThreshold) ? defaultThreshold : DEFAULT_TIGHT_THRESHOLD;
}
