import * as v from 'valibot';
import { cellOhmEquivalent, cycleCount, PACK_EVENT_LABELS, PACK_HEALTH_BASIS, packHealthProblems, packOhmOf, resistanceMeasurements, type PackEvent } from '../../core/pack-log';
import { deletePackEvent, getPackEvent, insertPackEvent, listPackEvents } from '../../store/repositories/pack-events';
import { readSettings, writeSettings } from '../../store/repositories/settings';
import type { DbHandle } from '../../store/db-handle';
import { ServiceError } from '../contract';
import { defineHandler } from '../define-handler';
import { runWrite } from '../run-write';
import { id, record } from '../schemas/field-builders';
import { packEventInput, packHealthPatch, type PackEventInput } from '../schemas/log-schemas';
import { requirePart } from './part-handlers';

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
