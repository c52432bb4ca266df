import { spawnSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { generateFleet } from '../../demo-fixtures/generate-fleet';
import { fleetText } from '../../src-main/service/fleet/export-fleet';
import { evaluateFleet } from '../../src-main/service/fleet/evaluate-fleet';
import { tempDirsPerTest } from '../helpers/temp-dir';
import { rigbook } from './run';

const EXAMPLE = join(process.cwd(), 'demo-fixtures', 'example-fleet.json');
const PACKAGE_VERSION = (JSON.parse(readFileSync(join(process.cwd(), 'package.json'), 'utf8')) as { version: string }).version;
const temp = tempDirsPerTest();

describe('rigbook and fleet files from scripts and spreadsheets', () => {
  it('--version prints the package version', async () => {
    const run = await rigbook(['--version']);
    expect(run.code).toBe(0);
    expect(run.out).toMatch(new RegExp(`^rigbook ${PACKAGE_VERSION.replace(/\./g, '\\.')} \\(rules engine \\d+, fleet file version 2\\)\\n$`));
  });

  it('- reads standard input for check and import', async () => {
    const t = temp();
    const text = readFileSync(EXAMPLE, 'utf8');
    const check = await rigbook(['check', '-', '--json'], { stdin: text });
    expect(check.code).toBe(1);
    expect((JSON.parse(check.out) as { builds: unknown[] }).builds).toHaveLength(2);
    const cut = await rigbook(['check', '-'], { stdin: text.slice(0, 100) });
    expect(cut.code).toBe(2);
    expect(cut.err).toMatch(/^rigbook check: Cannot read standard input: |^Cannot read standard input: /);
    const imported = await rigbook(['import', '-', '--db', t.file('s.sqlite')], { stdin: text });
    expect(imported.code).toBe(0);
    expect(imported.out).toMatch(/^Imported standard input \(merge\): added 2 packs, 1 motor, 1 speed controller, 1 customer, 1 vehicle, 2 builds\./);
  });

  it('check refuses a field named twice with its path (exit 3), and a 20 000-deep broken file with its place (exit 2)', async () => {
    const dup = await rigbook(['check', '-'], { stdin: '{"format":"rigbook-fleet","version":1,"motors":[{"id":"m1","name":"M","kv":3200,"kv":32000}]}' });
    expect(dup.code).toBe(3);
    expect(dup.err).toContain('standard input is not a valid rigbook-fleet file (1 problem):\n  motors[0].kv: the field "kv" appears twice in one object');
    const deep = await rigbook(['check', '-'], { stdin: `${'['.repeat(20_000)}}` });
    expect(deep.code).toBe(2);
    expect(deep.err).toBe('Cannot read standard input: The file is not JSON: unexpected "}" where a value should be, at line 1, column 20001.\n');
  });

  it('a scaled CSV is refused on the command line, listed field by field, and goes through with --accept-changes', async () => {
    const t = temp();
    const db = t.file('s.sqlite');
    expect((await rigbook(['import', EXAMPLE, '--db', db])).code).toBe(0);
    const csv = (await rigbook(['export', '--csv', 'motors', '--db', db])).out;
    // The example motor's 0.014 Ω winding read by a comma-decimal spreadsheet: 14.
    expect(csv).toContain(',0.014,');
    // 14 Ω is past any hobby motor's winding: refused outright by the plausible range, with the field's label.
    writeFileSync(t.file('motors.csv'), csv.replace(',0.014,', ',14,'));
    const implausible = await rigbook(['import', 'motors.csv', '--csv', 'motors', '--dry-run', '--db', db], { cwd: t.dir });
    expect(implausible.code).toBe(3);
    expect(implausible.err).toContain('Winding resistance must be above 0 Ω and at most 10 Ω');
    // Scaled by 100 (0.014 → 1.4) it stays plausible, so the change guard must catch it.
    writeFileSync(t.file('motors.csv'), csv.replace(',0.014,', ',1.4,'));
    const dry = await rigbook(['import', 'motors.csv', '--csv', 'motors', '--dry-run', '--db', db], { cwd: t.dir });
    expect(dry.code).toBe(3);
    expect(dry.err).toContain('motors.csv was not imported (1 problem; nothing was written):');
    expect(dry.err).toContain('motor "3660 can, 3200 Kv" [motor-3660]: the motor winding resistance (resistanceOhm) would change from 0.014 to 1.4, which grows by a factor of 100.');
    expect(dry.err).toContain('  motor "3660 can, 3200 Kv" [motor-3660]\n    resistanceOhm: 0.014 → 1.4   ← needs confirming: grows by a factor of 100');
    expect(dry.err).toContain('import again with --accept-changes');
    const refused = await rigbook(['import', 'motors.csv', '--csv', 'motors', '--db', db], { cwd: t.dir });
    expect(refused.code).toBe(3);
    const accepted = await rigbook(['import', 'motors.csv', '--csv', 'motors', '--accept-changes', '--db', db], { cwd: t.dir });
    expect(accepted.code).toBe(0);
    expect(accepted.out).toContain('Changed 1 stored record (before → after):');
    expect(accepted.out).toContain('resistanceOhm: 0.014 → 1.4');
  });

  it('a plain change is listed by the dry run, before → after', async () => {
    const t = temp();
    const db = t.file('s.sqlite');
    await rigbook(['import', EXAMPLE, '--db', db]);
    const fleet = JSON.parse(readFileSync(EXAMPLE, 'utf8')) as { motors: { maxCurrentA: number }[] };
    fleet.motors[0]!.maxCurrentA = 90;
    writeFileSync(t.file('edit.json'), JSON.stringify(fleet));
    const dry = await rigbook(['import', 'edit.json', '--dry-run', '--db', db], { cwd: t.dir });
    expect(dry.code).toBe(0);
    expect(dry.out).toContain('Would change 1 stored record (before → after):\n  motor "3660 can, 3200 Kv" [motor-3660]\n    maxCurrentA: 80 → 90\n');
  });

  it('a Windows-1252 file is refused with how to save it as UTF-8, and read with --encoding windows-1252', async () => {
    const t = temp();
    const db = t.file('s.sqlite');
    await rigbook(['import', EXAMPLE, '--db', db]);
    const csv = (await rigbook(['export', '--csv', 'vehicles', '--db', db])).out.replace('Short course truck', 'Jürgen Müller');
    // ü is 0xFC in Windows-1252 (the code page's published table).
    writeFileSync(t.file('vehicles.csv'), Buffer.from(csv, 'latin1'));
    const refused = await rigbook(['import', 'vehicles.csv', '--csv', 'vehicles', '--db', db], { cwd: t.dir });
    expect(refused.code).toBe(2);
    expect(refused.err).toContain('Cannot read vehicles.csv: the file is not UTF-8 text (byte 0xFC on line 2');
    expect(refused.err).toContain('--encoding windows-1252');
    const read = await rigbook(['import', 'vehicles.csv', '--csv', 'vehicles', '--encoding', 'windows-1252', '--db', db], { cwd: t.dir });
    expect(read.code).toBe(0);
    const again = (await rigbook(['export', '--csv', 'vehicles', '--db', db])).out;
    expect(again).toContain('Jürgen Müller');
    expect((await rigbook(['check', EXAMPLE, '--encoding', 'ebcdic'])).code).toBe(5);
  });

  it('export --csv counts records, not lines; counts and removals use the screens’ words', async () => {
    const t = temp();
    const db = t.file('s.sqlite');
    const fleet = JSON.parse(readFileSync(EXAMPLE, 'utf8')) as { batteries: { notes?: string }[]; classRules?: unknown[] };
    fleet.batteries[0]!.notes = 'first line\nsecond line\r\nthird line';
    fleet.classRules = [{ id: 'rule-stock', className: 'Stock', ruleId: 'class-max-rpm', figure: 'noLoadRpm', limit: 40000, unit: 'rpm' }];
    writeFileSync(t.file('notes.json'), JSON.stringify(fleet));
    await rigbook(['import', 'notes.json', '--db', db], { cwd: t.dir });
    const out = await rigbook(['export', 'packs.csv', '--csv', 'packs', '--db', db], { cwd: t.dir });
    expect(out.code).toBe(0);
    expect(out.err).toMatch(/^Wrote 2 packs to /);
    const whole = await rigbook(['export', 'all.json', '--db', db], { cwd: t.dir });
    expect(whole.err).toMatch(/^Wrote 2 builds, 2 packs, 1 motor, 1 speed controller, 0 propellers, 1 vehicle, 1 class, 1 class rule to /);
    const replaced = await rigbook(['import', 'all.json', '--mode', 'replace', '--db', db], { cwd: t.dir });
    expect(replaced.out).toContain('Replaced what the store held: 2 packs, 1 motor, 1 speed controller, 1 customer, 1 vehicle, 1 class, 1 class rule, 2 builds.');
    expect(replaced.out).not.toMatch(/classRules|batteries/);
  });

  it('a write error names the person’s file, never the temporary one beside it', async () => {
    const t = temp();
    const db = t.file('s.sqlite');
    await rigbook(['import', EXAMPLE, '--db', db]);
    writeFileSync(t.file('not-a-folder'), 'x');
    const run = await rigbook(['export', 'not-a-folder/out.json', '--db', db], { cwd: t.dir });
    expect(run.code).toBe(4);
    expect(run.err).toContain('Cannot write not-a-folder/out.json:');
    expect(run.err).not.toMatch(/partial|\.out\.json/);
  });

  it('a reader that closes the pipe early gets no stack trace, and the exit code is the command’s own', { timeout: 180_000 }, async () => {
    const t = temp();
    // Big enough that the output overflows the pipe's buffer long before the check is done printing.
    const fleet = generateFleet({ builds: 500, seed: 11 });
    // Only builds that are not over: the check's own answer is 0, and a crash on the closed pipe (exit 1) would read as "over".
    const over = new Set(
      evaluateFleet({ ...fleet, classRules: fleet.classRules ?? [] })
        .filter((v) => v.status === 'over')
        .map((v) => v.buildId),
    );
    fleet.builds = fleet.builds.filter((b) => !over.has(b.id));
    writeFileSync(t.file('big.json'), fleetText(fleet));
    const script = `node --import tsx src-main/cli/main.ts check "${t.file('big.json')}" --json 2>"${t.file('err.txt')}" | head -1; echo "exit=\${PIPESTATUS[0]}"`;
    const piped = spawnSync('bash', ['-c', script], { cwd: process.cwd(), encoding: 'utf8', env: { ...process.env, RIGBOOK_DB: '' } });
    const full = await rigbook(['check', t.file('big.json'), '--json']);
    expect(full.out.length).toBeGreaterThan(1 << 20);
    const own = full.code;
    expect(own).toBe(0);
    expect(piped.stdout).toBe(`{\nexit=${own}\n`);
    expect(readFileSync(t.file('err.txt'), 'utf8')).toBe('');
  });
});
