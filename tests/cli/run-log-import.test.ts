import { writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { tempDirsPerTest } from '../helpers/temp-dir';
import { rigbook } from './run';

const t = tempDirsPerTest();

/** A store with one buggy build on one 2S pack, through the service as the window would make it. */
async function storeWithBuild(db: string): Promise<{ buildId: string; supplyId: string }> {
  const host = await openServiceHost({ dbPath: db, actor: 'seed' });
  const call = async (name: string, args: unknown) => {
    const r = await host.call(name, args);
    if (!r.ok) throw new Error(r.error.message);
    return r.value as { id: string; record: { id: string; supplies: { id: string }[] } };
  };
  const vehicle = await call('vehicles.create', { name: 'Blue short-course truck', kind: 'truck', massKg: 2.4 });
  const pack = await call('batteries.create', { name: 'Blue 2S 5000', chemistry: 'lipo', cellsSeries: 2, capacityMah: 5000 });
  const build = await call('builds.create', { name: 'Blue truck on 2S', vehicleId: vehicle.id, supplies: [{ batteryIds: [pack.id] }] });
  await host.close();
  return { buildId: build.record.id, supplyId: build.record.supplies[0]!.id };
}

describe('rigbook import --run-log', () => {
  it('imports a telemetry CSV onto a build and prints its summary', async () => {
    const dir = t();
    const db = dir.file('store.sqlite');
    const { buildId, supplyId } = await storeWithBuild(db);
    // t = 0, 1, 3 s; i = 10, 20, 20 A: 55 A·s over 3 s, an average of 18.33 A (trapezoid rule, worked by hand).
    writeFileSync(dir.file('run.csv'), 'Time (s),Current (A),Voltage (V)\n0,10,8.3\n1,20,7.9\n3,20,8.0\n');
    const run = await rigbook(['import', 'run.csv', '--run-log', '--build', buildId, '--supply', '1', '--name', 'Heat 2', '--db', db], { cwd: dir.dir });
    expect(run.err).toBe('');
    expect(run.code).toBe(0);
    expect(run.out).toMatch(new RegExp(`^Imported run\\.csv as run log "Heat 2" \\(3 samples over 3 s\\) for build ${buildId}, supply ${supplyId}\\.`));
    expect(run.out).toMatch(/peak current 20 A, average 18\.33 A/);
    const json = await rigbook(['import', 'run.csv', '--run-log', '--build', buildId, '--json', '--db', db], { cwd: dir.dir });
    expect(JSON.parse(json.out)).toMatchObject({ buildId, supplyId, peakCurrentA: 20, sampleCount: 3 });
  });

  it('refuses a log with a bad row, naming the line, and writes nothing', async () => {
    const dir = t();
    const db = dir.file('store.sqlite');
    const { buildId } = await storeWithBuild(db);
    writeFileSync(dir.file('bad.csv'), 'Time (s),Current (A)\n0,10\n1,ten\n2,20\n');
    const run = await rigbook(['import', 'bad.csv', '--run-log', '--build', buildId, '--db', db], { cwd: dir.dir });
    expect(run.code).toBe(3);
    expect(run.err).toMatch(/line 3: "Current \(A\)" holds "ten", not a number/);
    const host = await openServiceHost({ dbPath: db, actor: 'check' });
    const listed = await host.call('runLogs.list', { buildId });
    await host.close();
    expect(listed).toEqual({ ok: true, value: [] });
  });

  it('asks for --build, and refuses a supply number the build does not have', async () => {
    const dir = t();
    const db = dir.file('store.sqlite');
    const { buildId } = await storeWithBuild(db);
    writeFileSync(dir.file('run.csv'), 'Time (s),Current (A)\n0,10\n1,20\n');
    const noBuild = await rigbook(['import', 'run.csv', '--run-log', '--db', db], { cwd: dir.dir });
    expect(noBuild.code).toBe(5);
    expect(noBuild.err).toMatch(/--run-log needs --build ID/);
    const noSupply = await rigbook(['import', 'run.csv', '--run-log', '--build', buildId, '--supply', '2', '--db', db], { cwd: dir.dir });
    expect(noSupply.err).toMatch(/--supply 2: build "Blue truck on 2S" has 1 supply/);
  });
});

describe('rigbook check on a version 2 file', () => {
  it('judges a pack by its log, as the store does: a puffed inspection is over', async () => {
    const dir = t();
    const db = dir.file('store.sqlite');
    const { buildId } = await storeWithBuild(db);
    const host = await openServiceHost({ dbPath: db, actor: 'seed' });
    const packs = (await host.call('batteries.list', {})) as { ok: true; value: { id: string }[] };
    const packId = packs.value[0]!.id;
    await host.call('packLog.add', { batteryId: packId, at: '2026-11-02', kind: 'inspection', puffed: true });
    const exported = (await host.call('fleet.export', {})) as { ok: true; value: unknown };
    await host.close();
    writeFileSync(dir.file('fleet.json'), JSON.stringify(exported.value));
    const run = await rigbook(['check', 'fleet.json', '--json'], { cwd: dir.dir });
    const report = JSON.parse(run.out) as { builds: { id: string; status: string; supplies: { findings: { rule: string; status: string }[] }[] }[] };
    const build = report.builds.find((b) => b.id === buildId)!;
    expect(build.supplies[0]!.findings.find((f) => f.rule === 'pack-health')?.status).toBe('over');
    expect(build.status).toBe('over');
    expect(run.code).toBe(1);
  });
});
