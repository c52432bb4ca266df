import type { DbHandle } from '../../store/db-handle';
import { loadBuilds } from '../../store/repositories/builds';
import { listParts } from '../../store/repositories/parts';
import { loadAllWorkOrders } from '../../store/repositories/work-orders';
import { canonicalRecord } from './canonical-record';
import { FLEET_FORMAT, FLEET_PART_KINDS, FLEET_SCHEMA_ID, FLEET_VERSION, type FleetFile, type FleetRecords } from './fleet-format';
import { progressCounter, type OnProgress } from './progress';
import { exportLogs } from './fleet-logs';

/**
 * The whole store as a rigbook-fleet file: every record, archived ones included (builds still
 * refer to them), with its version and archivedAt. Verdicts are not exported: they follow from
 * the records. Records are in name order, then id, so two exports of the same records are the
 * same bytes.
 */
export async function exportFleet(db: DbHandle, onProgress?: OnProgress): Promise<FleetFile> {
  const parts = {} as Omit<FleetRecords, 'builds'>;
  for (const kind of FLEET_PART_KINDS) {
    const records = await listParts(db, kind, { includeArchived: true });
    // Class rules have no name: their class and rule id order them.
    records.sort((a, b) => compareText(sortKey(a), sortKey(b)));
    (parts as Record<string, unknown>)[kind] = records.map((r) => canonicalRecord(kind, r));
  }
  const builds = await loadBuilds(db, { by: 'all' });
  const logs = await exportLogs(db);
  const tick = progressCounter(onProgress, 'export', builds.length);
  tick(0);
  builds.sort((a, b) => compareText(a.name, b.name) || compareText(a.id, b.id));
  const out: FleetFile = {
    $schema: FLEET_SCHEMA_ID,
    format: FLEET_FORMAT,
    version: FLEET_VERSION,
    ...parts,
    builds: builds.map((b, i) => {
      tick(i + 1);
      return canonicalRecord('builds', b) as unknown as FleetFile['builds'][number];
    }),
    packEvents: logs.packEvents,
    runLogs: logs.runLogs,
    workOrders: (await loadAllWorkOrders(db)).map((o) => canonicalRecord('workOrders', o) as unknown as FleetFile['workOrders'][number]),
  };
  return out;
}

function sortKey(r: object): string {
  const x = r as { name?: string; className?: string; ruleId?: string; id: string };
  const label = x.name ?? `${x.className ?? ''}\u0000${x.ruleId ?? ''}`;
  return `${label}\u0000${x.id}`;
}

/** Plain code-unit order: the same on every machine, unlike a locale's collation. */
function compareText(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** The file's text: two-space indented, ending with a newline. */
export function fleetText(fleet: FleetFile): string {
  return `${JSON.stringify(fleet, null, 2)}\n`;
}
