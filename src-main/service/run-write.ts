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
 *
 * On PostgreSQL several benches write at once, and the transaction is SERIALIZABLE: the
 * `expectedVersion` check, the parts the re-check reads and the verdicts it writes then behave
 * as if each write ran alone, so a re-check never stores a verdict computed from a part another
 * bench changed meanwhile. The engine resolves a clash by failing one side with a serialization
 * failure, and that write runs again from the start (reading the other's committed result: a
 * stale `expectedVersion` is then refused as a conflict, as on SQLite).
 */
export async function runWrite<R>(ctx: ServiceContext, work: (trx: Transaction<Db>, at: string) => Promise<WritePlan<R>>, options: { preview?: boolean; messages?: boolean } = {}): Promise<WriteOutcome<R>> {
  // A write into a file that was deleted or replaced underneath would be lost without a word.
  const moved = options.preview ? null : (ctx.storeFile?.problem() ?? null);
  if (moved) throw new ServiceError('store-changed', moved);
  const at = ctx.now().toISOString();
  let changed: WritePlan<R>['changed'] = { kind: '', ids: [] };
  const attempt = async (trx: Transaction<Db>): Promise<WriteOutcome<R>> => {
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
  };
  let outcome: WriteOutcome<R>;
  try {
    outcome = ctx.engine === 'postgres' ? await serializableWithRetry(ctx, attempt) : await ctx.db.transaction().execute(attempt);
  } catch (error) {
    if (error instanceof PreviewRollback) return error.outcome as WriteOutcome<R>;
    throw error;
  }
  if (changed.ids.length > 0) ctx.emit({ type: 'records-changed', kind: changed.kind, ids: changed.ids });
  if (outcome.verdicts.length > 0) ctx.emit({ type: 'verdicts-changed', buildIds: outcome.verdicts.map((v) => v.buildId) });
  return outcome;
}

/** Tries a write this many times before telling the person the store is too busy. */
export const SERIALIZATION_ATTEMPTS = 8;

/** SQLSTATE serialization_failure and deadlock_detected: the engine asks for the transaction to be run again. */
const RETRYABLE = new Set(['40001', '40P01']);

export function isRetryableClash(error: unknown): boolean {
  const code = (error as { code?: unknown } | null)?.code;
  return typeof code === 'string' && RETRYABLE.has(code);
}

async function serializableWithRetry<T>(ctx: ServiceContext, attempt: (trx: Transaction<Db>) => Promise<T>): Promise<T> {
  for (let tries = 1; ; tries++) {
    try {
      return await ctx.db.transaction().setIsolationLevel('serializable').execute(attempt);
    } catch (error) {
      if (!isRetryableClash(error)) throw error;
      if (tries >= SERIALIZATION_ATTEMPTS) {
        throw new ServiceError('conflict', `Other benches kept changing the same records while this was being saved (${SERIALIZATION_ATTEMPTS} tries). Nothing was saved; try again.`);
      }
      // A short, growing, jittered pause, so that the clashing writers do not meet again at once.
      await new Promise((resolve) => setTimeout(resolve, Math.random() * 10 * 2 ** Math.min(tries, 5)));
    }
  }
}
