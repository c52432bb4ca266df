import { afterEach, describe, expect, it } from 'vitest';
import { decodeColumns, encodeColumns } from '../../src-main/core/column-table';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

let f: ServiceFixture | undefined;
forEachEngine((engine) => {
  afterEach(async () => {
    await f?.close();
    f = undefined;
  });

  describe('the builds list in column form', () => {
    it('decodes to exactly the rows builds.list gives, archived list included', async () => {
      f = await serviceFixture(engine);
      const seed = await seedTwoBuggies(f);
      await f.call('builds.archive', { id: seed.onTwo.id, expectedVersion: seed.onTwo.version });
      for (const args of [{}, { includeArchived: true }, { text: '4s' }]) {
        const rows = await f.call('builds.list', args);
        const table = await f.call('builds.listColumns', args);
        expect(decodeColumns(table)).toEqual(rows);
      }
    });

    it('sends a repeated group once and a mostly distinct column plain, and gives no two rows one list', () => {
      const rows = Array.from({ length: 10 }, (_, i) => ({ id: `b${i}`, partId: i < 5 ? 'p1' : 'p2', partName: i < 5 ? 'Pack one' : 'Pack two', packs: ['p1'], speed: i * 1.5, note: null as string | null }));
      const table = encodeColumns(rows, ['id', 'partId', 'partName', 'packs', 'speed', 'note'], [['partId', 'partName']]);
      const part = table.columns.find((c) => 'keys' in c && c.keys[0] === 'partId');
      expect(part && 'dictionary' in part ? part.dictionary : null).toEqual([
        ['p1', 'Pack one'],
        ['p2', 'Pack two'],
      ]);
      expect(table.columns.find((c) => 'key' in c && c.key === 'id')).toEqual({ key: 'id', values: rows.map((r) => r.id) });
      const back = decodeColumns(JSON.parse(JSON.stringify(table)) as typeof table);
      expect(back).toEqual(rows);
      expect(back[0]!.packs).not.toBe(back[1]!.packs);
    });
  });
});
