import type { Finding } from './domain';
import { describeMissing } from './field-labels';
import type { Known } from './known';
import { messageNumber, messagePercent } from './message-number';
import { marginOf, statusOf } from './status';

export interface LimitCheck {
  rule: string;
  unit: string;
  value: Known;
  limit: Known;
  tightThreshold: number;
  what: string;
  limitName: string;
  /** Said when over: what can happen, then what to do. */
  risk: string;
  fix: string;
  tightHint: string;
  source?: 'model' | 'measured';
  /** Unmeasured inputs the model took as zero. */
  assumed?: readonly string[];
  /** False when only the status is wanted (a re-check): the message stays empty. */
  messages?: boolean;
}

const ASSUMED_TEXT: Readonly<Record<string, string>> = {
  'battery.cellResistanceOhm': 'pack resistance',
  'controller.resistanceOhm': 'controller resistance',
};

/** Compare a figure with its limit: over when it passes, tight under the threshold, else clear. */
export function checkLimit(c: LimitCheck): Finding {
  // One object shape for every finding, built without spreads: this runs ten times per supply
  // in the re-check of thousands of builds.
  const finding: Finding = { rule: c.rule, status: 'incomplete', value: null, limit: null, unit: c.unit, margin: null, message: '' };
  if (c.source) finding.source = c.source;
  const assumed = c.assumed && c.assumed.length > 0 ? c.assumed : null;
  if (assumed) finding.assumed = assumed.slice();
  if (c.value.value === null || c.limit.value === null) {
    const missing: string[] = [];
    for (const list of [c.value.missing, c.limit.missing]) {
      if (list) for (const f of list) if (!missing.includes(f)) missing.push(f);
    }
    finding.value = c.value.value;
    finding.limit = c.limit.value;
    finding.missing = missing;
    finding.message = missing.length > 0 ? `Not checked yet: needs ${describeMissing(missing)}.` : `Not checked: the inputs give no usable ${c.what.toLowerCase()} or limit; check the records for impossible values.`;
    return finding;
  }
  const value = c.value.value;
  const limit = c.limit.value;
  if (!Number.isFinite(value) || !Number.isFinite(limit) || !(limit > 0)) {
    finding.value = Number.isFinite(value) ? value : null;
    finding.limit = Number.isFinite(limit) ? limit : null;
    finding.missing = [];
    finding.message = `Not checked: the inputs give no usable ${c.what.toLowerCase()} or limit; check the records for impossible values.`;
    return finding;
  }
  const status = statusOf(value, limit, c.tightThreshold);
  const margin = marginOf(value, limit);
  finding.status = status;
  finding.value = value;
  finding.limit = limit;
  finding.margin = margin;
  if (c.messages === false) return finding;
  const v = `${messageNumber(value)} ${c.unit}`;
  const l = `${messageNumber(limit)} ${c.unit}`;
  let message: string;
  if (status === 'over') {
    message = `${c.what} is ${v}, above ${c.limitName} of ${l}. ${c.risk} ${c.fix} Follow the part maker's ratings.`;
  } else if (status === 'tight') {
    message = `${c.what} is ${v}, close to ${c.limitName} of ${l} (${messagePercent(margin)} headroom). ${c.tightHint}`;
  } else {
    message = `${c.what} is ${v}, inside ${c.limitName} of ${l} (${messagePercent(margin)} headroom).`;
  }
  if (assumed) {
    let names = '';
    for (const a of assumed) names += (names ? ' and ' : '') + (ASSUMED_TEXT[a] ?? a);
    message += ` (Not measured, taken as zero: ${names}; this reads the current on the high side.)`;
  }
  if (c.source === 'measured') message += ' Uses the measured current.';
  finding.message = message;
  return finding;
}
