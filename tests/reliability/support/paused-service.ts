import { Kysely, SqliteDialect, type KyselyPlugin, type PluginTransformQueryArgs, type PluginTransformResultArgs, type QueryResult, type RootOperationNode, type UnknownRow } from 'kysely';
import { openStore } from '../../../src-main/store/open-database';
import type { Db } from '../../../src-main/store/schema';
import type { CallResult } from '../../../src-main/service/contract';
import { dispatch } from '../../../src-main/service/dispatch';
import type { ServiceContext } from '../../../src-main/service/service-context';

/**
 * Holds a write between its first read and the rest of its transaction, so a test can let
 * another writer commit in that gap: the interleaving two workstations produce by chance,
 * produced on purpose. Only timing is controlled; every query still runs on the real store.
 */
class PauseAfterFirstRead implements KyselyPlugin {
  private armed: { reached: () => void; resume: Promise<void> } | null = null;

  arm(): { reached: Promise<void>; release: () => void } {
    let reached!: () => void;
    let release!: () => void;
    const reachedPromise = new Promise<void>((resolve) => (reached = resolve));
    const resume = new Promise<void>((resolve) => (release = resolve));
    this.armed = { reached, resume };
    return { reached: reachedPromise, release };
  }

  private reads = new WeakSet<object>();

  transformQuery(args: PluginTransformQueryArgs): RootOperationNode {
    if (this.armed && args.node.kind === 'SelectQueryNode') this.reads.add(args.queryId);
    return args.node;
  }

  async transformResult(args: PluginTransformResultArgs): Promise<QueryResult<UnknownRow>> {
    const armed = this.armed;
    if (armed && this.reads.has(args.queryId)) {
      this.armed = null;
      armed.reached();
      await armed.resume;
    }
    return args.result;
  }
}

/** A second service on the same file whose next call can be paused after its first read. */
export async function openPausableService(dbPath: string, actor: string) {
  const store = await openStore(dbPath);
  const pause = new PauseAfterFirstRead();
  const db = new Kysely<Db>({ dialect: new SqliteDialect({ database: store.raw }), plugins: [pause] });
  const ctx: ServiceContext = { db, actor, now: () => new Date(), emit: () => {}, newId: (prefix) => `${prefix}-${actor}-${Math.random().toString(36).slice(2, 10)}` };
  return {
    call: (name: string, args: unknown): Promise<CallResult> => dispatch(ctx, name, args),
    /** Starts the call and resolves once it has read inside its transaction; `release` lets it go on. */
    async callPaused(name: string, args: unknown): Promise<{ done: Promise<CallResult>; release: () => void }> {
      const gate = pause.arm();
      const done = dispatch(ctx, name, args);
      await Promise.race([gate.reached, done]);
      return { done, release: gate.release };
    },
    close: async () => {
      await db.destroy();
    },
  };
}
