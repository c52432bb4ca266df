import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { demoFleet } from '../../demo-fixtures/demo-fleet';
import { checkStoreFile } from '../../src-main/store/backup';
import { tempDir } from '../helpers/temp-dir';

const temps: ReturnType<typeof tempDir>[] = [];
afterEach(() => temps.splice(0).forEach((t) => t.remove()));

describe('the copy at start, taken after the start', () => {
  it('opens without copying, answers calls, then writes the copy', async () => {
    const t = tempDir();
    temps.push(t);
    const file = t.file('rigbook.sqlite');
    const first = await openServiceHost({ demoFleet, dbPath: file });
    expect(await first.call('demo.load', {})).toMatchObject({ ok: true });
    await first.close();

    const host = await openServiceHost({ demoFleet, dbPath: file, autoBackup: { keep: 5, afterStartMs: 50 } });
    // Open and answering before any copy exists: the copy is off the path to the first list.
    expect(host.autoBackupPath).toBeNull();
    expect(existsSync(join(t.dir, 'backups'))).toBe(false);
    expect(await host.call('builds.listColumns', {})).toMatchObject({ ok: true });
    const copy = await host.autoBackupDone;
    expect(copy).not.toBeNull();
    expect(checkStoreFile(copy!)).toMatchObject({ ok: true });
    await host.close();
  });

  it('a host closed before the copy is due takes none and closes at once', async () => {
    const t = tempDir();
    temps.push(t);
    const file = t.file('rigbook.sqlite');
    const first = await openServiceHost({ demoFleet, dbPath: file });
    await first.close();
    const host = await openServiceHost({ demoFleet, dbPath: file, autoBackup: { keep: 5, afterStartMs: 60_000 } });
    await host.close();
    expect(await host.autoBackupDone).toBeNull();
    expect(existsSync(join(t.dir, 'backups')) ? readdirSync(join(t.dir, 'backups')) : []).toEqual([]);
  });
});
