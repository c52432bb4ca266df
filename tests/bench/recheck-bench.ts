// The re-check a part edit sets off, end to end through the real handler map, beside the raw
// floor doing the same reads, evaluation and writes with hand-written SQL. Runs alternate
// (service, floor, service, floor …) so a burst of load on the shared machine hits both alike.

import { createHash } from 'node:crypto';
import { PerformanceObserver, type PerformanceEntry } from 'node:perf_hooks';
import { HOT_MOTOR_ID } from '../../demo-fixtures/generate-fleet';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { RawFloor, type FloorTiming } from './raw-floor';
import { median, settle, worst } from './stats';

export interface RecheckBench {
  builds: number;
  serviceMs: number[];
  floor: FloorTiming[];
  /** Median of each step of the floor. */
  floorPhases: Record<'read' | 'evaluate' | 'write' | 'commit', number>;
  /** Median of each step of the service path, or why it could not be measured. */
  servicePhases: Record<string, number> | string;
  /** The floor and the service left the same verdict rows after the same edit. */
  sameRows: boolean;
  /** Builds the last service edit re-checked, as `motors.update` reports it. */
  rechecked: number;
  /** Verdict rows the last timed floor run wrote (the service writes the same: rows that changed). */
  written: number;
  /** Median garbage-collection pause inside a service call and inside a floor run, ms. */
  serviceGcMs: number;
  floorGcMs: number;
  /** Store size (file + WAL, after a checkpoint) before and after the timed edits, and how many edits wrote history. */
  storeBytes: { before: number; after: number; edits: number };
}

interface UpdateAnswer {
  record: { version: number };
  rechecked: number;
}

async function verdictFingerprint(floor: RawFloor): Promise<string> {
  const rows = floor.raw.prepare('select buildId, status, supplyVoltageFullV, theoreticalSpeedKmh, peakCurrentA, peakCurrentLimitA, currentRule, currentSource, supplyStatuses, ruleStatuses from verdicts order by buildId').raw().all();
  return createHash('sha256').update(JSON.stringify(rows)).digest('hex');
}

/** The store's size with its WAL folded in: page count × page size after a checkpoint. */
function storeSize(floor: RawFloor): number {
  floor.raw.pragma('wal_checkpoint(TRUNCATE)');
  return Number(floor.raw.pragma('page_count', { simple: true })) * Number(floor.raw.pragma('page_size', { simple: true }));
}

/** Sum of the garbage-collection pauses that started inside [from, to] (performance.now() times). */
function gcWithin(entries: readonly PerformanceEntry[], from: number, to: number): number {
  let ms = 0;
  for (const e of entries) if (e.startTime >= from && e.startTime <= to) ms += e.duration;
  return ms;
}

export async function benchRecheck(dbPath: string, runs: number): Promise<RecheckBench> {
  const host = await openServiceHost({ dbPath, actor: 'bench' });
  const floor = new RawFloor(dbPath);
  const gc: PerformanceEntry[] = [];
  const observer = new PerformanceObserver((list) => gc.push(...list.getEntries()));
  observer.observe({ entryTypes: ['gc'] });
  try {
    const sizeBefore = storeSize(floor);
    const serviceWindows: [number, number][] = [];
    const floorWindows: [number, number][] = [];
    const serviceMs: number[] = [];
    const floorRuns: FloorTiming[] = [];
    let serviceRows = '';
    let rechecked = 0;
    // One untimed pair first: statements prepared, pages cached, JIT warm, on both sides.
    for (let r = -1; r < runs; r++) {
      // The service always sets one value and the floor the other, so each side's edit is a real
      // change from the state the other left, and both write the same rows (those that changed).
      const maxCurrentA = 151;
      const got = await host.call('motors.get', { id: HOT_MOTOR_ID });
      if (!got.ok) throw new Error(`motors.get: ${got.error.message}`);
      const version = (got.value as { version: number }).version;
      await settle();
      const started = performance.now();
      const answer = await host.call('motors.update', {
        id: HOT_MOTOR_ID,
        expectedVersion: version,
        changes: { maxCurrentA },
        reason: 'benchmark: harmless edit that re-checks every build using the motor',
      });
      const ms = performance.now() - started;
      if (!answer.ok) throw new Error(`motors.update: ${answer.error.message}`);
      rechecked = (answer.value as UpdateAnswer).rechecked;
      if (r === runs - 1) serviceRows = await verdictFingerprint(floor);
      await settle();
      const floorStarted = performance.now();
      const f = floor.editMotor(HOT_MOTOR_ID, 150, new Date().toISOString());
      const floorEnded = performance.now();
      if (r >= 0) {
        serviceMs.push(ms);
        floorRuns.push(f);
        serviceWindows.push([started, started + ms]);
        floorWindows.push([floorStarted, floorEnded]);
      }
    }
    // One more untimed floor edit to the service's value: the rows it leaves must be the service's.
    floor.editMotor(HOT_MOTOR_ID, 151, new Date().toISOString());
    const sameRows = serviceRows === (await verdictFingerprint(floor));
    const sizeAfter = storeSize(floor);
    await settle(); // the observer reports asynchronously
    let servicePhases: RecheckBench['servicePhases'];
    try {
      const { servicePhases: measure } = await import('./service-breakdown');
      const samples: Record<string, number>[] = [];
      for (let r = 0; r < Math.min(3, runs); r++) {
        await settle();
        samples.push({ ...(await measure(host.ctx.db, HOT_MOTOR_ID)) });
      }
      servicePhases = Object.fromEntries(Object.keys(samples[0] ?? {}).map((k) => [k, median(samples.map((s) => s[k] ?? Number.NaN))]));
    } catch (error) {
      servicePhases = `not measured: ${error instanceof Error ? error.message : String(error)}`;
    }
    return {
      builds: floorRuns[0]?.builds ?? 0,
      serviceMs,
      floor: floorRuns,
      floorPhases: {
        read: median(floorRuns.map((f) => f.readMs)),
        evaluate: median(floorRuns.map((f) => f.evaluateMs)),
        write: median(floorRuns.map((f) => f.writeMs)),
        commit: median(floorRuns.map((f) => f.commitMs)),
      },
      servicePhases,
      sameRows,
      rechecked,
      written: floorRuns.at(-1)?.written ?? 0,
      serviceGcMs: median(serviceWindows.map(([from, to]) => gcWithin(gc, from, to))),
      floorGcMs: median(floorWindows.map(([from, to]) => gcWithin(gc, from, to))),
      // Every timed edit, the untimed pair and the closing floor edit wrote a history entry.
      storeBytes: { before: sizeBefore, after: sizeAfter, edits: 2 * (runs + 1) + 1 },
    };
  } finally {
    observer.disconnect();
    floor.close();
    await host.close();
  }
}

export function summary(b: RecheckBench): { serviceMedian: number; serviceWorst: number; floorMedian: number; floorWorst: number; ratio: number } {
  const serviceMedian = median(b.serviceMs);
  const floorMedian = median(b.floor.map((f) => f.totalMs));
  return { serviceMedian, serviceWorst: worst(b.serviceMs), floorMedian, floorWorst: worst(b.floor.map((f) => f.totalMs)), ratio: serviceMedian / floorMedian };
}
