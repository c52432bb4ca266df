import { describe, expect, it } from 'vitest';
import type { BuildVerdict, Finding, Status } from '../../../src-main/core/domain';
import { decodeRuleStatuses, encodeRuleStatuses } from '../../../src-main/core/rule-statuses';

const finding = (rule: string, status: Status): Finding => ({ rule, status, value: null, limit: null, unit: '', margin: null, message: '' });

function verdict(...supplies: Finding[][]): BuildVerdict {
  return {
    buildId: 'b1',
    status: 'clear',
    supplies: supplies.map((findings, i) => ({ supplyId: `s${i}`, batteryIds: [], status: 'clear', figures: {} as BuildVerdict['supplies'][number]['figures'], findings, packShares: [], assumptions: [] })),
  };
}

describe('the flagged checks of a verdict as one text', () => {
  it('leaves clear checks out and sorts the rest by rule id', () => {
    const text = encodeRuleStatuses(verdict([finding('motor-heat', 'tight'), finding('controller-voltage', 'clear'), finding('battery-continuous', 'over'), finding('class-max-kv', 'incomplete')]));
    expect(text).toBe('battery-continuous=over,class-max-kv=incomplete,motor-heat=tight');
  });

  it('takes the worst status of a rule judged in several supplies, incomplete above tight', () => {
    // The ranking the overall verdict uses: over, incomplete, tight, clear (core/domain.ts STATUSES).
    const text = encodeRuleStatuses(verdict([finding('battery-burst', 'tight'), finding('wire-current', 'clear')], [finding('battery-burst', 'incomplete'), finding('wire-current', 'over')], [finding('battery-burst', 'clear')]));
    expect(text).toBe('battery-burst=incomplete,wire-current=over');
  });

  it('gives the same text whatever order the findings come in', () => {
    const a = encodeRuleStatuses(verdict([finding('b', 'over'), finding('a', 'tight')]));
    const b = encodeRuleStatuses(verdict([finding('a', 'tight')], [finding('b', 'over')]));
    expect(a).toBe(b);
    expect(encodeRuleStatuses(verdict([finding('a', 'clear')]))).toBe('');
    expect(encodeRuleStatuses(verdict())).toBe('');
  });

  it('reads back rule by rule and skips what is not a rule and a status', () => {
    expect([...decodeRuleStatuses('battery-continuous=over,class-a.b_c=tight')]).toEqual([
      ['battery-continuous', 'over'],
      ['class-a.b_c', 'tight'],
    ]);
    expect([...decodeRuleStatuses('')]).toEqual([]);
    expect([...decodeRuleStatuses('x=constructor,=over,y=tight')]).toEqual([['y', 'tight']]);
  });
});
