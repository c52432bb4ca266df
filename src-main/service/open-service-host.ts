import { randomBytes } from 'node:crypto';
import { userInfo } from 'node:os';
import { openStore } from '../store/open-database';
import type { EventListener, ServiceHost } from './contract';
import { dispatch } from './dispatch';
import { recheckIfEngineChanged } from './engine-upgrade';
import type { ServiceContext } from './service-context';

export interface HostOptions {
  dbPath: string;
  actor?: string;
  now?: () => Date;
  newId?: (prefix: string) => string;
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

/** Opens the store (migrating it) and returns the one surface both shells and the command line use. */
export async function openServiceHost(options: HostOptions): Promise<ServiceHost & { ctx: ServiceContext }> {
  const store = await openStore(options.dbPath);
  const listeners = new Set<EventListener>();
  const ctx: ServiceContext = {
    db: store.db,
    actor: options.actor ?? osUser(),
    now: options.now ?? (() => new Date()),
    newId: options.newId ?? randomId,
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
    dbPath: store.path,
    call: (name, args) => dispatch(ctx, name, args),
    subscribe: (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    close: async () => {
      listeners.clear();
      await store.db.destroy();
    },
  };
}
