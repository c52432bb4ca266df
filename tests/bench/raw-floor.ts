// The raw floor of a re-check: what the same work costs with hand-written SQL on prepared
// statements and nothing in between. It opens the store file with better-sqlite3 directly
// (same pragmas as the app), edits the motor, reads the same rows the service reads, runs the
// same pure evaluation (so the ratio to the service isolates the data layer, not the physics),
// compares each fresh verdict row with the stored one and writes only the rows that changed, then
// the history row, its selector row and a link for each build whose verdict changed, in one
// transaction.

import Database from 'better-sqlite3';
import type { Battery, BuildContext, BuildVerdict, ClassRule, Controller, Motor, Propeller, Status, Supply, Vehicle } from '../../src-main/core/domain';
import { evaluateBuild } from '../../src-main/core/evaluate';
import { encodeRuleStatuses } from '../../src-main/core/rule-statuses';
import { applyPragmas } from '../../src-main/store/open-database';

export interface FloorTiming {
  /** The whole transaction, BEGIN to COMMIT, as the caller waits for it. */
  totalMs: number;
  readMs: number;
  evaluateMs: number;
  writeMs: number;
  commitMs: number;
  builds: number;
  changes: number;
  /** Verdict rows written: those that differ from the stored row. */
  written: number;
}

/** A build as the `builds` statement returns it, column by column. */
type BuildRow = [
  id: string,
  vehicleId: string,
  motorId: string | null,
  motorCount: number,
  controllerId: string | null,
  propellerId: string | null,
  pinionTeeth: number | null,
  spurTeeth: number | null,
  internalRatio: number,
  tireDiameterMm: number | null,
  drivetrainEfficiency: number,
  measuredPeakCurrentA: number | null,
  measuredAverageCurrentA: number | null,
  tightThreshold: number | null,
];

type Row = Record<string, unknown>;

/**
 * The statements. Rows the re-check reads by the thousand come back as arrays (`.raw()`):
 * better-sqlite3 spends most of a wide row's cost building its object. Part records, a few
 * hundred at most, come back as objects because the evaluation takes them that way; they are
 * fetched by the distinct ids the builds name (json_each over one bound JSON list).
 */
const SQL = {
  motor: 'select * from motors where id = ?',
  updateMotor: 'update motors set maxCurrentA = ?, version = version + 1, updatedAt = ? where id = ? and version = ?',
  threshold: "select value from settings where key = 'tightThreshold'",
  builds: `select id, vehicleId, motorId, motorCount, controllerId, propellerId, pinionTeeth, spurTeeth, internalRatio, tireDiameterMm,
    drivetrainEfficiency, measuredPeakCurrentA, measuredAverageCurrentA, tightThreshold from builds where motorId = ?`,
  supplyPacks: `select s.buildId, s.id, s.arrangement, sp.batteryId from builds b join supplies s on s.buildId = b.id
    left join supplyPacks sp on sp.supplyId = s.id where b.motorId = ? order by s.buildId, s.position, sp.position`,
  packs: 'select * from batteries where id in (select value from json_each(?))',
  vehicles: 'select * from vehicles where id in (select value from json_each(?))',
  motors: 'select * from motors where id in (select value from json_each(?))',
  controllers: 'select * from controllers where id in (select value from json_each(?))',
  propellers: 'select * from propellers where id in (select value from json_each(?))',
  classRules: 'select * from classRules where archivedAt is null and className in (select value from json_each(?))',
  stored: `select v.buildId, v.status, v.supplyStatuses, v.ruleStatuses, v.supplyVoltageFullV, v.theoreticalSpeedKmh, v.peakCurrentA, v.peakCurrentLimitA, v.currentRule, v.currentSource
    from builds b join verdicts v on v.buildId = b.id where b.motorId = ?`,
  upsertVerdict: `insert into verdicts (buildId, status, supplyVoltageFullV, theoreticalSpeedKmh, peakCurrentA, peakCurrentLimitA, currentRule, currentSource, supplyStatuses, ruleStatuses, evaluatedAt)
    values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)
    on conflict (buildId) do update set status = excluded.status, supplyVoltageFullV = excluded.supplyVoltageFullV,
      theoreticalSpeedKmh = excluded.theoreticalSpeedKmh, peakCurrentA = excluded.peakCurrentA, peakCurrentLimitA = excluded.peakCurrentLimitA,
      currentRule = excluded.currentRule, currentSource = excluded.currentSource,
      supplyStatuses = excluded.supplyStatuses, ruleStatuses = excluded.ruleStatuses, evaluatedAt = excluded.evaluatedAt`,
  history: `insert into history (at, actor, action, entityKind, entityId, summary, reason, before, after, verdictChanges)
    values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
  historySelector: "insert into historySelectors (historyId, selects, partKind, target) values (?, 'part', 'motors', ?)",
  historyBuild: 'insert into historyBuilds (historyId, buildId) values (?, ?)',
} as const;

/** Statements whose rows come back as arrays. */
const RAW_ROWS: ReadonlySet<keyof typeof SQL> = new Set(['builds', 'supplyPacks', 'stored']);

const bookkeeping = (row: Row): Row => {
  const { createdAt: _c, updatedAt: _u, ...rest } = row;
  return rest;
};

function byId<T extends { id: string }>(rows: Row[], map: (row: Row) => T = (row) => bookkeeping(row) as unknown as T): Map<string, T> {
  return new Map(rows.map((row) => [row.id as string, map(row)]));
}

/** The list figures of a verdict row, computed the way the store keeps them (the tightest current check's value and limit). */
function rowValues(verdict: BuildVerdict): [number | null, number | null, number | null, number | null, string | null, string | null, string, string] {
  let fullV: number | null = null;
  let speed: number | null = null;
  let peak: number | null = null;
  let limit: number | null = null;
  let rule: string | null = null;
  let source: string | null = null;
  let tightest = Number.POSITIVE_INFINITY;
  const statuses: string[] = [];
  for (const s of verdict.supplies) {
    const f = s.figures;
    if (f.packVoltageFullV !== null && (fullV === null || f.packVoltageFullV > fullV)) fullV = f.packVoltageFullV;
    if (f.theoreticalSpeedKmh !== null && (speed === null || f.theoreticalSpeedKmh > speed)) speed = f.theoreticalSpeedKmh;
    for (const finding of s.findings) {
      if (finding.unit !== 'A' || finding.margin === null || finding.value === null || finding.limit === null) continue;
      if (finding.margin < tightest) {
        tightest = finding.margin;
        peak = finding.value;
        limit = finding.limit;
        rule = finding.rule;
        source = finding.source ?? f.currentSource;
      }
    }
    if (peak === null && f.peakCurrentA !== null) {
      peak = f.peakCurrentA;
      source = f.currentSource;
    }
    statuses.push(`${s.supplyId}=${s.status}`);
  }
  // The checks that are not clear, by the store's own pure encoder, as the evaluation is the engine's own.
  return [fullV, speed, peak, limit, rule, source, statuses.join(','), encodeRuleStatuses(verdict)];
}

export class RawFloor {
  readonly raw: Database.Database;
  private readonly st: { [K in keyof typeof SQL]: Database.Statement };

  constructor(dbPath: string) {
    this.raw = new Database(dbPath);
    // The same durability as the app (WAL, synchronous FULL, foreign keys), or the floor would be a different thing.
    applyPragmas(this.raw);
    this.st = Object.fromEntries(
      Object.entries(SQL).map(([key, sql]) => {
        const statement = this.raw.prepare(sql);
        return [key, RAW_ROWS.has(key as keyof typeof SQL) ? statement.raw() : statement];
      }),
    ) as RawFloor['st'];
  }

  /** Sets the motor's maxCurrentA and re-checks every build that uses it, as `motors.update` does. */
  editMotor(motorId: string, maxCurrentA: number, at: string): FloorTiming {
    const st = this.st;
    const t: Omit<FloorTiming, 'totalMs' | 'commitMs'> = { readMs: 0, evaluateMs: 0, writeMs: 0, builds: 0, changes: 0, written: 0 };
    const started = performance.now();
    let bodyDone = 0;
    this.raw.transaction(() => {
      let mark = performance.now();
      const before = st.motor.get(motorId) as Row;
      if (st.updateMotor.run(maxCurrentA, at, motorId, before.version).changes !== 1) throw new Error('raw floor: the motor was not updated');
      const after = st.motor.get(motorId) as Row;
      const threshold = JSON.parse((st.threshold.get() as { value: string } | undefined)?.value ?? '0.15') as number;
      const builds = st.builds.all(motorId) as BuildRow[];
      const supplies = new Map<string, Supply[]>();
      const packIds = new Set<string>();
      let last: Supply | null = null;
      for (const [buildId, supplyId, arrangement, batteryId] of st.supplyPacks.all(motorId) as [string, string, Supply['arrangement'], string | null][]) {
        if (last === null || last.id !== supplyId) {
          last = { id: supplyId, arrangement, batteryIds: [] };
          const list = supplies.get(buildId);
          if (list) list.push(last);
          else supplies.set(buildId, [last]);
        }
        if (batteryId !== null) {
          last.batteryIds.push(batteryId);
          packIds.add(batteryId);
        }
      }
      const ids = (column: number) => {
        const set = new Set<string>();
        for (const b of builds) if (b[column] !== null) set.add(b[column] as string);
        return JSON.stringify([...set]);
      };
      const packs = byId<Battery>(st.packs.all(JSON.stringify([...packIds])) as Row[], (row) => ({ ...bookkeeping(row), retired: row.retired === 1 }) as unknown as Battery);
      const vehicles = byId<Vehicle>(st.vehicles.all(ids(1)) as Row[]);
      const motors = byId<Motor>(st.motors.all(ids(2)) as Row[]);
      const controllers = byId<Controller>(st.controllers.all(ids(4)) as Row[]);
      const propellers = byId<Propeller>(st.propellers.all(ids(5)) as Row[]);
      const classNames = new Set<string>();
      for (const v of vehicles.values()) if (v.className !== '') classNames.add(v.className);
      const rulesByClass = new Map<string, ClassRule[]>();
      for (const row of (classNames.size === 0 ? [] : st.classRules.all(JSON.stringify([...classNames]))) as Row[]) {
        const rule = bookkeeping(row) as unknown as ClassRule;
        rulesByClass.set(rule.className, [...(rulesByClass.get(rule.className) ?? []), rule]);
      }
      const stored = new Map<string, { status: string; supplyStatuses: string; ruleStatuses: string; figures: unknown[] }>();
      for (const [buildId, status, supplyStatuses, ruleStatuses, ...figures] of st.stored.all(motorId) as [string, string, string, string, ...unknown[]][]) stored.set(buildId, { status, supplyStatuses, ruleStatuses, figures });
      let now = performance.now();
      t.readMs = now - mark;
      mark = now;

      const verdicts: BuildVerdict[] = [];
      for (const b of builds) {
        const [id, vehicleId, motorRef, motorCount, controllerId, propellerId, pinionTeeth, spurTeeth, internalRatio, tireDiameterMm, drivetrainEfficiency] = b;
        const vehicle = vehicles.get(vehicleId) ?? null;
        const context: BuildContext = {
          // Keys in the store's own order, so the evaluation meets objects of the shape it always meets.
          build: {
            id,
            version: 0,
            archivedAt: null,
            notes: '',
            name: '',
            vehicleId,
            motorId: motorRef,
            motorCount,
            controllerId,
            propellerId,
            gearing: { pinionTeeth, spurTeeth, internalRatio, tireDiameterMm, drivetrainEfficiency },
            supplies: supplies.get(id) ?? [],
            measuredPeakCurrentA: b[11],
            measuredAverageCurrentA: b[12],
            tightThreshold: b[13],
          },
          vehicle,
          motor: motorRef === null ? null : (motors.get(motorRef) ?? null),
          controller: controllerId === null ? null : (controllers.get(controllerId) ?? null),
          propeller: propellerId === null ? null : (propellers.get(propellerId) ?? null),
          batteries: packs,
          classRules: vehicle ? (rulesByClass.get(vehicle.className) ?? []) : [],
          defaultTightThreshold: threshold,
        };
        verdicts.push(evaluateBuild(context, { messages: false }));
      }
      now = performance.now();
      t.evaluateMs = now - mark;
      mark = now;

      const changes: { buildId: string; supplyId: string | null; from: Status | null; to: Status }[] = [];
      for (const v of verdicts) {
        const [fullV, speed, peak, limit, rule, source, supplyStatuses, ruleStatuses] = rowValues(v);
        const before = stored.get(v.buildId);
        if (before?.status !== v.status) changes.push({ buildId: v.buildId, supplyId: null, from: (before?.status ?? null) as Status | null, to: v.status });
        if (before?.supplyStatuses !== supplyStatuses) {
          const old = new Map((before?.supplyStatuses ?? '').split(',').map((pair) => [pair.slice(0, pair.lastIndexOf('=')), pair.slice(pair.lastIndexOf('=') + 1)]));
          for (const s of v.supplies) {
            const from = (old.get(s.supplyId) ?? null) as Status | null;
            if (from !== s.status) changes.push({ buildId: v.buildId, supplyId: s.supplyId, from, to: s.status });
          }
        }
        const same =
          before !== undefined &&
          before.status === v.status &&
          before.supplyStatuses === supplyStatuses &&
          before.ruleStatuses === ruleStatuses &&
          before.figures[0] === fullV &&
          before.figures[1] === speed &&
          before.figures[2] === peak &&
          before.figures[3] === limit &&
          before.figures[4] === rule &&
          before.figures[5] === source;
        if (!same) {
          st.upsertVerdict.run(v.buildId, v.status, fullV, speed, peak, limit, rule, source, supplyStatuses, ruleStatuses, at);
          t.written += 1;
        }
      }
      const history = st.history.run(
        at,
        'bench',
        'update',
        'motors',
        motorId,
        `Changed motor "${String(after.name)}": maxCurrentA ${String(before.maxCurrentA)} → ${maxCurrentA}`,
        'benchmark (raw floor)',
        JSON.stringify(bookkeeping(before)),
        JSON.stringify(bookkeeping(after)),
        JSON.stringify(changes),
      );
      st.historySelector.run(history.lastInsertRowid, motorId);
      for (const buildId of new Set(changes.map((c) => c.buildId))) st.historyBuild.run(history.lastInsertRowid, buildId);
      t.writeMs = performance.now() - mark;
      t.builds = builds.length;
      t.changes = changes.length;
      bodyDone = performance.now();
    })();
    const totalMs = performance.now() - started;
    return { ...t, totalMs, commitMs: performance.now() - bodyDone };
  }

  close(): void {
    this.raw.close();
  }
}
