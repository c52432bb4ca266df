import Database from 'better-sqlite3';
import { Migrator } from 'kysely';
import { afterEach, describe, expect, it } from 'vitest';
import { staticMigrationProvider } from '../../src-main/store/migration-provider';
import { serviceFixture, type ServiceFixture } from '../helpers/service-fixture';

let f: ServiceFixture | undefined;
afterEach(async () => {
  await f?.close();
  f = undefined;
});

/** A fleet of `count` builds that all share one motor, one controller and one pack. */
function sharedPartFleet(count: number) {
  const builds = Array.from({ length: count }, (_, i) => ({
    id: `b${i}`,
    name: `Stock class car ${i}`,
    vehicleId: 'club-car',
    motorId: 'club-motor',
    controllerId: 'club-esc',
    gearing: { pinionTeeth: 20 + (i % 10), spurTeeth: 87, internalRatio: 2.6, tireDiameterMm: 84, drivetrainEfficiency: 0.9 },
    supplies: [{ arrangement: 'series', batteryIds: ['club-pack'] }],
  }));
  return {
    format: 'rigbook-fleet',
    version: 1,
    batteries: [{ id: 'club-pack', name: 'Club 2S', chemistry: 'lipo', cellsSeries: 2, cellsParallel: 1, capacityMah: 5000, cRatingContinuous: 50, cRatingBurst: 100, cellResistanceOhm: 0.003 }],
    motors: [{ id: 'club-motor', name: 'Club 3300', kv: 3300, resistanceOhm: 0.012, noLoadCurrentA: 2.5, maxCurrentA: 120, maxPowerW: 1800, maxVoltageV: 17.4, maxRpm: 60000 }],
    controllers: [{ id: 'club-esc', name: 'Club 120 A', maxVoltageV: 25.2, continuousCurrentA: 120, burstCurrentA: 760, resistanceOhm: 0.001 }],
    propellers: [],
    vehicles: [{ id: 'club-car', name: 'Club buggy', kind: 'car', massKg: 1.6, dragAreaM2: 0.03, rollingCoefficient: 0.03, tractionCoefficient: 1.0, owner: 'Club' }],
    builds,
  };
}

/** Bytes the store file holds once the write-ahead log is folded back in: page count × page size. */
function storeBytes(path: string): number {
  const raw = new Database(path);
  try {
    raw.pragma('wal_checkpoint(TRUNCATE)');
    const pages = raw.pragma('page_count', { simple: true }) as number;
    const free = raw.pragma('freelist_count', { simple: true }) as number;
    const size = raw.pragma('page_size', { simple: true }) as number;
    // Free pages are reused by the next write, so they are not growth.
    return (pages - free) * size;
  } finally {
    raw.close();
  }
}

/** Store growth of `edits` edits of the motor that all builds share, none of which changes a verdict. */
async function growthPerEdit(builds: number, edits: number): Promise<{ perEdit: number; fixture: ServiceFixture }> {
  const fixture = await serviceFixture();
  const imported = await fixture.call('fleet.import', { fleet: sharedPartFleet(builds), mode: 'replace', reason: 'shared-part fleet' });
  expect(imported.ok).toBe(true);
  // One warm-up edit so page splits of a first history row are not counted as growth.
  await fixture.call('motors.update', { id: 'club-motor', expectedVersion: 1, changes: { notes: 'edit 0' } });
  const start = storeBytes(fixture.dbPath);
  for (let i = 1; i <= edits; i++) {
    const result = await fixture.call('motors.update', { id: 'club-motor', expectedVersion: i + 1, changes: { notes: `edit ${i}` }, reason: `bench edit ${i}` });
    expect(result.rechecked).toBe(builds);
  }
  return { perEdit: (storeBytes(fixture.dbPath) - start) / edits, fixture };
}

describe('store growth per edit of a shared part', () => {
  it('keeps the re-checked builds as a selector: growth does not scale with the builds re-checked', async () => {
    const small = await growthPerEdit(20, 8);
    await small.fixture.close();
    const large = await growthPerEdit(2000, 8);
    f = large.fixture;
    // One linked row per build (about 30 bytes each with its index entry) would add ~60 kB an
    // edit at 2 000 builds; a selector row adds the same few bytes whatever the fleet size.
    expect(large.perEdit).toBeLessThanOrEqual(small.perEdit + 4096);
    expect(large.perEdit).toBeLessThan(8192);
    const links = await f.db
      .selectFrom('historyBuilds')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .executeTakeFirstOrThrow();
    // Only the import links builds (it named them by id); the motor edits link none.
    expect(Number(links.n)).toBeLessThanOrEqual(2000);

    // The build's own timeline still lists the edit of its shared motor.
    const timeline = await f.call('history.list', { buildId: 'b1234' });
    expect(timeline.filter((h) => h.entityKind === 'motors')).toHaveLength(9);
    expect(timeline[0]?.reason).toBe('bench edit 8');
  }, 120_000);

  it('links by id the builds whose verdict an edit changed, and they keep it after leaving the part', async () => {
    f = await serviceFixture();
    await f.call('fleet.import', { fleet: sharedPartFleet(30), mode: 'replace', reason: 'shared-part fleet' });
    // A 6 V motor rating is far under a 2S pack's 8.4 V full charge (2 × 4.20 V, cell makers' sheets).
    await f.call('motors.update', { id: 'club-motor', expectedVersion: 1, changes: { maxVoltageV: 6 } });
    const entry = (await f.call('history.list', { entityKind: 'motors', entityId: 'club-motor' }))[0]!;
    const linked = await f.db.selectFrom('historyBuilds').select('buildId').where('historyId', '=', entry.id).execute();
    expect(linked).toHaveLength(30);
    // A later edit that changes no verdict links nothing.
    await f.call('motors.update', { id: 'club-motor', expectedVersion: 2, changes: { notes: 'label re-read' } });
    const quiet = (await f.call('history.list', { entityKind: 'motors', entityId: 'club-motor' }))[0]!;
    expect(await f.db.selectFrom('historyBuilds').select('buildId').where('historyId', '=', quiet.id).execute()).toHaveLength(0);
    const selectors = await f.db.selectFrom('historySelectors').selectAll().where('historyId', '=', quiet.id).execute();
    expect(selectors).toEqual([{ historyId: quiet.id, selects: 'part', partKind: 'motors', target: 'club-motor' }]);

    // Build b3 moves to another motor: the edit that changed its verdict stays in its timeline,
    // the quiet one (named only through the motor it no longer has) does not.
    const other = await f.call('motors.create', { name: 'Spare 3300', kv: 3300, resistanceOhm: 0.012, noLoadCurrentA: 2.5, maxCurrentA: 120, maxPowerW: 1800, maxVoltageV: 17.4, maxRpm: 60000 });
    await f.call('builds.update', { id: 'b3', expectedVersion: 1, changes: { motorId: other.id } });
    const timeline = await f.call('history.list', { buildId: 'b3' });
    expect(timeline.map((h) => h.id)).toContain(entry.id);
    expect(timeline.map((h) => h.id)).not.toContain(quiet.id);
    // b4 still uses the motor and sees both.
    const stays = (await f.call('history.list', { buildId: 'b4' })).map((h) => h.id);
    expect(stays).toEqual(expect.arrayContaining([entry.id, quiet.id]));
  }, 60_000);

  it('converts entries both ways: down links every named build, up keeps the selector and drops the links it names again', async () => {
    f = await serviceFixture();
    await f.call('fleet.import', { fleet: sharedPartFleet(12), mode: 'replace', reason: 'shared-part fleet' });
    await f.call('motors.update', { id: 'club-motor', expectedVersion: 1, changes: { notes: 'label re-read' } });
    const quiet = (await f.call('history.list', { entityKind: 'motors', entityId: 'club-motor' }))[0]!;
    const timelineBefore = await f.call('history.list', { buildId: 'b7' });
    expect(timelineBefore.map((h) => h.id)).toContain(quiet.id);

    const migrator = new Migrator({ db: f.db, provider: staticMigrationProvider });
    // Down to the step before history selectors, by name, so later migrations do not move the target.
    const down = await migrator.migrateTo('20261202-0004-verdict-current-rule');
    expect(down.error).toBeUndefined();
    expect(down.results?.map((r) => r.migrationName)).toContain('20261202-0005-history-selectors');
    // The old form: one link per build the motor edit re-checked.
    const oldLinks = await f.db.selectFrom('historyBuilds').select('buildId').where('historyId', '=', quiet.id).execute();
    expect(oldLinks).toHaveLength(12);

    const up = await migrator.migrateToLatest();
    expect(up.error).toBeUndefined();
    expect(await f.db.selectFrom('historyBuilds').select('buildId').where('historyId', '=', quiet.id).execute()).toHaveLength(0);
    expect(await f.db.selectFrom('historySelectors').select(['selects', 'partKind', 'target']).where('historyId', '=', quiet.id).execute()).toEqual([{ selects: 'part', partKind: 'motors', target: 'club-motor' }]);
    expect(await f.call('history.list', { buildId: 'b7' })).toEqual(timelineBefore);
  }, 60_000);
});
