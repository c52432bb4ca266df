// Real SQLite stores filled with generated fleets through the real `fleet.import` handler, so the
// benchmark reads exactly what a shop's import would have written.

import path from 'node:path';
import { generateFleet } from '../../demo-fixtures/generate-fleet';
import { openServiceHost } from '../../src-main/service/open-service-host';

export interface BenchStore {
  builds: number;
  dbPath: string;
  /** The import call alone (validation, bulk write, re-check of every build, history). */
  importMs: number;
  /** Stored verdicts by status, so the filters below can be read against them. */
  statuses: Record<string, number>;
}

export const BENCH_SEED = 20261202;

export async function makeStore(folder: string, builds: number): Promise<BenchStore> {
  const dbPath = path.join(folder, `fleet-${builds}.sqlite`);
  const fleet = generateFleet({ builds, seed: BENCH_SEED });
  const host = await openServiceHost({ dbPath, actor: 'bench' });
  try {
    const started = performance.now();
    const result = await host.call('fleet.import', { fleet, mode: 'replace', reason: `benchmark: ${builds} generated builds, seed ${BENCH_SEED}` });
    const importMs = performance.now() - started;
    if (!result.ok) throw new Error(`fleet.import refused the generated fleet: ${result.error.message}`);
    const report = result.value as { ok: boolean; problems?: { place: string; message: string }[] };
    if (!report.ok)
      throw new Error(
        `fleet.import refused the generated fleet: ${(report.problems ?? [])
          .slice(0, 3)
          .map((p) => `${p.place}: ${p.message}`)
          .join('; ')}`,
      );
    const statuses: Record<string, number> = {};
    const rows = await host.ctx.db
      .selectFrom('verdicts')
      .select(['status'])
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .groupBy('status')
      .execute();
    for (const row of rows) statuses[row.status] = Number(row.n);
    return { builds, dbPath, importMs, statuses };
  } finally {
    await host.close();
  }
}
