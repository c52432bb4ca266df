import { ENGINE_VERSION } from '../core/engine-version';
import { readSettings, writeSettings } from '../store/repositories/settings';
import { runWrite } from './run-write';
import type { ServiceContext } from './service-context';

/** Re-checks every build once when the store's verdicts come from another engine version. */
export async function recheckIfEngineChanged(ctx: ServiceContext): Promise<{ rechecked: number } | null> {
  const { engineVersion } = await readSettings(ctx.db);
  if (engineVersion === ENGINE_VERSION) return null;
  const outcome = await runWrite(ctx, async (trx) => {
    const builds = await trx.selectFrom('builds').select('id').limit(1).execute();
    await writeSettings(trx, { engineVersion: ENGINE_VERSION });
    return {
      result: null,
      history:
        builds.length === 0
          ? null
          : {
              action: 'recheck',
              entityKind: 'settings',
              entityId: 'engineVersion',
              summary: `Rules engine ${engineVersion} → ${ENGINE_VERSION}: every build re-checked`,
              reason: 'Rigbook was updated',
              before: { engineVersion },
              after: { engineVersion: ENGINE_VERSION },
            },
      recheck: { by: 'all' },
      changed: { kind: 'settings', ids: ['engineVersion'] },
    };
  });
  return { rechecked: outcome.verdicts.length };
}
