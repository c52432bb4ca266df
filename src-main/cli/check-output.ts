import { CAUTION_TEXT, CAUTION_TOPICS, type CautionTopic } from '../core/catalogue/cautions';
import { FIGURE_KEYS, FIGURES, type FigureKey } from '../core/catalogue/figures';
import { cautionsOfAll, isRuleId, ruleName } from '../core/catalogue/rules';
import { isLithium } from '../core/chemistry';
import type { BuildVerdict, Figures, Finding, PackShare, Status, SupplyVerdict, ValueUsed } from '../core/domain';
import { STATUSES } from '../core/domain';
import type { FleetRecords } from '../service/fleet/fleet-format';
import { formatNumber, formatPercent, JSON_SIGNIFICANT_DIGITS, roundSignificant } from './format-number';

/** Said whenever something is over: what can happen, and whose word counts. */
export const OVER_CAUTION = "Over means a part is used past its rating: it can overheat or fail, and a lithium pack can swell and catch fire. Before running it, follow the part maker's ratings and manuals and your local rules.";

/** The finding fields the check output carries. */
type FindingField = 'rule' | 'status' | 'value' | 'limit' | 'unit' | 'margin' | 'message';

export interface CheckJson {
  builds: {
    id: string;
    name: string;
    status: Status;
    supplies: {
      id: string;
      name: string;
      batteryIds: string[];
      status: Status;
      figures: Figures;
      findings: Pick<Finding, FindingField>[];
      packShares: PackShare[];
      assumptions: string[];
      /** Inputs left empty and taken as typical or estimated values (empty where none was). */
      valuesUsed: ValueUsed[];
      /** Figures resting on them. */
      markedFigures: FigureKey[];
    }[];
  }[];
}

const round = (x: number | null): number | null => (x === null ? null : roundSignificant(x, JSON_SIGNIFICANT_DIGITS));

function roundFigures(figures: Figures): Figures {
  const out: Figures = { ...figures };
  for (const key of FIGURE_KEYS) out[key] = round(figures[key]);
  return out;
}

/** Names of the packs of a supply as the build sheet reads them: `A + B` in series, `A ∥ B` in parallel. */
function supplyNamer(fleet: FleetRecords): (buildId: string, s: SupplyVerdict) => string {
  const packNames = new Map(fleet.batteries.map((b) => [b.id, b.name]));
  const arrangement = new Map(fleet.builds.flatMap((b) => b.supplies.map((s) => [`${b.id}/${s.id}`, s.arrangement] as const)));
  return (buildId, s) => s.batteryIds.map((id) => packNames.get(id) ?? id).join(arrangement.get(`${buildId}/${s.supplyId}`) === 'parallel' ? ' ∥ ' : ' + ');
}

/**
 * The documented shape, `{ builds: [{ id, name, status, supplies: [{ id, name, batteryIds,
 * status, figures, findings, packShares, assumptions, valuesUsed, markedFigures }] }] }`, with every figure, value, limit and margin rounded to
 * JSON_SIGNIFICANT_DIGITS significant digits.
 */
export function checkJson(fleet: FleetRecords, verdicts: readonly BuildVerdict[]): CheckJson {
  const names = new Map(fleet.builds.map((b) => [b.id, b.name]));
  const supplyName = supplyNamer(fleet);
  return {
    builds: verdicts.map((v) => ({
      id: v.buildId,
      name: names.get(v.buildId) ?? v.buildId,
      status: v.status,
      supplies: v.supplies.map((s) => ({
        id: s.supplyId,
        name: supplyName(v.buildId, s),
        batteryIds: [...s.batteryIds],
        status: s.status,
        figures: roundFigures(s.figures),
        findings: s.findings.map((f) => ({ rule: f.rule, status: f.status, value: round(f.value), limit: round(f.limit), unit: f.unit, margin: round(f.margin), message: f.message })),
        packShares: s.packShares.map((p) => ({ ...p, share: round(p.share) ?? 0, continuousA: round(p.continuousA), peakA: round(p.peakA), continuousLimitA: round(p.continuousLimitA), burstLimitA: round(p.burstLimitA) })),
        assumptions: [...s.assumptions],
        valuesUsed: (s.valuesUsed ?? []).map((u) => ({ ...u, value: round(u.value) ?? 0 })),
        markedFigures: [...(s.markedFigures ?? [])],
      })),
    })),
  };
}

function pad(text: string, width: number): string {
  return text.length >= width ? `${text} ` : text + ' '.repeat(width - text.length);
}

const WORD: Readonly<Record<Status, string>> = { over: 'OVER', tight: 'TIGHT', incomplete: 'INCOMPLETE', clear: 'clear' };

/** A figure with its catalogue unit: "12.6 V". */
function figure(f: Figures, key: FigureKey): string {
  return `${formatNumber(f[key])} ${FIGURES[key].unit}`;
}

function figureLine(s: SupplyVerdict): string {
  const f = s.figures;
  const parts = [`pack ${figure(f, 'packVoltageNominalV')} nominal / ${figure(f, 'packVoltageFullV')} full`, `Kt ${figure(f, 'torqueConstantNmPerA')}`, `no-load ${figure(f, 'noLoadRpm')}`];
  if (f.finalDriveRatio !== null) parts.push(`final drive ${formatNumber(f.finalDriveRatio)}`);
  if (f.theoreticalSpeedKmh !== null) parts.push(`${figure(f, 'theoreticalSpeedKmh')} theoretical`);
  if (f.pitchSpeedKmh !== null) parts.push(`${figure(f, 'pitchSpeedKmh')} pitch speed`);
  parts.push(`peak ${figure(f, 'peakCurrentA')}`, `continuous ${figure(f, 'continuousCurrentA')}`);
  if (f.currentSource) parts.push(`(${f.currentSource === 'measured' ? 'measured' : 'model'})`);
  return parts.join(' · ');
}

/** A catalogue rule by its short name and id; a class rule's id already says what it is. */
function ruleWords(rule: string): string {
  return isRuleId(rule) ? `${ruleName(rule)} (${rule})` : rule;
}

/** Whether a supply may hold lithium packs: a pack not in the file counts as lithium (the safe side). */
function lithiumOf(fleet: FleetRecords): (s: SupplyVerdict) => boolean {
  const chemistry = new Map(fleet.batteries.map((b) => [b.id, b.chemistry]));
  return (s) =>
    s.batteryIds.length === 0 ||
    s.batteryIds.some((id) => {
      const c = chemistry.get(id);
      return c === undefined || isLithium(c);
    });
}

/** A readable report: per build, per supply, the key figures and a table of the findings, with the full message of each that needs attention. */
export function checkText(fleet: FleetRecords, verdicts: readonly BuildVerdict[]): string {
  const names = new Map(fleet.builds.map((b) => [b.id, b.name]));
  const supplyName = supplyNamer(fleet);
  const lithium = lithiumOf(fleet);
  const cautions = new Set<CautionTopic>();
  const lines: string[] = [];
  for (const v of verdicts) {
    lines.push(`${WORD[v.status]}  ${names.get(v.buildId) ?? v.buildId}  [${v.buildId}]`);
    v.supplies.forEach((s, i) => {
      const packs = supplyName(v.buildId, s);
      lines.push(`  supply ${i + 1} of ${v.supplies.length}: ${packs || '(no packs)'}  →  ${WORD[s.status]}`);
      lines.push(`    ${figureLine(s)}`);
      lines.push(`    ${pad('status', 12)}${pad('rule', 24)}${pad('value', 14)}${pad('limit', 14)}margin`);
      for (const f of s.findings) {
        const value = f.value === null ? '–' : `${formatNumber(f.value)} ${f.unit}`;
        const limit = f.limit === null ? '–' : `${formatNumber(f.limit)} ${f.unit}`;
        lines.push(`    ${pad(WORD[f.status], 12)}${pad(f.rule, 24)}${pad(value, 14)}${pad(limit, 14)}${formatPercent(f.margin)}`);
      }
      for (const f of s.findings) if (f.status !== 'clear') lines.push(`    ${WORD[f.status]} ${ruleWords(f.rule)}: ${f.message}`);
      for (const c of cautionsOfAll(s.findings, lithium(s))) cautions.add(c);
      for (const a of s.assumptions) lines.push(`    assumed: ${a}`);
      for (const u of s.valuesUsed ?? []) lines.push(`    ${u.basis === 'rule-of-thumb' ? 'rule of thumb' : u.basis}: ${u.field} ${formatNumber(u.value)}`);
    });
    lines.push('');
  }
  const counts = new Map<Status, number>(STATUSES.map((s) => [s, 0]));
  for (const v of verdicts) counts.set(v.status, (counts.get(v.status) ?? 0) + 1);
  lines.push(`${verdicts.length} build${verdicts.length === 1 ? '' : 's'} checked: ${STATUSES.map((s) => `${counts.get(s)} ${s}`).join(', ')}.`);
  if ((counts.get('over') ?? 0) > 0) {
    lines.push(OVER_CAUTION);
    for (const c of CAUTION_TOPICS) if (cautions.has(c)) lines.push(`  ${CAUTION_TEXT[c]}`);
  }
  return `${lines.join('\n')}\n`;
}
