import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { handlers } from '../../src-main/service/handlers';
import { fileProblems, historyByVersion, historyChainProblems, ok, readHistory, readRecords, verdictProblems } from '../reliability/support/store-audit';
import { callAndCheck, newTally, storedRecordProblems } from './support/call-check';
import { createTemplate, fuzzDir, openFuzzStore, type FuzzStore } from './support/fuzz-store';
import { mutate, pick } from './support/payloads';
import type { SchemaNode } from './support/schema-walk';
import { readJsonText, scanJson } from '../../src-main/service/fleet/read-fleet-text';
import { propertySeed } from '../setup/property-seed';

// Damaged fleet files and CSV files: cut off at a random point, bytes flipped, fields bent.
// A refused import leaves every table exactly as it was (and so does any dry run); an
// accepted one leaves a sound store whose verdicts match a fresh evaluation.
// RIGBOOK_FUZZ_RUNS scales the number of files (a fortieth of it, at least 300 per format).

const TOTAL = Number(process.env.RIGBOOK_FUZZ_RUNS ?? 12_000);
const SEED = propertySeed();
const FILES = Math.max(300, Math.floor(TOTAL / 40));
const NEEDED = ['fleet.import', 'fleet.export', 'fleet.importCsv', 'fleet.exportCsv'];
const missing = NEEDED.filter((name) => !Object.hasOwn(handlers, name));
const skipReason = missing.length > 0 ? ` (skipped: ${missing.join(', ')} not in the handler map yet)` : '';

let temp: ReturnType<typeof fuzzDir>;
let template = '';
const tally = newTally();
const outcomes = { jsonRefused: 0, jsonAccepted: 0, csvRefused: 0, csvAccepted: 0, dryRuns: 0 };

beforeAll(async () => {
  temp = fuzzDir();
  template = await createTemplate(temp.dir);
}, 60_000);

afterAll(() => {
  temp.remove();
  console.log(`import fuzz: ${tally.cases} damaged files (seed ${SEED}), ${JSON.stringify(outcomes)}${skipReason}`);
});

interface ImportReport {
  ok: boolean;
  unreadable: boolean;
  problems: Array<{ place: string; message: string }>;
}

/** Flips 1–3 bytes of the UTF-8 text (invalid sequences read back as U+FFFD, as a decoder would). */
function flipBytes(g: fc.GeneratorValue, text: string): string {
  const bytes = Buffer.from(text, 'utf8');
  const flips = g(fc.integer, { min: 1, max: 3 });
  for (let i = 0; i < flips; i++) bytes[g(fc.nat, { max: bytes.length - 1 })] = g(fc.nat, { max: 255 });
  return bytes.toString('utf8');
}

/** Calls an import; a refusal (as an error or as a report) must leave the store as it was, and so must a dry run. */
async function importAndCheck(store: FuzzStore, name: string, payload: Record<string, unknown>, before: { fingerprint: string }): Promise<'refused' | 'accepted'> {
  const dataVersion = store.dataVersion();
  const fingerprint = before.fingerprint;
  const result = await callAndCheck(store, tally, name, payload, before);
  if (!result.ok) return 'refused';
  const report = result.value as ImportReport;
  if (payload.dryRun === true) outcomes.dryRuns++;
  if (payload.dryRun === true || !report.ok) {
    expect(store.dataVersion(), `${name} refused or dry, yet something was committed`).toBe(dataVersion);
    expect(store.fingerprint()).toBe(fingerprint);
  }
  if (!report.ok) {
    expect(report.problems.length).toBeGreaterThan(0);
    for (const p of report.problems) expect(p.message.trim()).not.toBe('');
    return 'refused';
  }
  return 'accepted';
}

async function expectSound(store: FuzzStore): Promise<void> {
  expect(await fileProblems(store.host)).toEqual([]);
  const records = await readRecords(store.host);
  const history = await readHistory(store.host);
  expect(historyChainProblems(records, historyByVersion(history), history)).toEqual([]);
  expect(verdictProblems(records).problems).toEqual([]);
  expect(await storedRecordProblems(store)).toEqual([]);
}

describe('damaged import files change nothing', () => {
  it.skipIf(missing.length > 0)(
    `a fleet file cut off, with bytes flipped or with fields bent${skipReason}`,
    async () => {
      const store = await openFuzzStore(template, temp.dir, 'json-import');
      try {
        const fleet = await ok<Record<string, unknown>>(store.host, 'fleet.export', {});
        const text = JSON.stringify(fleet, null, 2);
        const fleetSchema = handlers['fleet.import' as keyof typeof handlers].input as unknown as SchemaNode;
        const ids = ['batteries', 'motors', 'vehicles', 'builds'].flatMap((k) => store.ids(k));
        const before = { fingerprint: store.fingerprint() };
        await fc.assert(
          fc.asyncProperty(fc.gen(), async (g) => {
            const mode = pick(g, ['merge', 'merge', 'replace']);
            const dryRun = g(fc.boolean);
            const how = pick(g, ['cut', 'cut', 'flip', 'flip', 'bend']);
            let payload: Record<string, unknown>;
            if (how === 'cut') {
              // Any strict prefix that is more than trailing white space is unfinished JSON.
              const at = g(fc.nat, { max: text.trimEnd().length - 1 });
              payload = { text: text.slice(0, at), mode, dryRun };
            } else if (how === 'flip') {
              payload = { text: flipBytes(g, text), mode, dryRun };
            } else {
              payload = mutate(g, { fleet: structuredClone(fleet), mode, dryRun }, fleetSchema, ids) as Record<string, unknown>;
            }
            const outcome = await importAndCheck(store, 'fleet.import', payload, before);
            if (how === 'cut') expect(outcome, 'a cut-off file was accepted').toBe('refused');
            if (outcome === 'refused') outcomes.jsonRefused++;
            else outcomes.jsonAccepted++;
          }),
          { numRuns: FILES, seed: SEED, endOnFailure: true },
        );
        await expectSound(store);
      } finally {
        await store.close();
      }
    },
    240_000,
  );

  it.skipIf(missing.length > 0)(
    `a CSV file of each part kind cut off or with bytes flipped${skipReason}`,
    async () => {
      const store = await openFuzzStore(template, temp.dir, 'csv-import');
      try {
        const kinds = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles'];
        const texts = new Map<string, string>();
        for (const kind of kinds) texts.set(kind, (await ok<{ text: string }>(store.host, 'fleet.exportCsv', { kind })).text);
        const before = { fingerprint: store.fingerprint() };
        await fc.assert(
          fc.asyncProperty(fc.gen(), async (g) => {
            const kind = pick(g, kinds);
            const text = texts.get(kind)!;
            const dryRun = g(fc.boolean);
            const damaged = g(fc.boolean) ? text.slice(0, g(fc.nat, { max: Math.max(0, text.length - 1) })) : flipBytes(g, text);
            // A CSV has no end marker: cut at a row boundary it is a shorter, valid file. Either way a refusal changes nothing.
            const outcome = await importAndCheck(store, 'fleet.importCsv', { kind, text: damaged, dryRun }, before);
            if (outcome === 'refused') outcomes.csvRefused++;
            else outcomes.csvAccepted++;
          }),
          { numRuns: FILES, seed: SEED, endOnFailure: true },
        );
        await expectSound(store);
      } finally {
        await store.close();
      }
    },
    240_000,
  );

  it.skipIf(missing.length > 0)(`a refused replace removes nothing${skipReason}`, async () => {
    const store: FuzzStore = await openFuzzStore(template, temp.dir, 'replace-import');
    try {
      const fleet = await ok<{ builds: Array<Record<string, unknown>> }>(store.host, 'fleet.export', {});
      const fingerprint = store.fingerprint();
      // The last build names a pack the file does not hold: found only after the envelope checks pass.
      const broken = structuredClone(fleet);
      const lastBuild = broken.builds[broken.builds.length - 1]!;
      lastBuild.supplies = [{ batteryIds: ['pack-nowhere'] }];
      const result = await store.host.call('fleet.import', { fleet: broken, mode: 'replace' });
      expect(result).toMatchObject({ ok: true, value: { ok: false } });
      const report = (result as { value: ImportReport }).value;
      expect(report.problems.map((p) => p.message).join(' ')).toContain('pack-nowhere');
      expect(store.fingerprint()).toBe(fingerprint);
      await expectSound(store);
    } finally {
      await store.close();
    }
  });
});

describe('the JSON scan agrees with JSON.parse', () => {
  // JSON.parse is the reference: for any text, the scan finds a fault exactly when JSON.parse
  // throws; on text JSON.parse reads, it reports only a field named twice in one object.
  const hasDuplicateKeys = (text: string): boolean => {
    const stop = scanJson(text);
    return stop !== null && stop.kind === 'duplicate';
  };
  const text = fc.oneof(
    fc.json({ maxDepth: 6 }),
    fc.json({ maxDepth: 6 }).chain((t) => fc.tuple(fc.constant(t), fc.nat({ max: Math.max(0, t.length) }), fc.string({ maxLength: 3 })).map(([s, at, junk]) => s.slice(0, at) + junk + s.slice(at + 1))),
  );
  it('finds a fault exactly when JSON.parse throws, and says where', () => {
    fc.assert(
      fc.property(text, (t) => {
        let parses = true;
        try {
          JSON.parse(t);
        } catch {
          parses = false;
        }
        const stop = scanJson(t);
        if (parses) expect(stop === null || stop.kind === 'duplicate').toBe(true);
        else expect(stop === null || stop.kind === 'duplicate').toBe(false);
        if (!parses) expect(readJsonText(t)).toMatchObject({ ok: false });
        if (parses && !hasDuplicateKeys(t) && t.trim() !== '') expect(readJsonText(t)).toEqual({ ok: true, value: JSON.parse(t) });
      }),
      { numRuns: Math.max(2000, FILES * 4), seed: SEED },
    );
  });
});
