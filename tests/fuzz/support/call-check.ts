import * as v from 'valibot';
import { STATUSES } from '../../../src-main/core/domain';
import type { CallResult } from '../../../src-main/service/contract';
import { handlers } from '../../../src-main/service/handlers';
import { buildCreateSchema } from '../../../src-main/service/schemas/build-schemas';
import { partSchemasByTable } from '../../../src-main/service/schemas/part-schemas-by-table';
import { canonical } from '../../reliability/support/random';
import { PART_KINDS, readRecords } from '../../reliability/support/store-audit';
import type { FuzzStore } from './fuzz-store';
import { POLLUTION_MARK } from './payloads';

// The promises every handler keeps whatever it is sent: dispatch answers (never throws), a
// refusal is one of the plain kinds with a message and, for bad input, the field; a refused
// call leaves every table as it was; no prototype is touched; what is stored stays inside
// the schema's bounds.

export const REFUSAL_KINDS = ['invalid', 'not-found', 'conflict', 'unknown-handler'] as const;

/** Reads (exports and backups included) answer from the store and never change it, even when they succeed. */
export function isReadOnly(name: string): boolean {
  return /\.(list|get|info|preview|export\w*|backup)$/.test(name);
}

const prototypeShapes = () => [Object.prototype, Array.prototype, Function.prototype, String.prototype, Number.prototype].map((p) => Object.getOwnPropertyNames(p).sort().join(',')).join('|');
const CLEAN_PROTOTYPES = prototypeShapes();

export function prototypesPolluted(): string | null {
  if (prototypeShapes() !== CLEAN_PROTOTYPES) return 'a built-in prototype gained or lost a property';
  const probe: Record<string, unknown> = {};
  for (const key of [POLLUTION_MARK, 'isAdmin', 'admin', 'polluted']) if (probe[key] !== undefined) return `Object.prototype.${key} is set`;
  return null;
}

export interface Tally {
  cases: number;
  accepted: number;
  refused: Record<string, number>;
  wholeInputRefusals: number;
  writes: number;
}

export const newTally = (): Tally => ({ cases: 0, accepted: 0, refused: {}, wholeInputRefusals: 0, writes: 0 });

/** Throws (with the payload) when a promise is broken; returns the answer. */
export async function callAndCheck(store: FuzzStore, tally: Tally, name: string, payload: unknown, before: { fingerprint: string }): Promise<CallResult> {
  const dataVersion = store.dataVersion();
  let result: CallResult;
  try {
    result = await store.host.call(name, payload);
  } catch (error) {
    throw new Error(`dispatch threw on ${name}: ${error instanceof Error ? error.message : String(error)}`);
  }
  tally.cases++;
  const polluted = prototypesPolluted();
  if (polluted) throw new Error(`${name}: ${polluted}`);
  if (typeof result !== 'object' || result === null || typeof result.ok !== 'boolean') throw new Error(`${name}: answer is not a CallResult: ${String(result)}`);

  const unchanged = (why: string) => {
    if (store.dataVersion() !== dataVersion) throw new Error(`${name}: ${why}, yet a write was committed`);
    if (store.fingerprint() !== before.fingerprint) throw new Error(`${name}: ${why}, yet the tables changed`);
  };

  if (!result.ok) {
    const { kind, message, field } = result.error;
    tally.refused[kind] = (tally.refused[kind] ?? 0) + 1;
    if (!(REFUSAL_KINDS as readonly string[]).includes(kind)) throw new Error(`${name}: refused as "${kind}": ${message}`);
    if (typeof message !== 'string' || message.trim() === '') throw new Error(`${name}: refusal without a message`);
    if (/\n\s+at |node_modules|\.ts:\d+|SqliteError|TypeError/.test(message)) throw new Error(`${name}: refusal leaks internals: ${message}`);
    if (kind === 'invalid') {
      if (field === undefined) {
        // Only the whole input can be wrong without a field to name.
        if (!message.startsWith('Input ')) throw new Error(`${name}: invalid without a field: ${message}`);
        tally.wholeInputRefusals++;
      } else if (typeof field !== 'string' || field === '' || !message.startsWith(`${field}:`)) {
        throw new Error(`${name}: field "${String(field)}" is not named at the start of "${message}"`);
      }
    }
    unchanged('the call was refused');
    return result;
  }
  tally.accepted++;
  if (isReadOnly(name)) unchanged('a read answered');
  else if (store.dataVersion() !== dataVersion) {
    tally.writes++;
    before.fingerprint = store.fingerprint();
  }
  return result;
}

/** Every stored record passes the create schema of its kind unchanged: nothing outside the bounds got in. */
export async function storedRecordProblems(store: FuzzStore): Promise<string[]> {
  const problems: string[] = [];
  const records = await readRecords(store.host);
  const check = (kind: string, schema: v.GenericSchema, record: Record<string, unknown>) => {
    const { version: _v, archivedAt: _a, ...fields } = record;
    const parsed = v.safeParse(schema, fields);
    if (!parsed.success) problems.push(`${kind} ${String(record.id)}: ${v.getDotPath(parsed.issues[0]) ?? ''} ${parsed.issues[0].message} (${JSON.stringify(fields).slice(0, 300)})`);
    else if (canonical(parsed.output) !== canonical(fields)) problems.push(`${kind} ${String(record.id)}: stored value is not in the schema's own form`);
  };
  for (const kind of PART_KINDS) for (const record of records[kind]) check(kind, partSchemasByTable[kind].create, record);
  for (const record of records.builds) check('builds', buildCreateSchema, record);
  // The settings a person can set; others (bookkeeping the service keeps for itself) are not input.
  const settings = await store.host.call('settings.get', {});
  const settable = handlers['settings.update'].input;
  const shown = settings.ok ? Object.fromEntries(Object.entries(settings.value as Record<string, unknown>).filter(([key]) => Object.hasOwn(settable.entries, key))) : null;
  if (!shown || !v.safeParse(settable, shown).success) problems.push(`settings out of bounds: ${JSON.stringify(settings)}`);
  for (const [buildId, verdict] of records.verdicts) {
    if (!(STATUSES as readonly string[]).includes(verdict.status)) problems.push(`verdict of ${buildId}: status "${verdict.status}"`);
  }
  return problems;
}
