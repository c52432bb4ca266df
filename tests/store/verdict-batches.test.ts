import { afterEach, describe, expect, it } from 'vitest';
import { openStore, type OpenedStore } from '../../src-main/store/open-database';
import { writeVerdicts } from '../../src-main/store/repositories/verdicts';
import type { NewVerdictRow } from '../../src-main/store/schema';
import { tempDir } from '../helpers/temp-dir';

// A shop-scale re-check writes thousands of verdict rows in a few statements. SQLite refuses a
// statement with more than 32 766 bound parameters (SQLite documentation, "Limits In SQLite",
// SQLITE_MAX_VARIABLE_NUMBER), so the batch size must follow the row's column count.

let store: OpenedStore | undefined;
let remove: (() => void) | undefined;

afterEach(async () => {
  await store?.db.destroy();
  remove?.();
  store = undefined;
});

const row = (i: number, status: string): NewVerdictRow => ({
  buildId: `build-${i}`,
  status,
  supplyVoltageFullV: 16.8,
  theoreticalSpeedKmh: 60,
  peakCurrentA: 120,
  peakCurrentLimitA: 150,
  currentRule: 'motor-current',
  currentSource: 'model',
  supplyStatuses: `s${i}=${status}`,
  ruleStatuses: status === 'clear' ? '' : `motor-current=${status}`,
  evaluatedAt: '2026-12-04T06:00:00.000Z',
});

describe('verdict rows written in batches', () => {
  it('writes and then updates 7 000 rows in one call on a SQLite file', async () => {
    const temp = tempDir();
    remove = () => temp.remove();
    store = await openStore(temp.file('store.sqlite'));
    // The rows' builds are not the point here: the write alone, without the builds it belongs to.
    store.raw.pragma('foreign_keys = OFF');
    const count = 7000;
    await writeVerdicts(
      store.db,
      Array.from({ length: count }, (_, i) => row(i, 'clear')),
    );
    await writeVerdicts(
      store.db,
      Array.from({ length: count }, (_, i) => row(i, i % 2 === 0 ? 'over' : 'tight')),
    );
    const stored = await store.db.selectFrom('verdicts').select(['buildId', 'status', 'ruleStatuses']).orderBy('buildId').execute();
    expect(stored).toHaveLength(count);
    expect(stored.filter((r) => r.status === 'over')).toHaveLength(count / 2);
    expect(stored.find((r) => r.buildId === 'build-6999')).toEqual({ buildId: 'build-6999', status: 'tight', ruleStatuses: 'motor-current=tight' });
  });
});
