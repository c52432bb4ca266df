// Child of the crash-safety test: opens the store through openServiceHost and writes through
// the real handler map until it is killed, printing one acknowledgement line (JSON) after
// every call that returned ok. The parent kills it with SIGKILL at random moments and checks
// that every acknowledged write survived and nothing is half-applied.
//
//   node crash-writer.cjs DB_PATH SEED TAG

import { openServiceHost } from '../../../src-main/service/open-service-host';
import { handlers } from '../../../src-main/service/handlers';
import type { CallResult } from '../../../src-main/service/contract';
import { seededRandom } from '../support/random';

export type Ack =
  | { t: 'ack'; op: 'update' | 'create' | 'archive'; kind: string; id: string; version: number; record: Record<string, unknown> }
  | { t: 'ack'; op: 'settings'; tightThreshold: number }
  | { t: 'ack'; op: 'import'; historyId: number; pack: Record<string, unknown>; buildId: string; sharedId: string; sharedVersion: number };

export type ChildLine = { t: 'ready'; imports: boolean } | Ack | { t: 'unexpected'; name: string; error: unknown };

const [dbPath, seedText, tag] = process.argv.slice(2);

const random = seededRandom(Number(seedText));
const pick = <T>(items: readonly T[]): T => items[Math.floor(random() * items.length)] as T;
const int = (lo: number, hi: number): number => lo + Math.floor(random() * (hi - lo + 1));

function out(line: ChildLine): void {
  process.stdout.write(`${JSON.stringify(line)}\n`);
}

interface Known {
  id: string;
  version: number;
  archived: boolean;
}

// Values chosen so that edits move verdicts between clear, tight and over for many builds.
const PART_EDITS: Record<string, () => Record<string, unknown>> = {
  batteries: () => ({ cRatingContinuous: pick([5, 15, 30, 60, 100]), cRatingBurst: pick([10, 40, 120, 200]), cycleCount: int(0, 500) }),
  motors: () => ({ maxCurrentA: pick([30, 60, 120, 200]), maxVoltageV: pick([null, 8.4, 17.4, 30]) }),
  controllers: () => ({ continuousCurrentA: pick([20, 60, 120, 250]), burstCurrentA: pick([null, 100, 400, 800]) }),
  vehicles: () => ({ massKg: pick([1.2, 1.6, 2.4, 4]), className: pick(['', 'club']) }),
  classRules: () => ({ limit: pick([5, 9, 20, 40]) }),
};

async function main(): Promise<void> {
  const host = await openServiceHost({ dbPath: dbPath!, actor: 'crash-writer' });
  const call = async (name: string, args: unknown): Promise<Record<string, unknown>> => {
    const result: CallResult = await host.call(name, args);
    if (!result.ok) {
      // A single writer never meets a conflict: anything refused here is a finding.
      out({ t: 'unexpected', name, error: result.error });
      process.exit(3);
    }
    return result.value as Record<string, unknown>;
  };

  const known: Record<string, Known[]> = {};
  for (const kind of ['batteries', 'motors', 'controllers', 'vehicles', 'classRules'] as const) {
    const list = (await call(`${kind}.list`, { includeArchived: true })) as unknown as Array<{ id: string; version: number; archivedAt: string | null }>;
    known[kind] = list.map((r) => ({ id: r.id, version: r.version, archived: r.archivedAt !== null }));
  }
  const builds = (await call('builds.list', { includeArchived: true })) as unknown as Array<{ id: string; version: number; archivedAt: string | null }>;
  known.builds = builds.map((b) => ({ id: b.id, version: b.version, archived: b.archivedAt !== null }));
  let threshold = ((await call('settings.get', {})) as { tightThreshold: number }).tightThreshold;
  const imports = 'fleet.import' in handlers;
  out({ t: 'ready', imports });

  const ids = (kind: string) => (known[kind] ?? []).map((k) => k.id);
  let created = 0;
  let imported = 0;
  const ackRecord = (op: 'update' | 'create' | 'archive', kind: string, record: Record<string, unknown>) => {
    const id = String(record.id);
    const version = Number(record.version);
    const list = known[kind]!;
    const entry = list.find((k) => k.id === id);
    if (entry) {
      entry.version = version;
      entry.archived = record.archivedAt !== null;
    } else list.push({ id, version, archived: record.archivedAt !== null });
    out({ t: 'ack', op, kind, id, version, record });
  };
  const gearing = () => ({ pinionTeeth: int(12, 30), spurTeeth: pick([76, 84, 87]), internalRatio: 2.6, tireDiameterMm: pick([84, 110]), drivetrainEfficiency: 0.9 });
  // One physical pack can be in one place only: the packs of a build are all different.
  const supplies = () => {
    const packs = [...ids('batteries')];
    const take = (): string[] => (packs.length > 0 ? packs.splice(Math.floor(random() * packs.length), 1) : []);
    return Array.from({ length: int(1, 2) }, () => ({ arrangement: pick(['series', 'parallel'] as const), batteryIds: Array.from({ length: int(1, 2) }, take).flat() })).filter((s) => s.batteryIds.length > 0);
  };

  for (;;) {
    const roll = random();
    if (roll < 0.4) {
      // A shared part: every build using it is re-checked inside the same transaction.
      const kind = pick(['batteries', 'batteries', 'motors', 'motors', 'controllers', 'vehicles', 'classRules']);
      const target = pick(known[kind]!);
      const value = await call(`${kind}.update`, { id: target.id, expectedVersion: target.version, changes: PART_EDITS[kind]!(), reason: `crash trial ${tag}` });
      ackRecord('update', kind, value.record as Record<string, unknown>);
    } else if (roll < 0.55) {
      const id = `b-${tag}-${++created}`;
      const value = await call('builds.create', {
        id,
        name: `Crash build ${tag}/${created}`,
        vehicleId: pick(ids('vehicles')),
        motorId: pick(ids('motors')),
        controllerId: pick(ids('controllers')),
        gearing: gearing(),
        supplies: supplies(),
      });
      ackRecord('create', 'builds', value.record as Record<string, unknown>);
    } else if (roll < 0.8) {
      const target = pick(known.builds!);
      const changes = pick([{ gearing: gearing() }, { supplies: supplies() }, { motorId: pick(ids('motors')) }, { controllerId: pick(ids('controllers')), gearing: gearing() }]);
      const value = await call('builds.update', { id: target.id, expectedVersion: target.version, changes, reason: `crash trial ${tag}` });
      ackRecord('update', 'builds', value.record as Record<string, unknown>);
    } else if (roll < 0.9) {
      const target = pick(known.builds!);
      const value = await call('builds.archive', { id: target.id, expectedVersion: target.version, archived: !target.archived });
      ackRecord('archive', 'builds', value.record as Record<string, unknown>);
    } else if (roll < 0.93 || !imports) {
      // The default threshold re-checks every build: the longest transaction there is.
      const next = pick([0.1, 0.15, 0.2, 0.3].filter((t) => t !== threshold));
      const value = (await call('settings.update', { tightThreshold: next })) as { tightThreshold: number };
      threshold = value.tightThreshold;
      out({ t: 'ack', op: 'settings', tightThreshold: threshold });
    } else {
      // A fleet file merged in: a new pack and build, and a new rating for a pack many builds share.
      const n = ++imported;
      const shared = pick(known.batteries!);
      const current = (await call('batteries.get', { id: shared.id })) as Record<string, unknown>;
      const { version: _v, archivedAt: _a, ...sharedFields } = current;
      const pack = { id: `imp-${tag}-${n}`, name: `Imported ${tag}/${n}`, chemistry: 'lipo', cellsSeries: pick([2, 3, 4]), capacityMah: 4000, cRatingContinuous: pick([20, 60]), cRatingBurst: 100, cellResistanceOhm: 0.003 };
      const build = {
        id: `impb-${tag}-${n}`,
        name: `Imported build ${tag}/${n}`,
        vehicleId: pick(ids('vehicles')),
        motorId: pick(ids('motors')),
        controllerId: pick(ids('controllers')),
        gearing: gearing(),
        supplies: [{ batteryIds: [pack.id, shared.id] }],
      };
      const fleet = { format: 'rigbook-fleet', version: 1, batteries: [pack, { ...sharedFields, cRatingContinuous: pick([10, 25, 45, 90]) }], motors: [], controllers: [], propellers: [], vehicles: [], classRules: [], builds: [build] };
      const report = (await call('fleet.import', { fleet, mode: 'merge', reason: `crash import ${tag}` })) as { ok: boolean; historyId: number | null; problems: unknown[] };
      if (!report.ok) {
        out({ t: 'unexpected', name: 'fleet.import', error: report.problems });
        process.exit(3);
      }
      const after = (await call('batteries.get', { id: shared.id })) as { version: number };
      shared.version = after.version;
      out({ t: 'ack', op: 'import', historyId: report.historyId ?? -1, pack, buildId: build.id, sharedId: shared.id, sharedVersion: after.version });
    }
  }
}

main().catch((error: unknown) => {
  out({ t: 'unexpected', name: 'main', error: error instanceof Error ? error.message : String(error) });
  process.exit(4);
});
