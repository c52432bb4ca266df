import * as v from 'valibot';
import { cellOhmEquivalent, cycleCount, PACK_EVENT_LABELS, PACK_HEALTH_BASIS, packHealthProblems, packOhmOf, resistanceMeasurements, type PackEvent } from '../../core/pack-log';
import { deletePackEvent, getPackEvent, insertPackEvent, listPackEvents } from '../../store/repositories/pack-events';
import { readSettings, writeSettings } from '../../store/repositories/settings';
import type { DbHandle } from '../../store/db-handle';
import { ServiceError } from '../contract';
import { defineHandler } from '../define-handler';
import { runWrite } from '../run-write';
import { id, oneOf, record, text } from '../schemas/field-builders';
import { logDate, packEventInput, packHealthPatch, type PackEventInput } from '../schemas/log-schemas';
import { requirePart } from './part-handlers';
import { requireBuild, writeBuildPatch } from './build-handlers';
import { LOG_QUANTITIES } from '../../core/run-log';
import type { Build } from '../../core/domain';
import { deleteRunLog, getRunLog, insertRunLog, listRunLogs, type RunLog } from '../../store/repositories/run-logs';
import { previewLog, readLog } from '../run-log-import';

/** Refuses fields that do not belong to the kind of entry, and readings the pack cannot have. */
function checkEntry(input: PackEventInput, cellsSeries: number): void {
  const allowed: Record<PackEventInput['kind'], readonly string[]> = {
    charge: ['mah', 'voltagePerCellV'],
    discharge: ['mah', 'voltagePerCellV', 'capacityCheck'],
    storage: ['voltagePerCellV'],
    resistance: ['cellResistancesOhm', 'temperatureC'],
    inspection: ['puffed', 'damaged'],
  };
  const given: Record<string, boolean> = {
    mah: input.mah !== null,
    voltagePerCellV: input.voltagePerCellV !== null,
    cellResistancesOhm: input.cellResistancesOhm !== null,
    temperatureC: input.temperatureC !== null,
    capacityCheck: input.capacityCheck,
    puffed: input.puffed,
    damaged: input.damaged,
  };
  for (const [field, present] of Object.entries(given)) {
    if (present && !allowed[input.kind].includes(field)) throw new ServiceError('invalid', `${field}: does not belong to a ${PACK_EVENT_LABELS[input.kind].toLowerCase()} entry`, field);
  }
  if (input.kind === 'resistance') {
    if (input.cellResistancesOhm === null) throw new ServiceError('invalid', 'cellResistancesOhm: a resistance entry needs the readings, one per cell lead', 'cellResistancesOhm');
    if (input.cellResistancesOhm.length > cellsSeries) {
      throw new ServiceError('invalid', `cellResistancesOhm: ${input.cellResistancesOhm.length} readings for a pack of ${cellsSeries} cells in series (one reading per series cell)`, 'cellResistancesOhm');
    }
  }
  if (input.kind === 'storage' && input.voltagePerCellV === null) throw new ServiceError('invalid', 'voltagePerCellV: a storage entry needs the voltage per cell it was left at', 'voltagePerCellV');
  if (input.kind === 'discharge' && input.capacityCheck && input.mah === null) throw new ServiceError('invalid', 'mah: a capacity check needs the mAh used', 'mah');
}

/** A pack's log with what is read from it: cycles, the newest resistance and the health problems as of now. */
async function packLogView(db: DbHandle, batteryId: string, now: string) {
  const battery = await requirePart(db, 'batteries', batteryId, 'batteryId');
  const [events, settings] = await Promise.all([listPackEvents(db, batteryId), readSettings(db)]);
  const newest = resistanceMeasurements(events).at(-1) ?? null;
  return {
    batteryId,
    events,
    startingCycles: battery.cycleCount,
    cycles: cycleCount(battery.cycleCount, events),
    newestResistance:
      newest === null
        ? null
        : { at: newest.at, eventId: newest.id, packOhm: packOhmOf(newest.cellResistancesOhm), cellOhm: cellOhmEquivalent(newest.cellResistancesOhm, battery.cellsSeries, battery.cellsParallel), typedCellOhm: battery.cellResistanceOhm },
    health: packHealthProblems(battery, events, settings.packHealth, now),
    thresholds: settings.packHealth,
  };
}

export const listPackLog = defineHandler(record({ batteryId: id() }), async (ctx, input) => packLogView(ctx.db, input.batteryId, ctx.now().toISOString()));

/** Adds an entry; every build using the pack is re-checked in the same transaction (its sag and health may change). */
export const addPackEvent = defineHandler(packEventInput, async (ctx, input) => {
  const eventId = ctx.newId('log');
  const outcome = await runWrite(ctx, async (trx, at) => {
    const battery = await requirePart(trx, 'batteries', input.batteryId, 'batteryId');
    checkEntry(input, battery.cellsSeries);
    const { batteryId, ...fields } = input;
    const stored: PackEvent = await insertPackEvent(trx, eventId, batteryId, fields, at);
    return {
      result: stored,
      history: { action: 'log', entityKind: 'batteries', entityId: batteryId, summary: `Logged ${PACK_EVENT_LABELS[input.kind].toLowerCase()} of ${input.at} for pack "${battery.name}"`, reason: '', before: null, after: stored },
      recheck: { by: 'part', kind: 'batteries', id: batteryId },
      changed: { kind: 'packEvents', ids: [eventId] },
    };
  });
  return { event: outcome.result, verdictChanges: outcome.verdictChanges, log: await packLogView(ctx.db, input.batteryId, ctx.now().toISOString()) };
});

/** Removes an entry typed in error; recorded in history with what it held. */
export const removePackEvent = defineHandler(record({ id: id() }), async (ctx, input) => {
  const outcome = await runWrite(ctx, async (trx) => {
    const event = await getPackEvent(trx, input.id);
    if (!event) throw new ServiceError('not-found', `id: no pack log entry with id "${input.id}"`, 'id');
    const battery = await requirePart(trx, 'batteries', event.batteryId, 'batteryId');
    await deletePackEvent(trx, input.id);
    return {
      result: event,
      history: {
        action: 'unlog',
        entityKind: 'batteries',
        entityId: event.batteryId,
        summary: `Removed ${PACK_EVENT_LABELS[event.kind].toLowerCase()} of ${event.at} from the log of pack "${battery.name}"`,
        reason: '',
        before: event,
        after: null,
      },
      recheck: { by: 'part', kind: 'batteries', id: event.batteryId },
      changed: { kind: 'packEvents', ids: [input.id] },
    };
  });
  return { removed: outcome.result, verdictChanges: outcome.verdictChanges };
});

/** The pack-health thresholds in force, with the basis of each. */
export const getPackHealthSettings = defineHandler(v.optional(record({}), {}), async (ctx) => ({ thresholds: (await readSettings(ctx.db)).packHealth, basis: PACK_HEALTH_BASIS }));

/** Sets thresholds; every build is re-checked, since any build's packs may cross the new line. */
export const updatePackHealthSettings = defineHandler(packHealthPatch, async (ctx, input) => {
  const outcome = await runWrite(ctx, async (trx) => {
    const before = (await readSettings(trx)).packHealth;
    const after = { ...before, ...Object.fromEntries(Object.entries(input).filter(([, x]) => x !== undefined)) };
    await writeSettings(trx, { packHealth: after });
    return {
      result: after,
      history: { action: 'update', entityKind: 'settings', entityId: 'packHealth', summary: 'Changed the pack-health thresholds', reason: '', before, after },
      recheck: { by: 'all' },
      changed: { kind: 'settings', ids: ['packHealth'] },
    };
  });
  return { thresholds: outcome.result, basis: PACK_HEALTH_BASIS, verdictChanges: outcome.verdictChanges };
});

// ---- Run logs -------------------------------------------------------------------------------

const columnUse = record({
  column: v.pipe(v.number('must be a number'), v.integer('must be a whole number'), v.minValue(0, 'must be 0 or more'), v.maxValue(999, 'must be 999 or less')),
  quantity: oneOf(LOG_QUANTITIES),
  unit: text(10),
});

/** The log's text: size is checked in the handler, so the message can say how large it is. */
const logText = () => v.string('must be text');

export const previewRunLog = defineHandler(record({ text: logText() }), async (_ctx, input) => previewLog(input.text));

/** The supply a log is attached to: the one named, or the build's only supply. */
function supplyFor(build: Build, supplyId: string | undefined): string {
  if (supplyId !== undefined) {
    if (!build.supplies.some((s) => s.id === supplyId)) throw new ServiceError('invalid', `supplyId: build "${build.name}" has no supply "${supplyId}"`, 'supplyId');
    return supplyId;
  }
  const only = build.supplies.length === 1 ? build.supplies[0] : undefined;
  if (!only) throw new ServiceError('invalid', `supplyId: build "${build.name}" has ${build.supplies.length} supplies; name the one the log was recorded on`, 'supplyId');
  return only.id;
}

export const importRunLog = defineHandler(
  record({
    buildId: id(),
    supplyId: v.optional(id()),
    name: v.optional(text(120), ''),
    recordedAt: v.optional(v.union([v.literal(''), logDate()], 'must be a date as YYYY-MM-DD, or empty'), ''),
    note: v.optional(text(1000), ''),
    text: logText(),
    mapping: v.optional(v.pipe(v.array(columnUse, 'must be a list of column uses'), v.maxLength(50, 'must list at most 50 columns'))),
  }),
  async (ctx, input) => {
    // Nothing is written until the whole log has been read without a problem.
    const build = await requireBuild(ctx.db, input.buildId);
    const supplyId = supplyFor(build, input.supplyId);
    const read = await readLog(ctx, input.text, input.mapping);
    const logId = ctx.newId('run');
    const outcome = await runWrite(ctx, async (trx, at) => {
      const current = await requireBuild(trx, input.buildId);
      supplyFor(current, supplyId);
      const log: RunLog = {
        id: logId,
        buildId: input.buildId,
        supplyId,
        name: input.name.trim() || `Run log of ${at.slice(0, 10)}`,
        recordedAt: input.recordedAt,
        importedAt: at,
        sampleCount: read.sampleCount,
        ...read.summary,
        mapping: read.mapping,
        note: input.note,
        samples: read.kept,
      };
      await insertRunLog(trx, log);
      const { samples: _kept, ...info } = log;
      return {
        result: info,
        history: { action: 'log', entityKind: 'builds', entityId: input.buildId, summary: `Imported run log "${log.name}" (${read.sampleCount} samples) for build "${current.name}"`, reason: '', before: null, after: info },
        recheck: [],
        changed: { kind: 'runLogs', ids: [logId] },
      };
    });
    return outcome.result;
  },
);

export const listRunLogsHandler = defineHandler(record({ buildId: id() }), async (ctx, input) => {
  await requireBuild(ctx.db, input.buildId);
  return listRunLogs(ctx.db, input.buildId);
});

export const getRunLogHandler = defineHandler(record({ id: id() }), async (ctx, input) => {
  const log = await getRunLog(ctx.db, input.id);
  if (!log) throw new ServiceError('not-found', `id: no run log with id "${input.id}"`, 'id');
  return log;
});

/**
 * Puts the log's peak current, and its RMS current as the figure the continuous ratings judge,
 * in the build's measured figures for the log's supply, through the ordinary build update:
 * re-checked and recorded in history, with the log named as the reason. RMS, not the average:
 * heating goes with the square of the current, and the RMS is never below the average, so a
 * log with bursts is judged on the safe side.
 */
export const useRunLogFigures = defineHandler(record({ id: id(), expectedVersion: v.pipe(v.number('must be a number'), v.integer('must be a whole number'), v.minValue(1, 'must be 1 or more')) }), async (ctx, input) => {
  const log = await getRunLog(ctx.db, input.id);
  if (!log) throw new ServiceError('not-found', `id: no run log with id "${input.id}"`, 'id');
  if (log.peakCurrentA === null || !(log.peakCurrentA > 0) || log.averageCurrentA === null || !(log.averageCurrentA > 0)) {
    throw new ServiceError('invalid', `id: run log "${log.name}" has no usable current (a current column with a positive peak and average is needed)`, 'id');
  }
  const continuousA = Math.max(log.rmsCurrentA ?? 0, log.averageCurrentA);
  const outcome = await writeBuildPatch(
    ctx,
    {
      id: log.buildId,
      expectedVersion: input.expectedVersion,
      changes: { measuredPeakCurrentA: log.peakCurrentA, measuredAverageCurrentA: continuousA, measuredSupplyId: log.supplyId },
      reason: `Measured figures from run log "${log.name}"${log.recordedAt ? ` of ${log.recordedAt}` : ''}: peak ${log.peakCurrentA.toFixed(1)} A, RMS ${continuousA.toFixed(1)} A (average ${log.averageCurrentA.toFixed(1)} A) over ${(log.durationS ?? 0).toFixed(1)} s`,
    },
    'update',
  );
  return { record: outcome.result, verdict: outcome.verdicts[0] ?? null, verdictChanges: outcome.verdictChanges };
});

export const removeRunLog = defineHandler(record({ id: id() }), async (ctx, input) => {
  const outcome = await runWrite(ctx, async (trx) => {
    const log = await getRunLog(trx, input.id);
    if (!log) throw new ServiceError('not-found', `id: no run log with id "${input.id}"`, 'id');
    await deleteRunLog(trx, input.id);
    const { samples: _kept, ...info } = log;
    return {
      result: info,
      history: { action: 'unlog', entityKind: 'builds', entityId: log.buildId, summary: `Removed run log "${log.name}"`, reason: '', before: info, after: null },
      recheck: [],
      changed: { kind: 'runLogs', ids: [input.id] },
    };
  });
  return outcome.result;
});
