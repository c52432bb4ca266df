import { afterEach, describe, expect, it } from 'vitest';
import type { Finding, Status } from '../../src-main/core/domain';
import { flaggedChecks } from '../helpers/flagged-checks';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

// The stored list of flagged checks must say what a fresh evaluation of the build says, after a
// part edit changes which check fails. "Over" is a value past its limit, "tight" a margin under
// the threshold (common practice for a rating check; the definitions in the design brief).

let f: ServiceFixture | undefined;
forEachEngine((engine) => {
  afterEach(async () => {
    await f?.close();
    f = undefined;
  });

  async function stored(fx: ServiceFixture, buildId: string): Promise<string> {
    const row = await fx.db.selectFrom('verdicts').select('ruleStatuses').where('buildId', '=', buildId).executeTakeFirstOrThrow();
    return row.ruleStatuses;
  }

  async function fresh(fx: ServiceFixture, buildId: string): Promise<{ flagged: string; findings: Finding[] }> {
    const sheet = await fx.call('builds.get', { id: buildId });
    const findings = sheet.verdict.supplies.flatMap((s) => s.findings);
    return { flagged: flaggedChecks(findings), findings };
  }

  describe('the checks a verdict row flags', () => {
    it('follow a part edit that makes the controller continuous check fail, and its undoing', async () => {
      f = await serviceFixture(engine);
      const seed = await seedTwoBuggies(f);
      const before = await fresh(f, seed.onFour.id);
      expect(await stored(f, seed.onFour.id)).toBe(before.flagged);
      expect(before.flagged).not.toContain('controller-continuous=');

      // A continuous rating half the build's own continuous current: the check must read over.
      const cont = before.findings.find((x) => x.rule === 'controller-continuous');
      expect(cont?.value).toBeGreaterThan(0);
      const halfA = Math.round((cont!.value! / 2) * 10) / 10;
      const esc = await f.call('controllers.update', { id: seed.esc.id, expectedVersion: seed.esc.version, changes: { continuousCurrentA: halfA } });
      const after = await fresh(f, seed.onFour.id);
      expect(after.flagged).toContain('controller-continuous=over');
      expect(await stored(f, seed.onFour.id)).toBe(after.flagged);
      // The other build shares the controller: its row follows too.
      expect(await stored(f, seed.onTwo.id)).toBe((await fresh(f, seed.onTwo.id)).flagged);

      const flaggedIds = (await f.call('builds.list', { rules: ['controller-continuous'] })).map((b) => b.id);
      expect(flaggedIds).toContain(seed.onFour.id);
      expect(await f.call('builds.list', { rules: ['controller-continuous'], statuses: ['tight'] })).toEqual((await f.call('builds.list', {})).filter((b) => b.ruleStatuses.split(',').includes('controller-continuous=tight')));

      await f.call('controllers.update', { id: seed.esc.id, expectedVersion: esc.record.version, changes: { continuousCurrentA: seed.esc.continuousCurrentA } });
      const undone = await fresh(f, seed.onFour.id);
      expect(undone.flagged).toBe(before.flagged);
      expect(await stored(f, seed.onFour.id)).toBe(before.flagged);
      expect((await f.call('builds.list', { rules: ['controller-continuous'], statuses: ['over'] })).map((b) => b.id)).not.toContain(seed.onFour.id);
    });

    it('are listed, and filtered on, as whole pairs: a longer rule id or another status never matches', async () => {
      f = await serviceFixture(engine);
      const seed = await seedTwoBuggies(f);
      await f.db.updateTable('verdicts').set({ ruleStatuses: 'class-cap-x=over,motor-current=tight' }).where('buildId', '=', seed.onTwo.id).execute();
      await f.db.updateTable('verdicts').set({ ruleStatuses: 'class-cap=tight' }).where('buildId', '=', seed.onFour.id).execute();
      const ids = async (args: { rules: string[]; statuses?: Status[] }) => (await f!.call('builds.list', args)).map((b) => b.id);
      expect(await ids({ rules: ['class-cap'] })).toEqual([seed.onFour.id]);
      expect(await ids({ rules: ['class-cap'], statuses: ['over'] })).toEqual([]);
      expect(await ids({ rules: ['class-cap-x'], statuses: ['over', 'clear'] })).toEqual([seed.onTwo.id]);
      expect(await ids({ rules: ['class-CAP'] })).toEqual([]);
      expect(await ids({ rules: ['motor-current', 'class-cap'] })).toEqual([seed.onTwo.id, seed.onFour.id]);
      expect(await ids({ rules: ['motor-current'], statuses: ['clear'] })).toEqual([]);
      const row = (await f.call('builds.list', {})).find((b) => b.id === seed.onTwo.id);
      expect(row?.ruleStatuses).toBe('class-cap-x=over,motor-current=tight');
    });
  });
});
