import { describe, expect, it } from 'vitest';
import { runBandsConfig } from '../../src-renderer/lib/charts/sheet-chart-configs';
import { countByStatus, sortSummaries } from '../../src-renderer/lib/builds/build-filter';
import type { BuildSummary } from '../../src-renderer/lib/builds/build-summary';
import { figureGroupsFor } from '../../src-renderer/lib/figures/figure-groups';
import { STATUS_ORDER } from '../../src-renderer/lib/verdict/status-words';
import { runTrace } from '../../src-main/core/run-trace';
import { evaluateBuild } from '../../src-main/core/evaluate';
import { truckContext } from '../unit/core/fixtures';

const row = (id: string, status: BuildSummary['status']): BuildSummary => ({ id, name: id, status }) as BuildSummary;

describe('the builds list ranks incomplete above tight', () => {
  it('sorts over, incomplete, tight, clear and keeps the counts per verdict', () => {
    const rows = [row('t', 'tight'), row('c', 'clear'), row('i', 'incomplete'), row('o', 'over')];
    expect(sortSummaries(rows, 'status', 1).map((r) => r.id)).toEqual(['o', 'i', 't', 'c']);
    expect(STATUS_ORDER).toEqual(['over', 'incomplete', 'tight', 'clear']);
    expect(countByStatus([...rows, row('t2', 'tight')])).toEqual({ over: 1, incomplete: 1, tight: 2, clear: 1 });
  });
});

describe('the build sheet figures', () => {
  it('a propeller build shows pitch speed and both tip speeds, never a tyre speed', () => {
    const keys = figureGroupsFor('plane').flatMap((g) => g.figures.map((f) => f.key));
    expect(keys).toEqual(expect.arrayContaining(['pitchSpeedKmh', 'tipSpeedStaticMps', 'tipSpeedMps']));
    expect(keys).not.toContain('theoreticalSpeedKmh');
    expect(
      figureGroupsFor('plane')
        .flatMap((g) => g.figures)
        .find((f) => f.key === 'pitchSpeedKmh')?.label,
    ).toBe('Pitch speed, nominal');
  });

  it('charts the same run the continuous current is judged on', () => {
    const ctx = truckContext();
    const trace = runTrace(ctx, 'supply-a');
    expect(trace).not.toBeNull();
    const figures = evaluateBuild(ctx).supplies[0]!.figures;
    expect(trace!.rmsCurrentA).toBeCloseTo(figures.runRmsCurrentA as number, 9);
    const config = runBandsConfig(trace!, [], 'imperial');
    const [current, speed] = config.data.datasets;
    expect(current!.data).toHaveLength(trace!.timeS.length);
    // Speed shown in mph on an imperial sheet: km/h ÷ 1.609344 (NIST SP 811, mile = 1609.344 m).
    const last = speed!.data.at(-1) as { x: number; y: number };
    expect(last.y).toBeCloseTo(trace!.speedKmh.at(-1)! / 1.609344, 9);
    expect(speed!.label).toBe('Speed (mph)');
  });
});
