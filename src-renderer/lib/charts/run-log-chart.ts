import type { ChartConfiguration, ChartDataset } from 'chart.js';
import { overLimitMoments, type LogSamples, type OverLimitMoment, type RunLogSummary } from '$core/run-log';
import { SERIES } from './chart-configs';
import { bandDatasets, currentAxisMax } from './sheet-chart-configs';
import type { CurrentBand } from './sheet-chart-data';
import { fixed } from '../format/number';

// A run log beside the model: the measured current, voltage and rpm against time, with the
// model's peak and continuous currents and the ratings drawn as lines, and what the two say
// about each other in a sentence. Plain data, so it can be checked without a canvas.

type LineSet = ChartDataset<'line' | 'scatter', { x: number; y: number }[]>;

/** The model's supply currents for the log's supply, before any measured figure replaced them. */
export interface ModelCurrents {
  peakA: number | null;
  continuousA: number | null;
}

const xy = (xs: readonly number[], ys: readonly number[], t0: number) => xs.map((x, i) => ({ x: x - t0, y: ys[i] ?? 0 }));

const MODEL_STYLE = { peak: { color: '#b42318', dash: [12, 4] }, continuous: { color: '#b42318', dash: [3, 3] } };

export function runLogChartConfig(samples: LogSamples, model: ModelCurrents, bands: readonly CurrentBand[]): ChartConfiguration<'line' | 'scatter'> {
  const t0 = samples.timeS[0] ?? 0;
  const x1 = (samples.timeS.at(-1) ?? 0) - t0;
  const datasets: LineSet[] = [];
  const peak = samples.currentA ? Math.max(0, ...samples.currentA) : 0;
  if (samples.currentA) datasets.push({ type: 'line', label: 'Measured current (A)', data: xy(samples.timeS, samples.currentA, t0), borderColor: SERIES.current.color, borderWidth: 1.5, pointRadius: 0, yAxisID: 'y' });
  const flat = (label: string, y: number, style: { color: string; dash: number[] }): LineSet => ({
    type: 'line',
    label,
    data: [
      { x: 0, y },
      { x: x1, y },
    ],
    borderColor: style.color,
    borderDash: style.dash,
    borderWidth: 2,
    pointRadius: 0,
    yAxisID: 'y',
  });
  if (model.peakA !== null) datasets.push(flat(`Model peak ${fixed(model.peakA, 0)} A`, model.peakA, MODEL_STYLE.peak));
  if (model.continuousA !== null) datasets.push(flat(`Model continuous ${fixed(model.continuousA, 0)} A`, model.continuousA, MODEL_STYLE.continuous));
  datasets.push(...bandDatasets(bands, 0, x1));
  if (samples.voltageV)
    datasets.push({ type: 'line', label: 'Measured voltage (V)', data: xy(samples.timeS, samples.voltageV, t0), borderColor: SERIES.power.color, borderDash: SERIES.power.dash, borderWidth: 1.5, pointRadius: 0, yAxisID: 'y1' });
  if (samples.rpm) datasets.push({ type: 'line', label: 'Measured motor speed (rpm)', data: xy(samples.timeS, samples.rpm, t0), borderColor: SERIES.torque.color, borderDash: [1, 2], borderWidth: 1.5, pointRadius: 0, yAxisID: 'y2' });
  const top = currentAxisMax(Math.max(peak, model.peakA ?? 0), bands);
  return {
    type: 'line',
    data: { datasets },
    options: {
      responsive: true,
      maintainAspectRatio: false,
      parsing: false,
      normalized: true,
      scales: {
        x: { type: 'linear', title: { display: true, text: 'Time from the start of the log (s)' }, min: 0, max: x1, grid: { color: '#ebe9e3' } },
        y: { type: 'linear', position: 'left', title: { display: true, text: 'Current (A)' }, min: 0, max: top, grid: { color: '#ebe9e3' } },
        y1: { type: 'linear', position: 'right', display: samples.voltageV !== undefined, title: { display: true, text: 'Voltage (V)' }, grid: { display: false } },
        y2: { type: 'linear', position: 'right', display: samples.rpm !== undefined, title: { display: true, text: 'Motor speed (rpm)' }, grid: { display: false }, min: 0 },
      },
      plugins: { legend: { position: 'bottom', labels: { boxWidth: 18, boxHeight: 2, filter: (item: { text: string }) => item.text !== '' } } },
    },
  };
}

function versus(what: string, measured: number | null, modelled: number | null, modelWord: string): string | null {
  if (measured === null || modelled === null || !(modelled > 0)) return null;
  const diff = (measured - modelled) / modelled;
  const how = Math.abs(diff) < 0.005 ? 'the same as' : `${fixed(Math.abs(diff) * 100, 0)} % ${diff > 0 ? 'above' : 'below'}`;
  return `${what} ${fixed(measured, 1)} A is ${how} the model's ${modelWord} ${fixed(modelled, 1)} A`;
}

/**
 * How far the log and the model differ, in a short paragraph. The log's RMS current is set
 * against the model's continuous current (both stand for what heats the parts over a run).
 */
export function comparisonText(summary: RunLogSummary, model: ModelCurrents): string {
  const parts = [versus('Measured peak', summary.peakCurrentA, model.peakA, 'peak'), versus('measured RMS current', summary.rmsCurrentA, model.continuousA, 'continuous')].filter((x): x is string => x !== null);
  if (parts.length === 0) return 'The log has no current, or the model has no current to compare it with (see the missing inputs above).';
  const first = parts.join('; ');
  const higher = (summary.peakCurrentA ?? 0) > (model.peakA ?? Infinity) || (summary.rmsCurrentA ?? 0) > (model.continuousA ?? Infinity);
  const advice = higher ? ' The run drew more than the model predicts: judge this supply on the measured figures.' : ' The model reads on the high side here, as it is meant to; the verdict stays on the safe side either way.';
  return `${first.charAt(0).toUpperCase()}${first.slice(1)}.${advice}`;
}

export interface LimitMoment extends OverLimitMoment {
  /** "Controller burst rating 180 A". */
  limitLabel: string;
  limitA: number;
}

/** Moments the measured current was above each rating (burst and continuous), in time order, at most `max`. */
export function limitMoments(samples: LogSamples, bands: readonly CurrentBand[], max = 20): { moments: LimitMoment[]; more: number } {
  const i = samples.currentA;
  if (!i) return { moments: [], more: 0 };
  const out: LimitMoment[] = [];
  for (const b of bands) {
    const limits =
      b.lowA === b.highA
        ? [{ a: b.highA, word: 'rating' }]
        : [
            { a: b.highA, word: 'burst rating' },
            { a: b.lowA, word: 'continuous rating' },
          ];
    for (const l of limits) for (const m of overLimitMoments(samples.timeS, i, l.a)) out.push({ ...m, limitA: l.a, limitLabel: `${b.label} ${l.word} ${fixed(l.a, 0)} A` });
  }
  out.sort((a, b) => a.fromS - b.fromS || b.limitA - a.limitA);
  return { moments: out.slice(0, max), more: Math.max(0, out.length - max) };
}
