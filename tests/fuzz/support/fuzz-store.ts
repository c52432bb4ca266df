import Database from 'better-sqlite3';
import { copyFileSync, existsSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { openServiceHost } from '../../../src-main/service/open-service-host';
import { demoFleet } from '../../../demo-fixtures/demo-fleet';
import { ok } from '../../reliability/support/store-audit';
import { seededRandom } from '../../reliability/support/random';
import { seedSharedFleet } from '../../reliability/support/seed-fleet';
import { tableFingerprinter } from '../../reliability/support/fingerprint';

type Host = Awaited<ReturnType<typeof openServiceHost>>;

/**
 * A real SQLite file on a RAM-backed folder where there is one (/dev/shm): the fuzz commits
 * thousands of small writes and FULL fsyncs to a disk would make it crawl. Same engine, same
 * file format, same pragmas.
 */
export function fuzzDir(): { dir: string; remove: () => void } {
  const base = existsSync('/dev/shm') ? '/dev/shm' : tmpdir();
  // A run killed before its cleanup leaves its folder in memory; one a day old is nobody's any more.
  for (const name of readdirSync(base)) {
    const old = path.join(base, name);
    if (name.startsWith('rigbook-fuzz-') && Date.now() - statSync(old).mtimeMs > 24 * 3600 * 1000) rmSync(old, { recursive: true, force: true });
  }
  const dir = mkdtempSync(path.join(base, 'rigbook-fuzz-'));
  return { dir, remove: () => rmSync(dir, { recursive: true, force: true }) };
}

/** A seeded store to copy for each handler: a small fleet with every kind of record. */
export async function createTemplate(dir: string): Promise<string> {
  const file = path.join(dir, 'template.sqlite');
  const host = await openServiceHost({ demoFleet, dbPath: file, actor: 'seed' });
  const fleet = await seedSharedFleet(host, 6, seededRandom(7));
  const vehicle = await ok<{ id: string }>(host, 'vehicles.create', { name: 'Fuzz quad', kind: 'multirotor', massKg: 0.65, dragAreaM2: 0.01, className: 'club' });
  const prop = await ok<{ id: string }>(host, 'propellers.create', { name: 'Fuzz 5x4.3x3', diameterMm: 127, pitchMm: 109, blades: 3, thrustCoefficient: 0.11, powerCoefficient: 0.05 });
  const old = await ok<{ id: string }>(host, 'motors.create', { name: 'Archived can', kv: 2000 });
  await ok(host, 'motors.archive', { id: old.id, expectedVersion: 1, reason: 'seed' });
  await ok(host, 'builds.create', {
    name: 'Fuzz quad build',
    vehicleId: vehicle.id,
    motorId: fleet.motors[2],
    motorCount: 4,
    controllerId: fleet.controllers[1],
    propellerId: prop.id,
    supplies: [{ batteryIds: [fleet.batteries[3]] }],
  });
  await host.close();
  return file;
}

export interface FuzzStore {
  host: Host;
  /** Commits made by any other connection since the last look (PRAGMA data_version). */
  dataVersion(): number;
  /** Row count, highest version and a hash of the rows, for every table in the file. */
  fingerprint(): string;
  ids(kind: string): string[];
  version(kind: string, id: string): number;
  close(): Promise<void>;
}

/** Copies the template and opens it twice: the service host under test, and a plain connection that only watches. */
export async function openFuzzStore(template: string, dir: string, name: string): Promise<FuzzStore> {
  const file = path.join(dir, `${name.replace(/[^A-Za-z0-9.-]/g, '_')}.sqlite`);
  copyFileSync(template, file);
  const host = await openServiceHost({ demoFleet, dbPath: file, actor: 'fuzz' });
  const watcher = new Database(file);
  const fingerprint = tableFingerprinter(watcher);
  return {
    host,
    dataVersion: () => watcher.pragma('data_version', { simple: true }) as number,
    fingerprint,
    ids: (kind) => watcher.prepare(`select id from "${kind}" order by id`).pluck().all() as string[],
    version: (kind, id) => (watcher.prepare(`select version from "${kind}" where id = ?`).pluck().get(id) as number | undefined) ?? 1,
    close: async () => {
      watcher.close();
      await host.close();
    },
  };
}
