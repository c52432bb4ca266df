// A figure that must stay at or above a least value (thrust-to-weight), with a band above it
// that reads tight: the opposite sense of a rating, so its own small check.

import type { Finding } from './domain';
import type { Known } from './known';
import { describeMissing } from './field-labels';
import { messageNumber } from './message-number';
import type { RuleText } from './catalogue/rules';

export interface MinimumCheck {
  rule: string;
  unit: string;
  value: Known;
  /** Under it: over. */
  overBelow: number;
  /** Under it (and not under `overBelow`): tight. */
  tightBelow: number;
  text: RuleText;
  source?: 'model' | 'measured';
  messages: boolean;
}

/** Margin is (value − least) ÷ least: the share of the least value there is to spare. */
export function checkMinimum(c: MinimumCheck): Finding {
  const finding: Finding = { rule: c.rule, status: 'incomplete', value: null, limit: c.overBelow, unit: c.unit, margin: null, message: '' };
  if (c.source) finding.source = c.source;
  const v = c.value.value;
  if (v === null || !Number.isFinite(v)) {
    finding.missing = c.value.missing ? [...c.value.missing] : [];
    if (c.messages) finding.message = finding.missing.length > 0 ? `Not checked yet: needs ${describeMissing(finding.missing)}.` : `Not checked: the inputs give no usable ${c.text.what.toLowerCase()}.`;
    return finding;
  }
  finding.value = v;
  finding.margin = (v - c.overBelow) / c.overBelow;
  finding.status = v < c.overBelow ? 'over' : v < c.tightBelow ? 'tight' : 'clear';
  if (!c.messages) return finding;
  // A ratio reads "1.8:1"; a quantity "11.2 V".
  const withUnit = (x: number): string => `${messageNumber(x)}${c.unit === ':1' ? ':1' : ` ${c.unit}`}`;
  const shown = withUnit(v);
  const least = withUnit(c.overBelow);
  const spare = `${Math.round(finding.margin * 100)} % to spare`;
  if (finding.status === 'over') finding.message = `${c.text.what} is ${shown}, under ${c.text.limitName} of ${least}. ${c.text.risk} ${c.text.fix} Follow the part maker's ratings.`;
  else if (finding.status === 'tight') finding.message = `${c.text.what} is ${shown}, close to ${c.text.limitName} of ${least} (${spare}). ${c.text.tightHint}`;
  else finding.message = `${c.text.what} is ${shown}, above ${c.text.limitName} of ${least} (${spare}).`;
  return finding;
}
