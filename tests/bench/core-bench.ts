// Micro-benchmark of the computation core: one build evaluation and one motor operating
// point. Budgets (docs/performance.md): evaluation under 20 µs, operating point under 2 µs. Speed goals
// live here, never in timed unit tests.

import { pathToFileURL } from 'node:url';
import { evaluateBuild } from '../../src-main/core/evaluate';
import type { Battery, BuildContext } from '../../src-main/core/domain';
import { emptyOperatingPoint, motorParams, operatingPointAt } from '../../src-main/core/motor';
import { staticPropPoint } from '../../src-main/core/propeller';

export interface BenchResult {
  name: string;
  medianUs: number;
}

const meta = { version: 1, archivedAt: null, notes: '' };

function sampleContext(): BuildContext {
  const pack: Battery = {
    ...meta,
    id: 'p1',
    name: 'bench 4S',
    chemistry: 'lipo',
    cellsSeries: 4,
    cellsParallel: 1,
    capacityMah: 5000,
    cRatingContinuous: 50,
    cRatingBurst: 100,
    cellResistanceOhm: 0.003,
    massKg: 0.5,
    cycleCount: 10,
    retired: false,
  };
  return {
    build: {
      ...meta,
      id: 'bench',
      name: 'bench',
      vehicleId: 'v',
      motorId: 'm',
      motorCount: 1,
      controllerId: 'c',
      propellerId: null,
      gearing: { pinionTeeth: 15, spurTeeth: 46, internalRatio: 2.6, tireDiameterMm: 115, drivetrainEfficiency: 0.85 },
      supplies: [{ id: 's1', arrangement: 'series', batteryIds: ['p1'] }],
      measuredPeakCurrentA: null,
      measuredAverageCurrentA: null,
      tightThreshold: null,
    },
    vehicle: { ...meta, id: 'v', name: 'bench', kind: 'truck', massKg: 3.2, dragAreaM2: 0.03, rollingCoefficient: 0.03, tractionCoefficient: 0.9, customerId: null, className: 'bench' },
    motor: { ...meta, id: 'm', name: 'bench', kv: 2200, resistanceOhm: 0.011, noLoadCurrentA: 2.5, maxCurrentA: 120, maxPowerW: 1800, maxVoltageV: 18, maxRpm: 50000, poles: 4, massKg: 0.3 },
    controller: { ...meta, id: 'c', name: 'bench', maxVoltageV: null, maxCells: 6, continuousCurrentA: 120, burstCurrentA: 760, resistanceOhm: 0.001, massKg: 0.1 },
    propeller: null,
    batteries: new Map([['p1', pack]]),
    classRules: [{ ...meta, id: 'r1', className: 'bench', ruleId: 'class-speed', figure: 'theoreticalSpeedKmh', limit: 100, unit: 'km/h' }],
    defaultTightThreshold: 0.15,
  };
}

let sink = 0;

/** Median over `runs` of the mean time per call across `iterations` calls, in µs. */
function measure(runs: number, iterations: number, body: (i: number) => number): number {
  for (let i = 0; i < iterations; i++) sink += body(i); // warm-up for the JIT
  const perCall: number[] = [];
  for (let r = 0; r < runs; r++) {
    const start = process.hrtime.bigint();
    for (let i = 0; i < iterations; i++) sink += body(i);
    perCall.push(Number(process.hrtime.bigint() - start) / 1000 / iterations);
  }
  perCall.sort((a, b) => a - b);
  return perCall[Math.floor(perCall.length / 2)] ?? NaN;
}

export async function benchCore(): Promise<BenchResult[]> {
  const ctx = sampleContext();
  const m = motorParams(2200, 0.011 + 0.012 + 0.001, 2.5);
  const op = emptyOperatingPoint();
  const prop = { diameterM: 0.127, thrustCoefficient: 0.11, powerCoefficient: 0.045, densityKgM3: 1.225 };
  const results: BenchResult[] = [
    { name: 'evaluateBuild (truck, one supply, one class rule)', medianUs: measure(9, 20_000, () => evaluateBuild(ctx).supplies.length) },
    { name: 'motor operating point (Drela model)', medianUs: measure(9, 1_000_000, (i) => operatingPointAt(m, 16.8, 1000 + (i & 1023), op).currentA) },
    { name: 'static propeller operating point (solve)', medianUs: measure(9, 50_000, () => staticPropPoint(m, 16.8, prop).currentA) },
  ];
  if (sink === 0.123456789) console.log(sink); // keep results observable so nothing is optimised away
  return results;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  for (const r of await benchCore()) console.log(`${r.name}: ${r.medianUs.toFixed(3)} µs`);
}
