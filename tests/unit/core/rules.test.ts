import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DEFAULT_TIGHT_THRESHOLD, STATUSES, type Status } from '../../../src-main/core/domain';
import { known, lacking } from '../../../src-main/core/known';
import { checkLimit, type LimitCheck } from '../../../src-main/core/rule-check';
import { BUILT_IN_RULE_IDS } from '../../../src-main/core/catalogue/rules';
import { compareStatus, marginOf, worstStatus } from '../../../src-main/core/status';
import { tightThresholdFor } from '../../../src-main/core/threshold';
import { classRule } from './fixtures';

const base = (value: number | null, limit: number | null, threshold = 0.15): LimitCheck => ({
  rule: 'motor-current',
  unit: 'A',
  value: value === null ? lacking('motor.resistanceOhm') : known(value),
  limit: limit === null ? lacking('motor.maxCurrentA') : known(limit),
  tightThreshold: threshold,
  what: 'Peak motor current',
  limitName: "the motor's rated current",
  risk: 'The windings overheat.',
  fix: 'Gear down.',
  tightHint: 'Little headroom.',
});

describe('rule catalogue', () => {
  it('carries exactly the ids of the design brief and of issue 14', () => {
    expect([...BUILT_IN_RULE_IDS].sort()).toEqual(
      [
        'controller-voltage',
        'motor-voltage',
        'motor-speed',
        'battery-continuous',
        'battery-burst',
        'controller-continuous',
        'controller-burst',
        'motor-current',
        'motor-power',
        'prop-tip-speed',
        'motor-heat',
        'controller-erpm',
        'thrust-to-weight',
        'wire-current',
        'connector-current',
        'controller-min-voltage',
        'bec-current',
      ].sort(),
    );
  });
});

describe('limit checks', () => {
  it('margin is (limit − value) ÷ limit', () => {
    const f = checkLimit(base(90, 120));
    expect(f.margin).toBeCloseTo(0.25, 12);
    expect(f.status).toBe('clear');
  });

  it('reads tight under the threshold, over past the limit', () => {
    expect(checkLimit(base(110, 120)).status).toBe('tight');
    expect(checkLimit(base(120, 120)).status).toBe('tight');
    expect(checkLimit(base(121, 120)).status).toBe('over');
    expect(checkLimit(base(110, 120, 0.05)).status).toBe('clear');
  });

  it('over findings say what can happen and defer to the maker', () => {
    const f = checkLimit(base(150, 120));
    expect(f.message).toContain('The windings overheat.');
    expect(f.message).toContain("Follow the part maker's ratings.");
    expect(f.message).toContain('150 A');
  });

  it('incomplete findings name every missing input and carry no margin', () => {
    const f = checkLimit(base(null, null));
    expect(f.status).toBe('incomplete');
    expect(f.margin).toBeNull();
    expect(f.missing).toEqual(['motor.resistanceOhm', 'motor.maxCurrentA']);
    // Paths stay in `missing`; the sentence carries only words a user reads.
    expect(f.message).not.toContain('motor.resistanceOhm');
    expect(f.message).not.toMatch(/\(\w+\.\w+\)/u);
    expect(f.message).toContain('winding resistance');
    expect(f.message).toContain('rated current');
  });

  it('status is over exactly when the margin is negative (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e12, noNaN: true }), fc.double({ min: Number.MIN_VALUE, max: 1e12, noNaN: true }), fc.double({ min: 0, max: 0.99, noNaN: true }), (value, limit, threshold) => {
        const f = checkLimit(base(value, limit, threshold));
        expect(f.margin).not.toBeNull();
        expect(f.status === 'over').toBe((f.margin ?? 0) < 0);
        expect(f.status === 'over').toBe(value > limit);
        expect(Number.isFinite(f.margin)).toBe(true);
      }),
    );
    expect(marginOf(1, 5e-324)).toBeLessThan(0);
  });
});

describe('status order', () => {
  it('the worst of a set is over, then incomplete, then tight, then clear', () => {
    expect(worstStatus([])).toBe('clear');
    expect(worstStatus(['clear', 'incomplete'])).toBe('incomplete');
    // A check that cannot be made is worse news than a known small margin.
    expect(worstStatus(['incomplete', 'tight', 'clear'])).toBe('incomplete');
    expect(worstStatus(['tight', 'over', 'incomplete'])).toBe('over');
    const sorted = [...STATUSES].reverse().sort(compareStatus);
    expect(sorted).toEqual<Status[]>(['over', 'incomplete', 'tight', 'clear']);
  });
});

describe('tight threshold', () => {
  it("takes the build's, else the class's, else the default", () => {
    const classRules = [classRule({ tightThreshold: 0.2 }), classRule({ tightThreshold: 0.25 })];
    expect(tightThresholdFor(0.3, classRules, 0.15)).toBe(0.3);
    expect(tightThresholdFor(null, classRules, 0.15)).toBe(0.25);
    expect(tightThresholdFor(null, [], 0.1)).toBe(0.1);
    expect(tightThresholdFor(Number.NaN, [], Number.NaN)).toBe(DEFAULT_TIGHT_THRESHOLD);
  });
});
