// What a change does to verdicts, read from a preview (before and after), in the two cases a
// screen must never soften: a build that becomes OVER, and a build that was OVER and now cannot
// be checked (the change removed the data the check needed, not the problem).
import type { BuildVerdict, Finding, Status } from '$core/domain';
import { compareStatus } from '$core/status';
import { fieldLabel } from '$core/field-labels';

export interface ShiftPreview {
  before: readonly BuildVerdict[];
  after: readonly BuildVerdict[];
}

export interface OverCheck {
  /** 1-based supply number. */
  supply: number;
  rule: string;
  value: number | null;
  limit: number | null;
  unit: string;
  message: string;
}

export interface NewlyOver {
  buildId: string;
  /** The build's status before the change; null for a build the change creates. */
  from: Status | null;
  checks: OverCheck[];
}

function overChecks(verdict: BuildVerdict, except: (supply: number, rule: string) => boolean): OverCheck[] {
  const out: OverCheck[] = [];
  verdict.supplies.forEach((s, i) => {
    for (const f of s.findings) {
      if (f.status !== 'over' || except(i, f.rule)) continue;
      out.push({ supply: i + 1, rule: f.rule, value: f.value, limit: f.limit, unit: f.unit, message: f.message });
    }
  });
  return out;
}

/**
 * Builds the change makes OVER, or makes over in a check that was not over before: each with
 * the checks that pass their limits, to say why before saving. A build that stays over for the
 * same reasons is not news and is left out.
 */
export function newlyOver(preview: ShiftPreview): NewlyOver[] {
  const out: NewlyOver[] = [];
  for (const after of preview.after) {
    if (after.status !== 'over') continue;
    const before = preview.before.find((b) => b.buildId === after.buildId) ?? null;
    const wasOver = (supply: number, rule: string) => before?.supplies[supply]?.findings.some((f) => f.rule === rule && f.status === 'over') ?? false;
    const checks = overChecks(after, wasOver);
    if (before?.status === 'over' && checks.length === 0) continue;
    out.push({ buildId: after.buildId, from: before?.status ?? null, checks: checks.length > 0 ? checks : overChecks(after, () => false) });
  }
  return out;
}

export interface LostCheck {
  supply: number;
  rule: string;
  /** Plain words for the inputs the check now lacks. */
  missing: string[];
}

/**
 * A build that was OVER and now reads Incomplete: the checks that were over and can no longer
 * be made, with what they lack. Empty when the build is not in that case. Such a change is not
 * an improvement: nothing says the limit is now kept.
 */
export function overToIncomplete(before: BuildVerdict | undefined, after: BuildVerdict): LostCheck[] {
  if (!before || before.status !== 'over' || after.status !== 'incomplete') return [];
  const out: LostCheck[] = [];
  after.supplies.forEach((s, i) => {
    for (const f of s.findings) {
      if (f.status !== 'incomplete') continue;
      const was = before.supplies[i]?.findings.find((x) => x.rule === f.rule);
      if (was?.status !== 'over') continue;
      out.push({ supply: i + 1, rule: f.rule, missing: (f.missing ?? []).map(fieldLabel) });
    }
  });
  // Over before and incomplete now, yet no single check moved that way (a supply was dropped):
  // still say it, with every input the new verdict lacks.
  if (out.length === 0) {
    const missing = [...new Set(after.supplies.flatMap((s) => s.findings.flatMap((f: Finding) => (f.status === 'incomplete' ? (f.missing ?? []) : []))))].map(fieldLabel);
    out.push({ supply: 0, rule: '', missing });
  }
  return out;
}

/**
 * How a check row or a build reads from before to after: `worse`, `better`, `same`, or
 * `unknown` when the after side cannot be judged (incomplete), which is never shown as better.
 */
export function shiftOf(from: Status | null, to: Status): 'worse' | 'better' | 'same' | 'unknown' {
  if (from === to) return 'same';
  if (to === 'incomplete') return 'unknown';
  if (from === null || from === 'incomplete') return to === 'over' ? 'worse' : 'same';
  return compareStatus(to, from) < 0 ? 'worse' : 'better';
}
