import type { ApiOutput } from '$service/handlers';

// How an import report reads in the window: counts in the trade's words, kind by kind.

export type ImportReport = ApiOutput<'fleet.import'>;
type Kind = keyof ImportReport['counts'];

const WORDS: Readonly<Record<Kind, readonly [string, string]>> = {
  batteries: ['pack', 'packs'],
  motors: ['motor', 'motors'],
  controllers: ['speed controller', 'speed controllers'],
  propellers: ['propeller', 'propellers'],
  customers: ['customer', 'customers'],
  vehicles: ['vehicle', 'vehicles'],
  classes: ['class', 'classes'],
  classRules: ['class limit', 'class limits'],
  builds: ['build', 'builds'],
  workOrders: ['work order', 'work orders'],
};

export function countOf(n: number, kind: Kind): string {
  return `${n} ${WORDS[kind][n === 1 ? 0 : 1]}`;
}

/** "3 packs, 1 build" for one column of the counts; '' when none. */
export function countsLine(counts: ImportReport['counts'], field: 'added' | 'updated' | 'unchanged'): string {
  return (Object.keys(WORDS) as Kind[])
    .filter((k) => counts[k][field] > 0)
    .map((k) => countOf(counts[k][field], k))
    .join(', ');
}

/** A fleet file's name for today: `rigbook-fleet-2026-12-03.json`. */
export function exportFileName(now: Date): string {
  return `rigbook-fleet-${now.toISOString().slice(0, 10)}.json`;
}

/** A new backup's name in the backups folder, to the millisecond so two never share one. */
export function backupFileName(now: Date): string {
  return `rigbook-backup-${now.toISOString().replace(/[:.]/g, '-')}.sqlite`;
}
