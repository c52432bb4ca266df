// The quick way to fill a store with a generated fleet, for the benchmark and for trying the
// app with thousands of builds: the ordinary import (replace), which writes in bulk and
// re-checks every build in the same transaction.

import { openServiceHost } from '../src-main/service/open-service-host';
import { importFleet, type ImportReport } from '../src-main/service/fleet/import-fleet';
import { generateFleet, type GenerateOptions } from './generate-fleet';

export async function loadGeneratedFleet(dbPath: string, options: GenerateOptions): Promise<{ report: ImportReport; milliseconds: number }> {
  const fleet = generateFleet(options);
  const host = await openServiceHost({ dbPath, actor: 'generator' });
  try {
    const started = performance.now();
    const report = await importFleet(host.ctx, fleet, { mode: 'replace', source: 'generator', reason: `generated: ${options.builds} builds, seed ${options.seed}` });
    if (!report.ok) throw new Error(`the generated fleet was refused: ${report.problems.slice(0, 3).map((p) => `${p.place}: ${p.message}`).join('; ')}`);
    return { report, milliseconds: performance.now() - started };
  } finally {
    await host.close();
  }
}
