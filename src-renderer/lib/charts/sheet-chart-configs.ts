import type { ChartConfiguration, ChartDataset } from 'chart.js';
import type { RunTrace } from '$core/run-trace';
import { displayUnit, toDisplay, type UnitSystem } from '$core/units';
import { SERIES } from './chart-configs';
import type { CurrentBand, ForceChartData, LimitPart, PropChartData } from './sheet-chart-data';
import { fixed } from '../format/number';

// The sheet's charts as chart.js settings. Ratings are drawn as bands (continuous up to burst)
// with a dash pattern of their own per part, so they read on a black-and-white print too.

type LineSet = ChartDataset<'line' | 'scatter', { x: number; y: number }[]>;

const BAND_STYLE: Readonly<Record<LimitPart, { color: string; fill: string; dash: number[] }>> = {
  pack: { color: '#8a5a00', fill: 'rgba(138, 90, 0, 0.12)', dash: [8, 4] },
  controller: { color: '#5b3f8c', fill: 'rgba(91, 63, 140, 0.12)', dash: [2, 3] },
  motor: { color: '#0f6b5c', fill: 'rgba(15, 107, 92, 0.12)', dash: [10, 3, 2, 3] },
};

const GRID = { color: '#ebe9e3' };
const xy = (xs: readonly number[], ys: readonly number[]) => xs.map((x, i) => ({ x, y: ys[i] ?? 0 }));

/** "Pack rating 250–500 A" or "Motor rating 140 A". */
export function bandLabel(b: CurrentBand): string {
  return b.lowA === b.highA ? `${b.label} rating ${fixed(b.lowA, 0)} A` : `${b.label} rating ${fixed(b.lowA, 0)}–${fixed(b.highA, 0)} A`;
}

/** Two flat lines per band across the x range, the upper filled down to the lower. */
export function bandDatasets(bands: readonly CurrentBand[], x0: number, x1: number, yAxisID = 'y'): LineSet[] {
  const out: LineSet[] = [];
  for (const b of bands) {
    const s = BAND_STYLE[b.part];
    const line = (y: number) => [
      { x: x0, y },
      { x: x1, y },
    ];
    if (b.lowA !== b.highA) {
      // Unlabelled: the legend shows the band once, under its upper line.
      out.push({ type: 'line', label: '', data: line(b.lowA), borderColor: s.color, borderDash: s.dash, borderWidth: 1.5, pointRadius: 0, fill: false, yAxisID });
    }
    out.push({ type: 'line', label: bandLabel(b), data: line(b.highA), borderColor: s.color, borderDash: s.dash, borderWidth: 1.5, pointRadius: 0, fill: b.lowA !== b.highA ? '-1' : false, backgroundColor: s.fill, yAxisID });
  }
  return out;
}

/** The next round axis end at or above a value: 1, 2, 2.5 or 5 times a power of ten. */
export function niceCeil(value: number): number {
  if (!(value > 0) || !Number.isFinite(value)) return 1;
  const power = 10 ** Math.floor(Math.log10(value));
  for (const step of [1, 2, 2.5, 5, 10]) if (step * power >= value * (1 - 1e-12)) return step * power;
  return 10 * power;
}

/** The top of a current axis: room above the highest current, and the lowest rating in view. */
export function currentAxisMax(peakA: number, bands: readonly CurrentBand[]): number {
  const lowest = bands.length > 0 ? Math.min(...bands.map((b) => b.lowA)) : 0;
  return niceCeil(Math.max(peakA * 1.25, lowest * 1.15, 1));
}

const legend = { position: 'bottom' as const, labels: { boxWidth: 18, boxHeight: 2, filter: (item: { text: string }) => item.text !== '' } };

function marks(label: string, points: { x: number; y: number }[], yAxisID: string): LineSet {
  return { type: 'scatter', label, data: points, borderColor: SERIES.mark.color, backgroundColor: '#ffffff', borderWidth: 2, pointRadius: 6, pointStyle: points.map((_, i) => (i === 0 ? 'rectRot' : 'triangle')), yAxisID };
}

/** Supply current and speed over the full-throttle run, with the pack, controller and motor ratings as bands. */
export function runBandsConfig(run: RunTrace, bands: readonly CurrentBand[], units: UnitSystem): ChartConfiguration<'line' | 'scatter'> {
  const speedUnit = displayUnit('speedKmh', units);
  const peak = Math.max(0, ...run.currentA);
  return {
    type: 'line',
    data: {
      datasets: [
        { type: 'line', label: 'Supply current (A)', data: xy(run.timeS, run.currentA), borderColor: SERIES.current.color, borderDash: SERIES.current.dash, borderWidth: 2.5, pointRadius: 0, yAxisID: 'y' },
        {
          type: 'line',
          label: `Speed (${speedUnit})`,
          data: xy(
            run.timeS,
            run.speedKmh.map((v) => toDisplay(v, 'speedKmh', units)),
          ),
          borderColor: SERIES.power.color,
          borderDash: SERIES.power.dash,
          borderWidth: 2,
          pointRadius: 0,
          yAxisID: 'y1',
        },
        ...bandDatasets(bands, 0, run.runLengthS),
      ],
    },
    options: {
      responsive: true,
      maintainAspectRatio: false,
      parsing: false,
      interaction: { mode: 'nearest', intersect: false },
      plugins: { legend, tooltip: { callbacks: { title: (items) => `${(items[0]?.parsed.x ?? 0).toFixed(2)} s` } } },
      scales: {
        x: { type: 'linear', min: 0, max: run.runLengthS, title: { display: true, text: 'Time from standstill (s)' }, grid: GRID },
        y: { type: 'linear', position: 'left', min: 0, max: currentAxisMax(peak, bands), title: { display: true, text: 'Supply current (A)' }, grid: GRID },
        y1: { type: 'linear', position: 'right', min: 0, title: { display: true, text: `Speed (${speedUnit})` }, grid: { drawOnChartArea: false } },
      },
    },
  };
}

/** Drive force at the wheels and road load against road speed, with the traction limit and the launch and top-speed points. */
export function forceConfig(d: ForceChartData, units: UnitSystem): ChartConfiguration<'line' | 'scatter'> {
  const speedUnit = displayUnit('speedKmh', units);
  const forceUnit = displayUnit('forceN', units);
  const sx = d.speedKmh.map((v) => toDisplay(v, 'speedKmh', units));
  const f = (n: number) => toDisplay(n, 'forceN', units);
  const x1 = niceCeil(sx[sx.length - 1] ?? 0);
  const datasets: LineSet[] = [
    { type: 'line', label: `Drive force at the wheels (${forceUnit})`, data: xy(sx, d.driveN.map(f)), borderColor: SERIES.current.color, borderWidth: 2.5, pointRadius: 0 },
    { type: 'line', label: `Road load (${forceUnit})`, data: xy(sx, d.roadN.map(f)), borderColor: SERIES.power.color, borderDash: SERIES.power.dash, borderWidth: 2, pointRadius: 0 },
  ];
  if (d.tractionN !== null) {
    datasets.push({
      type: 'line',
      label: `Traction limit ${fixed(f(d.tractionN), 1)} ${forceUnit}`,
      data: [
        { x: 0, y: f(d.tractionN) },
        { x: x1, y: f(d.tractionN) },
      ],
      borderColor: '#4a5563',
      borderDash: [2, 3],
      borderWidth: 1.5,
      pointRadius: 0,
    });
  }
  datasets.push(
    marks(
      'Launch ◆, loaded top speed ▲',
      d.marks.map((m) => ({ x: toDisplay(m.speedKmh, 'speedKmh', units), y: f(m.forceN) })),
      'y',
    ),
  );
  return {
    type: 'line',
    data: { datasets },
    options: {
      responsive: true,
      maintainAspectRatio: false,
      parsing: false,
      interaction: { mode: 'nearest', intersect: false },
      plugins: { legend, tooltip: { callbacks: { title: (items) => `${(items[0]?.parsed.x ?? 0).toFixed(1)} ${speedUnit}` } } },
      scales: {
        x: { type: 'linear', min: 0, max: x1, title: { display: true, text: `Road speed (${speedUnit}), full charge` }, grid: GRID },
        y: { type: 'linear', min: 0, title: { display: true, text: `Force (${forceUnit})` }, grid: GRID },
      },
    },
  };
}

/** One motor's current and the thrust of all motors against propeller rpm, with the current ratings per motor as bands. */
export function propCurrentConfig(d: PropChartData, bands: readonly CurrentBand[], units: UnitSystem): ChartConfiguration<'line' | 'scatter'> {
  const forceUnit = displayUnit('forceN', units);
  const x1 = niceCeil(Math.max(...d.propellerRpm, ...d.marks.map((m) => m.propellerRpm)));
  const datasets: LineSet[] = [{ type: 'line', label: 'Current per motor (A)', data: xy(d.propellerRpm, d.currentA), borderColor: SERIES.current.color, borderWidth: 2.5, pointRadius: 0, yAxisID: 'y' }];
  if (d.thrustN.every((t) => t !== null)) {
    datasets.push({
      type: 'line',
      label: `Thrust, all motors (${forceUnit})`,
      data: xy(
        d.propellerRpm,
        d.thrustN.map((t) => toDisplay(t ?? 0, 'forceN', units)),
      ),
      borderColor: SERIES.power.color,
      borderDash: SERIES.power.dash,
      borderWidth: 2,
      pointRadius: 0,
      yAxisID: 'y1',
    });
  }
  datasets.push(...bandDatasets(bands, 0, x1));
  datasets.push(
    marks(
      'Static full throttle ◆, unloaded ▲',
      d.marks.map((m) => ({ x: m.propellerRpm, y: m.currentA })),
      'y',
    ),
  );
  return {
    type: 'line',
    data: { datasets },
    options: {
      responsive: true,
      maintainAspectRatio: false,
      parsing: false,
      interaction: { mode: 'nearest', intersect: false },
      plugins: { legend, tooltip: { callbacks: { title: (items) => `${Math.round(items[0]?.parsed.x ?? 0)} rpm` } } },
      scales: {
        x: { type: 'linear', min: 0, max: x1, title: { display: true, text: 'Propeller speed (rpm), static, throttle 10–100 %, full charge' }, grid: GRID },
        y: { type: 'linear', position: 'left', min: 0, max: currentAxisMax(Math.max(...d.currentA), bands), title: { display: true, text: 'Current per motor (A)' }, grid: GRID },
        y1: { type: 'linear', position: 'right', min: 0, title: { display: true, text: `Thrust (${forceUnit})` }, grid: { drawOnChartArea: false } },
      },
    },
  };
}

/** Tip speed against propeller rpm up to the unloaded speed, with the limit it is judged on. */
export function tipSpeedConfig(d: PropChartData, limitMps: number | null, units: UnitSystem): ChartConfiguration<'line' | 'scatter'> {
  const unit = displayUnit('speedMps', units);
  const s = (v: number) => toDisplay(v, 'speedMps', units);
  const unloaded = d.marks[1];
  const xEnd = unloaded?.propellerRpm ?? Math.max(...d.propellerRpm);
  const x1 = niceCeil(xEnd);
  const datasets: LineSet[] = [
    // Tip speed rises in proportion to rpm: a straight line from standstill to the unloaded speed.
    {
      type: 'line',
      label: `Tip speed (${unit})`,
      data: [
        { x: 0, y: 0 },
        { x: xEnd, y: s(unloaded?.tipSpeedMps ?? 0) },
      ],
      borderColor: SERIES.current.color,
      borderWidth: 2.5,
      pointRadius: 0,
    },
  ];
  if (limitMps !== null) {
    datasets.push({
      type: 'line',
      label: `Tip speed limit ${fixed(s(limitMps), 0)} ${unit}`,
      data: [
        { x: 0, y: s(limitMps) },
        { x: x1, y: s(limitMps) },
      ],
      borderColor: '#b42318',
      borderDash: [8, 4],
      borderWidth: 1.5,
      pointRadius: 0,
    });
  }
  datasets.push(
    marks(
      'Static full throttle ◆, unloaded ▲',
      d.marks.map((m) => ({ x: m.propellerRpm, y: s(m.tipSpeedMps) })),
      'y',
    ),
  );
  return {
    type: 'line',
    data: { datasets },
    options: {
      responsive: true,
      maintainAspectRatio: false,
      parsing: false,
      interaction: { mode: 'nearest', intersect: false },
      plugins: { legend, tooltip: { callbacks: { title: (items) => `${Math.round(items[0]?.parsed.x ?? 0)} rpm` } } },
      scales: {
        x: { type: 'linear', min: 0, max: x1, title: { display: true, text: 'Propeller speed (rpm), full charge' }, grid: GRID },
        y: { type: 'linear', min: 0, max: niceCeil(Math.max(s(unloaded?.tipSpeedMps ?? 0), s(limitMps ?? 0)) * 1.1), title: { display: true, text: `Tip speed (${unit})` }, grid: GRID },
      },
    },
  };
}
