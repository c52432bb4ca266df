import { describe, expect, it } from 'vitest';
import { overLimitMoments, summarize, thin, type LogSamples } from '../../../src-main/core/run-log';
import { guessColumns, readNumber, readRows, splitHeader, startReading, finishedSamples, type ColumnUse } from '../../../src-main/core/run-log-csv';

/** A generated run: 0.1 s steps, a current that ramps and holds, a sagging voltage, a warming controller. */
function generated(): LogSamples {
  const timeS: number[] = [];
  const currentA: number[] = [];
  const voltageV: number[] = [];
  const temperatureC: number[] = [];
  for (let k = 0; k <= 200; k++) {
    timeS.push(k / 10);
    currentA.push(k < 50 ? k * 2 : 100 - (k % 7));
    voltageV.push(16.8 - 0.01 * k);
    temperatureC.push(25 + k / 20);
  }
  return { timeS, currentA, voltageV, temperatureC };
}

describe('run log summary', () => {
  it('matches a direct computation with plain sums (even 0.1 s steps: trapezoid = step × (sum − half the ends))', () => {
    const s = generated();
    const got = summarize(s);
    const i = s.currentA!;
    const h = 0.1;
    const n = i.length;
    // Plain sums, written out again here rather than taken from the code under test.
    let sum = 0;
    let sumSq = 0;
    for (const x of i) {
      sum += x;
      sumSq += x * x;
    }
    const first = i[0]!;
    const last = i[n - 1]!;
    const charge = h * (sum - (first + last) / 2);
    const chargeSq = h * (sumSq - (first * first + last * last) / 2);
    const duration = h * (n - 1);
    expect(got.durationS).toBeCloseTo(duration, 9);
    expect(got.averageCurrentA).toBeCloseTo(charge / duration, 9);
    expect(got.rmsCurrentA).toBeCloseTo(Math.sqrt(chargeSq / duration), 9);
    // 1 mAh = 3.6 A·s (1 A·h = 3600 A·s).
    expect(got.usedMah).toBeCloseTo(charge / 3.6, 9);
    expect(got.peakCurrentA).toBe(Math.max(...i));
    expect(got.minVoltageV).toBe(Math.min(...s.voltageV!));
    expect(got.maxTemperatureC).toBe(Math.max(...s.temperatureC!));
  });

  it('matches a hand calculation, spreadsheet style', () => {
    // t = 0, 1, 3 s; i = 10, 20, 20 A. Trapezoids: (10+20)/2·1 = 15 A·s, (20+20)/2·2 = 40 A·s; total 55 A·s over 3 s.
    // Average 55/3 = 18.333 A; used 55/3.6 = 15.278 mAh.
    // i²: (100+400)/2·1 = 250, (400+400)/2·2 = 800; total 1050 A²·s; RMS √(1050/3) = √350 = 18.708 A.
    const got = summarize({ timeS: [0, 1, 3], currentA: [10, 20, 20], voltageV: [12.4, 11.9, 12.0] });
    expect(got.averageCurrentA).toBeCloseTo(18.3333, 4);
    expect(got.usedMah).toBeCloseTo(15.2778, 4);
    expect(got.rmsCurrentA).toBeCloseTo(18.7083, 4);
    expect(got.peakCurrentA).toBe(20);
    expect(got.minVoltageV).toBe(11.9);
    expect(got.durationS).toBe(3);
  });

  it('RMS of a square wave equals its peak (definition of RMS)', () => {
    const timeS: number[] = [];
    const currentA: number[] = [];
    for (let k = 0; k <= 400; k++) {
      timeS.push(k * 0.01);
      currentA.push(Math.floor(k / 20) % 2 === 0 ? 60 : -60);
    }
    expect(summarize({ timeS, currentA }).rmsCurrentA).toBeCloseTo(60, 9);
  });

  it('RMS of a sine equals its peak ÷ √2 (definition of RMS), over whole periods', () => {
    const timeS: number[] = [];
    const currentA: number[] = [];
    const perPeriod = 64;
    for (let k = 0; k <= perPeriod * 10; k++) {
      timeS.push(k / perPeriod);
      currentA.push(80 * Math.sin((2 * Math.PI * k) / perPeriod));
    }
    expect(summarize({ timeS, currentA }).rmsCurrentA).toBeCloseTo(80 / Math.SQRT2, 6);
  });

  it('thinning keeps the peak current and the lowest voltage of a long log', () => {
    const n = 50_000;
    const timeS = Array.from({ length: n }, (_, k) => k / 100);
    const currentA = Array.from({ length: n }, (_, k) => (k === 31_337 ? 250 : 40 + (k % 10)));
    const voltageV = Array.from({ length: n }, (_, k) => (k === 12_345 ? 10.1 : 15));
    const kept = thin({ timeS, currentA, voltageV });
    expect(kept.timeS.length).toBeLessThan(5000);
    expect(Math.max(...kept.currentA!)).toBe(250);
    expect(Math.min(...kept.voltageV!)).toBe(10.1);
    expect(kept.timeS.at(-1)).toBe(timeS.at(-1));
  });

  it('lists the stretches above a limit with their times', () => {
    expect(overLimitMoments([10, 11, 12, 13, 14, 15], [50, 130, 140, 90, 125, 60], 120)).toEqual([
      { fromS: 1, toS: 2, peak: 140 },
      { fromS: 4, toS: 4, peak: 125 },
    ]);
  });
});

describe('reading a log file', () => {
  it('recognises several header spellings and their units', () => {
    expect(splitHeader('Current (A)')).toEqual({ name: 'current', unitText: 'A' });
    expect(splitHeader('time_ms')).toEqual({ name: 'time', unitText: 'ms' });
    expect(splitHeader('Voltage [mV]')).toEqual({ name: 'voltage', unitText: 'mV' });
    const g = guessColumns(['Time (s)', 'Volts', 'Amps', 'RPM', 'Temp (°F)', 'Throttle', 'GPS']);
    expect(g.map((c) => [c.quantity, c.unit])).toEqual([
      ['time', 's'],
      ['voltage', 'V'],
      ['current', 'A'],
      ['rpm', 'rpm'],
      ['temperature', '°F'],
      ['throttle', '%'],
      [null, null],
    ]);
  });

  it('says what is wrong with a column whose unit it does not read, or that has none', () => {
    const g = guessColumns(['Time', 'Current (kA)']);
    expect(g[0]!.problem).toMatch(/no unit/);
    expect(g[1]!.problem).toMatch(/"kA" is not one Rigbook reads/);
  });

  it('converts units on the way in (°F to °C exact per NIST SP 811; ms to s)', () => {
    const uses: ColumnUse[] = [
      { column: 0, quantity: 'time', unit: 'ms' },
      { column: 1, quantity: 'temperature', unit: '°F' },
    ];
    const state = startReading();
    readRows(state, ['t,temp', '0,32', '500,212'], 1, 3, uses, ['t', 'temp'], ',');
    expect(state.problems).toEqual([]);
    expect(finishedSamples(state, uses)).toEqual({ timeS: [0, 0.5], temperatureC: [0, 100] });
  });

  it('reports bad rows by line: text in a number, an empty cell, time going backwards', () => {
    const uses: ColumnUse[] = [
      { column: 0, quantity: 'time', unit: 's' },
      { column: 1, quantity: 'current', unit: 'A' },
    ];
    const lines = ['time,current', '0,10', '1,abc', '2,', '1.5,12', '3,13'];
    const state = startReading();
    readRows(state, lines, 1, lines.length, uses, ['time', 'current'], ',');
    expect(state.problems).toEqual([
      { line: 3, message: '"current" holds "abc", not a number' },
      { line: 4, message: '"current" is empty' },
      { line: 5, message: 'time goes backwards (1.5 s after 2 s)' },
    ]);
  });

  it('reads a decimal comma in semicolon files only', () => {
    expect(readNumber('3,7', true)).toBe(3.7);
    expect(readNumber('3,7', false)).toBeNull();
    expect(readNumber('1e3', false)).toBe(1000);
    expect(readNumber('12 A', false)).toBeNull();
  });
});
