// The builds list's current column: one current against one limit, and words saying which
// current (peak or continuous), whose rating the limit is, and where the current came from.
import { MISSING, fixed } from '../format/number';
import { ruleName } from '../verdict/rule-names';
import type { BuildSummary } from './build-summary';

type CurrentRow = Pick<BuildSummary, 'peakCurrentA' | 'peakCurrentLimitA' | 'currentRule' | 'currentSource' | 'status'>;

interface RuleBasis {
  /** Which current the check judges. */
  basis: 'peak' | 'continuous' | null;
  /** Whose rating the limit is, in a word for the cell. */
  whose: string;
  /** The whole sentence for the tooltip. */
  long: string;
}

const BUILT_IN: Readonly<Record<string, RuleBasis>> = {
  'battery-continuous': { basis: 'continuous', whose: 'pack', long: "one pack's share of the continuous current against its continuous rating (C × capacity)" },
  'battery-burst': { basis: 'peak', whose: 'pack', long: "one pack's share of the peak current against its burst rating (C × capacity)" },
  'controller-continuous': { basis: 'continuous', whose: 'controller', long: "the continuous current against the speed controller's continuous rating" },
  'controller-burst': { basis: 'peak', whose: 'controller', long: "the peak current against the speed controller's burst rating" },
  'motor-current': { basis: 'peak', whose: 'motor', long: "the peak current through one motor against the motor's rated current" },
  'wire-current': { basis: 'continuous', whose: 'leads', long: "one pack's share of the continuous current against what its lead gauge carries in chassis wiring" },
  'connector-current': { basis: 'continuous', whose: 'connector', long: "one pack's share of the continuous current against its connector's rating" },
};

export function ruleBasis(rule: string | null): RuleBasis {
  if (rule === null) return { basis: 'peak', whose: 'no limit', long: 'the peak current; no current check could be made' };
  const known = BUILT_IN[rule];
  if (known) return known;
  // A class rule names its own figure; its name says which current it limits.
  const name = ruleName(rule);
  const lower = name.toLowerCase();
  const basis = lower.includes('continuous') ? 'continuous' : lower.includes('peak') || lower.includes('burst') ? 'peak' : null;
  return { basis, whose: 'class', long: `the current a class rule limits (${name}) against that class limit` };
}

export interface CurrentCell {
  /** "96 A / 120 A", or the current alone when no limit was checked. */
  figures: string;
  /** "peak · controller", "cont. · pack", with "measured" where the current was logged. */
  tag: string;
  /** The full sentence, for the tooltip and for screen readers. */
  title: string;
  /** How the current stands against its limit; said in a word as well as a colour. */
  level: 'past' | 'near' | '';
}

/** Share of the limit above which a current reads "near" when the build is tight or over (common practice: the 15 % default threshold). */
const NEAR_SHARE = 0.85;

export function currentLevel(row: CurrentRow): CurrentCell['level'] {
  const { peakCurrentA: value, peakCurrentLimitA: limit, status } = row;
  if (value === null || limit === null || limit <= 0) return '';
  // The pair is one check's own value and limit, so passing the limit is that check over.
  if (value > limit) return 'past';
  // Near only where the build's verdict agrees: the build's own threshold may differ from the default.
  return value / limit > NEAR_SHARE && (status === 'tight' || status === 'over') ? 'near' : '';
}

const LEVEL_WORD: Readonly<Record<CurrentCell['level'], string>> = { past: 'past its limit', near: 'near its limit', '': '' };

export function currentCell(row: CurrentRow): CurrentCell {
  const { peakCurrentA: value, peakCurrentLimitA: limit } = row;
  if (value === null) return { figures: MISSING, tag: '', title: 'No current: the model lacks an input', level: '' };
  const b = ruleBasis(row.currentRule);
  const measured = row.currentSource === 'measured';
  const basisWord = b.basis === 'continuous' ? 'cont.' : b.basis === 'peak' ? 'peak' : 'current';
  const tag = [basisWord, b.whose, measured ? 'measured' : ''].filter((x) => x !== '').join(' · ');
  const level = currentLevel(row);
  const figures = limit === null ? `${fixed(value, 0)} A` : `${fixed(value, 0)} A / ${fixed(limit, 0)} A`;
  const source = measured ? 'as measured' : 'from the model at full charge';
  const title = `${figures}: ${b.long}, ${source}${level ? `; ${LEVEL_WORD[level]}` : ''}`;
  return { figures, tag, title, level };
}

export const CURRENT_LEVEL_WORD: Readonly<Record<Exclude<CurrentCell['level'], ''>, string>> = { past: 'past', near: 'near' };
