// The two record sections of a version 2 rigbook-fleet file that are logs rather than parts:
// `packEvents` (each pack's dated log) and `runLogs` (telemetry attached to a build's supply,
// with its kept samples and summary). Entries are written whole: an import adds entries the
// store lacks and replaces those whose id it already holds; nothing the file leaves out is removed.

import * as v from 'valibot';
import { PACK_EVENT_KINDS, type PackEvent } from '../../core/pack-log';
import { LOG_QUANTITIES } from '../../core/run-log';
import type { DbHandle } from '../../store/db-handle';
import { insertPackEvent, listAllPackEvents } from '../../store/repositories/pack-events';
import { insertRunLog, listAllRunLogs, type RunLog } from '../../store/repositories/run-logs';
import { count, flag, id, newId, nullable, number, oneOf, record, text } from '../schemas/field-builders';
import { logDate } from '../schemas/log-schemas';
import { placeOf, schemaProblems, type FleetProblem } from './fleet-problems';

const optionalNumber = (opts: { min?: number; above?: number; max: number }) => v.optional(nullable(number(opts)), null);
const MAX_SAMPLES = 100_000;
const sampleColumn = () => v.pipe(v.array(number({ min: -1e9, max: 1e9 }), 'must be a list of numbers'), v.maxLength(MAX_SAMPLES, `must hold at most ${MAX_SAMPLES} samples`));

export const packEventFileSchema = record({
  id: newId(),
  batteryId: id(),
  at: logDate(),
  kind: oneOf(PACK_EVENT_KINDS),
  mah: optionalNumber({ above: 0, max: 1_000_000 }),
  voltagePerCellV: optionalNumber({ above: 0, max: 5 }),
  cellResistancesOhm: v.optional(nullable(v.pipe(v.array(number({ above: 0, max: 1 }), 'must be a list of readings in ohms'), v.minLength(1, 'must hold at least one reading'), v.maxLength(30, 'must hold at most 30 readings'))), null),
  temperatureC: optionalNumber({ min: -40, max: 120 }),
  capacityCheck: v.optional(flag(), false),
  puffed: v.optional(flag(), false),
  damaged: v.optional(flag(), false),
  note: v.optional(text(1000), ''),
});

export const runLogFileSchema = record({
  id: newId(),
  buildId: id(),
  supplyId: id(),
  name: text(120),
  recordedAt: v.optional(v.union([v.literal(''), logDate()], 'must be a date as YYYY-MM-DD, or empty'), ''),
  importedAt: v.pipe(v.string('must be text'), v.isoTimestamp('must be an ISO time such as 2026-12-01T08:00:00.000Z')),
  sampleCount: count(0, 1e9),
  durationS: optionalNumber({ min: 0, max: 1e7 }),
  peakCurrentA: optionalNumber({ min: -1e6, max: 1e6 }),
  averageCurrentA: optionalNumber({ min: -1e6, max: 1e6 }),
  rmsCurrentA: optionalNumber({ min: 0, max: 1e6 }),
  minVoltageV: optionalNumber({ min: -1e4, max: 1e4 }),
  maxTemperatureC: optionalNumber({ min: -300, max: 1e4 }),
  usedMah: optionalNumber({ min: -1e9, max: 1e9 }),
  mapping: v.optional(v.array(record({ column: count(0, 999), quantity: oneOf(LOG_QUANTITIES), unit: text(10) }), 'must be a list of column uses'), []),
  note: v.optional(text(1000), ''),
  samples: record({
    timeS: sampleColumn(),
    voltageV: v.optional(sampleColumn()),
    currentA: v.optional(sampleColumn()),
    rpm: v.optional(sampleColumn()),
    temperatureC: v.optional(sampleColumn()),
    throttlePct: v.optional(sampleColumn()),
  }),
});

export interface FleetLogs {
  packEvents: PackEvent[];
  runLogs: RunLog[];
}

export const LOG_SECTIONS = ['packEvents', 'runLogs'] as const;

/** Reads the two log sections of a file (absent in version 1 files), reporting every problem with its place. */
export function validateLogs(file: Record<string, unknown>): { logs: FleetLogs; problems: FleetProblem[] } {
  const logs: FleetLogs = { packEvents: [], runLogs: [] };
  const problems: FleetProblem[] = [];
  const sections = [
    ['packEvents', packEventFileSchema, 'pack log entries'],
    ['runLogs', runLogFileSchema, 'run logs'],
  ] as const;
  for (const [key, schema, words] of sections) {
    const list = file[key];
    if (list === undefined) continue;
    if (!Array.isArray(list)) {
      problems.push({ place: key, message: `must be a list of ${words}` });
      continue;
    }
    const seen = new Map<string, number>();
    const knownKeys = new Set(Object.keys(schema.entries));
    list.forEach((raw, index) => {
      const place = placeOf(key, index);
      const parsed = schemaProblems(schema, raw, place, knownKeys);
      if (!parsed.ok) {
        problems.push(...parsed.problems);
        return;
      }
      const entryId = parsed.output.id;
      const first = seen.get(entryId);
      if (first !== undefined) problems.push({ place: placeOf(place, 'id'), message: `"${entryId}" is used twice in this file (also ${placeOf(key, first)})` });
      else seen.set(entryId, index);
      if (key === 'packEvents') logs.packEvents.push(parsed.output as PackEvent);
      else {
        const log = parsed.output as RunLog;
        if (log.samples.timeS.length < 2) problems.push({ place: placeOf(place, 'samples', 'timeS'), message: 'must hold at least two samples' });
        for (const [column, values] of Object.entries(log.samples)) {
          if (Array.isArray(values) && values.length !== log.samples.timeS.length) problems.push({ place: placeOf(place, 'samples', column), message: `must hold as many samples as timeS (${log.samples.timeS.length})` });
        }
        logs.runLogs.push(log);
      }
    });
  }
  return { logs, problems };
}

/** Where each log's pack, build and supply must be found: in the file, or (merging) in the store. */
export interface LogReferenceIds {
  batteries: ReadonlySet<string>;
  builds: ReadonlySet<string>;
  /** Supply id → build id. */
  supplyOwners: ReadonlyMap<string, string>;
}

export function logReferenceProblems(logs: FleetLogs, file: LogReferenceIds, stored: LogReferenceIds | null): FleetProblem[] {
  const problems: FleetProblem[] = [];
  const where = stored === null ? 'in this file' : 'in this file or the store';
  logs.packEvents.forEach((e, k) => {
    if (!file.batteries.has(e.batteryId) && !stored?.batteries.has(e.batteryId)) problems.push({ place: placeOf('packEvents', k, 'batteryId'), message: `no pack with id "${e.batteryId}" ${where}` });
  });
  logs.runLogs.forEach((log, k) => {
    if (!file.builds.has(log.buildId) && !stored?.builds.has(log.buildId)) {
      problems.push({ place: placeOf('runLogs', k, 'buildId'), message: `no build with id "${log.buildId}" ${where}` });
      return;
    }
    // A build the file carries brings its own supplies; one it leaves alone keeps the stored ones.
    const owner = file.builds.has(log.buildId) ? file.supplyOwners.get(log.supplyId) : stored?.supplyOwners.get(log.supplyId);
    if (owner !== log.buildId) problems.push({ place: placeOf('runLogs', k, 'supplyId'), message: `build "${log.buildId}" has no supply "${log.supplyId}"` });
  });
  return problems;
}

/** Writes the entries, replacing any the store holds under the same id. Returns the packs whose builds need a re-check. */
export async function writeLogs(trx: DbHandle, logs: FleetLogs, at: string): Promise<{ packEvents: number; runLogs: number; packIds: string[] }> {
  for (const e of logs.packEvents) {
    await trx.deleteFrom('packEvents').where('id', '=', e.id).execute();
    const { id: eventId, batteryId, ...fields } = e;
    await insertPackEvent(trx, eventId, batteryId, fields, at);
  }
  for (const log of logs.runLogs) {
    await trx.deleteFrom('runLogs').where('id', '=', log.id).execute();
    await insertRunLog(trx, log);
  }
  return { packEvents: logs.packEvents.length, runLogs: logs.runLogs.length, packIds: [...new Set(logs.packEvents.map((e) => e.batteryId))] };
}

/** Every entry in the store, in a fixed order, as the file carries them. */
export async function exportLogs(db: DbHandle): Promise<FleetLogs> {
  const [packEvents, runLogs] = await Promise.all([listAllPackEvents(db), listAllRunLogs(db)]);
  return { packEvents, runLogs };
}
