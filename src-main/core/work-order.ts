import type { Status } from './domain';

// A job on one vehicle: opened with the customer's complaint, worked through in steps, and
// handed back. What the shop records and what the job sheet prints; no I/O here.

export const WORK_ORDER_STATUSES = ['open', 'waiting-for-parts', 'ready', 'handed-over'] as const;
export type WorkOrderStatus = (typeof WORK_ORDER_STATUSES)[number];

export const WORK_ORDER_STATUS_LABELS: Readonly<Record<WorkOrderStatus, string>> = {
  open: 'Open',
  'waiting-for-parts': 'Waiting for parts',
  ready: 'Ready',
  'handed-over': 'Handed over',
};

/**
 * Where a job may go from each status. A job waiting for parts goes back to open when they
 * come; a ready job goes back to open when the test drive finds more. Handed over is the end:
 * a new complaint opens a new work order, so the signed sheet stays what was signed.
 */
export const WORK_ORDER_TRANSITIONS: Readonly<Record<WorkOrderStatus, readonly WorkOrderStatus[]>> = {
  open: ['waiting-for-parts', 'ready'],
  'waiting-for-parts': ['open', 'ready'],
  ready: ['open', 'handed-over'],
  'handed-over': [],
};

export const WORK_STEP_KINDS = ['checked', 'part-swapped', 're-geared', 'tested', 'note'] as const;
export type WorkStepKind = (typeof WORK_STEP_KINDS)[number];

export const WORK_STEP_LABELS: Readonly<Record<WorkStepKind, string>> = {
  checked: 'Checked',
  'part-swapped': 'Part swapped',
  're-geared': 'Re-geared',
  tested: 'Tested',
  note: 'Note',
};

/** One build's verdict as it stood at a moment of the job: what the sheet prints before and after. */
export interface VerdictSnapshot {
  buildId: string;
  buildName: string;
  /** null: the build had not been checked. */
  status: Status | null;
  /** The checks that were not clear, in the sheet's words. */
  findings: { rule: string; status: Status; message: string; unit: string }[];
}

export interface WorkStep {
  position: number;
  kind: WorkStepKind;
  /** What was found or done. */
  text: string;
  /** Why: the finding or complaint it answers. */
  reason: string;
  at: string;
  actor: string;
  /** History entries this step caused (a part swap's edit, a re-gear's build change). */
  historyIds: number[];
}

export interface WorkOrder {
  id: string;
  version: number;
  vehicleId: string;
  /** The customer at opening; null for the shop's own vehicle. */
  customerId: string | null;
  complaint: string;
  status: WorkOrderStatus;
  openedAt: string;
  handedOverAt: string | null;
  signedOffBy: string;
  verdictsAtOpening: VerdictSnapshot[];
  /** Taken at hand-over; null before. */
  verdictsAtHandOver: VerdictSnapshot[] | null;
  steps: WorkStep[];
}

/** Why a status change is refused, or null when it may be made. */
export function transitionProblem(from: WorkOrderStatus, to: WorkOrderStatus): string | null {
  if (from === to) return `the work order is already "${WORK_ORDER_STATUS_LABELS[to]}"`;
  if (WORK_ORDER_TRANSITIONS[from].includes(to)) return null;
  if (from === 'handed-over') return `the work order was handed over and is closed; open a new work order for new work`;
  const allowed = WORK_ORDER_TRANSITIONS[from].map((s) => `"${WORK_ORDER_STATUS_LABELS[s]}"`).join(' or ');
  return `a work order that is "${WORK_ORDER_STATUS_LABELS[from]}" can go to ${allowed}, not to "${WORK_ORDER_STATUS_LABELS[to]}"`;
}

/** Steps may be added until the vehicle is handed over. */
export function stepProblem(status: WorkOrderStatus): string | null {
  return status === 'handed-over' ? 'the work order was handed over and is closed; open a new work order for new work' : null;
}

export interface VerdictComparison {
  buildId: string;
  buildName: string;
  before: Status | null;
  after: Status | null;
  /** before and after both present and different. */
  changed: boolean;
}

/** Builds side by side at opening and at hand-over (or now), in the order they first appear. */
export function compareSnapshots(before: readonly VerdictSnapshot[], after: readonly VerdictSnapshot[] | null): VerdictComparison[] {
  const rows = new Map<string, VerdictComparison>();
  for (const b of before) rows.set(b.buildId, { buildId: b.buildId, buildName: b.buildName, before: b.status, after: null, changed: false });
  for (const a of after ?? []) {
    const row = rows.get(a.buildId) ?? { buildId: a.buildId, buildName: a.buildName, before: null, after: null, changed: false };
    row.after = a.status;
    row.buildName = a.buildName;
    rows.set(a.buildId, row);
  }
  for (const row of rows.values()) row.changed = after !== null && row.before !== row.after;
  return [...rows.values()];
}
