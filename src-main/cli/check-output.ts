import type { BuildVerdict, Finding, PackShare, Status, SupplyVerdict } from '../core/domain';
import { STATUSES } from '../core/domain';
import type { FleetRecords } from '../service/fleet/fleet-format';
import { formatNumber, formatPercent, JSON_SIGNIFICANT_DIGITS, roundSignificant } from './format-number';

/** Said whenever something is over: what can happen, and whose word counts. */
export const OVER_CAUTION =
  "Over means a part is used past its rating: it can overheat or fail, and a lithium pack can swell and catch fire. Before running it, follow the part maker's ratings and manuals and your local rules.";

/** The finding fields the check output carries. */
type FindingField = 'rule' | 'status' | 'value' | 'limit' | 'unit' | 'margin' | 'message';

type JsonFigures = Record<string, number | string | null>;

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
      figures: JsonFigures;
      findings: Pick<Finding, FindingField>[];
      packShares: PackShare[];
      assumptions: string[];
    }[];
  }[];
}

const round = (x: number | null): number | null => (x === null ? null : roundSignificant(x, JSON_SIGNIFICANT_DIGITS));

function roundFigures(figures: SupplyVerdict['figures']): JsonFigures {
  const out: JsonFigures = {};
  for (const [key, value] of Object.entries(figures)) out[key] = typeof value === 'number' ? roundSignificant(value, JSON_SIGNIFICANT_DIGITS) : value;
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
 * status, figures, findings, packShares, assumptions }] }] }`, with every figure, value, limit and margin rounded to
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
      })),
    })),
  };
}

function pad(text: string, width: number): string {
  return text.length >= width ? `${text} ` : text + ' '.repeat(width - text.length);
}

const WORD: Readonly<Record<Status, string>> = { over: 'OVER', tight: 'TIGHT', incomplete: 'INCOMPLETE', clear: 'clear' };

function figureLine(s: SupplyVerdict): string {
  const f = s.figures;
  const parts = [
    `pack ${formatNumber(f.packVoltageNominalV)} V nominal / ${formatNumber(f.packVoltageFullV)} V full`,
    `Kt ${formatNumber(f.torqueConstantNmPerA)} N·m/A`,
    `no-load ${formatNumber(f.noLoadRpm)} rpm`,
  ];
  if (f.finalDriveRatio !== null) parts.push(`final drive ${formatNumber(f.finalDriveRatio)}`);
  if (f.theoreticalSpeedKmh !== null) parts.push(`${formatNumber(f.theoreticalSpeedKmh)} km/h theoretical`);
  if (typeof f.pitchSpeedKmh === 'number') parts.push(`${formatNumber(f.pitchSpeedKmh)} km/h pitch speed`);
  parts.push(`peak ${formatNumber(f.peakCurrentA)} A`, `continuous ${formatNumber(f.continuousCurrentA)} A`);
  if (f.currentSource) parts.push(`(${f.currentSource === 'measured' ? 'measured' : 'model'})`);
  return parts.join(' · ');
}

/** A readable report: per build, per supply, the key figures and a table of the findings, with the full message of each that needs attention. */
export function checkText(fleet: FleetRecords, verdicts: readonly BuildVerdict[]): string {
  const names = new Map(fleet.builds.map((b) => [b.id, b.name]));
  const supplyName = supplyNamer(fleet);
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
      for (const f of s.findings) if (f.status !== 'clear') lines.push(`    ${WORD[f.status]} ${f.rule}: ${f.message}`);
      for (const a of s.assumptions) lines.push(`    assumed: ${a}`);
    });
    lines.push('');
  }
  const counts = new Map<Status, number>(STATUSES.map((s) => [s, 0]));
  for (const v of verdicts) counts.set(v.status, (counts.get(v.status) ?? 0) + 1);
  lines.push(`${verdicts.length} build${verdicts.length === 1 ? '' : 's'} checked: ${STATUSES.map((s) => `${counts.get(s)} ${s}`).join(', ')}.`);
  if ((counts.get('over') ?? 0) > 0) lines.push(OVER_CAUTION);
  return `${lines.join('\n')}\n`;
}
