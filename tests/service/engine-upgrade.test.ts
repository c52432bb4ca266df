import { afterEach, describe, expect, it } from 'vitest';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { writeSettings } from '../../src-main/store/repositories/settings';
import { ENGINE_VERSION } from '../../src-main/core/engine-version';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

let f: ServiceFixture | undefined;
forEachEngine((engine) => {
  afterEach(async () => f?.close());

  describe('a store opened by another engine version', () => {
    it('re-checks every build once, fixing stale statuses, and says so in history', async () => {
      f = await serviceFixture(engine);
      const seed = await seedTwoBuggies(f);
      const truth = (await f.call('builds.list', {})).find((b) => b.id === seed.onTwo.id)?.status;
      // Simulate verdicts written by an older engine that judged differently.
      await f.db.updateTable('verdicts').set({ status: 'incomplete', supplyStatuses: '' }).execute();
      await writeSettings(f.db, { engineVersion: ENGINE_VERSION - 1 });

      // A second host on the same file stands for the next start of the app.
      const reopened = await openServiceHost({ dbPath: f.dbPath });
      try {
        const list = await reopened.call('builds.list', {});
        expect(list.ok && (list.value as { id: string; status: string }[]).find((b) => b.id === seed.onTwo.id)?.status).toBe(truth);
        const history = await reopened.call('history.list', { entityKind: 'settings' });
        expect(history.ok && (history.value as { action: string }[])[0]?.action).toBe('recheck');
        // Opening again does not re-check again.
        const settings = await reopened.call('settings.get', {});
        expect(settings.ok && (settings.value as { engineVersion: number }).engineVersion).toBe(ENGINE_VERSION);
      } finally {
        await reopened.close();
      }
    });

    it('writes no history for an empty store', async () => {
      f = await serviceFixture(engine);
      expect(await f.call('history.list', {})).toEqual([]);
    });
  });
});
