import { existsSync, readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import type { Page } from '@playwright/test';
import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp, seedOneBuild, type SheetValue, type StoredRecord } from './app-helpers';

async function shot(page: Page, name: string) {
  await page.screenshot({ path: `${SCREENSHOT_DIR}/${name}.png`, fullPage: true });
}

interface FleetFile {
  format: string;
  batteries: (StoredRecord & { cRatingContinuous: number | null })[];
  motors: StoredRecord[];
  classes: unknown[];
  builds: StoredRecord[];
}

test('from the settings screen: export downloads the fleet file, an edited copy is checked (nothing written) and then imported, and a backup lands in the backups folder', async ({ page, shell }, testInfo) => {
  const { pack, build } = await seedOneBuild(shell);
  await openApp(page, shell, '#/settings');
  const section = page.getByRole('region', { name: 'Fleet files and backups' });

  const [download] = await Promise.all([page.waitForEvent('download'), section.getByRole('button', { name: 'Export fleet file' }).click()]);
  expect(download.suggestedFilename()).toMatch(/^rigbook-fleet-\d{4}-\d{2}-\d{2}\.json$/);
  const exported = JSON.parse(readFileSync((await download.path())!, 'utf8')) as FleetFile;
  expect(exported.format).toBe('rigbook-fleet');
  expect(exported.builds.map((b) => b.id)).toEqual([build.id]);
  expect(exported.classes).toEqual([]);
  // The download is the service's own export, byte for byte as the command line writes it.
  expect(readFileSync((await download.path())!, 'utf8')).toBe(`${JSON.stringify(await shell.api('fleet.export', {}), null, 2)}\n`);

  // A copy edited elsewhere: the pack's continuous C rating read as 1 (makes the build over), and a spare motor added.
  const edited: FleetFile = { ...exported, batteries: exported.batteries.map((p) => ({ ...p, cRatingContinuous: 1 })), motors: [...exported.motors, { ...exported.motors[0]!, id: 'motor-spare', name: 'Spare 2200Kv' }] };
  const file = testInfo.outputPath('edited-fleet.json');
  const { writeFileSync } = await import('node:fs');
  writeFileSync(file, JSON.stringify(edited));
  await section.getByTestId('fleet-file-input').setInputFiles(file);

  const preview = section.getByTestId('import-preview');
  await expect(preview).toContainText('nothing has been written yet');
  await expect(preview).toContainText('add 1 motor');
  await expect(preview).toContainText('update 1 pack');
  await expect(preview).toContainText('change 1 build verdict');
  await expect(preview.getByTestId('import-changes')).toContainText('Test 4S 5000: the continuous C rating of the pack (cRatingContinuous) 50 → 1');
  await shot(page, 'fleet-files-import-checked');
  // The check wrote nothing.
  expect((await shell.api<StoredRecord>('batteries.get', { id: pack.id })).cRatingContinuous).toBe(50);
  expect(await shell.api<StoredRecord[]>('motors.list', {})).toHaveLength(1);

  await preview.getByRole('button', { name: 'Import edited-fleet.json' }).click();
  await expect(section.getByTestId('import-done')).toContainText('added 1 motor; updated 1 pack; 1 build re-checked');
  expect((await shell.api<StoredRecord>('batteries.get', { id: pack.id })).cRatingContinuous).toBe(1);
  expect((await shell.api<SheetValue>('builds.get', { id: build.id })).verdict?.status).toBe('over');
  const [entry] = await shell.api<{ summary: string; reason: string }[]>('history.list', { entityKind: 'fleet' });
  expect(entry?.reason).toBe('from the window: edited-fleet.json');

  // A file that is not a fleet file is refused with its problem, and nothing is written.
  const bad = testInfo.outputPath('notes.json');
  writeFileSync(bad, JSON.stringify({ format: 'something-else' }));
  await section.getByTestId('fleet-file-input').setInputFiles(bad);
  await expect(preview.getByRole('alert')).toContainText('notes.json cannot be imported as it is; nothing was written');
  await expect(preview).toContainText('this is not a Rigbook fleet file');
  await expect(preview.getByRole('button', { name: /^Import/ })).toHaveCount(0);

  await section.getByRole('button', { name: 'Back up the store now' }).click();
  await expect(section.getByTestId('backup-done')).toContainText(`${path.sep}backups${path.sep}rigbook-backup-`);
  const folder = path.join(path.dirname(shell.dbPath), 'backups');
  const written = readdirSync(folder).filter((n) => n.startsWith('rigbook-backup-'));
  expect(written).toHaveLength(1);
  expect(existsSync(path.join(folder, written[0]!))).toBe(true);
  await shot(page, 'fleet-files-done');
});
