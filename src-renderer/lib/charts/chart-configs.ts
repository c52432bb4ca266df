import { Chart, type ChartConfiguration } from 'chart.js';
import type { Finding } from '$core/domain';
import { displayUnit, toDisplay, type UnitSystem } from '$core/units';
import type { MotorChartData } from './motor-chart-data';
import { ruleName } from '../verdict/rule-names';

// Chart settings as plain data, so they can be checked without a canvas. Series differ by
// dash pattern as well as colour, so they read on a black-and-white print.

export const SERIES = {
  current: { color: '#1f4e79', dash: [] as number[] },
  power: { color: '#b35c00', dash: [6, 3] },
  torque: { color: '#3d6b2a', dash: [] as number[] },
  efficiency: { color: '#6b4c9a', dash: [2, 2] },
  mark: { color: '#b42318' },
};

const xy = (xs: readonly number[], ys: readonly number[]) => xs.map((x, i) => ({ x, y: ys[i] ?? 0 }));

function rpmAxis() {
  return { type: 'linear' as const, title: { display: true, text: 'Motor speed (rpm)' }, grid: { color: '#ebe9e3' }, min: 0 };
}

/** The operating points drawn over a motor curve, at the given heights on the given axis. */
function operatingPoints(d: MotorChartData, ys: readonly number[], yAxisID: 'y' | 'y1') {
  return {
    type: 'scatter' as const,
    label: 'Operating points',
    data: d.marks.map((m, i) => ({ x: m.rpm, y: ys[i] ?? 0 })),
    borderColor: SERIES.mark.color,
    backgroundColor: '#ffffff',
    borderWidth: 2,
    pointRadius: 6,
    pointStyle: d.marks.map((_, i) => (i === 0 ? 'rectRot' : 'triangle')),
    yAxisID,
  };
}

type Scales = NonNullable<ChartConfiguration<'line' | 'scatter'>['options']>['scales'];

/**
 * Options shared by the two motor-curve charts: a left and a right axis against rpm, and a
 * tooltip that names an operating point (dataset 2) or the series with its own precision.
 */
function motorCurveOptions(
  d: MotorChartData,
  markText: (y: number) => string,
  seriesDigits: (datasetIndex: number) => number,
  y: { title: string; max?: number },
  y1: { title: string; max?: number },
): ChartConfiguration<'line' | 'scatter'>['options'] {
  const scales: Scales = {
    x: rpmAxis(),
    y: { type: 'linear', position: 'left', min: 0, ...(y.max === undefined ? {} : { max: y.max }), title: { display: true, text: y.title }, grid: { color: '#ebe9e3' } },
    y1: { type: 'linear', position: 'right', min: 0, ...(y1.max === undefined ? {} : { max: y1.max }), title: { display: true, text: y1.title }, grid: { drawOnChartArea: false } },
  };
  return {
    responsive: true,
    maintainAspectRatio: false,
    parsing: false,
    interaction: { mode: 'nearest', intersect: false },
    plugins: {
      legend: { position: 'bottom', labels: { boxWidth: 18, boxHeight: 2 } },
      tooltip: {
        callbacks: {
          title: (items) => `${Math.round(items[0]?.parsed.x ?? 0)} rpm`,
          label: (item) => {
            const mark = item.datasetIndex === 2 ? d.marks[item.dataIndex] : undefined;
            return mark ? `${mark.label}: ${markText(item.parsed.y ?? 0)}` : `${item.dataset.label}: ${item.parsed.y?.toFixed(seriesDigits(item.datasetIndex))}`;
          },
        },
      },
    },
    scales,
  };
}

export function currentPowerConfig(d: MotorChartData): ChartConfiguration<'line' | 'scatter'> {
  return {
    type: 'line',
    data: {
      datasets: [
        { type: 'line', label: 'Current (A)', data: xy(d.curve.rpm, d.curve.currentA), borderColor: SERIES.current.color, borderDash: SERIES.current.dash, borderWidth: 2, pointRadius: 0, yAxisID: 'y' },
        { type: 'line', label: 'Shaft power (W)', data: xy(d.curve.rpm, d.curve.shaftPowerW), borderColor: SERIES.power.color, borderDash: SERIES.power.dash, borderWidth: 2, pointRadius: 0, yAxisID: 'y1' },
        operatingPoints(
          d,
          d.marks.map((m) => m.currentA),
          'y',
        ),
      ],
    },
    options: motorCurveOptions(
      d,
      (y) => `${y.toFixed(1)} A`,
      () => 1,
      { title: 'Current (A)' },
      { title: 'Shaft power (W)' },
    ),
  };
}

/** Torque in the user's units: N·m, or oz·in in imperial. */
export function torqueEfficiencyConfig(d: MotorChartData, system: UnitSystem = 'metric'): ChartConfiguration<'line' | 'scatter'> {
  const torqueUnit = displayUnit('torqueNm', system);
  const torque = d.curve.torqueNm.map((t) => toDisplay(t, 'torqueNm', system));
  const effAt = (rpm: number): number => {
    const { rpm: xs, efficiency } = d.curve;
    for (let k = 1; k < xs.length; k++) {
      if (xs[k]! >= rpm) {
        const t = (rpm - xs[k - 1]!) / (xs[k]! - xs[k - 1]! || 1);
        return 100 * (efficiency[k - 1]! + t * (efficiency[k]! - efficiency[k - 1]!));
      }
    }
    return 100 * (efficiency[efficiency.length - 1] ?? 0);
  };
  return {
    type: 'line',
    data: {
      datasets: [
        { type: 'line', label: `Torque (${torqueUnit})`, data: xy(d.curve.rpm, torque), borderColor: SERIES.torque.color, borderDash: SERIES.torque.dash, borderWidth: 2, pointRadius: 0, yAxisID: 'y' },
        {
          type: 'line',
          label: 'Efficiency (%)',
          data: xy(
            d.curve.rpm,
            d.curve.efficiency.map((e) => Math.max(0, e * 100)),
          ),
          borderColor: SERIES.efficiency.color,
          borderDash: SERIES.efficiency.dash,
          borderWidth: 2,
          pointRadius: 0,
          yAxisID: 'y1',
        },
        operatingPoints(
          d,
          d.marks.map((m) => effAt(m.rpm)),
          'y1',
        ),
      ],
    },
    options: motorCurveOptions(
      d,
      (y) => `${y.toFixed(0)} %`,
      (i) => (i === 0 ? (system === 'metric' ? 3 : 1) : 0),
      { title: `Torque (${torqueUnit})` },
      { title: 'Efficiency (%)', max: 100 },
    ),
  };
}

/** The current findings that have both a value and a limit, for the bar chart. */
export function currentBars(findings: readonly Finding[]): { labels: string[]; values: number[]; limits: number[] } {
  const rows = findings.filter((f) => f.unit === 'A' && f.value !== null && f.limit !== null);
  return { labels: rows.map((f) => ruleName(f.rule)), values: rows.map((f) => f.value ?? 0), limits: rows.map((f) => f.limit ?? 0) };
}

export function currentLimitsConfig(findings: readonly Finding[]): ChartConfiguration<'bar'> {
  const bars = currentBars(findings);
  const over = bars.values.map((v, i) => v > (bars.limits[i] ?? Infinity));
  return {
    type: 'bar',
    data: {
      labels: bars.labels,
      datasets: [
        {
          label: 'Current (A)',
          data: bars.values,
          backgroundColor: over.map((o) => (o ? '#b42318' : '#1f4e79')),
          borderColor: over.map((o) => (o ? '#7a1710' : '#173c5e')),
          borderWidth: 1,
          barPercentage: 0.9,
          categoryPercentage: 0.7,
        },
        { label: 'Limit (A)', data: bars.limits, backgroundColor: '#ffffff', borderColor: '#4a5563', borderWidth: 1.5, barPercentage: 0.9, categoryPercentage: 0.7 },
      ],
    },
    options: {
      indexAxis: 'y',
      responsive: true,
      maintainAspectRatio: false,
      plugins: {
        legend: {
          position: 'bottom',
          // The current bars are red where over; the legend keys them by the usual blue.
          labels: {
            boxWidth: 14,
            generateLabels: (chart) => Chart.defaults.plugins.legend.labels.generateLabels(chart).map((l, i) => (i === 0 ? { ...l, fillStyle: '#1f4e79', strokeStyle: '#173c5e' } : l)),
          },
        },
      },
      scales: {
        x: { min: 0, title: { display: true, text: 'Current (A); controller and motor rows are per motor' }, grid: { color: '#ebe9e3' } },
        y: { grid: { display: false } },
      },
    },
  };
}
