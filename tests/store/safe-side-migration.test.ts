import { Migrator } from 'kysely';
import { afterEach, describe, expect, it } from 'vitest';
import { staticMigrationProvider } from '../../src-main/store/migration-provider';
import { openStore } from '../../src-main/store/open-database';
import { columns } from '../helpers/table-columns';
import { tempDir } from '../helpers/temp-dir';

const temps: ReturnType<typeof tempDir>[] = [];
afterEach(() => temps.splice(0).forEach((t) => t.remove()));

describe('the safe-side inputs migration', () => {
  it('adds nullable columns that read as the defaults on old rows, and its down removes them', async () => {
    const t = tempDir();
    temps.push(t);
    const store = await openStore(t.file('m.sqlite'));
    const migrator = new Migrator({ db: store.db, provider: staticMigrationProvider });
    expect((await migrator.migrateTo('20261202-0001-initial')).error).toBeUndefined();
    expect(await columns(store.db, 'builds')).not.toContain('runLengthS');
    await store.db
      .insertInto('propellers')
      .values({ id: 'p1', name: '5 inch', diameterMm: 127, blades: 3, version: 1, notes: '', createdAt: 'x', updatedAt: 'x' } as never)
      .execute();
    expect((await migrator.migrateTo('20261202-0002-safe-side-inputs')).error).toBeUndefined();
    expect(await columns(store.db, 'propellers')).toContain('maxRpm');
    expect(await columns(store.db, 'vehicles')).toEqual(expect.arrayContaining(['driveLayout', 'drivenWeightShare', 'water']));
    expect(await columns(store.db, 'builds')).toEqual(expect.arrayContaining(['runLengthS', 'measuredSupplyId']));
    const prop = await store.db.selectFrom('propellers').selectAll().where('id', '=', 'p1').executeTakeFirstOrThrow();
    expect(prop.maxRpm).toBeNull();
    expect((await migrator.migrateTo('20261202-0001-initial')).error).toBeUndefined();
    expect(await columns(store.db, 'vehicles')).not.toContain('water');
    expect(await columns(store.db, 'propellers')).not.toContain('maxRpm');
    await store.db.destroy();
  });
});
