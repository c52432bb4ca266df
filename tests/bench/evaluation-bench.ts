// The mean evaluation over every build of a generated fleet. One context evaluated again and
// again lets the JIT specialise on a single shape and keep it all in cache; thousands of
// different builds (ground and air, one or two supplies, packs with figures missing) do not.

import type { BuildContext } from '../../src-main/core/domain';
import { evaluateBuild } from '../../src-main/core/evaluate';
import { loadBuildContexts } from '../../src-main/service/recheck';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { readSettings } from '../../src-main/store/repositories/settings';
import { median, settle } from './stats';

export interface VariedEvaluation {
  builds: number;
  /** Median over runs of the mean µs a build, without the findings' sentences (what a re-check does). */
  statusOnlyUs: number;
  statusOnlyWorstUs: number;
  /** The same with the sentences (what a build sheet or a preview does). */
  withMessagesUs: number;
  withMessagesWorstUs: number;
  loadMs: number;
}

let sink = 0;

function meanUs(contexts: readonly BuildContext[], messages: boolean): number {
  const started = process.hrtime.bigint();
  for (const ctx of contexts) sink += evaluateBuild(ctx, { messages }).supplies.length;
  return Number(process.hrtime.bigint() - started) / 1000 / contexts.length;
}

export async function benchVariedEvaluation(dbPath: string, runs: number): Promise<VariedEvaluation> {
  const host = await openServiceHost({ dbPath, actor: 'bench' });
  try {
    const started = performance.now();
    const settings = await readSettings(host.ctx.db);
    const contexts = await loadBuildContexts(host.ctx.db, { by: 'all' }, settings.tightThreshold);
    const loadMs = performance.now() - started;
    // One untimed pass of each so both are measured warm, as a long-running shell would be.
    meanUs(contexts, false);
    meanUs(contexts, true);
    const statusOnly: number[] = [];
    const withMessages: number[] = [];
    for (let r = 0; r < runs; r++) {
      // Alternated so a burst of load on the shared machine hits both alike.
      statusOnly.push(meanUs(contexts, false));
      withMessages.push(meanUs(contexts, true));
      await settle();
    }
    if (sink === 0.5) console.log(sink); // keeps the results observable
    return {
      builds: contexts.length,
      statusOnlyUs: median(statusOnly),
      statusOnlyWorstUs: Math.max(...statusOnly),
      withMessagesUs: median(withMessages),
      withMessagesWorstUs: Math.max(...withMessages),
      loadMs,
    };
  } finally {
    await host.close();
  }
}
