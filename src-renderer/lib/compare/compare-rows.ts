// The rows of the compare view, as plain data: one column per build (the supply compared), one
// row per check and per figure, grouped by stage of the power path. A row differs where what the
// columns show differs; a check row names the column with the most and the least headroom.

import type { Finding, SupplyVerdict, VehicleKind } from '$core/domain';
import { compareStatus } from '$core/status';
import type { UnitSystem } from '$core/units';
import { RULE_IDS } from '$core/catalogue/rules';
import { MISSING } from '../format/number';
import { figureText } from '../figures/figure-groups';
import { ruleName } from '../verdict/rule-names';
import { STATUS_WORD } from '../verdict/status-words';
import { askedText, assumedText } from '../sheet/power-path';
import { STAGES, stageOfRule, type Stage } from '../sheet/path-stages';
import { figuresByStage, stageTitle } from '../sheet/stage-figures';

export interface CompareColumn {
  id: string;
  name: string;
  kind: VehicleKind | null;
  /** The supply compared; null where the build has not been checked. */
  verdict: SupplyVerdict | null;
}

export interface CheckCell {
  /** The build's check; null where this build has no such check. */
  finding: Finding | null;
  /** "35.8 A of 60 A continuous", or what the cell lacks. */
  asked: string;
  /** What the figure assumed: "peak, model, full charge". */
  assumed: string | null;
  /** The finding's own margin, (limit − value) ÷ limit. */
  margin: number | null;
  marginText: string;
  /** The most and least headroom of the row, where the columns' margins differ. */
  mark: 'best' | 'worst' | null;
}

export interface CheckRow {
  rule: string;
  label: string;
  cells: CheckCell[];
  differs: boolean;
}

export interface FigureRow {
  key: string;
  label: string;
  cells: string[];
  differs: boolean;
}

export interface StageRows {
  stage: Stage;
  title: string;
  checks: CheckRow[];
  figures: FigureRow[];
}

export const NOT_CHECKED = 'not checked for this build';

/** "12 % headroom", "5 % over", as the sheet words a margin. */
export function marginText(margin: number | null): string {
  if (margin === null) return MISSING;
  return margin < 0 ? `${Math.round(-margin * 100)} % over` : `${Math.round(margin * 100)} % headroom`;
}

const ruleOrder = (rule: string): number => {
  const i = (RULE_IDS as readonly string[]).indexOf(rule);
  return i < 0 ? RULE_IDS.length : i;
};

/** What a cell shows, for telling whether the columns differ: verdict, figure and rating. */
function shownCheck(cell: CheckCell): string {
  return cell.finding === null ? NOT_CHECKED : `${STATUS_WORD[cell.finding.status]}|${cell.asked}`;
}

function checkCell(finding: Finding | null, system: UnitSystem): CheckCell {
  if (finding === null) return { finding, asked: NOT_CHECKED, assumed: null, margin: null, marginText: MISSING, mark: null };
  return { finding, asked: askedText(finding, system), assumed: assumedText(finding), margin: finding.margin, marginText: marginText(finding.margin), mark: null };
}

/** Marks the most and the least headroom of a row; none where fewer than two margins differ. */
function markMargins(cells: CheckCell[]): void {
  const margins = cells.map((c) => c.margin).filter((m): m is number => m !== null);
  if (margins.length < 2) return;
  const best = Math.max(...margins);
  const worst = Math.min(...margins);
  if (best === worst) return;
  for (const c of cells) {
    if (c.margin === best) c.mark = 'best';
    else if (c.margin === worst) c.mark = 'worst';
  }
}

const isGround = (kind: VehicleKind | null) => kind === 'car' || kind === 'truck';

/**
 * A kind that stands for every column: cars beside trucks read as ground builds, boats beside
 * planes as propeller builds; null where both families meet (the figure list then covers both).
 */
function sharedKind(columns: readonly CompareColumn[]): VehicleKind | null {
  const first = columns[0]?.kind ?? null;
  if (first === null) return null;
  return columns.every((c) => c.kind !== null && isGround(c.kind) === isGround(first)) ? first : null;
}

/** The comparison of two or more builds, stage by stage, packs first. */
export function compareRows(columns: readonly CompareColumn[], system: UnitSystem): StageRows[] {
  // Each check once, under the stage of the first build that has it.
  const rules = new Map<string, { stage: Stage; unit: string }>();
  for (const col of columns) for (const f of col.verdict?.findings ?? []) if (!rules.has(f.rule)) rules.set(f.rule, { stage: stageOfRule(f.rule, f.unit), unit: f.unit });

  const kind = sharedKind(columns);
  const figureGroups = new Map(figuresByStage(kind).map((g) => [g.id, g.figures]));

  return STAGES.map((stage): StageRows => {
    const checks = [...rules]
      .filter(([, r]) => r.stage === stage)
      .sort(([a], [b]) => ruleOrder(a) - ruleOrder(b) || a.localeCompare(b))
      .map(([rule]): CheckRow => {
        const cells = columns.map((col) => checkCell(col.verdict?.findings.find((f) => f.rule === rule) ?? null, system));
        markMargins(cells);
        return { rule, label: ruleName(rule), cells, differs: new Set(cells.map(shownCheck)).size > 1 };
      });
    const figures = (figureGroups.get(stage) ?? [])
      .filter((def) => !def.optional || columns.some((col) => typeof col.verdict?.figures[def.key] === 'number'))
      .map((def): FigureRow => {
        const cells = columns.map((col) => figureText(def, col.verdict?.figures ?? null, system));
        return { key: def.key, label: def.label, cells, differs: new Set(cells).size > 1 };
      });
    return { stage, title: stageTitle(stage, kind), checks, figures };
  }).filter((g) => g.checks.length > 0 || g.figures.length > 0);
}

/** The supply a build is compared on: the one that decides its verdict (the worst; the first of equals). */
export function decidingSupply(supplies: readonly Pick<SupplyVerdict, 'status'>[]): number {
  let at = 0;
  supplies.forEach((s, i) => {
    if (compareStatus(s.status, supplies[at]!.status) < 0) at = i;
  });
  return at;
}
