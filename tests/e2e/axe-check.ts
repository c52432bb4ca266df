import AxeBuilder from '@axe-core/playwright';
import { test, type Page } from '@playwright/test';
import type { Result } from 'axe-core';

// The accessibility rule set every screen is held to: WCAG 2.0 and 2.1, levels A and AA, as
// tagged by the axe-core engine (the rules are axe-core's, not ours, so a screen is judged by
// an outside standard rather than by what we remembered to test).
export const AXE_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] as const;

export interface AxeViolationLine {
  rule: string;
  impact: string;
  target: string;
  summary: string;
}

/** One line per element, so a failure says which rule, how bad, where, and on which screen. */
export function violationLines(violations: Result[]): AxeViolationLine[] {
  return violations.flatMap((v) =>
    v.nodes.map((node) => ({
      rule: v.id,
      impact: node.impact ?? v.impact ?? 'unknown',
      target: node.target.map((t) => (Array.isArray(t) ? t.join(' >> ') : String(t))).join(' | '),
      summary: (node.failureSummary ?? v.help).replace(/\s+/g, ' ').trim(),
    })),
  );
}

export function formatViolations(screenName: string, lines: AxeViolationLine[]): string {
  const body = lines.map((l) => `  - [${l.rule}] (${l.impact}) ${l.target}\n      ${l.summary}`).join('\n');
  return `axe (${AXE_TAGS.join(', ')}) found ${lines.length} violation(s) on screen "${screenName}":\n${body}`;
}

/** Runs the rule set on what the page shows now. */
export async function axeScan(page: Page): Promise<AxeViolationLine[]> {
  const results = await new AxeBuilder({ page }).withTags([...AXE_TAGS]).analyze();
  return violationLines(results.violations);
}

/**
 * Fails with every violation (rule id, impact, element selector, screen name) on the page as
 * it is now. Call it at each screen and state a test visits, after the state has settled.
 */
export async function expectNoAxeViolations(page: Page, screenName: string): Promise<void> {
  await test.step(`accessibility rules: ${screenName}`, async () => {
    const lines = await axeScan(page);
    if (lines.length > 0) throw new Error(formatViolations(screenName, lines));
  });
}
