// A telemetry log of one run, as columns of samples in SI-like units (s, V, A, rpm, °C, %),
// and what is read from it: the summary figures, a thinned copy for keeping, and the moments
// a figure passed a limit. Pure.

export const LOG_QUANTITIES = ['time', 'voltage', 'current', 'rpm', 'temperature', 'throttle'] as const;
export type LogQuantity = (typeof LOG_QUANTITIES)[number];

/** The samples, column by column; time is always there, the others where the log had them. */
export interface LogSamples {
  timeS: number[];
  voltageV?: number[];
  currentA?: number[];
  rpm?: number[];
  temperatureC?: number[];
  throttlePct?: number[];
}

export const SAMPLE_KEYS: Readonly<Record<LogQuantity, keyof LogSamples>> = {
  time: 'timeS',
  voltage: 'voltageV',
  current: 'currentA',
  rpm: 'rpm',
  temperature: 'temperatureC',
  throttle: 'throttlePct',
};

/** What a log says about its run; null where the log has no column for it. All are measured figures, not the model's. */
export interface RunLogSummary {
  durationS: number | null;
  /** Highest current sample. */
  peakCurrentA: number | null;
  /** Time-weighted mean current (trapezoid rule), over the whole log. */
  averageCurrentA: number | null;
  /** Root mean square current: √(∫i² dt ÷ duration), trapezoid rule; what heats wires and packs. */
  rmsCurrentA: number | null;
  /** Lowest voltage sample (under load). */
  minVoltageV: number | null;
  maxTemperatureC: number | null;
  /** Charge drawn, ∫i dt, in mAh (1 mAh = 3.6 A·s). */
  usedMah: number | null;
}

/**
 * The summary. Averages are integrals over time by the trapezoid rule, so unevenly spaced
 * samples weigh by the time they cover; the integral of i² gives the RMS, the integral of i the
 * charge. A log shorter than two samples, or of no duration, has no averages.
 */
export function summarize(s: LogSamples): RunLogSummary {
  const t = s.timeS;
  const n = t.length;
  const duration = n >= 2 ? (t[n - 1] ?? 0) - (t[0] ?? 0) : null;
  const out: RunLogSummary = { durationS: duration, peakCurrentA: null, averageCurrentA: null, rmsCurrentA: null, minVoltageV: null, maxTemperatureC: null, usedMah: null };
  const i = s.currentA;
  if (i && i.length === n && n > 0) {
    let peak = -Infinity;
    for (const x of i) if (x > peak) peak = x;
    out.peakCurrentA = peak;
    if (duration !== null && duration > 0) {
      let q = 0;
      let q2 = 0;
      for (let k = 1; k < n; k++) {
        const dt = (t[k] ?? 0) - (t[k - 1] ?? 0);
        const a = i[k - 1] ?? 0;
        const b = i[k] ?? 0;
        q += ((a + b) / 2) * dt;
        q2 += ((a * a + b * b) / 2) * dt;
      }
      out.averageCurrentA = q / duration;
      out.rmsCurrentA = Math.sqrt(q2 / duration);
      out.usedMah = q / 3.6;
    }
  }
  if (s.voltageV && s.voltageV.length > 0) {
    let lo = Infinity;
    for (const x of s.voltageV) if (x < lo) lo = x;
    out.minVoltageV = lo;
  }
  if (s.temperatureC && s.temperatureC.length > 0) {
    let hi = -Infinity;
    for (const x of s.temperatureC) if (x > hi) hi = x;
    out.maxTemperatureC = hi;
  }
  return out;
}

/** Logs up to this many samples are kept whole; longer ones are thinned to about this many. */
export const KEPT_SAMPLES = 4000;

/**
 * A thinned copy for keeping and drawing: the samples fall into buckets, and each bucket keeps
 * its first sample, its highest current and its lowest voltage, so no peak or dip is lost
 * (the over-limit moments read from the kept samples are those of the whole log). The summary
 * is computed from the whole log before thinning.
 */
export function thin(s: LogSamples, target = KEPT_SAMPLES): LogSamples {
  const n = s.timeS.length;
  if (n <= target) return s;
  const buckets = Math.max(1, Math.floor(target / 3));
  const size = Math.ceil(n / buckets);
  const keep: number[] = [];
  for (let start = 0; start < n; start += size) {
    const end = Math.min(n, start + size);
    const picks = new Set<number>([start]);
    if (s.currentA) {
      let best = start;
      for (let k = start; k < end; k++) if ((s.currentA[k] ?? -Infinity) > (s.currentA[best] ?? -Infinity)) best = k;
      picks.add(best);
    }
    if (s.voltageV) {
      let best = start;
      for (let k = start; k < end; k++) if ((s.voltageV[k] ?? Infinity) < (s.voltageV[best] ?? Infinity)) best = k;
      picks.add(best);
    }
    for (const k of [...picks].sort((a, b) => a - b)) keep.push(k);
  }
  if (keep.at(-1) !== n - 1) keep.push(n - 1);
  const pick = (col: number[] | undefined): number[] | undefined => (col ? keep.map((k) => col[k] ?? 0) : undefined);
  const out: LogSamples = { timeS: keep.map((k) => s.timeS[k] ?? 0) };
  for (const key of ['voltageV', 'currentA', 'rpm', 'temperatureC', 'throttlePct'] as const) {
    const col = pick(s[key]);
    if (col) out[key] = col;
  }
  return out;
}

/** A stretch of the log where a figure was above a limit. */
export interface OverLimitMoment {
  /** When it first passed the limit and when it came back, seconds from the start of the log. */
  fromS: number;
  toS: number;
  /** The highest value inside the stretch. */
  peak: number;
}

/** Stretches where `values` were above `limit`, with times counted from the log's first sample. */
export function overLimitMoments(timeS: readonly number[], values: readonly number[], limit: number): OverLimitMoment[] {
  const out: OverLimitMoment[] = [];
  const t0 = timeS[0] ?? 0;
  let open: OverLimitMoment | null = null;
  for (let k = 0; k < values.length; k++) {
    const x = values[k] ?? 0;
    const t = (timeS[k] ?? 0) - t0;
    if (x > limit) {
      if (open === null) open = { fromS: t, toS: t, peak: x };
      else {
        open.toS = t;
        if (x > open.peak) open.peak = x;
      }
    } else if (open !== null) {
      out.push(open);
      open = null;
    }
  }
  if (open !== null) out.push(open);
  return out;
}
