import { randomBytes } from 'node:crypto';
import { existsSync } from 'node:fs';
import { userInfo } from 'node:os';
import { openStore, type OpenedStore } from '../store/open-database';
import { backupFolderFor, newestRollingBackupAt, rollingBackup } from '../store/backup';
import type { EventListener, ServiceHost } from './contract';
import { dispatch } from './dispatch';
import { recheckIfEngineChanged } from './engine-upgrade';
import type { ServiceContext } from './service-context';
import { StoreFileWatch } from '../store/file-identity';

export interface HostOptions {
  dbPath: string;
  actor?: string;
  now?: () => Date;
  newId?: (prefix: string) => string;
  /**
   * A copy of the store at start, in `backups/` beside it, keeping the newest `keep` (the shells
   * pass { keep: 5 }). No copy is taken while the newest one is younger than `minIntervalHours`
   * (default 12): a shop restarting the app all day would otherwise keep five copies of one
   * morning, and a large store's copy delays every start. With `afterStartMs` the copy is taken
   * that long after the host is open (the shells: once the window has its first list), so it is
   * off the path to the first paint; `autoBackupDone` then says where it went.
   */
  autoBackup?: { keep: number; minIntervalHours?: number; afterStartMs?: number };
  /** The fleet `demo.load` offers; the shells pass the invented demo, so production service code never imports fixtures. */
  demoFleet?: () => unknown;
}

export function randomId(prefix: string): string {
  return `${prefix}-${randomBytes(6).toString('hex')}`;
}

function osUser(): string {
  try {
    return userInfo().username;
  } catch {
    return 'unknown';
  }
}

/** Rolling copies kept in `<data folder>/backups/` by the shells at each start. */
export const AUTO_BACKUPS_KEPT = 5;

/** How long after start the shells take that copy: after the window's first list, off its path. */
export const AUTO_BACKUP_AFTER_START_MS = 5000;

/** Opens the store (migrating it) and returns the one surface both shells and the command line use. */
export async function openServiceHost(
  options: HostOptions,
): Promise<ServiceHost & { ctx: ServiceContext; raw: OpenedStore['raw']; autoBackupPath: string | null; autoBackupDone: Promise<string | null> }> {
  // A store created just now holds nothing worth a copy.
  const existed = options.dbPath !== ':memory:' && existsSync(options.dbPath);
  // The file's identity is taken before SQLite opens it: a restore that swaps the file in the
  // meantime must not leave this host writing into the file it replaced.
  const watchBefore = existed ? new StoreFileWatch(options.dbPath) : null;
  const store = await openStore(options.dbPath);
  const storeFile = watchBefore ?? (options.dbPath === ':memory:' ? undefined : new StoreFileWatch(options.dbPath));
  const changed = storeFile?.problem('opening') ?? null;
  if (changed) {
    await store.db.destroy();
    throw new Error(changed);
  }
  let autoBackupPath: string | null = null;
  const backUpAtStart = async (plan: NonNullable<HostOptions['autoBackup']>): Promise<string | null> => {
    try {
      const folder = backupFolderFor(store.path);
      const newest = newestRollingBackupAt(folder);
      const interval = (plan.minIntervalHours ?? 12) * 3_600_000;
      const now = (options.now ?? (() => new Date()))();
      if (newest === null || now.getTime() - newest.getTime() >= interval) return await rollingBackup(store.raw, folder, plan.keep, now);
    } catch (error) {
      // A full disk must not keep a shop out of its records; the failure is logged.
      process.stderr.write(`Rigbook: the automatic backup at start was not written: ${error instanceof Error ? error.message : String(error)}\n`);
    }
    return null;
  };
  let autoBackupDone: Promise<string | null> = Promise.resolve(null);
  let closing = false;
  let deferredTimer: ReturnType<typeof setTimeout> | null = null;
  let cancelDeferred = () => {};
  if (options.autoBackup && existed) {
    const plan = options.autoBackup;
    if (plan.afterStartMs === undefined) {
      autoBackupPath = await backUpAtStart(plan);
      autoBackupDone = Promise.resolve(autoBackupPath);
    } else {
      autoBackupDone = new Promise((resolve) => {
        cancelDeferred = () => resolve(null);
        deferredTimer = setTimeout(() => {
          deferredTimer = null;
          if (closing) resolve(null);
          else void backUpAtStart(plan).then(resolve);
        }, plan.afterStartMs);
        // The timer alone does not keep the process alive.
        deferredTimer.unref?.();
      });
    }
  }
  const listeners = new Set<EventListener>();
  const ctx: ServiceContext = {
    db: store.db,
    actor: options.actor ?? osUser(),
    now: options.now ?? (() => new Date()),
    newId: options.newId ?? randomId,
    raw: store.raw,
    ...(storeFile ? { storeFile } : {}),
    ...(options.demoFleet ? { demoFleet: options.demoFleet } : {}),
    emit: (event) => {
      for (const listener of listeners) {
        try {
          listener(event);
        } catch {
          // A broken listener (a closed window) must not fail the write that already committed.
        }
      }
    },
  };
  await recheckIfEngineChanged(ctx);
  return {
    ctx,
    raw: store.raw,
    autoBackupPath,
    autoBackupDone,
    dbPath: store.path,
    call: (name, args) => dispatch(ctx, name, args),
    subscribe: (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    close: async () => {
      closing = true;
      if (deferredTimer !== null) {
        clearTimeout(deferredTimer);
        deferredTimer = null;
        cancelDeferred();
      }
      // A copy under way finishes before the store closes under it.
      await autoBackupDone;
      listeners.clear();
      await store.db.destroy();
    },
  };
}
