import type { Transaction } from 'kysely';
import type { Db } from '../store/schema';
import { appendHistory, type HistoryEntryInput, type VerdictChange } from '../store/repositories/history';
import { readSettings } from '../store/repositories/settings';
import { recheckBuilds } from './recheck';
import { byIds, type BuildSelector } from '../store/build-selector';
import type { BuildVerdict } from '../core/domain';
import type { ServiceContext } from './service-context';
import { ServiceError } from './contract';

/** What a write did, as the work function reports it. */
export interface WritePlan<R> {
  result: R;
  /** The history entry, less what the write path fills in itself. */
  history: Omit<HistoryEntryInput, 'at' | 'actor' | 'verdictChanges' | 'builds'> | null;
  /** Builds whose verdict this write may change: a list of ids or a selector query. */
  recheck: readonly string[] | BuildSelector;
  changed: { kind: string; ids: string[] };
}

export interface WriteOutcome<R> {
  result: R;
  verdicts: BuildVerdict[];
  verdictChanges: VerdictChange[];
  historyId: number | null;
}

function toSelector(recheck: readonly string[] | BuildSelector): BuildSelector {
  return Array.isArray(recheck) ? byIds(recheck as readonly string[]) : (recheck as BuildSelector);
}

class PreviewRollback<R> extends Error {
  constructor(readonly outcome: WriteOutcome<R>) {
    super('preview rollback');
  }
}

/**
 * One transaction for the write, the re-check of the builds it affects and the history entry:
 * a crash leaves all of it or none of it. With `preview`, the same work runs and is rolled
 * back, so a preview shows exactly what saving would do. Verdicts returned carry the findings'
 * sentences only for a preview or when asked (`messages`): a re-check of thousands of builds
 * stores statuses, and the sheet composes the sentences when it is read.
 *
 * The transaction is SQLite's default (deferred). A second program writing at the same moment
 * is refused at once as a `conflict` ("busy, try again") rather than made to wait: better-sqlite3
 * waits synchronously, so waiting for the lock would freeze the window or the server meanwhile.
 */
export async function runWrite<R>(
  ctx: ServiceContext,
  work: (trx: Transaction<Db>, at: string) => Promise<WritePlan<R>>,
  options: { preview?: boolean; messages?: boolean } = {},
): Promise<WriteOutcome<R>> {
  // A write into a file that was deleted or replaced underneath would be lost without a word.
  const moved = options.preview ? null : (ctx.storeFile?.problem() ?? null);
  if (moved) throw new ServiceError('store-changed', moved);
  const at = ctx.now().toISOString();
  let changed: WritePlan<R>['changed'] = { kind: '', ids: [] };
  let outcome: WriteOutcome<R>;
  try {
    outcome = await ctx.db.transaction().execute(async (trx) => {
      const plan = await work(trx, at);
      changed = plan.changed;
      const settings = await readSettings(trx);
      const selector = toSelector(plan.recheck);
      const recheck = await recheckBuilds(trx, selector, settings.tightThreshold, at, { messages: options.messages ?? options.preview === true });
      let historyId: number | null = null;
      if (plan.history) {
        historyId = await appendHistory(trx, {
          ...plan.history,
          at,
          actor: ctx.actor,
          verdictChanges: recheck.changes,
          builds: selector,
        });
      }
      const done: WriteOutcome<R> = { result: plan.result, verdicts: recheck.verdicts, verdictChanges: recheck.changes, historyId };
      if (options.preview) throw new PreviewRollback(done);
      return done;
    });
  } catch (error) {
    if (error instanceof PreviewRollback) return error.outcome as WriteOutcome<R>;
    throw error;
  }
  if (changed.ids.length > 0) ctx.emit({ type: 'records-changed', kind: changed.kind, ids: changed.ids });
  if (outcome.verdicts.length > 0) ctx.emit({ type: 'verdicts-changed', buildIds: outcome.verdicts.map((v) => v.buildId) });
  return outcome;
}
