import { describe, expect, it } from 'vitest';
import { motorChartData, rpmAtCurrent } from '../../src-renderer/lib/charts/motor-chart-data';
import { currentBars } from '../../src-renderer/lib/charts/chart-configs';
import { motorCurve } from '../../src-main/core/motor-curve';
import type { Figures, Motor } from '../../src-main/core/domain';

// First-order DC motor model (M. Drela, "First-Order DC Electric Motor Model", MIT 2007):
// I = (V − ω/Kv)/R with Kv in rad/s per volt, so the speed at a current is ω = (V − I·R)·Kv,
// or in rpm: rpm = (V − I·R) × Kv[rpm/V].

describe('motor chart data', () => {
  it('finds the speed at a current on the curve where the first-order model puts it', () => {
    const curve = motorCurve({ kv: 1000, resistanceOhm: 0.1, noLoadCurrentA: 1, voltageV: 10, points: 200 });
    // (10 V − 50 A × 0.1 Ω) × 1000 rpm/V = 5000 rpm.
    expect(rpmAtCurrent(curve, 50)!).toBeCloseTo(5000, 0);
    // (10 − 20 × 0.1) × 1000 = 8000 rpm.
    expect(rpmAtCurrent(curve, 20)!).toBeCloseTo(8000, 0);
    expect(rpmAtCurrent(curve, 10_000)).toBeNull();
  });

  const motor = {
    id: 'm',
    version: 1,
    archivedAt: null,
    notes: '',
    name: 'M',
    kv: 1000,
    resistanceOhm: 0.1,
    noLoadCurrentA: 1,
    maxCurrentA: null,
    maxPowerW: null,
    maxVoltageV: null,
    maxRpm: null,
    poles: null,
    massKg: null,
  } satisfies Motor;
  const figures = { packVoltageFullV: 10, packResistanceOhm: null, motorPeakCurrentA: 50, motorContinuousCurrentA: 20, loadedRpm: 8000 } as unknown as Figures;

  it('marks the peak and the loaded top-speed points at the supply voltage', () => {
    const d = motorChartData(motor, null, figures, 1)!;
    expect(d.voltageV).toBe(10);
    expect(d.marks.map((m) => m.label)).toEqual(['Peak', 'Loaded top speed']);
    expect(d.marks[0]!.rpm).toBeCloseTo(5000, 0);
    expect(d.marks[1]!.rpm).toBe(8000);
  });

  it('adds the controller and the pack share to the loop resistance', () => {
    // Loop R = 0.1 + 0.05 (controller) + 2 × 0.025 (pack, two motors) = 0.2 Ω: stall current 10 V ÷ 0.2 Ω = 50 A.
    const controller = { id: 'c', version: 1, archivedAt: null, notes: '', name: 'C', maxVoltageV: null, maxCells: null, continuousCurrentA: null, burstCurrentA: null, resistanceOhm: 0.05, massKg: null };
    const d = motorChartData(motor, controller, { ...figures, packResistanceOhm: 0.025 } as Figures, 2)!;
    expect(d.curve.currentA[0]).toBeCloseTo(50, 9);
  });

  it('gives no chart where the motor lacks what the model needs', () => {
    expect(motorChartData({ ...motor, resistanceOhm: null }, null, figures, 1)).toBeNull();
    expect(motorChartData(null, null, figures, 1)).toBeNull();
  });

  it('draws a bar for each current finding with a value and a limit', () => {
    const bars = currentBars([
      { rule: 'battery-burst', status: 'clear', value: 90, limit: 500, unit: 'A', margin: 0.82, message: '' },
      { rule: 'motor-current', status: 'incomplete', value: 90, limit: null, unit: 'A', margin: null, message: '' },
      { rule: 'motor-voltage', status: 'clear', value: 16.8, limit: 26, unit: 'V', margin: 0.35, message: '' },
    ]);
    expect(bars).toEqual({ labels: ['Pack burst current'], values: [90], limits: [500] });
  });
});
