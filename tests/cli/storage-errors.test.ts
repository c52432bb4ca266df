import { writeFileSync } from 'node:fs';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { demoFleet } from '../../demo-fixtures/demo-fleet';
import { dumpStore } from '../fleet/store-dump';
import { generateFleet } from '../../demo-fixtures/generate-fleet';
import { tempDir } from '../helpers/temp-dir';
import { rigbook } from './run';

// The command line on a full disk. Filling the machine's disk is not an option on a shared
// machine, so the disk is made "full" in the two places the command writes:
// - the store: SQLite's max_page_count on the host the command opens, so SQLite itself fails
//   the write with SQLITE_FULL (the same code a full disk gives);
// - an output file: the OS call that writes it fails with ENOSPC (OS glue, replaced here).

const state = vi.hoisted(() => ({ fullStore: false, fullFiles: false }));

vi.mock('../../src-main/service/open-service-host', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../src-main/service/open-service-host')>();
  return {
    ...real,
    openServiceHost: async (options: Parameters<typeof real.openServiceHost>[0]) => {
      const host = await real.openServiceHost(options);
      if (state.fullStore) host.raw!.pragma(`max_page_count = ${Number(host.raw!.pragma('page_count', { simple: true })) + 4}`);
      return host;
    },
  };
});

vi.mock('node:fs', async (importOriginal) => {
  const real = await importOriginal<typeof import('node:fs')>();
  const writeFile = ((path: Parameters<typeof real.writeFileSync>[0], ...rest: unknown[]) => {
    if (state.fullFiles && String(path).includes('.partial-')) throw Object.assign(new Error(`ENOSPC: no space left on device, write`), { code: 'ENOSPC', errno: -28, syscall: 'write' });
    return (real.writeFileSync as (...a: unknown[]) => void)(path, ...rest);
  }) as typeof real.writeFileSync;
  return { ...real, default: { ...real, writeFileSync: writeFile }, writeFileSync: writeFile };
});

const temps: (() => void)[] = [];
afterEach(() => {
  state.fullStore = false;
  state.fullFiles = false;
  for (const remove of temps.splice(0)) remove();
});

async function storeWithDemo(): Promise<{ dir: string; store: string }> {
  const t = tempDir('rigbook-cli-full-');
  temps.push(t.remove);
  const store = t.file('rigbook.sqlite');
  const host = await openServiceHost({ demoFleet, dbPath: store, actor: 'tester' });
  await host.call('demo.load', {});
  await host.close();
  return { dir: t.dir, store };
}

async function dumpOf(store: string) {
  const host = await openServiceHost({ demoFleet, dbPath: store, actor: 'tester' });
  try {
    return await dumpStore(host.ctx.db);
  } finally {
    await host.close();
  }
}

describe('rigbook on a full disk', () => {
  it('import: exit 4, says the disk is full, no stack trace, the store unchanged', async () => {
    const { dir, store } = await storeWithDemo();
    const before = await dumpOf(store);
    const file = `${dir}/big.json`;
    writeFileSync(file, JSON.stringify(generateFleet({ builds: 400, seed: 5 })));
    state.fullStore = true;
    const run = await rigbook(['import', file, '--db', store]);
    state.fullStore = false;
    expect(run.code).toBe(4);
    expect(run.err).toMatch(/is full\. Nothing was saved\. Free some space/);
    expect(run.err).not.toMatch(/\n\s+at /);
    expect(run.err).not.toMatch(/something went wrong/i);
    expect(await dumpOf(store)).toEqual(before);
  });

  it('export: exit 4, says the disk is full, and leaves no half file', async () => {
    const { dir, store } = await storeWithDemo();
    state.fullFiles = true;
    const run = await rigbook(['export', `${dir}/fleet.json`, '--db', store]);
    expect(run.code).toBe(4);
    expect(run.err).toMatch(/the disk holding .* is full\. Nothing was written/);
    expect(run.err).toMatch(/ENOSPC/);
    const { readdirSync } = await import('node:fs');
    expect(readdirSync(dir).filter((n) => n.includes('fleet.json'))).toEqual([]);
  });
});
