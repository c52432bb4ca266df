import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openServiceHost } from '../../src-main/service/open-service-host';
import type { Ack, ChildLine } from './children/crash-writer';
import { bundleChild, ChildLines } from './support/child-process';
import { canonical, seededRandom, sleep } from './support/random';
import { seedSharedFleet } from './support/seed-fleet';
import { buildsUsing, fileProblems, historyByVersion, historyChainProblems, PART_KINDS, readHistory, readRecords, versionKey, verdictProblems, type HistoryRow, type RecordKind, type StoreRecords } from './support/store-audit';
import { tempDir } from '../helpers/temp-dir';

// A child process writes through the real handler map and is killed with SIGKILL at random
// moments; after every kill the store must open, pass integrity_check, hold every write the
// child acknowledged (at its version), and hold no half-applied write: each record version
// has its history entry and every stored verdict is what a fresh evaluation gives.
//
// RIGBOOK_CRASH_TRIALS sets the number of kills (default 60), RIGBOOK_CRASH_SEED repeats a run.

const TRIALS = Number(process.env.RIGBOOK_CRASH_TRIALS ?? 60);
const SEED = Number(process.env.RIGBOOK_CRASH_SEED ?? Math.floor(Math.random() * 2 ** 31));
const SEED_BUILDS = 150;

const temp = tempDir('rigbook-crash-');
const dbPath = temp.file('store.sqlite');
let script = '';

beforeAll(async () => {
  script = await bundleChild('tests/reliability/children/crash-writer.ts', temp.dir);
  const host = await openServiceHost({ dbPath, actor: 'seed' });
  await seedSharedFleet(host, SEED_BUILDS, seededRandom(SEED));
  await host.close();
}, 60_000);

afterAll(() => temp.remove());

/** What the acknowledged writes demand of the store; empty when all of them are there. */
function ackProblems(acks: readonly Ack[], byVersion: ReadonlyMap<string, HistoryRow>, records: StoreRecords, history: readonly HistoryRow[]): string[] {
  const problems: string[] = [];
  for (const ack of acks) {
    if (ack.op === 'settings') {
      const found = history.some((h) => h.entityKind === 'settings' && (h.after as { tightThreshold?: number } | null)?.tightThreshold === ack.tightThreshold);
      if (!found) problems.push(`acknowledged default threshold ${ack.tightThreshold} has no history entry`);
      continue;
    }
    if (ack.op === 'import') {
      // All of the import or none of it: its history entry, the new pack as the file gave it, the new build, the shared pack's new version.
      if (!history.some((h) => h.id === ack.historyId && h.action === 'import')) problems.push(`acknowledged import (history ${ack.historyId}) has no history entry`);
      const pack = records.batteries.find((r) => r.id === ack.pack.id);
      if (!pack) problems.push(`acknowledged import: pack ${String(ack.pack.id)} is missing`);
      else if (pack.version === 1 && Object.entries(ack.pack).some(([k, v]) => canonical(pack[k]) !== canonical(v))) problems.push(`acknowledged import: pack ${String(ack.pack.id)} differs from the file`);
      if (!records.builds.some((b) => b.id === ack.buildId)) problems.push(`acknowledged import: build ${ack.buildId} is missing`);
      const shared = records.batteries.find((r) => r.id === ack.sharedId);
      if (!shared || shared.version < ack.sharedVersion) problems.push(`acknowledged import: pack ${ack.sharedId} is below version ${ack.sharedVersion}`);
      continue;
    }
    const entry = byVersion.get(versionKey(ack.kind, ack.id, ack.version));
    if (!entry) problems.push(`acknowledged ${ack.op} of ${ack.kind} ${ack.id} at version ${ack.version} is missing from history`);
    else if (canonical(entry.after) !== canonical(ack.record)) problems.push(`acknowledged ${ack.kind} ${ack.id} version ${ack.version} differs from what history holds`);
    const current = records[ack.kind as RecordKind].find((r) => r.id === ack.id);
    if (!current) problems.push(`acknowledged ${ack.kind} ${ack.id} is gone`);
    else if (current.version < ack.version) problems.push(`${ack.kind} ${ack.id} is at version ${current.version}, below the acknowledged ${ack.version}`);
  }
  return problems;
}

describe('crash safety under SIGKILL', () => {
  it(`keeps every acknowledged write and no half-applied one across ${TRIALS} kills`, async () => {
    const random = seededRandom(SEED);
    const acks: Ack[] = [];
    const figures = { trials: 0, trialsWithAck: 0, killedBeforeReady: 0, acknowledged: 0, importsAcknowledged: 0, ackChecks: 0, unacknowledgedCommits: 0, buildsEvaluated: 0, partEditsChecked: 0, historyEntries: 0, imports: false };
    const started = Date.now();

    for (let trial = 0; trial < TRIALS; trial++) {
      const where = `trial ${trial} (seed ${SEED})`;
      const child = new ChildLines(script, [dbPath, String(SEED + trial), `t${trial}`]);
      if (random() < 0.15) {
        // Some kills land while the child is still opening the store.
        figures.killedBeforeReady++;
        await sleep(random() * 120);
      } else {
        const ready = await child.waitForLine((l) => l.includes('"ready"'), 15_000);
        expect(ready, `${where}: the child did not start: ${child.stderr}`).not.toBeNull();
        // Wait for the first acknowledged write, so that a loaded machine (a slow child) still
        // gives every such trial something to audit; then kill at a random later moment.
        const firstAck = await child.waitForLine((l) => l.includes('"t":"ack"'), 30_000);
        expect(firstAck, `${where}: the child acknowledged nothing: ${child.stderr}`).not.toBeNull();
        figures.trialsWithAck++;
        await sleep(5 + random() * 250);
      }
      await child.kill('SIGKILL');
      const exit = await child.exited;
      const lines = child.lines.filter((l) => l !== '').map((l) => JSON.parse(l) as ChildLine);
      const unexpected = lines.find((l) => l.t === 'unexpected');
      expect(unexpected, `${where}: ${JSON.stringify(unexpected)}`).toBeUndefined();
      expect(exit.signal, `${where}: the child ended on its own: ${child.stderr}`).toBe('SIGKILL');
      const ready = lines.find((l): l is Extract<ChildLine, { t: 'ready' }> => l.t === 'ready');
      if (ready) figures.imports = ready.imports;
      const trialAcks = lines.filter((l): l is Ack => l.t === 'ack');
      acks.push(...trialAcks);
      figures.acknowledged += trialAcks.length;
      figures.importsAcknowledged += trialAcks.filter((a) => a.op === 'import').length;

      const host = await openServiceHost({ dbPath, actor: 'auditor' });
      try {
        expect(await fileProblems(host), where).toEqual([]);
        const history = await readHistory(host);
        const records = await readRecords(host);
        const byVersion = historyByVersion(history);
        expect(ackProblems(acks, byVersion, records, history), where).toEqual([]);
        figures.ackChecks += acks.length;
        expect(historyChainProblems(records, byVersion, history), where).toEqual([]);
        const verdicts = verdictProblems(records);
        expect(verdicts.problems, where).toEqual([]);
        figures.buildsEvaluated += verdicts.buildsEvaluated;
        // Every part edit on record reaches builds whose verdicts were just found consistent.
        const partEdits = history.filter((h) => (PART_KINDS as readonly string[]).includes(h.entityKind) && h.action !== 'create');
        figures.partEditsChecked = partEdits.filter((h) => buildsUsing(records, h.entityKind, h.entityId).length > 0).length;
        // Writes the child committed but was killed before acknowledging: allowed, and counted.
        const written = history.filter((h) => h.reason === `crash trial t${trial}`).length;
        const ackedUpdates = trialAcks.filter((a) => a.op === 'update').length;
        figures.unacknowledgedCommits += Math.max(0, written - ackedUpdates);
        figures.historyEntries = history.length;
      } finally {
        await host.close();
      }
      figures.trials++;
    }

    expect(figures.trials).toBe(TRIALS);
    // Without acknowledged writes the run would prove nothing: every trial that was not killed
    // while opening waited for at least one, and most trials are of that kind.
    expect(figures.acknowledged).toBeGreaterThanOrEqual(figures.trialsWithAck);
    expect(figures.trialsWithAck).toBeGreaterThan(TRIALS / 2);
    console.log(
      `crash safety: ${figures.trials} SIGKILL trials (${figures.killedBeforeReady} while opening), ${figures.acknowledged} acknowledged writes, ` +
        `${figures.ackChecks} acknowledged-write checks, ${figures.unacknowledgedCommits} commits made just before a kill, ` +
        `${figures.buildsEvaluated} build verdicts re-evaluated, ${figures.partEditsChecked} part edits with their builds checked, ` +
        `${figures.historyEntries} history entries, fleet.import ${figures.imports ? `included (${figures.importsAcknowledged} acknowledged imports)` : 'not in the handler map yet'}, seed ${SEED}, ${Math.round((Date.now() - started) / 1000)} s`,
    );
  }, 240_000);

  it('would notice a write without its history, a stale verdict and a lost acknowledged write', async () => {
    const t = tempDir('rigbook-audit-');
    const host = await openServiceHost({ dbPath: t.file('store.sqlite'), actor: 'auditor' });
    try {
      const fleet = await seedSharedFleet(host, 6, seededRandom(11));
      const audit = async () => {
        const records = await readRecords(host);
        const history = await readHistory(host);
        return { records, history, chain: historyChainProblems(records, historyByVersion(history), history), verdicts: verdictProblems(records).problems };
      };
      const clean = await audit();
      expect([...clean.chain, ...clean.verdicts]).toEqual([]);

      // A record row bumped without its history entry: what a half-applied write would leave.
      await sql`update batteries set cycleCount = 99, version = version + 1 where id = ${fleet.batteries[0]}`.execute(host.ctx.db);
      expect((await audit()).chain).toEqual([`batteries ${fleet.batteries[0]}: version 2 has no history entry`]);

      // A verdict left behind by a write that did not re-check.
      const build = fleet.builds[0]!;
      const stored = (await audit()).records.verdicts.get(build)!.status;
      await sql`update verdicts set status = ${stored === 'over' ? 'clear' : 'over'} where buildId = ${build}`.execute(host.ctx.db);
      expect((await audit()).verdicts.join('\n')).toContain(`build ${build}: stored verdict`);

      // An acknowledged write that is not there.
      const after = await audit();
      const lost: Ack = { t: 'ack', op: 'update', kind: 'motors', id: fleet.motors[0]!, version: 5, record: {} };
      expect(ackProblems([lost], historyByVersion(after.history), after.records, after.history)).toEqual([
        `acknowledged update of motors ${fleet.motors[0]} at version 5 is missing from history`,
        `motors ${fleet.motors[0]} is at version 1, below the acknowledged 5`,
      ]);
    } finally {
      await host.close();
      t.remove();
    }
  });
});
