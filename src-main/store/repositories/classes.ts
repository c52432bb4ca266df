import type { ClassRule, VehicleClass } from '../../core/domain';
import type { DbHandle } from '../db-handle';
import { insertPart, listParts } from './parts';
import { rowToRecord } from './part-records';

/** The stored class of this name, archived or not. */
export async function getClassByName(db: DbHandle, name: string): Promise<VehicleClass | undefined> {
  const row = await db.selectFrom('classes').selectAll().where('name', '=', name).executeTakeFirst();
  if (!row) return undefined;
  const { createdAt: _c, updatedAt: _u, ...record } = row;
  return record;
}

/**
 * Makes a class record for each name a vehicle or a limit carries that has none yet, so every
 * class named anywhere is one the Classes screen lists. Returns the records it added.
 */
export async function ensureClasses(db: DbHandle, names: Iterable<string>, at: string, newId: () => string): Promise<VehicleClass[]> {
  const wanted = [...new Set([...names].filter((n) => n !== ''))];
  if (wanted.length === 0) return [];
  const have = new Set((await db.selectFrom('classes').select('name').where('name', 'in', wanted).execute()).map((r) => r.name));
  const added: VehicleClass[] = [];
  for (const name of wanted) if (!have.has(name)) added.push(await insertPart(db, 'classes', newId(), { name, notes: '' }, at));
  return added;
}

/** A class's limits: the class rules naming it (archived ones only when asked). */
export async function classLimits(db: DbHandle, className: string, includeArchived = false): Promise<ClassRule[]> {
  let query = db.selectFrom('classRules').selectAll().where('className', '=', className);
  if (!includeArchived) query = query.where('archivedAt', 'is', null);
  const rows = await query.orderBy('ruleId').orderBy('id').execute();
  return rows.map((row) => rowToRecord('classRules', row));
}

/**
 * A renamed class carries its vehicles and limits along: they name it by its name. Each
 * record so moved is a write of that record, so its version moves too.
 */
export async function renameClassReferences(db: DbHandle, from: string, to: string, at: string): Promise<{ vehicles: number; limits: number }> {
  const vehicles = await db
    .updateTable('vehicles')
    .set({ className: to, updatedAt: at })
    .set((eb) => ({ version: eb('version', '+', 1) }))
    .where('className', '=', from)
    .executeTakeFirst();
  const limits = await db
    .updateTable('classRules')
    .set({ className: to, updatedAt: at })
    .set((eb) => ({ version: eb('version', '+', 1) }))
    .where('className', '=', from)
    .executeTakeFirst();
  return { vehicles: Number(vehicles.numUpdatedRows), limits: Number(limits.numUpdatedRows) };
}

export interface ClassSummary extends VehicleClass {
  limits: ClassRule[];
  vehicleCount: number;
  buildCount: number;
}

/** Every class with its limits in use and how many vehicles and builds (not archived) it holds. */
export async function listClassSummaries(db: DbHandle, includeArchived = false): Promise<ClassSummary[]> {
  const classes = await listParts(db, 'classes', { includeArchived });
  const rules = await listParts(db, 'classRules');
  const vehicles = await db
    .selectFrom('vehicles')
    .select(['className'])
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('archivedAt', 'is', null)
    .groupBy('className')
    .execute();
  const builds = await db
    .selectFrom('builds')
    .innerJoin('vehicles', 'vehicles.id', 'builds.vehicleId')
    .select(['vehicles.className'])
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('builds.archivedAt', 'is', null)
    .groupBy('vehicles.className')
    .execute();
  const vehicleCount = new Map(vehicles.map((r) => [r.className, Number(r.n)]));
  const buildCount = new Map(builds.map((r) => [r.className, Number(r.n)]));
  return classes.map((c) => ({
    ...c,
    limits: rules.filter((r) => r.className === c.name),
    vehicleCount: vehicleCount.get(c.name) ?? 0,
    buildCount: buildCount.get(c.name) ?? 0,
  }));
}
