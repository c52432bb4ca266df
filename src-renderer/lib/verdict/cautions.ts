import type { Finding } from '$core/domain';

// What can happen when a figure is over, in the plain words a workshop poster would use.
// The finding's own message says what to change; these say why it matters.

export const FOLLOW_RATINGS = "Follow the part maker's ratings and manuals, and local rules.";

export type CautionTopic = 'fire' | 'heat' | 'propeller' | 'voltage' | 'mechanical';

export const CAUTION_TEXT: Readonly<Record<CautionTopic, string>> = {
  fire: 'Fire risk: a lithium pack driven past its rating heats up, swells and can catch fire. Charge and store packs on a fire-safe surface, never unattended.',
  heat: 'Heat: current above the rating heats wires, connectors and solder joints; insulation can melt and short.',
  propeller: 'Injury risk: a propeller near the speed of sound is stressed beyond its design and can break and throw pieces. Keep clear of turning propellers.',
  voltage: 'Over-voltage can destroy a controller or motor at once; a failing controller can catch fire.',
  mechanical: 'Above its rated speed a motor’s rotor and bearings are over-stressed and can come apart.',
};

const CURRENT_RULES = new Set(['battery-continuous', 'battery-burst', 'controller-continuous', 'controller-burst', 'motor-current', 'motor-power']);

/** The cautions an `over` finding calls for; none for any other status. */
export function cautionsFor(finding: Pick<Finding, 'rule' | 'status' | 'unit'>, lithium: boolean): CautionTopic[] {
  if (finding.status !== 'over') return [];
  const out: CautionTopic[] = [];
  const rule = finding.rule;
  if (rule.startsWith('battery-') || rule === 'supply-match' || rule === 'pack-retired' || rule === 'pack-repeated') {
    if (lithium) out.push('fire');
    out.push('heat');
  } else if (CURRENT_RULES.has(rule) || finding.unit === 'A' || finding.unit === 'W') {
    out.push('heat');
  } else if (rule === 'prop-tip-speed') {
    out.push('propeller');
  } else if (rule.endsWith('-voltage') || finding.unit === 'V') {
    out.push('voltage');
  } else if (rule === 'motor-speed') {
    out.push('mechanical');
  }
  return out;
}

/** Every caution of a set of findings, once each, in a fixed order. */
export function cautionsOfAll(findings: readonly Pick<Finding, 'rule' | 'status' | 'unit'>[], lithium: boolean): CautionTopic[] {
  const seen = new Set<CautionTopic>();
  for (const f of findings) for (const c of cautionsFor(f, lithium)) seen.add(c);
  return (Object.keys(CAUTION_TEXT) as CautionTopic[]).filter((c) => seen.has(c));
}

/** Shown on every printed sheet, whatever the verdict. */
export const STANDING_CAUTIONS: readonly string[] = [
  'Lithium packs can burn: charge on a fire-safe surface, never unattended, and stop using packs that are swollen, damaged or hot.',
  'High currents heat wires and connectors: use wire and connectors rated for the peak current.',
  'Propellers injure: remove them while setting up on the bench, and keep clear when the power is connected.',
  'The figures are estimates from a first-order model and the ratings on record. Follow the part makers’ ratings and manuals, and local rules.',
];
