import type { ClassRule, Figures, Finding } from './domain';
import { known, lacking, type Known } from './known';
import { checkLimit } from './rule-check';

/** Class rules that apply to a vehicle of this class (archived rules do not). */
export function classRulesFor(rules: readonly ClassRule[], className: string | null | undefined): ClassRule[] {
  if (!className) return [];
  return rules.filter((r) => r.className === className && r.archivedAt === null);
}

/** Plain words for the figures a class rule can name. */
const FIGURE_WORDS: Readonly<Record<string, string>> = {
  packVoltageNominalV: 'Nominal supply voltage',
  packVoltageFullV: 'Full-charge supply voltage',
  packVoltageCutoffV: 'Cut-off supply voltage',
  packResistanceOhm: 'Supply resistance',
  capacityMah: 'Supply capacity',
  torqueConstantNmPerA: 'Torque constant',
  noLoadRpm: 'No-load speed',
  noLoadRpmFull: 'No-load speed at full charge',
  finalDriveRatio: 'Final drive ratio',
  rolloutMm: 'Rollout',
  theoreticalSpeedKmh: 'Theoretical speed',
  loadedTopSpeedKmh: 'Loaded top speed',
  peakCurrentA: 'Peak current',
  continuousCurrentA: 'Continuous current',
  peakPowerW: 'Peak power',
  loadedVoltageV: 'Loaded supply voltage',
  thrustN: 'Static thrust',
  tipSpeedMps: 'Propeller tip speed (unloaded)',
  tipSpeedStaticMps: 'Propeller tip speed (static)',
  pitchSpeedKmh: 'Pitch speed',
  runRmsCurrentA: 'RMS current over the run',
  steadyCurrentA: 'Steady current',
  loadedRpm: 'Loaded motor speed',
  loadedRpmFull: 'Loaded motor speed at full charge',
};

/**
 * Findings of class rules against a supply's figures. A figure that could not be computed
 * makes the finding incomplete and names what it lacks.
 */
export function classFindings(
  rules: readonly ClassRule[],
  figures: Figures,
  figureMissing: Readonly<Record<string, readonly string[]>>,
  tightThreshold: number,
): Finding[] {
  return rules.map((r) => {
    const raw = Object.hasOwn(figures, r.figure) ? figures[r.figure] : undefined;
    let value: Known;
    if (typeof raw === 'number') value = known(raw);
    else if (raw === null && figureMissing[r.figure]) value = lacking(...(figureMissing[r.figure] ?? []));
    else value = lacking('classRule.figure');
    const limit = Number.isFinite(r.limit) && r.limit > 0 ? known(r.limit) : lacking('classRule.limit');
    const what = FIGURE_WORDS[r.figure] ?? `Figure ${r.figure}`;
    return checkLimit({
      rule: r.ruleId,
      unit: r.unit,
      value,
      limit,
      tightThreshold,
      what,
      limitName: `the ${r.className} class limit`,
      risk: 'The build does not meet the class rules.',
      fix: 'Change the parts or gearing, or run it in another class.',
      tightHint: 'Little room before the class limit.',
    });
  });
}
