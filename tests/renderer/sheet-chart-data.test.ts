import { describe, expect, it } from 'vitest';
import { currentBands, forceChartData, groundModelOf, propChartData, propModelOf } from '../../src-renderer/lib/charts/sheet-chart-data';
import { bandDatasets, niceCeil, runBandsConfig } from '../../src-renderer/lib/charts/sheet-chart-configs';
import { runTrace } from '../../src-main/core/run-trace';
import { battery, finding, quadContext, supplyOf, truckContext } from '../unit/core/fixtures';

describe('sheet chart data', () => {
  it('the current bands of a one-pack truck are the ratings the checks used', () => {
    const ctx = truckContext();
    const v = supplyOf(ctx);
    const bands = currentBands(v, 1);
    // Pack: 50 C × 5 Ah = 250 A continuous, 100 C × 5 Ah = 500 A burst (rating = C × capacity, common practice).
    expect(bands.find((b) => b.part === 'pack')).toMatchObject({ lowA: 250, highA: 500 });
    expect(finding(v, 'battery-continuous').limit).toBe(250);
    // Controller: 150 A continuous, 800 A burst; motor: rated 120 A (fixture ratings).
    expect(bands.find((b) => b.part === 'controller')).toMatchObject({ lowA: 150, highA: 800 });
    expect(bands.find((b) => b.part === 'motor')).toMatchObject({ lowA: 120, highA: 120 });
  });

  it('two packs in parallel: the pack band is the supply current at which the worse pack reaches its rating', () => {
    const a = battery({ id: 'a', cellResistanceOhm: 0.003 });
    const b = battery({ id: 'b', cellResistanceOhm: 0.006 });
    const base = truckContext();
    const ctx = truckContext({
      batteries: new Map([
        [a.id, a],
        [b.id, b],
      ]),
      build: { ...base.build, supplies: [{ id: 'supply-a', arrangement: 'parallel', batteryIds: ['a', 'b'] }] },
    });
    const v = supplyOf(ctx);
    // By conductance the lower-resistance pack carries 2/3 of the current: 250 A ÷ (2/3) = 375 A of supply current.
    const worst = Math.max(...v.packShares.map((p) => p.share));
    expect(worst).toBeCloseTo(2 / 3, 6);
    expect(currentBands(v, 1).find((x) => x.part === 'pack')!.lowA).toBeCloseTo(375, 6);
  });

  it('per motor on a quad: controller and motor ratings as rated, the pack divided by the motor count', () => {
    const ctx = quadContext();
    const v = supplyOf(ctx);
    const bands = currentBands(v, 4, true);
    expect(bands.find((b) => b.part === 'controller')).toMatchObject({ lowA: 45, highA: 55 });
    expect(bands.find((b) => b.part === 'motor')).toMatchObject({ lowA: 40, highA: 40 });
    // 250 A ÷ 4 motors = 62.5 A.
    expect(bands.find((b) => b.part === 'pack')!.lowA).toBeCloseTo(62.5, 9);
    // For the whole supply the per-motor ratings are times four: 4 × 45 A = 180 A.
    expect(currentBands(v, 4).find((b) => b.part === 'controller')!.lowA).toBe(180);
  });

  it('the drawn band lines sit at the ratings', () => {
    const ctx = truckContext();
    const v = supplyOf(ctx);
    const bands = currentBands(v, 1);
    const sets = bandDatasets(bands, 0, 4);
    const ys = sets.map((s) => s.data[0]!.y);
    expect(ys).toEqual([250, 500, 150, 800, 120]);
    const config = runBandsConfig(runTrace(ctx, 'supply-a')!, bands, 'metric');
    // The run's own current and speed, then the bands.
    expect(config.data.datasets.length).toBe(2 + sets.length);
  });

  it('marks the loaded top speed and the launch where the figures put them', () => {
    const ctx = truckContext();
    const v = supplyOf(ctx);
    const d = forceChartData(groundModelOf(ctx, 'supply-a')!)!;
    const top = d.marks[1]!;
    // At the loaded top speed drive force equals road load, and the supply current is the steady figure.
    expect(top.currentA).toBeCloseTo(v.figures.steadyCurrentA as number, 6);
    // Launch: the peak current figure (traction-limited, or the stall current).
    expect(d.marks[0]!.currentA).toBeCloseTo(v.figures.motorPeakCurrentA as number, 6);
    // Traction limit μ·m·g: 0.9 × 3.2 kg × 9.80665 m/s² = 28.24 N (g from CGPM) on all four wheels.
    expect(d.tractionN).toBeCloseTo(0.9 * 3.2 * 9.80665, 6);
    expect(d.driveN[0]).toBeLessThanOrEqual(d.tractionN! + 1e-9);
  });

  it('a propeller build marks its static and unloaded points at the figures', () => {
    const ctx = quadContext();
    const v = supplyOf(ctx);
    const pm = propModelOf(ctx, 'supply-a')!;
    const d = propChartData(pm.m, pm.fullV, pm.load, pm.motorCount);
    expect(d.marks[0]!.propellerRpm).toBeCloseTo(v.figures.propellerRpmStatic as number, 3);
    expect(d.marks[0]!.currentA).toBeCloseTo(v.figures.motorPeakCurrentA as number, 6);
    expect(d.marks[0]!.thrustN!).toBeCloseTo(v.figures.thrustN!, 6);
    expect(d.marks[1]!.propellerRpm).toBeCloseTo(v.figures.propellerRpmUnloaded as number, 3);
    expect(d.marks[1]!.tipSpeedMps).toBeCloseTo(v.figures.tipSpeedMps!, 6);
    // Full throttle is the last throttle step: the curve ends at the static point.
    expect(d.throttle[d.throttle.length - 1]).toBeCloseTo(1, 12);
    expect(d.currentA[d.currentA.length - 1]).toBeCloseTo(d.marks[0]!.currentA, 9);
  });

  it('axis ends are round numbers at or above the data', () => {
    expect(niceCeil(41158.3)).toBe(50000);
    expect(niceCeil(318.2)).toBe(500);
    expect(niceCeil(161)).toBe(200);
    expect(niceCeil(37.4)).toBe(50);
    expect(niceCeil(25)).toBe(25);
    expect(niceCeil(75.07)).toBe(100);
  });
});
