// Where a re-check's time goes on the service path: the same steps `runWrite` takes after the
// part's own write, each timed on its own, inside a transaction that is rolled back so the
// store is left as it was. Loaded on its own by the benchmark: if the lead reshapes these
// functions, only this breakdown is lost, not the benchmark.

import type { Kysely } from 'kysely';
import type { BuildVerdict } from '../../src-main/core/domain';
import { evaluateBuild } from '../../src-main/core/evaluate';
import { diffStatuses, loadBuildContexts } from '../../src-main/service/recheck';
import type { BuildSelector } from '../../src-main/store/build-selector';
import { appendHistory, type VerdictChange } from '../../src-main/store/repositories/history';
import { readSettings } from '../../src-main/store/repositories/settings';
import { getStoredStatuses, sameVerdictRow, verdictToRow, writeVerdicts } from '../../src-main/store/repositories/verdicts';
import type { Db } from '../../src-main/store/schema';

export interface ServicePhases {
  'load contexts (builds, supplies, parts)': number;
  'stored statuses': number;
  'evaluate (no sentences)': number;
  'diff + verdict rows': number;
  'write changed verdict rows': number;
  'history row, selector, links of changed builds': number;
}

class Rollback extends Error {}

export async function servicePhases(db: Kysely<Db>, motorId: string): Promise<ServicePhases> {
  const selector: BuildSelector = { by: 'part', kind: 'motors', id: motorId };
  const phases = {} as ServicePhases;
  const at = new Date().toISOString();
  try {
    await db.transaction().execute(async (trx) => {
      let mark = performance.now();
      const lap = (name: keyof ServicePhases) => {
        const now = performance.now();
        phases[name] = now - mark;
        mark = now;
      };
      const settings = await readSettings(trx);
      mark = performance.now();
      const contexts = await loadBuildContexts(trx, selector, settings.tightThreshold);
      lap('load contexts (builds, supplies, parts)');
      const stored = await getStoredStatuses(trx, selector);
      lap('stored statuses');
      const verdicts: BuildVerdict[] = contexts.map((context) => evaluateBuild(context, { messages: false }));
      lap('evaluate (no sentences)');
      const changes: VerdictChange[] = [];
      for (const verdict of verdicts) for (const change of diffStatuses(verdict, stored.get(verdict.buildId))) changes.push(change);
      const rows = verdicts.map((verdict) => verdictToRow(verdict, at)).filter((row) => !sameVerdictRow(stored.get(row.buildId), row));
      lap('diff + verdict rows');
      await writeVerdicts(trx, rows);
      lap('write changed verdict rows');
      await appendHistory(trx, {
        at,
        actor: 'bench',
        action: 'update',
        entityKind: 'motors',
        entityId: motorId,
        summary: 'benchmark breakdown',
        reason: '',
        before: null,
        after: null,
        verdictChanges: changes,
        builds: selector,
      });
      lap('history row, selector, links of changed builds');
      throw new Rollback('rolled back on purpose');
    });
  } catch (error) {
    if (!(error instanceof Rollback)) throw error;
  }
  return phases;
}
