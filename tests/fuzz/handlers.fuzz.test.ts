import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { handlers } from '../../src-main/service/handlers';
import { historyByVersion, historyChainProblems, readHistory, readRecords, verdictProblems } from '../reliability/support/store-audit';
import { callAndCheck, newTally, storedRecordProblems } from './support/call-check';
import { createTemplate, fuzzDir, openFuzzStore } from './support/fuzz-store';
import { confinePaths, malformedPayload, mutate, PROTO_KEYS } from './support/payloads';
import { fieldNames, type SchemaNode } from './support/schema-walk';
import { validPayload, type SeedFiles } from './support/seeds';
import { propertySeed } from '../setup/property-seed';

// Property tests over every handler in the map, on a real store: malformed payloads of every
// shape, and valid payloads bent one field at a time. RIGBOOK_FUZZ_RUNS sets the total number
// of cases (default 12 000; `npm run fuzz` runs 200 000); RIGBOOK_FUZZ_SEED repeats a run.

const TOTAL = Number(process.env.RIGBOOK_FUZZ_RUNS ?? 12_000);
const SEED = propertySeed();
const NAMES = Object.keys(handlers);
const PER_HANDLER = Math.floor((TOTAL * 0.96) / NAMES.length);
const NAME_RUNS = TOTAL - PER_HANDLER * NAMES.length;
/** Handlers the seeds know how to call validly; any other gets the malformed fuzz only. */
const SEEDED =
  /^((batteries|motors|controllers|propellers|vehicles|classRules)\.(list|get|create|update|archive)|builds\.(list|get|create|update|archive|preview)|history\.list|settings\.(get|update)|store\.(info|backup)|fleet\.(export|exportCsv|import|importCsv)|demo\.load)$/;

const tally = newTally();
let temp: ReturnType<typeof fuzzDir>;
let template = '';

beforeAll(async () => {
  temp = fuzzDir();
  template = await createTemplate(temp.dir);
}, 60_000);

afterAll(() => {
  temp.remove();
  console.log(
    `handler fuzz: ${tally.cases} cases over ${NAMES.length} handlers (seed ${SEED}), ${tally.accepted} accepted (${tally.writes} writes), ` +
      `refused ${JSON.stringify(tally.refused)}, ${tally.wholeInputRefusals} refusals of a whole input that was not an object`,
  );
});

describe('every handler keeps its promises under bad input', () => {
  it.each(NAMES)(
    '%s',
    async (name) => {
      const store = await openFuzzStore(template, temp.dir, name);
      try {
        const before = { fingerprint: store.fingerprint() };
        const schema = handlers[name as keyof typeof handlers].input as unknown as SchemaNode;
        const seeded = SEEDED.test(name);
        const malformedRuns = seeded ? Math.ceil(PER_HANDLER * 0.4) : PER_HANDLER;
        await fc.assert(
          fc.asyncProperty(malformedPayload(fieldNames(schema)), async (payload) => {
            await callAndCheck(store, tally, name, confinePaths(payload, temp.dir), before);
          }),
          { numRuns: malformedRuns, seed: SEED, endOnFailure: true },
        );
        if (seeded) {
          const ids = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles', 'builds'].flatMap((k) => store.ids(k));
          const files: SeedFiles = { fleet: null, csv: new Map(), sandbox: temp.dir };
          if (name.startsWith('fleet.')) {
            files.fleet = (await store.host.call('fleet.export', {})).ok ? ((await store.host.call('fleet.export', {})) as { value: unknown }).value : null;
            for (const kind of ['batteries', 'motors', 'vehicles']) {
              const csv = await store.host.call('fleet.exportCsv', { kind });
              if (csv.ok) files.csv.set(kind, (csv.value as { text: string }).text);
            }
            before.fingerprint = store.fingerprint();
          }
          await fc.assert(
            fc.asyncProperty(fc.gen(), async (g) => {
              await callAndCheck(store, tally, name, confinePaths(mutate(g, validPayload(name, g, store, files), schema, ids), temp.dir), before);
            }),
            { numRuns: PER_HANDLER - malformedRuns, seed: SEED, endOnFailure: true },
          );
        }
        // What the accepted calls wrote: inside the bounds, with history, with fresh verdicts.
        expect(await storedRecordProblems(store)).toEqual([]);
        const records = await readRecords(store.host);
        const history = await readHistory(store.host);
        expect(historyChainProblems(records, historyByVersion(history), history)).toEqual([]);
        expect(verdictProblems(records).problems).toEqual([]);
      } finally {
        await store.close();
      }
    },
    120_000,
  );

  it('refuses every name that is not a handler, prototype names included', async () => {
    const store = await openFuzzStore(template, temp.dir, 'names');
    try {
      const before = { fingerprint: store.fingerprint() };
      const nameArb = fc.oneof(
        fc.string({ maxLength: 40 }),
        fc.constantFrom(...PROTO_KEYS, 'toString', 'hasOwnProperty', '__defineGetter__', 'batteries.list ', 'Batteries.list', 'batteries..list', 'batteries.list\u0000', '../batteries.list'),
        fc.constantFrom(...NAMES).map((n) => `${n}.x`),
      );
      await fc.assert(
        fc.asyncProperty(nameArb, fc.anything(), async (name, args) => {
          fc.pre(!Object.hasOwn(handlers, name));
          await callAndCheck(store, tally, name, confinePaths(args, temp.dir), before);
          const result = await store.host.call(name, args);
          expect(result).toMatchObject({ ok: false, error: { kind: 'unknown-handler' } });
        }),
        { numRuns: Math.max(NAME_RUNS, 100), seed: SEED, endOnFailure: true },
      );
      // A shell can hand over a name that is not text at all.
      for (const odd of [undefined, null, 42, {}, ['batteries.list'], Symbol.iterator.description]) {
        const result = await store.host.call(odd as unknown as string, {});
        expect(result.ok).toBe(false);
      }
    } finally {
      await store.close();
    }
  }, 120_000);

  it(`ran at least the ${TOTAL} cases asked for`, () => {
    expect(tally.cases).toBeGreaterThanOrEqual(TOTAL);
  });
});
