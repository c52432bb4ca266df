import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { toApiError } from '../../src-main/service/dispatch';
import { serviceFixture, type ServiceFixture } from '../helpers/service-fixture';

// One test per fault the reliability suite found, kept small and named after the symptom, so
// the fault cannot come back unnoticed even if the larger suites change.

let f: ServiceFixture;
beforeEach(async () => {
  f = await serviceFixture();
});
afterEach(async () => f.close());

describe('faults found by the reliability suite', () => {
  it('classRules.list answers (it ordered by a name column class rules do not have)', async () => {
    await f.call('classRules.create', { className: 'stock', ruleId: 'class-voltage', figure: 'packVoltageFullV', limit: 8.4, unit: 'V' });
    await f.call('classRules.create', { className: 'mod', ruleId: 'class-speed', figure: 'theoreticalSpeedKmh', limit: 60, unit: 'km/h' });
    await f.call('classRules.create', { className: 'mod', ruleId: 'class-amps', figure: 'peakCurrentA', limit: 90, unit: 'A' });
    const rules = await f.call('classRules.list', {});
    expect(rules.map((r) => `${r.className} ${r.ruleId}`)).toEqual(['mod class-amps', 'mod class-speed', 'stock class-voltage']);
  });

  it('a write whose read went stale under another process (SQLITE_BUSY_SNAPSHOT) is a conflict, not an internal error', () => {
    // better-sqlite3 reports SQLite's extended result codes; the snapshot case came back as "internal".
    const logged: string[] = [];
    for (const code of ['SQLITE_BUSY', 'SQLITE_BUSY_SNAPSHOT', 'SQLITE_BUSY_RECOVERY', 'SQLITE_LOCKED', 'SQLITE_LOCKED_SHAREDCACHE']) {
      const error = Object.assign(new Error('database is locked'), { code });
      expect(
        toApiError(error, (m) => logged.push(m)),
        code,
      ).toEqual({ kind: 'conflict', message: 'The store is busy with another write. Nothing was saved; try again.' });
    }
    expect(logged).toEqual([]);
  });

  it('an unknown field with an empty name is refused as the input’s problem, not as an empty field', async () => {
    const error = await f.refuse('batteries.create', { name: 'P', chemistry: 'lipo', cellsSeries: 2, capacityMah: 2000, '': 1 });
    expect(error).toEqual({ kind: 'invalid', message: 'Input has a field with an empty name, which Rigbook does not know' });
    // A named unknown field still names itself.
    expect(await f.refuse('batteries.create', { name: 'P', chemistry: 'lipo', cellsSeries: 2, capacityMah: 2000, colour: 1 })).toMatchObject({ field: 'colour', message: 'colour: is not a field Rigbook knows' });
  });
});
