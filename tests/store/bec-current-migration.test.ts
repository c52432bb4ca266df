import { Migrator } from 'kysely';
import { afterEach, describe, expect, it } from 'vitest';
import { staticMigrationProvider } from '../../src-main/store/migration-provider';
import { openStore } from '../../src-main/store/open-database';
import { columns } from '../helpers/table-columns';
import { tempDir } from '../helpers/temp-dir';

const temps: ReturnType<typeof tempDir>[] = [];
afterEach(() => temps.splice(0).forEach((t) => t.remove()));

describe('the BEC current migration', () => {
  it('adds the controller rating and the build load, null on old rows, and its down removes them', async () => {
    const t = tempDir();
    temps.push(t);
    const store = await openStore(t.file('m.sqlite'));
    const migrator = new Migrator({ db: store.db, provider: staticMigrationProvider });
    expect((await migrator.migrateTo('20261203-0009-class-records')).error).toBeUndefined();
    expect(await columns(store.db, 'controllers')).not.toContain('becCurrentA');
    expect(await columns(store.db, 'builds')).not.toContain('becLoadA');
    await store.db
      .insertInto('controllers')
      .values({ id: 'c1', name: '50 A', continuousCurrentA: 50, version: 1, notes: '', createdAt: 'x', updatedAt: 'x' } as never)
      .execute();
    expect((await migrator.migrateTo('20261204-0010-bec-current')).error).toBeUndefined();
    expect(await columns(store.db, 'controllers')).toContain('becCurrentA');
    expect(await columns(store.db, 'builds')).toContain('becLoadA');
    const row = await store.db.selectFrom('controllers').selectAll().where('id', '=', 'c1').executeTakeFirstOrThrow();
    expect(row.becCurrentA).toBeNull();
    expect((await migrator.migrateTo('20261203-0009-class-records')).error).toBeUndefined();
    expect(await columns(store.db, 'controllers')).not.toContain('becCurrentA');
    expect(await columns(store.db, 'builds')).not.toContain('becLoadA');
    const kept = await store.db.selectFrom('controllers').select(['id', 'continuousCurrentA']).where('id', '=', 'c1').executeTakeFirstOrThrow();
    expect(kept).toEqual({ id: 'c1', continuousCurrentA: 50 });
    await store.db.destroy();
  });
});
