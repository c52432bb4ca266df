import { describe, expect, it } from 'vitest';
import type { BuildVerdict, Finding } from '../../src-main/core/domain';
import { decodeSupplyStatuses, encodeSupplyStatuses, sameVerdictRow, verdictToRow } from '../../src-main/store/repositories/verdicts';

const finding = (rule: string, value: number, limit: number): Finding => ({
  rule,
  status: 'clear',
  value,
  limit,
  unit: 'A',
  margin: (limit - value) / limit,
  message: '',
});

describe('the list row of a stored verdict', () => {
  it('pairs the tightest current check with its own limit, never a per-motor limit with the supply current', () => {
    const verdict = {
      buildId: 'b1',
      status: 'tight',
      supplies: [
        {
          supplyId: 's1',
          batteryIds: ['p1'],
          status: 'tight',
          figures: { packVoltageFullV: 25.2, theoreticalSpeedKmh: null, peakCurrentA: 112 },
          // A quad: 112 A from the pack, 28 A through each of four controllers rated 40 A.
          findings: [finding('battery-burst', 112, 200), finding('controller-burst', 28, 40)],
        },
      ],
    } as unknown as BuildVerdict;
    const row = verdictToRow(verdict, 'now');
    expect([row.peakCurrentA, row.peakCurrentLimitA]).toEqual([28, 40]);
    expect(row.supplyVoltageFullV).toBe(25.2);
  });

  it('keeps supply statuses through the compact encoding, even with odd ids', () => {
    const supplies = [
      { supplyId: 'sup-1', status: 'over' },
      { supplyId: 'a=b', status: 'clear' },
    ] as BuildVerdict['supplies'];
    expect([...decodeSupplyStatuses(encodeSupplyStatuses(supplies))]).toEqual([
      ['sup-1', 'over'],
      ['a=b', 'clear'],
    ]);
  });

  it('counts a change in which checks are flagged as a change of the row, with the same status and figures', () => {
    const base = {
      buildId: 'b1',
      status: 'over',
      supplies: [{ supplyId: 's1', batteryIds: ['p1'], status: 'over', figures: { packVoltageFullV: 16.8, theoreticalSpeedKmh: null, peakCurrentA: null }, findings: [{ ...finding('battery-burst', 130, 100), status: 'over' }] }],
    } as unknown as BuildVerdict;
    const moved = { ...base, supplies: [{ ...base.supplies[0]!, findings: [{ ...finding('motor-current', 130, 100), status: 'over' }] }] } as BuildVerdict;
    const row = verdictToRow(base, 'then');
    const next = verdictToRow(moved, 'now');
    expect(row.ruleStatuses).toBe('battery-burst=over');
    expect(next.ruleStatuses).toBe('motor-current=over');
    const { buildId: _b, evaluatedAt: _e, ...columns } = row;
    expect(sameVerdictRow({ status: 'over', supplies: new Map(), row: columns }, row)).toBe(true);
    expect(sameVerdictRow({ status: 'over', supplies: new Map(), row: columns }, { ...next, peakCurrentA: row.peakCurrentA, peakCurrentLimitA: row.peakCurrentLimitA, currentRule: row.currentRule })).toBe(false);
  });
});
