import { describe, expect, it } from 'vitest';
import { comparisonText, limitMoments, runLogChartConfig } from '../../src-renderer/lib/charts/run-log-chart';
import type { CurrentBand } from '../../src-renderer/lib/charts/sheet-chart-data';

const bands: CurrentBand[] = [
  { part: 'controller', label: 'Speed controller', lowA: 100, highA: 150 },
  { part: 'motor', label: 'Motor', lowA: 120, highA: 120 },
];
const samples = { timeS: [10, 10.5, 11, 11.5, 12, 12.5], currentA: [50, 130, 160, 90, 125, 60] };

describe('run log beside the model', () => {
  it('lists the stretches above each rating with times from the start of the log', () => {
    const { moments, more } = limitMoments(samples, bands);
    expect(more).toBe(0);
    // Above 100 A (continuous): 0.5–1.0 s and 2.0 s; above 120 A (motor): 0.5–1.0 s and 2.0 s; above 150 A (burst): 1.0 s.
    expect(moments.map((m) => [m.fromS, m.toS, m.limitA])).toEqual([
      [0.5, 1, 120],
      [0.5, 1, 100],
      [1, 1, 150],
      [2, 2, 120],
      [2, 2, 100],
    ]);
  });

  it('says how far the measured peak and RMS are from the model, by the plain ratio', () => {
    // 180 against 150: (180 − 150) ÷ 150 = 20 % above; 40 against 50: 20 % below.
    const text = comparisonText({ durationS: 20, peakCurrentA: 180, averageCurrentA: 35, rmsCurrentA: 40, minVoltageV: 14, maxTemperatureC: 50, usedMah: 200 }, { peakA: 150, continuousA: 50 });
    expect(text).toMatch(/^Measured peak 180\.0 A is 20 % above the model's peak 150\.0 A; measured RMS current 40\.0 A is 20 % below the model's continuous 50\.0 A\./);
    expect(text).toMatch(/judge this supply on the measured figures/);
  });

  it('draws the model’s currents and the ratings as lines across the log', () => {
    const config = runLogChartConfig(samples, { peakA: 140, continuousA: 70 }, bands);
    const labels = config.data.datasets.map((d) => d.label);
    expect(labels).toEqual(expect.arrayContaining(['Measured current (A)', 'Model peak 140 A', 'Model continuous 70 A', 'Motor rating 120 A', 'Speed controller rating 100–150 A']));
    const peak = config.data.datasets.find((d) => d.label === 'Model peak 140 A')!;
    expect(peak.data).toEqual([
      { x: 0, y: 140 },
      { x: 2.5, y: 140 },
    ]);
  });
});
