import { describe, expect, it } from 'vitest';
import type { BuildVerdict, Finding, Status } from '../../src-main/core/domain';
import { newlyOver, overToIncomplete, shiftOf } from '../../src-renderer/lib/verdict/verdict-shift';

const f = (rule: string, status: Status, value: number | null, limit: number | null, missing?: string[]): Finding => ({
  rule,
  status,
  value,
  limit,
  unit: 'V',
  margin: value !== null && limit !== null ? (limit - value) / limit : null,
  message: `${rule} ${status}`,
  ...(missing ? { missing } : {}),
});
const verdict = (buildId: string, status: Status, findings: Finding[]): BuildVerdict => ({
  buildId,
  status,
  supplies: [{ supplyId: `${buildId}.s1`, batteryIds: ['p'], status, figures: {} as BuildVerdict['supplies'][number]['figures'], findings, packShares: [], assumptions: [] }],
});

describe('what a change does to verdicts', () => {
  it('names the builds a change makes OVER, with the checks that pass their limits', () => {
    // 4S LiPo at full charge: 4 × 4.20 V = 16.8 V (cell makers' specification sheets) against a 2S controller's 8.4 V.
    const before = [verdict('a', 'clear', [f('controller-voltage', 'clear', 16.8, 25.2)]), verdict('b', 'clear', [])];
    const after = [verdict('a', 'over', [f('controller-voltage', 'over', 16.8, 8.4)]), verdict('b', 'clear', [])];
    expect(newlyOver({ before, after })).toEqual([{ buildId: 'a', from: 'clear', checks: [{ supply: 1, rule: 'controller-voltage', value: 16.8, limit: 8.4, unit: 'V', message: 'controller-voltage over' }] }]);
  });

  it('leaves out a build that stays over for the same reasons, but not one over in a new check', () => {
    const before = [verdict('a', 'over', [f('motor-voltage', 'over', 30, 26), f('controller-voltage', 'clear', 16, 25)])];
    const same = [verdict('a', 'over', [f('motor-voltage', 'over', 31, 26), f('controller-voltage', 'clear', 16, 25)])];
    expect(newlyOver({ before, after: same })).toEqual([]);
    const worse = [verdict('a', 'over', [f('motor-voltage', 'over', 30, 26), f('controller-voltage', 'over', 30, 25)])];
    expect(newlyOver({ before, after: worse }).map((w) => w.checks.map((c) => c.rule))).toEqual([['controller-voltage']]);
  });

  it('treats a build the change creates as coming from nothing', () => {
    expect(newlyOver({ before: [], after: [verdict('n', 'over', [f('motor-voltage', 'over', 30, 26)])] })[0]?.from).toBeNull();
  });

  it('says which over checks can no longer be made after a change to Incomplete, and what they lack', () => {
    const before = verdict('a', 'over', [f('controller-voltage', 'over', 16.8, 8.4)]);
    const after = verdict('a', 'incomplete', [f('controller-voltage', 'incomplete', 16.8, null, ['controller.maxVoltageV'])]);
    expect(overToIncomplete(before, after)).toEqual([{ supply: 1, rule: 'controller-voltage', missing: ['the controller maximum voltage (or maximum cell count)'] }]);
    expect(overToIncomplete(verdict('a', 'tight', []), after)).toEqual([]);
  });

  it('never reads a move to Incomplete as better', () => {
    expect(shiftOf('over', 'incomplete')).toBe('unknown');
    expect(shiftOf('over', 'tight')).toBe('better');
    expect(shiftOf('clear', 'over')).toBe('worse');
    expect(shiftOf('tight', 'tight')).toBe('same');
  });
});
