import { randomBytes } from 'node:crypto';
import { existsSync } from 'node:fs';
import { userInfo } from 'node:os';
import { openStore, type OpenedStore } from '../store/open-database';
import { backupFolderFor, newestRollingBackupAt, rollingBackup } from '../store/backup';
import type { EventListener, ServiceEvent, ServiceHost } from './contract';
import { dispatch } from './dispatch';
import { recheckIfEngineChanged } from './engine-upgrade';
import type { ServiceContext } from './service-context';
import { StoreFileWatch } from '../store/file-identity';
import { isPostgresUrl } from '../store/store-location';
import { openPostgresStore } from '../store/open-postgres';
import { openChangeFeed, type ChangeFeed } from '../store/change-feed';
import type { Kysely } from 'kysely';
import type { Db } from '../store/schema';

export interface HostOptions {
  /** A SQLite file's path, or a `postgres://` / `postgresql://` connection string. */
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

export type OpenedServiceHost = ServiceHost & { ctx: ServiceContext; raw: OpenedStore['raw'] | null; autoBackupPath: string | null; autoBackupDone: Promise<string | null> };

/** Opens the store (migrating it) and returns the one surface both shells and the command line use. */
export async function openServiceHost(options: HostOptions): Promise<OpenedServiceHost> {
  if (isPostgresUrl(options.dbPath)) return openPostgresServiceHost(options);
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
    emit: (event) => tell(listeners, event),
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

function tell(listeners: ReadonlySet<EventListener>, event: ServiceEvent): void {
  for (const listener of listeners) {
    try {
      listener(event);
    } catch {
      // A broken listener (a closed window) must not fail the write that already committed.
    }
  }
}

/**
 * The same surface on a PostgreSQL store. There is no file to watch or copy (the engine's own
 * dump is its backup), and changes committed by other processes on the same store arrive
 * through the change feed and reach this host's subscribers like its own.
 */
async function openPostgresServiceHost(options: HostOptions): Promise<OpenedServiceHost> {
  const store = await openPostgresStore(options.dbPath);
  const listeners = new Set<EventListener>();
  const origin = randomId('host');
  let feed: ChangeFeed | null = null;
  const ctx: ServiceContext = {
    db: store.db,
    engine: 'postgres',
    actor: options.actor ?? osUser(),
    ...(options.demoFleet ? { demoFleet: options.demoFleet } : {}),
    now: options.now ?? (() => new Date()),
    newId: options.newId ?? randomId,
    emit: (event) => {
      tell(listeners, event);
      if (feed && event.type !== 'progress') void feed.publish({ origin, event });
    },
  };
  try {
    await recheckIfEngineChanged(ctx);
    feed = await openChangeFeed(store.url, store.schema, origin, (message) => tell(listeners, message.event));
  } catch (error) {
    await destroyQuietly(store.db);
    throw error;
  }
  const openFeed = feed;
  return {
    ctx,
    raw: null,
    autoBackupPath: null,
    autoBackupDone: Promise.resolve(null),
    dbPath: store.label,
    call: (name, args) => dispatch(ctx, name, args),
    subscribe: (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    close: async () => {
      listeners.clear();
      await openFeed.close();
      await store.db.destroy();
    },
  };
}

async function destroyQuietly(db: Kysely<Db>): Promise<void> {
  try {
    await db.destroy();
  } catch {
    // Already failing: the first error is the one to report.
  }
}
