import type { Selectable } from 'kysely';
import type { VerdictSnapshot, WorkOrder, WorkOrderStatus, WorkStep } from '../../core/work-order';
import type { DbHandle } from '../db-handle';
import type { WorkOrderStepTable, WorkOrderTable } from '../schema';

// Work orders and their steps. Steps are numbered from 1 within their order; the order's
// version guards a status change against a second bench changing it meanwhile.

export type NewWorkOrder = Omit<WorkOrder, 'version' | 'steps' | 'handedOverAt' | 'verdictsAtHandOver' | 'signedOffBy'>;

function snapshots(text: string | null): VerdictSnapshot[] | null {
  return text === null ? null : (JSON.parse(text) as VerdictSnapshot[]);
}

function toStep(row: Selectable<WorkOrderStepTable>): WorkStep {
  return { position: Number(row.position), kind: row.kind, text: row.text, reason: row.reason, at: row.at, actor: row.actor, historyIds: JSON.parse(row.historyIds) as number[] };
}

function toOrder(row: Selectable<WorkOrderTable>, steps: WorkStep[]): WorkOrder {
  return {
    id: row.id,
    version: Number(row.version),
    vehicleId: row.vehicleId,
    customerId: row.customerId,
    complaint: row.complaint,
    status: row.status,
    openedAt: row.openedAt,
    handedOverAt: row.handedOverAt,
    signedOffBy: row.signedOffBy,
    verdictsAtOpening: snapshots(row.verdictsAtOpening) ?? [],
    verdictsAtHandOver: snapshots(row.verdictsAtHandOver),
    steps,
  };
}

export async function insertWorkOrder(db: DbHandle, order: NewWorkOrder, now: string): Promise<void> {
  await db
    .insertInto('workOrders')
    .values({
      id: order.id,
      version: 1,
      vehicleId: order.vehicleId,
      customerId: order.customerId,
      complaint: order.complaint,
      status: order.status,
      openedAt: order.openedAt,
      handedOverAt: null,
      signedOffBy: '',
      verdictsAtOpening: JSON.stringify(order.verdictsAtOpening),
      verdictsAtHandOver: null,
      createdAt: now,
      updatedAt: now,
    })
    .execute();
}

export async function getWorkOrder(db: DbHandle, id: string): Promise<WorkOrder | undefined> {
  const row = await db.selectFrom('workOrders').selectAll().where('id', '=', id).executeTakeFirst();
  if (!row) return undefined;
  const steps = await db.selectFrom('workOrderSteps').selectAll().where('workOrderId', '=', id).orderBy('position').execute();
  return toOrder(row, steps.map(toStep));
}

export interface WorkOrderQuery {
  vehicleId?: string;
  customerId?: string;
  statuses?: WorkOrderStatus[];
}

/** Work orders newest first, without their steps (a list shows the complaint and status). */
export async function listWorkOrders(db: DbHandle, q: WorkOrderQuery = {}): Promise<(Omit<WorkOrder, 'steps'> & { stepCount: number })[]> {
  let query = db
    .selectFrom('workOrders')
    .selectAll('workOrders')
    .select((eb) =>
      eb
        .selectFrom('workOrderSteps')
        .select((e) => e.fn.countAll<number>().as('n'))
        .whereRef('workOrderSteps.workOrderId', '=', 'workOrders.id')
        .as('stepCount'),
    )
    .orderBy('workOrders.openedAt', 'desc')
    .orderBy('workOrders.id', 'desc');
  if (q.vehicleId !== undefined) query = query.where('workOrders.vehicleId', '=', q.vehicleId);
  if (q.customerId !== undefined) query = query.where('workOrders.customerId', '=', q.customerId);
  if (q.statuses && q.statuses.length > 0) query = query.where('workOrders.status', 'in', q.statuses);
  const rows = await query.execute();
  return rows.map(({ stepCount, ...row }) => {
    const { steps: _none, ...order } = toOrder(row, []);
    return { ...order, stepCount: Number(stepCount ?? 0) };
  });
}

export async function insertWorkStep(db: DbHandle, workOrderId: string, step: Omit<WorkStep, 'position'>): Promise<number> {
  const last = await db
    .selectFrom('workOrderSteps')
    .select((eb) => eb.fn.max('position').as('last'))
    .where('workOrderId', '=', workOrderId)
    .executeTakeFirst();
  const position = Number(last?.last ?? 0) + 1;
  await db
    .insertInto('workOrderSteps')
    .values({ workOrderId, position, kind: step.kind, text: step.text, reason: step.reason, at: step.at, actor: step.actor, historyIds: JSON.stringify(step.historyIds) })
    .execute();
  return position;
}

/** Writes at the read version only; returns the rows written (0: someone else wrote first). */
export async function updateWorkOrderAtVersion(db: DbHandle, id: string, expectedVersion: number, patch: Partial<Pick<WorkOrderTable, 'status' | 'handedOverAt' | 'signedOffBy' | 'verdictsAtHandOver'>>, now: string): Promise<number> {
  const result = await db
    .updateTable('workOrders')
    .set({ ...patch, updatedAt: now })
    .set((eb) => ({ version: eb('version', '+', 1) }))
    .where('id', '=', id)
    .where('version', '=', expectedVersion)
    .executeTakeFirst();
  return Number(result.numUpdatedRows);
}

/** Which of these history ids are stored. */
export async function existingHistoryIds(db: DbHandle, ids: readonly number[]): Promise<Set<number>> {
  if (ids.length === 0) return new Set();
  const rows = await db
    .selectFrom('history')
    .select('id')
    .where('id', 'in', [...ids])
    .execute();
  return new Set(rows.map((r) => Number(r.id)));
}

/** Writes a whole work order as a file carries it (an import): its row at the given version, and its steps. */
export async function writeWholeWorkOrder(db: DbHandle, order: WorkOrder, now: string): Promise<void> {
  await db.deleteFrom('workOrderSteps').where('workOrderId', '=', order.id).execute();
  await db.deleteFrom('workOrders').where('id', '=', order.id).execute();
  await db
    .insertInto('workOrders')
    .values({
      id: order.id,
      version: order.version,
      vehicleId: order.vehicleId,
      customerId: order.customerId,
      complaint: order.complaint,
      status: order.status,
      openedAt: order.openedAt,
      handedOverAt: order.handedOverAt,
      signedOffBy: order.signedOffBy,
      verdictsAtOpening: JSON.stringify(order.verdictsAtOpening),
      verdictsAtHandOver: order.verdictsAtHandOver === null ? null : JSON.stringify(order.verdictsAtHandOver),
      createdAt: now,
      updatedAt: now,
    })
    .execute();
  for (const step of order.steps) {
    await db
      .insertInto('workOrderSteps')
      .values({ workOrderId: order.id, position: step.position, kind: step.kind, text: step.text, reason: step.reason, at: step.at, actor: step.actor, historyIds: JSON.stringify(step.historyIds) })
      .execute();
  }
}

/** Every work order with its steps, opened first first: what an export writes. */
export async function loadAllWorkOrders(db: DbHandle): Promise<WorkOrder[]> {
  const rows = await db.selectFrom('workOrders').selectAll().orderBy('openedAt').orderBy('id').execute();
  const steps = await db.selectFrom('workOrderSteps').selectAll().orderBy('workOrderId').orderBy('position').execute();
  const byOrder = new Map<string, WorkStep[]>();
  for (const s of steps) {
    const list = byOrder.get(s.workOrderId) ?? [];
    list.push(toStep(s));
    byOrder.set(s.workOrderId, list);
  }
  return rows.map((row) => toOrder(row, byOrder.get(row.id) ?? []));
}
