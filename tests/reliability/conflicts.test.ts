import Database from 'better-sqlite3';
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { ApiError, CallResult } from '../../src-main/service/contract';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { tempDir } from '../helpers/temp-dir';
import { bundleChild, ChildLines } from './support/child-process';
import { openPausableService } from './support/paused-service';
import { fileProblems, historyByVersion, historyChainProblems, ok, readHistory, readRecords, verdictProblems } from './support/store-audit';

// Two workstations on one store file (the desktop window and the command line, or two shop
// PCs on a shared folder) editing the same record: exactly one edit wins, the other is told
// plainly, nothing is silently overwritten, and a busy store never turns into a crash.

type Host = Awaited<ReturnType<typeof openServiceHost>>;

const CONFLICT_WORDING = /changed elsewhere|busy with another write/;

function expectConflict(result: CallResult, where = ''): ApiError {
  expect(result.ok, `${where} ${JSON.stringify(result)}`).toBe(false);
  if (result.ok) throw new Error('unreachable');
  expect(result.error.kind, `${where} ${result.error.message}`).toBe('conflict');
  expect(result.error.message).toMatch(CONFLICT_WORDING);
  expect(result.error.message).toMatch(/Nothing was saved/);
  return result.error;
}

async function auditClean(host: Host): Promise<void> {
  expect(await fileProblems(host)).toEqual([]);
  const records = await readRecords(host);
  const history = await readHistory(host);
  expect(historyChainProblems(records, historyByVersion(history), history)).toEqual([]);
  expect(verdictProblems(records).problems).toEqual([]);
}

const packArgs = { name: 'Shared 2S', chemistry: 'lipo', cellsSeries: 2, capacityMah: 5000, cRatingContinuous: 50, cRatingBurst: 100, cellResistanceOhm: 0.003 };

async function seedBuild(host: Host) {
  const vehicle = await ok<{ id: string }>(host, 'vehicles.create', { name: 'Shop buggy', kind: 'car', massKg: 1.6, dragAreaM2: 0.03, rollingCoefficient: 0.03, tractionCoefficient: 1 });
  const motor = await ok<{ id: string }>(host, 'motors.create', { name: 'Shop 3300', kv: 3300, resistanceOhm: 0.012, noLoadCurrentA: 2.5, maxCurrentA: 120 });
  const pack = await ok<{ id: string }>(host, 'batteries.create', packArgs);
  const build = await ok<{ record: { id: string } }>(host, 'builds.create', {
    name: 'Customer buggy',
    vehicleId: vehicle.id,
    motorId: motor.id,
    gearing: { pinionTeeth: 17, spurTeeth: 87, internalRatio: 2.6, tireDiameterMm: 84 },
    supplies: [{ batteryIds: [pack.id] }],
  });
  return { pack: pack.id, build: build.record.id, motor: motor.id };
}

describe('two service hosts in one process on one store file', () => {
  let temp: ReturnType<typeof tempDir>;
  let a: Host;
  let b: Host;
  beforeEach(async () => {
    temp = tempDir('rigbook-conflict-');
    a = await openServiceHost({ dbPath: temp.file('store.sqlite'), actor: 'bench-a' });
    b = await openServiceHost({ dbPath: temp.file('store.sqlite'), actor: 'bench-b' });
  });
  afterEach(async () => {
    await a.close();
    await b.close();
    temp.remove();
  });

  it('refuses an edit of a version another host already replaced, and keeps that host’s edit', async () => {
    const seed = await seedBuild(a);
    await ok(a, 'batteries.update', { id: seed.pack, expectedVersion: 1, changes: { cycleCount: 40 } });
    const error = expectConflict(await b.call('batteries.update', { id: seed.pack, expectedVersion: 1, changes: { cycleCount: 3 } }));
    expect(error).toMatchObject({ field: 'expectedVersion' });
    expect(error.message).toContain('now version 2, you edited version 1');
    expect(await ok(b, 'batteries.get', { id: seed.pack })).toMatchObject({ version: 2, cycleCount: 40 });

    await ok(b, 'builds.update', { id: seed.build, expectedVersion: 1, changes: { gearing: { pinionTeeth: 19, spurTeeth: 87, internalRatio: 2.6, tireDiameterMm: 84 } } });
    expectConflict(await a.call('builds.update', { id: seed.build, expectedVersion: 1, changes: { gearing: { pinionTeeth: 14, spurTeeth: 87, internalRatio: 2.6, tireDiameterMm: 84 } } }));
    expectConflict(await a.call('builds.archive', { id: seed.build, expectedVersion: 1 }));
    const sheet = await ok<{ build: { version: number; archivedAt: string | null; gearing: { pinionTeeth: number } } }>(a, 'builds.get', { id: seed.build });
    expect(sheet.build).toMatchObject({ version: 2, archivedAt: null, gearing: { pinionTeeth: 19 } });
    await auditClean(a);
  });

  it('refuses a write whose read went stale while another host committed (SQLITE_BUSY_SNAPSHOT) as a conflict', async () => {
    const seed = await seedBuild(a);
    const paused = await openPausableService(temp.file('store.sqlite'), 'bench-c');
    try {
      // The paused writer has read version 1 inside its transaction; then another host commits version 2.
      const late = await paused.callPaused('batteries.update', { id: seed.pack, expectedVersion: 1, changes: { cycleCount: 5 } });
      await ok(a, 'batteries.update', { id: seed.pack, expectedVersion: 1, changes: { cycleCount: 77 } });
      late.release();
      expectConflict(await late.done, 'stale reader');

      // The same with a build edit, which re-checks and writes history in the same transaction.
      const lateBuild = await paused.callPaused('builds.update', { id: seed.build, expectedVersion: 1, changes: { motorCount: 2 } });
      await ok(b, 'builds.update', { id: seed.build, expectedVersion: 1, changes: { notes: 'pinion checked' } });
      lateBuild.release();
      expectConflict(await lateBuild.done, 'stale build reader');
    } finally {
      await paused.close();
    }
    expect(await ok(a, 'batteries.get', { id: seed.pack })).toMatchObject({ version: 2, cycleCount: 77 });
    expect((await ok<{ build: { motorCount: number; notes: string } }>(a, 'builds.get', { id: seed.build })).build).toMatchObject({ motorCount: 1, notes: 'pinion checked' });
    await auditClean(a);
  });

  it('lets exactly one of several simultaneous edits win, round after round, and loses none of the winners', async () => {
    const seed = await seedBuild(a);
    const c = await openPausableService(temp.file('store.sqlite'), 'bench-c');
    const ROUNDS = 25;
    const outcomes = { versionConflicts: 0, busyConflicts: 0 };
    try {
      for (let round = 0; round < ROUNDS; round++) {
        const version = round + 1;
        const edits = [11, 22, 33].map((base) => base * 1000 + round);
        const results = await Promise.all([
          a.call('batteries.update', { id: seed.pack, expectedVersion: version, changes: { cycleCount: edits[0] } }),
          b.call('batteries.update', { id: seed.pack, expectedVersion: version, changes: { cycleCount: edits[1] } }),
          c.call('batteries.update', { id: seed.pack, expectedVersion: version, changes: { cycleCount: edits[2] } }),
        ]);
        const winners = results.flatMap((r, i) => (r.ok ? [i] : []));
        expect(winners, `round ${round}: ${JSON.stringify(results.map((r) => (r.ok ? 'ok' : r.error)))}`).toHaveLength(1);
        for (const r of results) {
          if (r.ok) continue;
          const error = expectConflict(r, `round ${round}`);
          if (/busy/.test(error.message)) outcomes.busyConflicts++;
          else outcomes.versionConflicts++;
        }
        const stored = await ok<{ version: number; cycleCount: number }>(a, 'batteries.get', { id: seed.pack });
        expect(stored).toMatchObject({ version: version + 1, cycleCount: edits[winners[0]!] });
      }
    } finally {
      await c.close();
    }
    const history = (await readHistory(a)).filter((h) => h.entityId === seed.pack);
    expect(history).toHaveLength(ROUNDS + 1);
    await auditClean(a);
    console.log(`conflicts in one process: ${ROUNDS} rounds of 3 writers, ${outcomes.versionConflicts} version conflicts, ${outcomes.busyConflicts} busy conflicts, 0 lost`);
  });

  it('serialises simultaneous calls on one host: the second sees the first’s version', async () => {
    const seed = await seedBuild(a);
    const results = await Promise.all([1, 2, 3].map((n) => a.call('batteries.update', { id: seed.pack, expectedVersion: 1, changes: { cycleCount: n } })));
    expect(results.filter((r) => r.ok)).toHaveLength(1);
    for (const r of results.filter((x) => !x.ok)) expect(expectConflict(r).field).toBe('expectedVersion');
  });
});

describe('a second process on the same store file', () => {
  let temp: ReturnType<typeof tempDir>;
  let script = '';
  let host: Host;
  let child: ChildLines;
  let seed: Awaited<ReturnType<typeof seedBuild>>;

  beforeAll(async () => {
    temp = tempDir('rigbook-conflict-proc-');
    script = await bundleChild('tests/reliability/children/conflict-writer.ts', temp.dir);
    host = await openServiceHost({ dbPath: temp.file('store.sqlite'), actor: 'front-desk' });
    seed = await seedBuild(host);
    child = new ChildLines(script, [temp.file('store.sqlite'), 'workshop']);
    expect(await child.waitForLine((l) => l.includes('"ready"'), 15_000), child.stderr).not.toBeNull();
  }, 60_000);

  afterAll(async () => {
    await child.kill('SIGTERM');
    await host.close();
    temp.remove();
  });

  /** Sends a command and resolves with the child's next line of the given type. */
  async function ask(command: unknown, type: string): Promise<{ t: string; result?: CallResult }> {
    const from = child.lines.length;
    child.send(JSON.stringify(command));
    const line = await child.waitForLine((l) => l.includes(`"t":"${type}"`), 15_000, from);
    expect(line, `child gave no ${type}: ${child.stderr}`).not.toBeNull();
    return JSON.parse(line!) as { t: string; result?: CallResult };
  }

  it('races the other process on one record: one edit wins each round, the other is told, nothing is overwritten', async () => {
    const ROUNDS = 15;
    let wonHere = 0;
    let wonThere = 0;
    const start = (await ok<{ version: number }>(host, 'batteries.get', { id: seed.pack })).version;
    for (let round = 0; round < ROUNDS; round++) {
      const version = start + round;
      const [there, here] = await Promise.all([
        ask({ op: 'call', name: 'batteries.update', args: { id: seed.pack, expectedVersion: version, changes: { cycleCount: 500 + round } } }, 'result'),
        host.call('batteries.update', { id: seed.pack, expectedVersion: version, changes: { cycleCount: 900 + round } }),
      ]);
      const results = [there.result!, here];
      expect(
        results.filter((r) => r.ok),
        `round ${round}: ${JSON.stringify(results)}`,
      ).toHaveLength(1);
      for (const r of results) if (!r.ok) expectConflict(r, `round ${round}`);
      const expected = here.ok ? 900 + round : 500 + round;
      if (here.ok) wonHere++;
      else wonThere++;
      expect(await ok(host, 'batteries.get', { id: seed.pack })).toMatchObject({ version: version + 1, cycleCount: expected });
    }
    expect(wonHere + wonThere).toBe(ROUNDS);
    await auditClean(host);
  });

  it('answers a write made while the other process holds the write lock with a clear busy message, and keeps both writes after', async () => {
    await ask({ op: 'lock' }, 'locked');
    const version = (await ok<{ version: number }>(host, 'batteries.get', { id: seed.pack })).version;
    const blocked = await host.call('batteries.update', { id: seed.pack, expectedVersion: version, changes: { notes: 'written while locked' } });
    const error = expectConflict(blocked, 'while locked');
    expect(error.message).toMatch(/busy with another write/);
    await ask({ op: 'unlock' }, 'unlocked');
    const retried = await ok<{ record: { version: number; notes: string } }>(host, 'batteries.update', { id: seed.pack, expectedVersion: version, changes: { notes: 'written after' } });
    expect(retried.record).toMatchObject({ version: version + 1, notes: 'written after' });
    // The other process's committed write is still there.
    const raw = new Database(temp.file('store.sqlite'), { readonly: true });
    try {
      expect(raw.prepare("select value from settings where key = 'lockProbe'").get()).toEqual({ value: '"workshop"' });
    } finally {
      raw.close();
    }
    await auditClean(host);
  });

  it('refuses, as a conflict, a write whose read went stale because this process committed in between', async () => {
    const version = (await ok<{ version: number }>(host, 'batteries.get', { id: seed.pack })).version;
    await ask({ op: 'pausedCall', name: 'batteries.update', args: { id: seed.pack, expectedVersion: version, changes: { cycleCount: 1 } } }, 'paused');
    await ok(host, 'batteries.update', { id: seed.pack, expectedVersion: version, changes: { cycleCount: 4242 } });
    const late = await ask({ op: 'go' }, 'result');
    expectConflict(late.result!, 'stale reader in another process');
    expect(await ok(host, 'batteries.get', { id: seed.pack })).toMatchObject({ version: version + 1, cycleCount: 4242 });
    await auditClean(host);
  });
});
