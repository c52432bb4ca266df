import { FIGURES, isFigureKey, type FigureKey } from './catalogue/figures';
import { CLASS_RULE } from './catalogue/rules';
import type { ClassRule, Figures, Finding } from './domain';
import { known, lacking, type Known } from './known';
import { checkLimit } from './rule-check';

/** Class rules that apply to a vehicle of this class (archived rules do not). */
export function classRulesFor(rules: readonly ClassRule[], className: string | null | undefined): ClassRule[] {
  if (!className) return [];
  return rules.filter((r) => r.className === className && r.archivedAt === null);
}

/**
 * Findings of class rules against a supply's figures. A figure that could not be computed
 * makes the finding incomplete and names what it lacks.
 */
export function classFindings(rules: readonly ClassRule[], figures: Figures, figureMissing: Readonly<Partial<Record<FigureKey, readonly string[]>>>, tightThreshold: number): Finding[] {
  return rules.map((r) => {
    // A stored rule may name a figure this engine does not compute: it cannot be checked.
    const key = isFigureKey(r.figure) ? r.figure : null;
    const raw = key === null ? undefined : figures[key];
    const lacks = key === null ? undefined : figureMissing[key];
    let value: Known;
    if (typeof raw === 'number') value = known(raw);
    else if (raw === null && lacks) value = lacking(...lacks);
    else value = lacking('classRule.figure');
    const limit = Number.isFinite(r.limit) && r.limit > 0 ? known(r.limit) : lacking('classRule.limit');
    const what = key === null ? `Figure ${r.figure}` : FIGURES[key].name;
    return checkLimit({
      rule: r.ruleId,
      unit: r.unit,
      value,
      limit,
      tightThreshold,
      what,
      limitName: CLASS_RULE.limitName(r.className),
      risk: CLASS_RULE.risk,
      fix: CLASS_RULE.fix,
      tightHint: CLASS_RULE.tightHint,
    });
  });
}
