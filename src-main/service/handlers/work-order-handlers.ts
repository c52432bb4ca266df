import * as v from 'valibot';
import { evaluateBuild } from '../../core/evaluate';
import { stepProblem, transitionProblem, WORK_ORDER_STATUS_LABELS, WORK_ORDER_STATUSES, WORK_STEP_KINDS, WORK_STEP_LABELS, type VerdictSnapshot, type WorkOrder } from '../../core/work-order';
import type { DbHandle } from '../../store/db-handle';
import { getPart } from '../../store/repositories/parts';
import { readSettings } from '../../store/repositories/settings';
import { existingHistoryIds, getWorkOrder, insertWorkOrder, insertWorkStep, listWorkOrders, updateWorkOrderAtVersion } from '../../store/repositories/work-orders';
import { ServiceError } from '../contract';
import { defineHandler } from '../define-handler';
import { loadBuildContexts } from '../recheck';
import { runWrite } from '../run-write';
import { count, id, newId, notes, oneOf, record, text } from '../schemas/field-builders';
import { requirePart } from './part-handlers';

// Work orders: a job on one vehicle from the customer's complaint to the hand-over. Each write
// goes through runWrite with its own history entry (entityKind `workOrders`), so the job's
// opening, steps and status changes sit in the same dated history as the edits they caused.

const MAX_LINKS = 50;

/** Every active build of the vehicle, evaluated now: what the sheet prints as "before" or "after". */
export async function vehicleSnapshot(db: DbHandle, vehicleId: string): Promise<VerdictSnapshot[]> {
  const settings = await readSettings(db);
  // The evaluation's own read leaves names and archiving out: they are read here.
  const active = await db.selectFrom('builds').select(['id', 'name']).where('vehicleId', '=', vehicleId).where('archivedAt', 'is', null).orderBy('name').orderBy('id').execute();
  if (active.length === 0) return [];
  const contexts = new Map((await loadBuildContexts(db, { by: 'ids', ids: active.map((b) => b.id) }, settings.tightThreshold)).map((c) => [c.build.id, c]));
  return active.flatMap((build) => {
    const context = contexts.get(build.id);
    if (!context) return [];
    const verdict = evaluateBuild(context);
    const seen = new Set<string>();
    const findings: VerdictSnapshot['findings'] = [];
    for (const supply of verdict.supplies) {
      for (const f of supply.findings) {
        if (f.status === 'clear' || seen.has(f.message)) continue;
        seen.add(f.message);
        findings.push({ rule: f.rule, status: f.status, message: f.message, unit: f.unit });
      }
    }
    return [{ buildId: build.id, buildName: build.name, status: verdict.status, findings }];
  });
}

async function requireWorkOrder(db: DbHandle, workOrderId: string): Promise<WorkOrder> {
  const found = await getWorkOrder(db, workOrderId);
  if (!found) throw new ServiceError('not-found', `id: no work order with id "${workOrderId}"`, 'id');
  return found;
}

function shortText(s: string, max = 80): string {
  const one = s.replace(/\s+/g, ' ').trim();
  return one.length <= max ? one : `${one.slice(0, max - 1)}…`;
}

const complaint = () => v.pipe(notes(), v.trim(), v.minLength(1, 'is required: what the customer says is wrong, in their words'));

export const openWorkOrder = defineHandler(record({ id: v.optional(newId()), vehicleId: id(), complaint: complaint() }), async (ctx, input) => {
  const workOrderId = input.id ?? ctx.newId('job');
  const outcome = await runWrite(ctx, async (trx, at) => {
    if (await getWorkOrder(trx, workOrderId)) throw new ServiceError('conflict', `id: a work order with id "${workOrderId}" already exists`, 'id');
    const vehicle = await requirePart(trx, 'vehicles', input.vehicleId, 'vehicleId');
    if (vehicle.archivedAt !== null) throw new ServiceError('invalid', `vehicleId: the vehicle "${vehicle.name}" is archived; restore it before opening a work order`, 'vehicleId');
    const customerId = vehicle.customerId ?? null;
    await insertWorkOrder(trx, { id: workOrderId, vehicleId: vehicle.id, customerId, complaint: input.complaint, status: 'open', openedAt: at, verdictsAtOpening: await vehicleSnapshot(trx, vehicle.id) }, at);
    const stored = await requireWorkOrder(trx, workOrderId);
    return {
      result: stored,
      history: { action: 'open', entityKind: 'workOrders', entityId: workOrderId, summary: `Opened work order for "${vehicle.name}": ${shortText(input.complaint)}`, reason: '', before: null, after: stored },
      recheck: [],
      changed: { kind: 'workOrders', ids: [workOrderId] },
    };
  });
  return outcome.result;
});

export const addWorkStep = defineHandler(
  record({
    id: id(),
    kind: oneOf(WORK_STEP_KINDS),
    text: v.pipe(notes(), v.trim(), v.minLength(1, 'is required: what was found or done')),
    reason: v.optional(text(2000), ''),
    historyIds: v.optional(v.pipe(v.array(count(1, Number.MAX_SAFE_INTEGER), 'must be a list of history entry numbers'), v.maxLength(MAX_LINKS, `may link at most ${MAX_LINKS} history entries`)), []),
  }),
  async (ctx, input) => {
    const outcome = await runWrite(ctx, async (trx, at) => {
      const order = await requireWorkOrder(trx, input.id);
      const closed = stepProblem(order.status);
      if (closed) throw new ServiceError('invalid', `id: ${closed}`, 'id');
      const links = [...new Set(input.historyIds)];
      const known = await existingHistoryIds(trx, links);
      const missing = links.filter((h) => !known.has(h));
      if (missing.length > 0) throw new ServiceError('not-found', `historyIds: no history entry ${missing.map((m) => `#${m}`).join(', ')}`, 'historyIds');
      const position = await insertWorkStep(trx, order.id, { kind: input.kind, text: input.text, reason: input.reason, at, actor: ctx.actor, historyIds: links });
      const stored = await requireWorkOrder(trx, order.id);
      const step = stored.steps.find((s) => s.position === position);
      return {
        result: stored,
        history: {
          action: 'step',
          entityKind: 'workOrders',
          entityId: order.id,
          summary: `Work order step ${position}, ${WORK_STEP_LABELS[input.kind].toLowerCase()}: ${shortText(input.text)}`,
          reason: input.reason,
          before: null,
          after: step ?? null,
        },
        recheck: [],
        changed: { kind: 'workOrders', ids: [order.id] },
      };
    });
    return outcome.result;
  },
);

export const setWorkOrderStatus = defineHandler(
  record({
    id: id(),
    expectedVersion: v.pipe(v.number('must be a number'), v.integer('must be a whole number'), v.minValue(1, 'must be 1 or more')),
    status: oneOf(WORK_ORDER_STATUSES),
    /** Who hands the vehicle over, printed on the sheet; the writer's name when left out. */
    signedOffBy: v.optional(v.pipe(text(120), v.trim())),
    reason: v.optional(text(500), ''),
  }),
  async (ctx, input) => {
    const outcome = await runWrite(ctx, async (trx, at) => {
      const before = await requireWorkOrder(trx, input.id);
      if (before.version !== input.expectedVersion) {
        throw new ServiceError('conflict', `This work order was changed elsewhere (now version ${before.version}, you read version ${input.expectedVersion}). Nothing was saved: reload it and try again.`, 'expectedVersion');
      }
      const refused = transitionProblem(before.status, input.status);
      if (refused) throw new ServiceError('invalid', `status: ${refused}`, 'status');
      const handOver = input.status === 'handed-over';
      const patch = handOver ? { status: input.status, handedOverAt: at, signedOffBy: input.signedOffBy || ctx.actor, verdictsAtHandOver: JSON.stringify(await vehicleSnapshot(trx, before.vehicleId)) } : { status: input.status };
      const written = await updateWorkOrderAtVersion(trx, before.id, input.expectedVersion, patch, at);
      if (written === 0) throw new ServiceError('conflict', 'This work order was changed elsewhere. Nothing was saved: reload it and try again.', 'expectedVersion');
      const after = await requireWorkOrder(trx, before.id);
      return {
        result: after,
        history: {
          action: 'status',
          entityKind: 'workOrders',
          entityId: before.id,
          summary: `Work order ${WORK_ORDER_STATUS_LABELS[before.status].toLowerCase()} → ${WORK_ORDER_STATUS_LABELS[after.status].toLowerCase()}${handOver ? `, signed off by ${after.signedOffBy}` : ''}`,
          reason: input.reason,
          before: { status: before.status },
          after: { status: after.status, handedOverAt: after.handedOverAt, signedOffBy: after.signedOffBy },
        },
        recheck: [],
        changed: { kind: 'workOrders', ids: [before.id] },
      };
    });
    return outcome.result;
  },
);

export const listWorkOrdersHandler = defineHandler(
  v.optional(record({ vehicleId: v.optional(id()), customerId: v.optional(id()), statuses: v.optional(v.array(oneOf(WORK_ORDER_STATUSES), 'must be a list of work order statuses')) }), {}),
  async (ctx, input) => {
    const orders = await listWorkOrders(ctx.db, input);
    const names = new Map<string, string>();
    for (const o of orders) {
      if (!names.has(o.vehicleId)) names.set(o.vehicleId, (await getPart(ctx.db, 'vehicles', o.vehicleId))?.name ?? o.vehicleId);
    }
    return orders.map((o) => ({ ...o, vehicleName: names.get(o.vehicleId) ?? o.vehicleId }));
  },
);

/**
 * A work order with what its sheet prints: the vehicle, the customer, the history entries its
 * steps link to, the verdicts now (the "after" until the hand-over fixes it), and the entries
 * since opening about the vehicle, its builds and their parts that a step may link to.
 */
export const getWorkOrderHandler = defineHandler(record({ id: id() }), async (ctx, input) => {
  const order = await requireWorkOrder(ctx.db, input.id);
  const vehicle = await requirePart(ctx.db, 'vehicles', order.vehicleId, 'vehicleId');
  const customer = order.customerId === null ? null : ((await getPart(ctx.db, 'customers', order.customerId)) ?? null);
  const builds = await ctx.db.selectFrom('builds').select(['id', 'motorId', 'controllerId', 'propellerId']).where('vehicleId', '=', vehicle.id).execute();
  const packs =
    builds.length === 0
      ? []
      : await ctx.db
          .selectFrom('supplyPacks')
          .innerJoin('supplies', 'supplies.id', 'supplyPacks.supplyId')
          .select('supplyPacks.batteryId')
          .where(
            'supplies.buildId',
            'in',
            builds.map((b) => b.id),
          )
          .execute();
  const related = new Set<string>([vehicle.id, ...builds.flatMap((b) => [b.id, b.motorId, b.controllerId, b.propellerId].filter((x): x is string => x !== null)), ...packs.map((p) => p.batteryId)]);
  const linkedIds = [...new Set(order.steps.flatMap((s) => s.historyIds))];
  const rows = await ctx.db
    .selectFrom('history')
    .select(['id', 'at', 'actor', 'action', 'entityKind', 'entityId', 'summary', 'reason'])
    .where((eb) => {
      const since = eb.and([eb('at', '>=', order.openedAt), eb('entityKind', '!=', 'workOrders'), eb('entityId', 'in', [...related])]);
      return linkedIds.length === 0 ? since : eb.or([since, eb('id', 'in', linkedIds)]);
    })
    .orderBy('id', 'desc')
    .limit(200)
    .execute();
  const entries = rows.map((r) => ({ ...r, id: Number(r.id) }));
  const linked = new Set(linkedIds);
  return {
    order,
    vehicle,
    customer,
    linkedHistory: entries.filter((e) => linked.has(e.id)),
    /** Entries since opening that no step links yet, newest first. */
    unlinkedHistory: order.status === 'handed-over' ? [] : entries.filter((e) => !linked.has(e.id) && e.at >= order.openedAt),
    verdictsNow: order.verdictsAtHandOver ?? (await vehicleSnapshot(ctx.db, vehicle.id)),
  };
});
