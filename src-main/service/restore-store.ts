import Database from 'better-sqlite3';
import { removeQuietly, settleCopy } from '../store/backup';
import { checkRestoreCandidate, lockStore, RestoreRefused, stageCopy, swapIn, type SwapResult } from '../store/restore-file';
import { openServiceHost } from './open-service-host';
import { runWrite } from './run-write';

/** The swap happened, but the store in place did not pass its check when opened again. */
export class RestoredButUnsound extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RestoredButUnsound';
  }
}

export interface RestoreOutcome extends SwapResult {
  migrations: string[];
  /** Builds re-checked in the restored store, and how many of their stored verdicts were wrong. */
  rechecked: number;
  verdictChanges: number;
}

/**
 * Replaces the store at `target` with a checked copy of `candidate`:
 * 1. the candidate must be a sound Rigbook store whose schema is exactly what Rigbook's
 *    migrations make for the version it records (no trigger, view, table or column of its own);
 * 2. it is copied beside the target, brought up to date, and every build in it is re-checked
 *    by this Rigbook (a backup's stored verdicts are never trusted), with a history entry;
 * 3. the copy passes integrity_check and is swapped in with one rename, after any journal
 *    files beside the target were moved aside (store/restore-file.ts);
 * 4. the restored store is opened again and passes integrity_check.
 * The candidate itself is left as it is, and the replaced store is kept under a dated name.
 */
export async function restoreStore(candidate: string, target: string, options: { now?: Date; actor?: string } = {}): Promise<RestoreOutcome> {
  const now = options.now ?? new Date();
  const migrations = await checkRestoreCandidate(candidate);
  // Refuse early, before any copying, when a window or a command has the store open.
  lockStore(target)?.close();
  const staged = await stageCopy(candidate, target);
  let rechecked = 0;
  let verdictChanges = 0;
  let swapped: SwapResult;
  try {
    const host = await openServiceHost({ dbPath: staged, actor: options.actor ?? 'restore', now: () => now });
    try {
      const outcome = await runWrite(host.ctx, async () => ({
        result: null,
        history: {
          action: 'restore',
          entityKind: 'store',
          entityId: 'store',
          summary: `Restored from ${candidate}: every build re-checked`,
          reason: '',
          before: null,
          after: { file: candidate, schema: migrations.at(-1) ?? '' },
        },
        recheck: { by: 'all' },
        changed: { kind: 'store', ids: [] },
      }));
      rechecked = outcome.verdicts.length;
      verdictChanges = outcome.verdictChanges.length;
    } finally {
      await host.close();
    }
    const integrity = settleCopy(staged);
    if (integrity !== 'ok') throw new RestoreRefused(`The restored copy failed its integrity check (${integrity}). Nothing was replaced.`);
    swapped = swapIn(staged, target, now);
  } catch (error) {
    removeQuietly(staged);
    throw error;
  }
  const reopened = new Database(target, { fileMustExist: true });
  try {
    const rows = (reopened.pragma('integrity_check') as { integrity_check: string }[]).map((r) => r.integrity_check);
    if (rows.join('; ') !== 'ok') {
      throw new RestoredButUnsound(`the restored store failed its integrity check after the swap (${rows.slice(0, 3).join('; ')}). The replaced store is at ${swapped.keptAs ?? '(none)'}.`);
    }
  } finally {
    reopened.close();
  }
  return { ...swapped, migrations, rechecked, verdictChanges };
}
