import { test, expect, SCREENSHOT_DIR } from './local-shell';
import { openApp, seedOneBuild, TRUCK_GEARING, type StoredRecord } from './app-helpers';

type Flagged = { rule: string; status: string; value: number | null };

async function findings(api: <T>(name: string, args: unknown) => Promise<T>, id: string): Promise<Flagged[]> {
  const sheet = await api<{ verdict: { supplies: { findings: Flagged[] }[] } }>('builds.get', { id });
  return sheet.verdict.supplies.flatMap((s) => s.findings);
}

test('the Check filter lists the builds a check flags, and with a verdict only those whose check has it', async ({ page, shell }) => {
  const { pack, motor, car, build } = await seedOneBuild(shell);
  const cont = (await findings(shell.api, build.id)).find((f) => f.rule === 'controller-continuous');
  expect(cont?.status).toBe('clear');
  const amps = cont!.value!;
  // Over: a continuous rating half the current. Tight: the current at about 95 % of the rating,
  // inside the 15 % band the tight verdict uses by default (design brief).
  const small = await shell.api<StoredRecord>('controllers.create', { name: 'Half rating', maxCells: 6, continuousCurrentA: Math.floor(amps / 2), burstCurrentA: 900, resistanceOhm: 0.0008 });
  const snug = await shell.api<StoredRecord>('controllers.create', { name: 'Snug rating', maxCells: 6, continuousCurrentA: Math.ceil((amps / 0.95) * 10) / 10, burstCurrentA: 900, resistanceOhm: 0.0008 });
  // The snug build is over as a whole for another reason: a pack rated far below its draw.
  const weak = await shell.api<StoredRecord>('batteries.create', { name: 'Weak 4S 5000', chemistry: 'lipo', cellsSeries: 4, capacityMah: 5000, cRatingContinuous: 1, cRatingBurst: 2, cellResistanceOhm: 0.003 });
  // The seeded truck and motor on another controller and pack, geared as the seeded build.
  const truckOn = (name: string, controllerId: string, batteryId: string) =>
    shell.api<{ record: StoredRecord }>('builds.create', {
      name,
      vehicleId: car.id,
      motorId: motor.id,
      controllerId,
      supplies: [{ arrangement: 'series', batteryIds: [batteryId] }],
      gearing: TRUCK_GEARING,
    });
  const over = await truckOn('Truck on the half rating', small.id, pack.id);
  const tight = await truckOn('Truck on the snug rating', snug.id, weak.id);
  expect((await findings(shell.api, over.record.id)).find((f) => f.rule === 'controller-continuous')?.status).toBe('over');
  expect((await findings(shell.api, tight.record.id)).find((f) => f.rule === 'controller-continuous')?.status).toBe('tight');
  expect((await findings(shell.api, tight.record.id)).find((f) => f.rule === 'battery-continuous')?.status).toBe('over');

  await openApp(page, shell, '#/builds');
  await expect(page.getByTestId('build-count')).toHaveText('3 builds');
  const rows = page.getByTestId('build-row');
  const chip = (word: string) => page.getByRole('group', { name: 'Verdict' }).getByRole('button', { name: new RegExp(`^${word}`) });

  // The verdict alone: both builds that are over as a whole.
  await chip('Over').click();
  await expect(page.getByTestId('build-count')).toHaveText('2 of 3 shown');

  // With the check: only the build whose controller continuous check itself is over.
  await page.getByLabel('Check').selectOption({ label: 'Controller continuous current' });
  await expect(page.getByTestId('build-count')).toHaveText('1 of 3 shown');
  await expect(rows).toHaveCount(1);
  await expect(rows.first()).toContainText('Truck on the half rating');
  await expect(chip('Clear')).toBeDisabled();

  // The check alone: every build it flags, over or tight.
  await chip('Over').click();
  await expect(page.getByTestId('build-count')).toHaveText('2 of 3 shown');
  await expect(rows.filter({ hasText: 'Truck on the snug rating' })).toHaveCount(1);
  await expect(rows.filter({ hasText: 'Test truck 4S' })).toHaveCount(0);
  await expect(page.getByTestId('check-note')).toContainText('Controller continuous current');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/builds-list-check-filter.png` });
  await chip('Tight').click();
  await expect(page.getByTestId('build-count')).toHaveText('1 of 3 shown');
  await expect(rows.first()).toContainText('Truck on the snug rating');

  // The address keeps the check: a reload opens the list as it was left.
  await expect.poll(() => page.evaluate(() => window.location.hash)).toContain('check=controller-continuous');
  await page.reload();
  await expect(page.getByTestId('build-count')).toHaveText('1 of 3 shown');
  await expect(page.getByLabel('Check')).toHaveValue('controller-continuous');

  await page.getByLabel('Check').selectOption({ label: 'Any check' });
  await expect(page).not.toHaveURL(/check=/);
  await expect(page.getByTestId('check-note')).toHaveCount(0);
  await page.getByRole('button', { name: 'Clear filters' }).click();
  await expect(page.getByTestId('build-count')).toHaveText('3 builds');
});
