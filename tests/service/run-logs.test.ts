import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { sql } from 'kysely';
import { seedTwoBuggies, serviceFixture, type ServiceFixture } from '../helpers/service-fixture';
import { forEachEngine } from '../helpers/store-engines';

/** A run of 0.1 s steps as a logger writes it: time in ms, current, voltage, rpm, controller temperature. */
function runCsv(rows = 300, header = 'Time (ms),Voltage (V),Current (A),RPM,Temp (C)'): string {
  const lines = [header];
  for (let k = 0; k < rows; k++) lines.push(`${k * 100},${(8.4 - k * 0.002).toFixed(3)},${(k % 50 === 25 ? 140 : 40 + (k % 5)).toFixed(1)},${20000 + k * 10},${(30 + k / 30).toFixed(2)}`);
  return lines.join('\n');
}

let f: ServiceFixture;
forEachEngine((engine) => {
  beforeEach(async () => {
    f = await serviceFixture(engine);
  });
  afterEach(async () => f.close());

  const counts = async () => ({
    runLogs: Number(
      (
        await f.db
          .selectFrom('runLogs')
          .select(sql<number>`count(*)`.as('n'))
          .executeTakeFirstOrThrow()
      ).n,
    ),
    history: Number(
      (
        await f.db
          .selectFrom('history')
          .select(sql<number>`count(*)`.as('n'))
          .executeTakeFirstOrThrow()
      ).n,
    ),
  });

  describe('run logs', () => {
    it('previews the columns the header names, with units and examples', async () => {
      const preview = await f.call('runLogs.preview', { text: runCsv(20) });
      expect(preview.columns.map((c) => [c.quantity, c.unit])).toEqual([
        ['time', 'ms'],
        ['voltage', 'V'],
        ['current', 'A'],
        ['rpm', 'rpm'],
        ['temperature', '°C'],
      ]);
      expect(preview.rowCount).toBe(20);
      expect(preview.rows[0]).toMatchObject({ line: 2, cells: ['0', '8.400', '40.0', '20000', '30.00'] });
      expect(preview.suggested).toHaveLength(5);
    });

    it('imports a log for the build’s only supply, keeps its summary, and lists it', async () => {
      const { onTwo } = await seedTwoBuggies(f);
      const log = await f.call('runLogs.import', { buildId: onTwo.id, name: 'Club practice', recordedAt: '2026-11-28', text: runCsv() });
      expect(log).toMatchObject({ buildId: onTwo.id, supplyId: onTwo.supplies[0]!.id, sampleCount: 300, peakCurrentA: 140, minVoltageV: 7.802, maxTemperatureC: 39.97 });
      // 300 samples 0.1 s apart: 29.9 s.
      expect(log.durationS).toBeCloseTo(29.9, 9);
      const listed = await f.call('runLogs.list', { buildId: onTwo.id });
      expect(listed.map((l) => l.id)).toEqual([log.id]);
      const full = await f.call('runLogs.get', { id: log.id });
      expect(full.samples.timeS).toHaveLength(300);
      expect(full.samples.rpm![0]).toBe(20000);
      const history = await f.call('history.list', { entityKind: 'builds', entityId: onTwo.id });
      expect(history.find((h) => h.action === 'log')?.summary).toMatch(/Imported run log "Club practice"/);
    });

    it('using the measured figures sets the build’s measured currents for that supply, re-checked and recorded with the log as the reason', async () => {
      const { onTwo } = await seedTwoBuggies(f);
      const log = await f.call('runLogs.import', { buildId: onTwo.id, text: runCsv() });
      const used = await f.call('runLogs.useFigures', { id: log.id, expectedVersion: onTwo.version });
      expect(used.record).toMatchObject({ measuredPeakCurrentA: 140, measuredSupplyId: onTwo.supplies[0]!.id });
      // The continuous ratings judge the log's RMS current, never below its average (the safe side for heating).
      expect(used.record.measuredAverageCurrentA).toBeCloseTo(log.rmsCurrentA!, 9);
      expect(log.rmsCurrentA!).toBeGreaterThan(log.averageCurrentA!);
      const sheet = await f.call('builds.get', { id: onTwo.id });
      expect(sheet.verdict.supplies[0]!.figures.peakCurrentSource).toBe('measured');
      const history = await f.call('history.list', { entityKind: 'builds', entityId: onTwo.id });
      expect(history.find((h) => h.action === 'update')?.reason).toMatch(/run log .*peak 140\.0 A/);
      // An older version is refused, as any build edit is.
      expect(await f.refuse('runLogs.useFigures', { id: log.id, expectedVersion: onTwo.version })).toMatchObject({ kind: 'conflict' });
    });

    it.each([
      ['time going backwards', () => runCsv(10).replace('\n500,', '\n50,'), /line 7: time goes backwards/],
      ['text in a number', () => runCsv(10).replace(/\n300,([\d.]+),[\d.]+,/, '\n300,$1,lots,'), /line 5: "Current \(A\)" holds "lots", not a number/],
      ['an empty cell', () => runCsv(10).replace(/\n300,([\d.]+),[\d.]+,/, '\n300,$1,,'), /line 5: "Current \(A\)" is empty/],
      ['an empty column', () => runCsv(10, 'Time (ms),Voltage (V),Current (A),RPM,Temp (C)').replace(/,(\d+),([\d.]+)$/gm, ',$1,'), /column 5 "Temp \(C\)" is empty on every row/],
      ['an unknown unit', () => runCsv(10, 'Time (ms),Voltage (V),Current (kA),RPM,Temp (C)'), /column 3 "Current \(kA\)": unit "kA" is not one Rigbook reads/],
      ['a log of one row', () => runCsv(1), /needs at least two/],
      ['a file without a header', () => runCsv(10).split('\n').slice(1).join('\n'), /holds numbers, not column names/],
    ])('refuses %s with the row, and saves nothing', async (_label, text, message) => {
      const { onTwo } = await seedTwoBuggies(f);
      const before = await counts();
      const error = await f.refuse('runLogs.import', { buildId: onTwo.id, text: text() });
      expect(error.kind).toBe('invalid');
      expect(error.message).toMatch(message);
      expect(await counts()).toEqual(before);
    });

    it('refuses a log over 50 MB, saying how large it is, and saves nothing', async () => {
      const { onTwo } = await seedTwoBuggies(f);
      const before = await counts();
      const big = 'time (s),current (A)\n' + '0,1\n'.repeat(13_200_000);
      const error = await f.refuse('runLogs.import', { buildId: onTwo.id, text: big });
      expect(error).toMatchObject({ kind: 'invalid', field: 'text' });
      expect(error.message).toMatch(/the log is 50\.\d MB; Rigbook reads logs up to 50\.0 MB/);
      expect(await counts()).toEqual(before);
    });

    it('reads a column mapping chosen by hand where the header has no units', async () => {
      const { onTwo } = await seedTwoBuggies(f);
      const text = 'Time;Amps;Volts\n0;10,5;8,4\n1;20,5;8,2\n2;20,5;8,1';
      const preview = await f.call('runLogs.preview', { text });
      expect(preview.columns[0]!.problem).toMatch(/no unit/);
      expect(await f.refuse('runLogs.import', { buildId: onTwo.id, text })).toMatchObject({ kind: 'invalid', field: 'mapping' });
      const log = await f.call('runLogs.import', {
        buildId: onTwo.id,
        text,
        mapping: [
          { column: 0, quantity: 'time', unit: 's' },
          { column: 1, quantity: 'current', unit: 'A' },
          { column: 2, quantity: 'voltage', unit: 'V' },
        ],
      });
      // Trapezoids: (10.5+20.5)/2 + (20.5+20.5)/2 = 15.5 + 20.5 = 36 A·s over 2 s: 18 A average, 10 mAh.
      expect(log.averageCurrentA).toBeCloseTo(18, 9);
      expect(log.usedMah).toBeCloseTo(10, 9);
      expect(log.minVoltageV).toBe(8.1);
    });

    it('asks which supply when the build has several', async () => {
      const { onTwo, pack4s } = await seedTwoBuggies(f);
      const two = await f.call('builds.update', {
        id: onTwo.id,
        expectedVersion: onTwo.version,
        changes: { supplies: [...onTwo.supplies.map((s) => ({ id: s.id, arrangement: s.arrangement, batteryIds: s.batteryIds })), { batteryIds: [pack4s.id] }] },
      });
      expect(await f.refuse('runLogs.import', { buildId: onTwo.id, text: runCsv(5) })).toMatchObject({ kind: 'invalid', field: 'supplyId' });
      const log = await f.call('runLogs.import', { buildId: onTwo.id, supplyId: two.record.supplies[1]!.id, text: runCsv(5) });
      expect(log.supplyId).toBe(two.record.supplies[1]!.id);
    });
  });
});
