import type { Selectable } from 'kysely';
import type { PackEvent, PackEventKind } from '../../core/pack-log';
import type { DbHandle } from '../db-handle';
import type { PackEventTable } from '../schema';
import { chunks } from '../db-handle';
import type { SelectQueryBuilder } from 'kysely';
import type { Db } from '../schema';

export type PackEventFields = Omit<PackEvent, 'id' | 'batteryId'>;

/** The stored readings; text that is not a list of numbers reads as no readings rather than stopping a re-check. */
function readings(json: string | null): number[] | null {
  if (json === null) return null;
  try {
    const parsed = JSON.parse(json) as unknown;
    return Array.isArray(parsed) && parsed.every((x) => typeof x === 'number') ? parsed : null;
  } catch {
    return null;
  }
}

function rowToEvent(row: Selectable<PackEventTable>): PackEvent {
  return {
    id: row.id,
    batteryId: row.batteryId,
    at: row.at,
    kind: row.kind as PackEventKind,
    mah: row.mah,
    voltagePerCellV: row.voltagePerCellV,
    cellResistancesOhm: readings(row.cellResistancesOhm),
    temperatureC: row.temperatureC,
    capacityCheck: row.capacityCheck === 1,
    puffed: row.puffed === 1,
    damaged: row.damaged === 1,
    note: row.note,
  };
}

/** One pack's log, oldest first. */
export async function listPackEvents(db: DbHandle, batteryId: string): Promise<PackEvent[]> {
  const rows = await db.selectFrom('packEvents').selectAll().where('batteryId', '=', batteryId).orderBy('at').orderBy('id').execute();
  return rows.map(rowToEvent);
}

/** Every entry of every pack, oldest first (for a fleet file). */
export async function listAllPackEvents(db: DbHandle): Promise<PackEvent[]> {
  const rows = await db.selectFrom('packEvents').selectAll().orderBy('batteryId').orderBy('at').orderBy('id').execute();
  return rows.map(rowToEvent);
}

/** The logs of the packs a query names, by pack id: one query however many packs. */
export async function packEventsOf(db: DbHandle, batteryIds: SelectQueryBuilder<Db, never, { batteryId: string }> | readonly string[]): Promise<Map<string, PackEvent[]>> {
  const out = new Map<string, PackEvent[]>();
  const add = (rows: Selectable<PackEventTable>[]): void => {
    for (const row of rows) {
      const list = out.get(row.batteryId) ?? [];
      list.push(rowToEvent(row));
      out.set(row.batteryId, list);
    }
  };
  if (Array.isArray(batteryIds)) {
    for (const part of chunks(batteryIds as readonly string[])) {
      if (part.length > 0) add(await db.selectFrom('packEvents').selectAll().where('batteryId', 'in', part).orderBy('at').orderBy('id').execute());
    }
  } else {
    add(
      await db
        .selectFrom('packEvents')
        .selectAll()
        .where('batteryId', 'in', batteryIds as SelectQueryBuilder<Db, never, { batteryId: string }>)
        .orderBy('at')
        .orderBy('id')
        .execute(),
    );
  }
  return out;
}

export async function getPackEvent(db: DbHandle, id: string): Promise<PackEvent | undefined> {
  const row = await db.selectFrom('packEvents').selectAll().where('id', '=', id).executeTakeFirst();
  return row ? rowToEvent(row) : undefined;
}

export async function insertPackEvent(db: DbHandle, id: string, batteryId: string, fields: PackEventFields, now: string): Promise<PackEvent> {
  await db
    .insertInto('packEvents')
    .values({
      id,
      batteryId,
      at: fields.at,
      kind: fields.kind,
      mah: fields.mah,
      voltagePerCellV: fields.voltagePerCellV,
      cellResistancesOhm: fields.cellResistancesOhm === null ? null : JSON.stringify(fields.cellResistancesOhm),
      temperatureC: fields.temperatureC,
      capacityCheck: fields.capacityCheck ? 1 : 0,
      puffed: fields.puffed ? 1 : 0,
      damaged: fields.damaged ? 1 : 0,
      note: fields.note,
      createdAt: now,
    })
    .execute();
  const stored = await getPackEvent(db, id);
  if (!stored) throw new Error(`insert into packEvents did not store ${id}`);
  return stored;
}

export async function deletePackEvent(db: DbHandle, id: string): Promise<number> {
  const result = await db.deleteFrom('packEvents').where('id', '=', id).executeTakeFirst();
  return Number(result.numDeletedRows);
}
