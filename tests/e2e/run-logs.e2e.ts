import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp, seedOneBuild } from './app-helpers';
import { expectNoAxeViolations } from './axe-check';

// A run log imported through the window: the file picker, the column-mapping step with its
// preview, the log beside the model on the sheet, and its figures taken as the build's
// measured currents.

/** A 20 s run at 10 samples a second: cruising at about 60 A with two 180 A bursts, as a logger writes it (time in ms). */
function runCsv(): string {
  const lines = ['Time (ms);Volts;Amps;RPM;ESC temp (C)'];
  for (let k = 0; k <= 200; k++) {
    const burst = (k >= 50 && k < 54) || (k >= 150 && k < 153);
    const amps = burst ? 180 : 55 + (k % 10);
    lines.push(`${k * 100};${(16.4 - amps * 0.006).toFixed(3).replace('.', ',')};${amps};${30000 - amps * 20};${(35 + k / 20).toFixed(1).replace('.', ',')}`);
  }
  return lines.join('\n');
}

test('a run log imported through the window is drawn beside the model, and its figures can judge the supply', async ({ page, shell }) => {
  test.setTimeout(120_000);
  const { build } = await seedOneBuild(shell);
  await openApp(page, shell, `#/builds/${build.id}`);
  const sheet = page.getByTestId('build-sheet');
  await expect(sheet.getByRole('heading', { level: 1, name: 'Test truck 4S' })).toBeVisible();
  const panel = sheet.getByTestId('run-logs');
  await expect(panel.getByText('No log for this supply yet.')).toBeVisible();

  await panel.getByTestId('run-log-file').setInputFiles({ name: 'heat-3.csv', mimeType: 'text/csv', buffer: Buffer.from(runCsv()) });
  const mapping = panel.getByTestId('run-log-mapping');
  await expect(mapping.getByText('201 rows, separated by ";"')).toBeVisible();
  // The header's units were read: ms for time, V, A, rpm, °C.
  await expect(mapping.getByLabel('What column Time (ms) holds')).toHaveValue('time');
  await expect(mapping.getByLabel('Unit of column Time (ms)')).toHaveValue('ms');
  await expect(mapping.getByLabel('Unit of column ESC temp (C)')).toHaveValue('°C');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/run-log-mapping.png`, fullPage: true });
  await mapping.getByLabel('Name').fill('Heat 3');
  await mapping.getByRole('button', { name: 'Import log' }).click();

  const shown = panel.getByTestId('run-log-shown');
  await expect(panel.getByRole('status').filter({ hasText: 'Imported "Heat 3": 201 samples.' })).toBeVisible();
  await expect(shown.getByText('Measured peak current')).toBeVisible();
  await expect(shown.locator('dd').first()).toHaveText('180.0 A');
  await expect(shown.getByTestId('run-log-comparison')).toContainText('Measured peak 180.0 A is');
  // The motor is rated 140 A: both bursts are listed with their times (5.0–5.3 s and 15.0–15.2 s).
  const moments = shown.getByTestId('run-log-moments');
  await expect(moments).toContainText('5.00–5.30 s: up to 180.0 A, above the Motor rating 140 A');
  await expect(moments).toContainText('15.00–15.20 s');
  await expectNoAxeViolations(page, 'build sheet with a run log');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/run-log-sheet.png`, fullPage: true });

  await shown.getByRole('button', { name: 'Use measured figures' }).click();
  await expect(panel.getByText('The build now uses the measured figures of "Heat 3"')).toBeVisible();
  const stored = await shell.api<{ build: { measuredPeakCurrentA: number | null }; verdict: { supplies: { figures: Record<string, unknown> }[] } }>('builds.get', { id: build.id });
  expect(stored.build.measuredPeakCurrentA).toBe(180);
  expect(stored.verdict.supplies[0]!.figures.peakCurrentSource).toBe('measured');
  await expect(shown.getByText('This supply is judged on these measured figures.')).toBeVisible();
  await page.screenshot({ path: `${SCREENSHOT_DIR}/run-log-used.png`, fullPage: true });
});

test('the pack log on the pack page: cycles from the log, a resistance that moves the sag, a worn pack turning its build over', async ({ page, shell }) => {
  test.setTimeout(120_000);
  const { pack, build } = await seedOneBuild(shell);
  await shell.api('packLog.add', { batteryId: pack.id, at: '2026-10-01', kind: 'resistance', cellResistancesOhm: [0.003, 0.003, 0.003, 0.003], temperatureC: 22 });
  await shell.api('packLog.add', { batteryId: pack.id, at: '2026-10-20', kind: 'discharge', mah: 4700, capacityCheck: true, voltagePerCellV: 3.6 });
  await shell.api('packLog.add', { batteryId: pack.id, at: '2026-11-20', kind: 'charge', mah: 4600, voltagePerCellV: 4.2 });
  // Brought to storage voltage the next day, so the pack was never left charged whatever today's date.
  await shell.api('packLog.add', { batteryId: pack.id, at: '2026-11-21', kind: 'storage', voltagePerCellV: 3.85 });
  await openApp(page, shell, `#/parts/packs/${pack.id}`);
  const log = page.getByTestId('pack-log');
  await expect(log.getByTestId('pack-cycles')).toHaveText('1 cycle');

  // A new measurement through the form: 4.6 mΩ a lead on average, 53 % over the first 3 mΩ, past the 50 % growth threshold.
  await log.getByLabel('Kind').selectOption('resistance');
  await log.getByLabel('Date', { exact: true }).fill('2026-11-25');
  await log.getByLabel('Readings per cell lead (mΩ, separated by spaces)').fill('4.6 4.6 4.5 4.7');
  await log.getByRole('button', { name: 'Add to the log' }).click();
  await expect(log.getByText('Newest resistance measurement (2026-11-25): 18.4 mΩ for the pack.')).toBeVisible();
  await expect(log.getByTestId('pack-health')).toContainText('resistance up 53 % over its first measurement');
  await expect(log.getByRole('img', { name: /Measured pack resistance and capacity checks/ })).toBeVisible();
  await expectNoAxeViolations(page, 'pack page with its log');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/pack-log.png`, fullPage: true });

  const sheet = await shell.api<{ verdict: { status: string; supplies: { figures: Record<string, number | null>; findings: { rule: string; status: string }[] }[] } }>('builds.get', { id: build.id });
  // Series readings add: 4.6 + 4.6 + 4.5 + 4.7 = 18.4 mΩ for the pack.
  expect(sheet.verdict.supplies[0]!.figures.packResistanceOhm).toBeCloseTo(0.0184, 9);
  expect(sheet.verdict.supplies[0]!.findings.find((f) => f.rule === 'pack-health')?.status).toBe('over');
  expect(sheet.verdict.status).toBe('over');

  // The thresholds live in Settings with their basis: 95 % of rated makes the 4700 mAh check (94 %) a worn pack too.
  await openApp(page, shell, '#/settings');
  const form = page.getByRole('form', { name: 'Pack health' });
  await expect(form.getByLabel('Capacity check under (% of rated)')).toHaveValue('80');
  await expect(form.getByText(/cycle life to 80 % of rated capacity/)).toBeVisible();
  await form.getByLabel('Capacity check under (% of rated)').fill('95');
  await form.getByRole('button', { name: 'Apply thresholds' }).click();
  await expect(form.getByRole('status')).toHaveText('Pack-health thresholds saved; every build was re-checked.');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/pack-health-settings.png`, fullPage: true });
  const after = await shell.api<{ health: { kind: string }[] }>('packLog.list', { batteryId: pack.id });
  expect(after.health.map((h) => h.kind)).toEqual(['resistance', 'capacity']);
});
