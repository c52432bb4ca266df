// The full-throttle run of one supply of a car or truck as a series for the build sheet's
// chart: the same run the continuous current is judged on.

import { buildInputs } from './build-inputs';
import type { BuildContext } from './domain';
import { groundRunModel } from './ground-operating-point';
import { fullThrottleRun } from './run';
import { supplyModel } from './supply';
import { mpsToKmh } from './units';

export interface RunTrace {
  runLengthS: number;
  /** True where the build sets no run length and the default is used. */
  defaultLength: boolean;
  timeS: number[];
  speedKmh: number[];
  /** Supply current (all motors), A. */
  currentA: number[];
  rmsCurrentA: number;
  averageCurrentA: number;
}

export function runTrace(ctx: BuildContext, supplyId: string): RunTrace | null {
  const supply = ctx.build.supplies.find((s) => s.id === supplyId);
  if (!supply) return null;
  const inp = buildInputs(ctx);
  const model = groundRunModel(inp, supplyModel(supply, ctx.batteries));
  if (!model) return null;
  const run = fullThrottleRun(model, inp.runLengthS, true);
  const n = model.d.motorCount;
  return {
    runLengthS: inp.runLengthS,
    defaultLength: inp.runLengthDefault,
    timeS: run.timeS,
    speedKmh: run.speedMps.map(mpsToKmh),
    currentA: run.currentA.map((a) => a * n),
    rmsCurrentA: run.rmsCurrentA * n,
    averageCurrentA: run.averageCurrentA * n,
  };
}
