import type { BuildVerdict, Status, SupplyVerdict } from '../../core/domain';
import { encodeRuleStatuses } from '../../core/rule-statuses';
import { chunks, type DbHandle } from '../db-handle';
import { selectedBuildIds, type BuildSelector } from '../build-selector';
import type { NewVerdictRow } from '../schema';

/** The list columns a verdict row holds, everything but when it was written. */
const LIST_COLUMNS = ['status', 'supplyVoltageFullV', 'theoreticalSpeedKmh', 'peakCurrentA', 'peakCurrentLimitA', 'currentRule', 'currentSource', 'supplyStatuses', 'ruleStatuses'] as const;

type ListColumns = Pick<NewVerdictRow, (typeof LIST_COLUMNS)[number]>;

/** The stored status of every supply of a build, keyed by supply id, and the stored row's list columns. */
export interface StoredStatuses {
  status: Status;
  supplies: Map<string, Status>;
  row: ListColumns;
}

/**
 * Whether a freshly computed row says what the stored row says. Same inputs through the same
 * code give bit-identical numbers, and SQLite keeps a double exactly, so equality is exact.
 */
export function sameVerdictRow(stored: StoredStatuses | undefined, row: NewVerdictRow): boolean {
  if (stored === undefined) return false;
  for (const column of LIST_COLUMNS) if (stored.row[column] !== row[column]) return false;
  return true;
}

export function encodeSupplyStatuses(supplies: readonly SupplyVerdict[]): string {
  return supplies.map((s) => `${s.supplyId}=${s.status}`).join(',');
}

export function decodeSupplyStatuses(text: string): Map<string, Status> {
  const out = new Map<string, Status>();
  if (text === '') return out;
  for (const pair of text.split(',')) {
    const at = pair.lastIndexOf('=');
    out.set(pair.slice(0, at), pair.slice(at + 1) as Status);
  }
  return out;
}

export async function getStoredStatuses(db: DbHandle, selector: BuildSelector): Promise<Map<string, StoredStatuses>> {
  const out = new Map<string, StoredStatuses>();
  const rows = await db
    .selectFrom('verdicts')
    .select(['buildId', ...LIST_COLUMNS])
    .where('buildId', 'in', selectedBuildIds(db, selector))
    .execute();
  for (const r of rows) {
    const { buildId, ...row } = r;
    out.set(buildId, { status: r.status as Status, supplies: decodeSupplyStatuses(r.supplyStatuses), row });
  }
  return out;
}

/**
 * The figures the builds list shows without opening the detail. The current shown is the one
 * of the tightest current check (smallest margin), paired with that check's own limit, so a
 * per-motor limit is never set against a whole-supply current.
 */
export function verdictToRow(verdict: BuildVerdict, evaluatedAt: string): NewVerdictRow {
  let supplyVoltageFullV: number | null = null;
  let theoreticalSpeedKmh: number | null = null;
  let peakCurrentA: number | null = null;
  let peakCurrentLimitA: number | null = null;
  let currentRule: string | null = null;
  let currentSource: string | null = null;
  let tightest = Number.POSITIVE_INFINITY;
  for (const s of verdict.supplies) {
    const f = s.figures;
    if (f.packVoltageFullV !== null && (supplyVoltageFullV === null || f.packVoltageFullV > supplyVoltageFullV)) supplyVoltageFullV = f.packVoltageFullV;
    if (f.theoreticalSpeedKmh !== null && (theoreticalSpeedKmh === null || f.theoreticalSpeedKmh > theoreticalSpeedKmh)) theoreticalSpeedKmh = f.theoreticalSpeedKmh;
    for (const finding of s.findings) {
      if (finding.unit !== 'A' || finding.margin === null || finding.value === null || finding.limit === null) continue;
      if (finding.margin < tightest) {
        tightest = finding.margin;
        peakCurrentA = finding.value;
        peakCurrentLimitA = finding.limit;
        currentRule = finding.rule;
        currentSource = finding.source ?? f.currentSource;
      }
    }
    if (peakCurrentA === null && f.peakCurrentA !== null) {
      // No current check could be made: the supply's peak, with no limit and no rule.
      peakCurrentA = f.peakCurrentA;
      currentSource = f.currentSource;
    }
  }
  return {
    buildId: verdict.buildId,
    status: verdict.status,
    supplyVoltageFullV,
    theoreticalSpeedKmh,
    peakCurrentA,
    peakCurrentLimitA,
    currentRule,
    currentSource,
    supplyStatuses: encodeSupplyStatuses(verdict.supplies),
    ruleStatuses: encodeRuleStatuses(verdict),
    evaluatedAt,
  };
}

// A row binds its build id, its list columns and when it was written: as many rows a statement
// as stay under SQLite's 32 766 bound parameters, so a new list column cannot overflow it.
const ROWS_PER_INSERT = Math.floor(32_766 / (LIST_COLUMNS.length + 2));

/** Upserts verdict rows in large batches: a few statements for a 10 000-build re-check. */
export async function writeVerdicts(db: DbHandle, rows: readonly NewVerdictRow[]): Promise<void> {
  for (const part of chunks(rows, ROWS_PER_INSERT)) {
    await db
      .insertInto('verdicts')
      .values(part)
      .onConflict((oc) =>
        oc.column('buildId').doUpdateSet((eb) => ({
          status: eb.ref('excluded.status'),
          supplyVoltageFullV: eb.ref('excluded.supplyVoltageFullV'),
          theoreticalSpeedKmh: eb.ref('excluded.theoreticalSpeedKmh'),
          peakCurrentA: eb.ref('excluded.peakCurrentA'),
          peakCurrentLimitA: eb.ref('excluded.peakCurrentLimitA'),
          currentRule: eb.ref('excluded.currentRule'),
          currentSource: eb.ref('excluded.currentSource'),
          supplyStatuses: eb.ref('excluded.supplyStatuses'),
          ruleStatuses: eb.ref('excluded.ruleStatuses'),
          evaluatedAt: eb.ref('excluded.evaluatedAt'),
        })),
      )
      .execute();
  }
}

/** When the stored verdict was last computed; the detail itself is evaluated fresh on reading. */
export async function getEvaluatedAt(db: DbHandle, buildId: string): Promise<string | null> {
  const row = await db.selectFrom('verdicts').select('evaluatedAt').where('buildId', '=', buildId).executeTakeFirst();
  return row?.evaluatedAt ?? null;
}
