import type { Kysely } from 'kysely';
import type { Db } from '../store/schema';
import type { ServiceEvent } from './contract';
import type { StoreFileWatch } from '../store/file-identity';
import type { SqliteFileHandle } from '../store/sqlite-file-handle';

export interface ServiceContext {
  db: Kysely<Db>;
  /** Which engine holds the store; absent means a SQLite file. */
  engine?: 'sqlite' | 'postgres';
  /** Who is writing: the OS user or a name the shop sets; shown in history. */
  actor: string;
  now: () => Date;
  emit: (event: ServiceEvent) => void;
  /** Fresh ids for new records; replaceable so tests and imports stay deterministic. */
  newId: (prefix: string) => string;
  /** The SQLite handle under `db`, for the online backup API only; absent where the store is not a SQLite file. */
  raw?: SqliteFileHandle;
  /** The store file as it was when opened: every write first checks it is still the file at its path. */
  storeFile?: StoreFileWatch;
  /** A fresh copy of the demo fleet, handed in by the shell; absent where no demo is offered. */
  demoFleet?: () => unknown;
}
