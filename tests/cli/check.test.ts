import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { unit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { tempDirsPerTest } from '../helpers/temp-dir';
import { rigbook } from './run';

const EXAMPLE = join(process.cwd(), 'demo-fixtures', 'example-fleet.json');
const temp = tempDirsPerTest();

interface CheckOutput {
  builds: {
    id: string;
    name: string;
    status: string;
    supplies: {
      id: string;
      name: string;
      batteryIds: string[];
      status: string;
      figures: Record<string, number | string | null>;
      findings: Record<string, unknown>[];
      packShares: Record<string, unknown>[];
      assumptions: string[];
      valuesUsed: { field: string; value: number; basis: string }[];
      markedFigures: string[];
    }[];
  }[];
}

/** Writes `fleet` to `file` in the temp folder, checks it with `--json` (nothing on stderr), and gives the builds by id. */
async function checkedById(t: ReturnType<typeof temp>, file: string, fleet: unknown): Promise<Map<string, CheckOutput['builds'][number]>> {
  writeFileSync(t.file(file), JSON.stringify(fleet));
  const run = await rigbook(['check', t.file(file), '--json']);
  expect(run.err).toBe('');
  return new Map((JSON.parse(run.out) as CheckOutput).builds.map((b) => [b.id, b]));
}

describe('rigbook check', () => {
  it('--json prints exactly the documented shape, and exits 1 when something is over', async () => {
    const t = temp();
    const run = await rigbook(['check', EXAMPLE, '--json'], { env: { RIGBOOK_DB: t.file('never.sqlite') } });
    expect(run.code).toBe(1);
    const out = JSON.parse(run.out) as CheckOutput;
    expect(Object.keys(out)).toEqual(['builds']);
    expect(out.builds.map((b) => [b.id, b.status])).toEqual([
      ['truck-on-3s', 'clear'],
      ['truck-on-6s', 'over'],
    ]);
    for (const b of out.builds) {
      expect(Object.keys(b)).toEqual(['id', 'name', 'status', 'supplies']);
      for (const s of b.supplies) {
        expect(Object.keys(s)).toEqual(['id', 'name', 'batteryIds', 'status', 'figures', 'findings', 'packShares', 'assumptions', 'valuesUsed', 'markedFigures']);
        expect(Object.keys(s.figures)).toEqual(expect.arrayContaining(['packVoltageNominalV', 'packVoltageFullV', 'torqueConstantNmPerA', 'noLoadRpm', 'finalDriveRatio', 'theoreticalSpeedKmh', 'peakCurrentA', 'continuousCurrentA']));
        for (const finding of s.findings) expect(Object.keys(finding)).toEqual(['rule', 'status', 'value', 'limit', 'unit', 'margin', 'message']);
      }
    }
    // Build and supply names and ids, as the file has them (the supply id derived as <build id>.s1).
    expect(out.builds[1]).toMatchObject({ id: 'truck-on-6s', name: 'Truck on 6S (4S controller)' });
    expect(out.builds[1]!.supplies[0]).toMatchObject({ id: 'truck-on-6s.s1', name: '6S 5000 basher', batteryIds: ['pack-6s-5000'] });
    // Pure: no store was opened or created.
    expect(existsSync(t.file('never.sqlite'))).toBe(false);
  });

  it('--json rounds figures to 6 significant digits: no float noise', async () => {
    const out = JSON.parse((await rigbook(['check', EXAMPLE, '--json'])).out) as CheckOutput;
    const f = out.builds[0]!.supplies[0]!.figures;
    // 3 × 3.7 in binary floating point is 11.100000000000001; six significant digits give 11.1.
    expect(3 * 3.7).not.toBe(11.1);
    expect(f.packVoltageNominalV).toBe(11.1);
    for (const b of out.builds)
      for (const s of b.supplies) {
        for (const value of Object.values(s.figures)) if (typeof value === 'number') expect(value).toBe(Number(value.toPrecision(6)));
        for (const finding of s.findings)
          for (const key of ['value', 'limit', 'margin']) {
            const value = finding[key];
            if (typeof value === 'number') expect(value).toBe(Number(value.toPrecision(6)));
          }
      }
  });

  /** Equal to six significant digits, the precision `check --json` promises. */
  const close6 = (actual: unknown, expected: number) => expect(Math.abs((actual as number) - expected)).toBeLessThanOrEqual(Math.abs(expected) * 5e-6);

  it('the figures agree with values worked out independently', async () => {
    const run = await rigbook(['check', EXAMPLE, '--json']);
    const out = JSON.parse(run.out) as CheckOutput;
    const f = out.builds[0]!.supplies[0]!.figures;
    // 3 cells × 3.7 V nominal, × 4.20 V full (LiPo, cell makers' specification sheets).
    close6(f.packVoltageNominalV, 11.1);
    close6(f.packVoltageFullV, 12.6);
    // Kt = 1 / Kv in SI units (N·m/A = V·s/rad); Kv converted with mathjs: 3200 rev/min per volt.
    const kvRad = unit(3200, 'cycle/minute').toNumber('rad/s');
    close6(f.torqueConstantNmPerA, 1 / kvRad);
    // The trade's no-load figure: Kv × nominal voltage.
    close6(f.noLoadRpm, 3200 * 11.1);
    // Final drive = spur / pinion × internal ratio: 46 / 14 × 2.85.
    close6(f.finalDriveRatio, (46 / 14) * 2.85);
    // Wheel rpm × circumference (110 mm tyre), converted to km/h with mathjs.
    const wheelRevPerMin = (3200 * 11.1) / ((46 / 14) * 2.85);
    const expectedKmh = unit(wheelRevPerMin * Math.PI * unit(110, 'mm').toNumber('m'), 'm/minute').toNumber('km/h');
    close6(f.theoreticalSpeedKmh, expectedKmh);

    const over = out.builds[1]!.supplies[0]!.findings.find((x) => x.rule === 'controller-voltage')!;
    // 6 × 4.20 V against a controller rated for 4 cells (4 × 4.2 V).
    expect(over).toMatchObject({ status: 'over', unit: 'V' });
    close6(over.value, 25.2);
    close6(over.limit, 16.8);
    close6(over.margin, (16.8 - 25.2) / 16.8);
  });

  it('prints a readable table per build and supply', async () => {
    const run = await rigbook(['check', EXAMPLE]);
    expect(run.code).toBe(1);
    expect(run.out).toContain('OVER  Truck on 6S (4S controller)  [truck-on-6s]');
    expect(run.out).toContain('supply 1 of 1: 6S 5000 basher  →  OVER');
    expect(run.out).toMatch(/OVER\s+controller-voltage\s+25\.2 V\s+16\.8 V\s+-50\.0 %/);
    expect(run.out).toContain('2 builds checked: 1 over, 0 incomplete, 0 tight, 1 clear.');
    expect(run.out).toContain("follow the part maker's ratings");
    // The over finding by its short name, and the caution its rule calls for, once.
    expect(run.out).toContain('OVER Controller voltage (controller-voltage): Full-charge supply voltage is 25.2 V');
    expect(run.out.match(/Over-voltage can destroy a controller or motor at once/g)).toHaveLength(1);
  });

  it('--json carries the safe-side verdicts: conductance share, retired pack, unloaded tip speed, ranking', async () => {
    const t = temp();
    const fleet = JSON.parse(readFileSync(EXAMPLE, 'utf8')) as Record<string, Record<string, unknown>[]>;
    fleet.batteries!.push(
      { id: 'small', name: 'Small 3S 2200', chemistry: 'lipo', cellsSeries: 3, capacityMah: 2200, cRatingContinuous: 25, cRatingBurst: 50, cellResistanceOhm: 0.002 },
      { id: 'big', name: 'Big 3S 8000', chemistry: 'lipo', cellsSeries: 3, capacityMah: 8000, cRatingContinuous: 25, cRatingBurst: 50, cellResistanceOhm: 0.01 },
      { id: 'tired', name: 'Tired 3S', chemistry: 'lipo', cellsSeries: 3, capacityMah: 5000, cRatingContinuous: 50, cRatingBurst: 100, cellResistanceOhm: 0.003, retired: true },
    );
    fleet.propellers = [{ id: 'prop-5', name: '5 inch', diameterMm: 127, pitchMm: 109, blades: 3, thrustCoefficient: 0.11, powerCoefficient: 0.05 }];
    fleet.vehicles!.push({ id: 'quad', name: 'Quad', kind: 'multirotor', massKg: 0.7 });
    const truck = fleet.builds![0]!;
    fleet.builds!.push(
      { ...truck, id: 'pair', name: 'Mixed pair', supplies: [{ arrangement: 'parallel', batteryIds: ['small', 'big'] }], measuredPeakCurrentA: 106, measuredAverageCurrentA: 106 },
      { ...truck, id: 'tired-build', name: 'On a retired pack', supplies: [{ batteryIds: ['tired'] }] },
      { ...truck, id: 'quad-build', name: 'Quad', vehicleId: 'quad', propellerId: 'prop-5', motorCount: 4, gearing: { internalRatio: 1 }, supplies: [{ batteryIds: ['pack-6s-5000'] }] },
    );
    const byId = await checkedById(t, 'safe.json', fleet);

    const pair = byId.get('pair')!.supplies[0]!;
    const cont = pair.findings.find((x) => x.rule === 'battery-continuous')!;
    // Current division (Alexander & Sadiku, "Fundamentals of Electric Circuits", ch. 2): 106 × 30 ÷ 36 A.
    // The check output rounds to 6 significant digits (docs/command-line.md, check output).
    expect(cont.value as number).toBeCloseTo((106 * 30) / 36, 3);
    expect(cont.limit as number).toBeCloseTo(55, 9);
    expect(cont.status).toBe('over');
    expect(cont.message).toMatch(/pack "Small 3S 2200"/);
    expect(pair.packShares.map((p) => p.batteryId)).toEqual(['small', 'big']);

    expect(byId.get('tired-build')!.status).toBe('over');
    expect(byId.get('tired-build')!.supplies[0]!.findings.map((x) => x.rule)).toContain('pack-retired');

    const quad = byId.get('quad-build')!.supplies[0]!;
    // A propeller build: pitch speed, never a tyre speed; tip speed judged unloaded, above the static one.
    expect(quad.figures.theoreticalSpeedKmh).toBeNull();
    expect(quad.figures.pitchSpeedKmh).toBeGreaterThan(0);
    expect(quad.figures.tipSpeedMps as number).toBeGreaterThan(quad.figures.tipSpeedStaticMps as number);
    expect(quad.findings.find((x) => x.rule === 'prop-tip-speed')!.value).toBe(quad.figures.tipSpeedMps);

    // The cars and trucks carry their run: the continuous current judged is at least the steady one.
    const steady = byId.get('truck-on-3s')!.supplies[0]!.figures;
    expect(steady.continuousCurrentA as number).toBeGreaterThanOrEqual(steady.steadyCurrentA as number);
    expect(steady.runLengthS).toBe(4);
  });

  it('--json carries the wider figures, the typical and estimated values used and the figures resting on them', async () => {
    const t = temp();
    const fleet = JSON.parse(readFileSync(EXAMPLE, 'utf8')) as Record<string, Record<string, unknown>[]>;
    // Owners' builds as entered from scratch: a truck by kind and mass only, a quad's propeller by size only.
    fleet.vehicles!.push({ id: 'plain-truck', name: 'Plain truck', kind: 'truck', massKg: 3 }, { id: 'quad', name: 'Quad', kind: 'multirotor', massKg: 0.7 });
    fleet.propellers = [{ id: 'prop-5', name: '5 inch', diameterMm: 127, pitchMm: 109, blades: 3 }];
    const truck = fleet.builds![0]!;
    fleet.builds!.push(
      { ...truck, id: 'plain', name: 'Plain truck build', vehicleId: 'plain-truck' },
      { ...truck, id: 'quad-build', name: 'Quad', vehicleId: 'quad', propellerId: 'prop-5', motorCount: 4, gearing: { internalRatio: 1 }, fieldAltitudeM: 1000, airTemperatureC: 30 },
    );
    const byId = await checkedById(t, 'plain.json', fleet);
    const plain = byId.get('plain')!.supplies[0]!;
    expect(plain.valuesUsed.map((u) => [u.field, u.basis])).toEqual([
      ['vehicle.dragAreaM2', 'typical'],
      ['vehicle.rollingCoefficient', 'typical'],
      ['vehicle.tractionCoefficient', 'typical'],
    ]);
    expect(plain.markedFigures).toContain('continuousCurrentA');
    for (const rule of ['battery-continuous', 'battery-burst', 'controller-continuous', 'controller-burst', 'motor-current', 'motor-power']) {
      const f = plain.findings.find((x) => x.rule === rule);
      if (f) expect(f.status, rule).not.toMatch(/incomplete|clear/);
    }
    expect(plain.figures.packEnergyWh as number).toBeGreaterThan(0);
    expect(plain.figures.motorLossW as number).toBeGreaterThan(0);
    const quad = byId.get('quad-build')!.supplies[0]!;
    expect(quad.valuesUsed.map((u) => u.basis)).toEqual(['estimated', 'estimated']);
    // ISO 2533 at 1000 m with 30 °C: 1.0328 kg/m³ (hand computation in tests/unit/core/wider-checks.test.ts).
    expect(quad.figures.fluidDensityKgM3 as number).toBeCloseTo(1.0328, 4);
    for (const key of ['thrustToWeight', 'allUpMassKg', 'hoverThrottle', 'runTimeMin']) expect(quad.figures[key], key).not.toBeNull();
    expect(quad.findings.map((x) => x.rule)).toContain('thrust-to-weight');
  });

  it('--json carries the BEC load as a figure and its check, and a heat limit by motor mass as a typical value', async () => {
    const t = temp();
    const fleet = JSON.parse(readFileSync(EXAMPLE, 'utf8')) as Record<string, Record<string, unknown>[]>;
    // A 3 A BEC with 3.5 A of receiver and servos on it; a second copy of the motor with a mass and no rated heat loss.
    fleet.controllers![0]!.becCurrentA = 3;
    fleet.motors!.push({ ...fleet.motors![0]!, id: 'motor-by-mass', name: 'Same can, weighed', massKg: 0.3 });
    const truck = fleet.builds![0]!;
    fleet.builds!.push({ ...truck, id: 'bec', name: 'BEC loaded', becLoadA: 3.5 }, { ...truck, id: 'by-mass', name: 'Heat by mass', motorId: 'motor-by-mass' });
    const byId = await checkedById(t, 'bec.json', fleet);
    const bec = byId.get('bec')!.supplies[0]!;
    expect(bec.figures.becLoadA).toBe(3.5);
    expect(bec.findings.find((x) => x.rule === 'bec-current')).toMatchObject({ status: 'over', value: 3.5, limit: 3, unit: 'A' });
    // The same controller without a load entered: the figure is null and the check is left out.
    const plain = byId.get('truck-on-3s')!.supplies[0]!;
    expect(Object.keys(plain.figures)).toContain('becLoadA');
    expect(plain.figures.becLoadA).toBeNull();
    expect(plain.findings.some((x) => x.rule === 'bec-current')).toBe(false);
    // 300 g × 0.15 W/g (the rule of thumb, common practice, from memory) = 45 W.
    const byMass = byId.get('by-mass')!.supplies[0]!;
    expect(byMass.valuesUsed).toEqual([{ field: 'motor.maxLossW', value: 45, basis: 'rule-of-thumb' }]);
    expect(byMass.findings.find((x) => x.rule === 'motor-heat')!.limit).toBe(45);
    expect(byMass.findings.find((x) => x.rule === 'motor-heat')!.status).not.toBe('clear');
    expect(plain.findings.some((x) => x.rule === 'motor-heat')).toBe(false);
  });

  it('refuses a file that lists one pack twice in a build, naming it', async () => {
    const t = temp();
    const fleet = JSON.parse(readFileSync(EXAMPLE, 'utf8')) as { builds: { supplies: { batteryIds: string[] }[] }[] };
    fleet.builds[0]!.supplies = [{ batteryIds: ['pack-3s-5000', 'pack-3s-5000'] }];
    writeFileSync(t.file('twice.json'), JSON.stringify(fleet));
    const run = await rigbook(['check', t.file('twice.json'), '--json']);
    expect(run.code).toBe(3);
    expect(run.err).toContain('builds[0].supplies[0].batteryIds[1]: pack "3S 5000 hard case" is already in this build');
  });

  it('exits 0 when nothing is over', async () => {
    const t = temp();
    const fleet = JSON.parse(readFileSync(EXAMPLE, 'utf8')) as { builds: { id: string }[] };
    fleet.builds = fleet.builds.filter((b) => b.id !== 'truck-on-6s');
    writeFileSync(t.file('ok.json'), JSON.stringify(fleet));
    const run = await rigbook(['check', 'ok.json', '--json'], { cwd: t.dir });
    expect(run.code).toBe(0);
    expect((JSON.parse(run.out) as CheckOutput).builds).toHaveLength(1);
  });

  it('exits 2 for a file it cannot read, saying why', async () => {
    const t = temp();
    const missing = await rigbook(['check', t.file('nope.json')]);
    expect(missing.code).toBe(2);
    expect(missing.err).toMatch(/Cannot read .*nope\.json: there is no such file/);
    writeFileSync(t.file('cut.json'), readFileSync(EXAMPLE, 'utf8').slice(0, 300));
    const cut = await rigbook(['check', t.file('cut.json')]);
    expect(cut.code).toBe(2);
    expect(cut.err).toMatch(/not complete JSON/);
    expect(cut.out).toBe('');
    const folder = await rigbook(['check', t.dir]);
    expect(folder.code).toBe(2);
    expect(folder.err).toMatch(/is a folder/);
  });

  it('exits 3 for a file that is JSON but not a valid fleet, listing every problem', async () => {
    const t = temp();
    const fleet = JSON.parse(readFileSync(EXAMPLE, 'utf8')) as { batteries: Record<string, unknown>[]; builds: Record<string, unknown>[] };
    fleet.batteries[1]!.chemistry = 'lead-acid';
    fleet.builds[0]!.controllerId = 'esc-missing';
    writeFileSync(t.file('bad.json'), JSON.stringify(fleet));
    const run = await rigbook(['check', t.file('bad.json'), '--json']);
    expect(run.code).toBe(3);
    expect(run.out).toBe('');
    expect(run.err).toContain('(2 problems)');
    expect(run.err).toContain('batteries[1].chemistry: must be one of: lipo, lihv, lifepo4, liion, nimh');
    expect(run.err).toContain('builds[0].controllerId: no speed controller with id "esc-missing" in this file');
  });

  it('runs as a real process through the entry file', () => {
    const result = spawnSync(process.execPath, ['--import', 'tsx', 'src-main/cli/main.ts', 'check', EXAMPLE, '--json'], { cwd: process.cwd(), encoding: 'utf8', env: { ...process.env, RIGBOOK_DB: '' } });
    expect(result.status).toBe(1);
    expect((JSON.parse(result.stdout) as CheckOutput).builds).toHaveLength(2);
    const usage = spawnSync(process.execPath, ['--import', 'tsx', 'src-main/cli/main.ts', 'frobnicate'], { cwd: process.cwd(), encoding: 'utf8' });
    expect(usage.status).toBe(5);
    expect(usage.stderr).toMatch(/no command "frobnicate"/);
  });
});
