import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import type { ApiError } from '../service/contract';
import { AUTO_BACKUPS_KEPT, openServiceHost } from '../service/open-service-host';
import { demoFleet } from '../../demo-fixtures/demo-fleet';
import { resolveDbPath } from '../store/data-location';
import { CliFailure, type CliIo } from './cli-io';
import { EXIT } from '../shell-common/exit-codes';
import { progressPrinter } from './progress-line';
import { describeStorageError } from '../store/storage-errors';
import { isPostgresUrl, redactUrl, withoutSecret } from '../store/store-location';

export type Host = Awaited<ReturnType<typeof openServiceHost>>;

/** `--db PATH` (or a PostgreSQL URL), then RIGBOOK_DB, then the shared per-user data folder (as the app itself). */
export function storePath(io: CliIo, explicit: string | undefined): string {
  const chosen = resolveDbPath(explicit, io.env);
  return isPostgresUrl(chosen) ? chosen : resolve(io.cwd, chosen);
}

/** The store as a message may name it: a file's path, or a connection string without its password. */
export function storeLabel(dbPath: string): string {
  return redactUrl(dbPath);
}

/**
 * Commands that copy the store file refuse a PostgreSQL store at once: its backup is the
 * server's own dump (pg_dump), and a move between engines is `rigbook export` then `import`.
 */
export function refuseUnlessFile(dbPath: string, command: string): void {
  if (!isPostgresUrl(dbPath)) return;
  throw new CliFailure(
    EXIT.store,
    `the store ${redactUrl(dbPath)} is a PostgreSQL database, and ${command} copies SQLite store files only. Back a PostgreSQL store up with the server's own tools (pg_dump and pg_restore), or move its records with rigbook export and rigbook import.`,
  );
}

export interface StoreOptions {
  /** Refuse rather than create an empty store (backup of a store that is not there). */
  mustExist?: boolean;
  /** Take the rolling start-up copy first (commands that write). */
  autoBackup?: boolean;
}

/** How many rolling copies the command line keeps, the same as the app's shells. */
export { AUTO_BACKUPS_KEPT };

/** Opens the store through the same service host the app uses, prints progress events, and always closes it. */
export async function withStore<T>(io: CliIo, dbPath: string, options: StoreOptions, work: (host: Host, existed: boolean) => Promise<T>): Promise<T> {
  // A PostgreSQL store is a database the server has: whether it holds records shows when it opens.
  const existed = isPostgresUrl(dbPath) || existsSync(dbPath);
  if (options.mustExist && !existed) throw new CliFailure(EXIT.store, `There is no store at ${dbPath} (give another with --db PATH or RIGBOOK_DB).`);
  let host: Host;
  try {
    host = await openServiceHost({ dbPath, demoFleet, ...(options.autoBackup ? { autoBackup: { keep: AUTO_BACKUPS_KEPT, minIntervalHours: 0 } } : {}) });
  } catch (error) {
    const storage = describeStorageError(error, dbPath);
    const cause = withoutSecret(error instanceof Error ? error.message : String(error), dbPath);
    throw new CliFailure(EXIT.store, storage ? `The store could not be opened. ${storage.message}\n  (${storage.code}: ${cause})` : `The store at ${storeLabel(dbPath)} could not be opened: ${cause}`);
  }
  const progress = progressPrinter(io);
  const stop = host.subscribe(progress.onEvent);
  try {
    return await work(host, existed);
  } finally {
    progress.finish();
    stop();
    await host.close();
  }
}

/** Exit code for an error the service returned. */
export function exitFor(error: ApiError): number {
  return error.kind === 'invalid' || error.kind === 'not-found' ? EXIT.invalid : EXIT.store;
}

/** Calls a handler and turns a refusal into a CliFailure carrying the service's own message. */
export async function callOrFail(host: Host, name: string, args: unknown): Promise<unknown> {
  const result = await host.call(name, args);
  if (!result.ok) throw new CliFailure(exitFor(result.error), result.error.message);
  return result.value;
}
