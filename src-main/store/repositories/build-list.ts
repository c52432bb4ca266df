import type { Status, VehicleKind } from '../../core/domain';
import { sql } from 'kysely';
import type { DbHandle } from '../db-handle';

/** One line of the builds list: enough to sort, filter and show a badge without the detail. */
export interface BuildSummary {
  id: string;
  name: string;
  version: number;
  archivedAt: string | null;
  vehicleId: string;
  vehicleName: string;
  kind: VehicleKind;
  /** The customer whose vehicle it is; null for the shop's own. */
  customerId: string | null;
  /** '' for the shop's own. */
  customerName: string;
  className: string;
  motorId: string | null;
  motorName: string | null;
  controllerId: string | null;
  controllerName: string | null;
  propellerId: string | null;
  /** Pack names per supply, e.g. "Pack A + Pack B". */
  supplyLabels: string[];
  batteryIds: string[];
  status: Status | null;
  supplyVoltageFullV: number | null;
  theoreticalSpeedKmh: number | null;
  peakCurrentA: number | null;
  peakCurrentLimitA: number | null;
  /** Rule id of the check the current and limit come from; null when no current check was made. */
  currentRule: string | null;
  currentSource: 'model' | 'measured' | null;
  /** The checks that are not clear, `rule=status` pairs by rule id ('' when none, or no verdict yet). */
  ruleStatuses: string;
  updatedAt: string;
}

/** Every key of a summary, in order: the columns of the list's compact wire form. */
export const BUILD_SUMMARY_KEYS = [
  'id',
  'name',
  'version',
  'archivedAt',
  'vehicleId',
  'vehicleName',
  'kind',
  'customerId',
  'customerName',
  'className',
  'motorId',
  'motorName',
  'controllerId',
  'controllerName',
  'propellerId',
  'supplyLabels',
  'batteryIds',
  'status',
  'supplyVoltageFullV',
  'theoreticalSpeedKmh',
  'peakCurrentA',
  'peakCurrentLimitA',
  'currentRule',
  'currentSource',
  'ruleStatuses',
  'updatedAt',
] as const satisfies readonly (keyof BuildSummary)[];

/** Columns that follow one another (a vehicle and its kind, customer and class; a part and its name): sent as one dictionary. */
export const BUILD_SUMMARY_GROUPS = [
  ['vehicleId', 'vehicleName', 'kind', 'customerId', 'customerName', 'className'],
  ['motorId', 'motorName'],
  ['controllerId', 'controllerName'],
  ['supplyLabels', 'batteryIds'],
] as const satisfies readonly (readonly (keyof BuildSummary)[])[];

/** Columns that hardly ever repeat: sent as they are. */
export const BUILD_SUMMARY_PLAIN = ['id', 'name', 'theoreticalSpeedKmh', 'peakCurrentA'] as const satisfies readonly (keyof BuildSummary)[];

/** The customer filter's word for the shop's own vehicles (no customer). */
export const CUSTOMER_SHOP = '-';

export interface BuildListFilter {
  text?: string;
  statuses?: Status[];
  kinds?: VehicleKind[];
  /** A customer's id, or CUSTOMER_SHOP ('-') for the shop's own vehicles; '' or absent for every one. */
  customer?: string;
  /** Builds that use this part (pack, motor, controller, propeller or vehicle id). */
  partId?: string;
  /**
   * Builds where one of these checks (rule ids) is not clear. With `statuses` as well, the
   * check's own status must be one of them, not the build's overall verdict.
   */
  rules?: string[];
  includeArchived?: boolean;
  limit?: number;
}

export async function listBuildSummaries(db: DbHandle, filter: BuildListFilter = {}): Promise<BuildSummary[]> {
  let query = db
    .selectFrom('builds')
    .innerJoin('vehicles', 'vehicles.id', 'builds.vehicleId')
    .leftJoin('customers', 'customers.id', 'vehicles.customerId')
    .leftJoin('motors', 'motors.id', 'builds.motorId')
    .leftJoin('controllers', 'controllers.id', 'builds.controllerId')
    .leftJoin('verdicts', 'verdicts.buildId', 'builds.id')
    .select([
      'builds.id',
      'builds.name',
      'builds.version',
      'builds.archivedAt',
      'builds.vehicleId',
      'vehicles.name as vehicleName',
      'vehicles.kind',
      'vehicles.customerId',
      'customers.name as customerName',
      'vehicles.className',
      'builds.motorId',
      'motors.name as motorName',
      'builds.controllerId',
      'controllers.name as controllerName',
      'builds.propellerId',
      'verdicts.status',
      'verdicts.supplyVoltageFullV',
      'verdicts.theoreticalSpeedKmh',
      'verdicts.peakCurrentA',
      'verdicts.peakCurrentLimitA',
      'verdicts.currentRule',
      'verdicts.currentSource',
      'verdicts.ruleStatuses',
      'builds.updatedAt',
    ])
    .orderBy('builds.name')
    .orderBy('builds.id');
  if (!filter.includeArchived) query = query.where('builds.archivedAt', 'is', null);
  const rules = filter.rules?.filter((r) => r !== '') ?? [];
  if (rules.length > 0) {
    // A check is flagged when its `rule=status` pair is in the stored text; commas on both ends
    // make a whole pair match, never the tail of a longer rule id. replace() finds it: exact and
    // case-sensitive on SQLite and PostgreSQL alike, where LIKE ignores case on SQLite.
    const flagged = filter.statuses && filter.statuses.length > 0 ? filter.statuses.filter((s) => s !== 'clear') : (['over', 'incomplete', 'tight'] as const);
    const pairs = rules.flatMap((rule) => flagged.map((status) => `,${rule}=${status},`));
    query =
      pairs.length === 0
        ? query.where(sql<boolean>`1 = 0`)
        : query.where((eb) => {
            const wrapped = sql<string>`(',' || ${eb.ref('verdicts.ruleStatuses')} || ',')`;
            return eb.or(pairs.map((pair) => sql<boolean>`replace(${wrapped}, ${pair}, '') <> ${wrapped}`));
          });
  } else if (filter.statuses && filter.statuses.length > 0) query = query.where('verdicts.status', 'in', filter.statuses);
  if (filter.kinds && filter.kinds.length > 0) query = query.where('vehicles.kind', 'in', filter.kinds);
  if (filter.customer === CUSTOMER_SHOP) query = query.where('vehicles.customerId', 'is', null);
  else if (filter.customer !== undefined && filter.customer !== '') query = query.where('vehicles.customerId', '=', filter.customer);
  if (filter.partId !== undefined && filter.partId !== '') {
    const partId = filter.partId;
    query = query.where((eb) =>
      eb.or([
        eb('builds.motorId', '=', partId),
        eb('builds.controllerId', '=', partId),
        eb('builds.propellerId', '=', partId),
        eb('builds.vehicleId', '=', partId),
        eb('builds.id', 'in', eb.selectFrom('supplyPacks').innerJoin('supplies', 'supplies.id', 'supplyPacks.supplyId').select('supplies.buildId').where('supplyPacks.batteryId', '=', partId)),
      ]),
    );
  }
  if (filter.text !== undefined && filter.text.trim() !== '') {
    // LIKE with escaped wildcards: the user's % and _ are literal characters.
    const pattern = `%${likeLiteral(filter.text.trim().toLowerCase())}%`;
    query = query.where((eb) => eb.or((['builds.name', 'vehicles.name', 'customers.name', 'motors.name', 'controllers.name'] as const).map((column) => sql<boolean>`lower(${eb.ref(column)}) like ${pattern} escape '\\'`)));
  }
  if (filter.limit !== undefined) query = query.limit(filter.limit);
  const rows = await query.execute();
  const labels = await supplyLabels(db, rows.length <= 900 ? rows.map((r) => r.id) : null);
  return rows.map((r) => ({
    ...r,
    kind: r.kind as VehicleKind,
    customerName: r.customerName ?? '',
    status: r.status as Status | null,
    currentSource: r.currentSource === 'model' || r.currentSource === 'measured' ? r.currentSource : null,
    ruleStatuses: r.ruleStatuses ?? '',
    supplyLabels: labels.get(r.id)?.labels ?? [],
    batteryIds: labels.get(r.id)?.batteryIds ?? [],
  }));
}

/** A text for LIKE with its wildcards escaped: the user's % and _ are literal characters. */
function likeLiteral(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

/** Pack names per supply; `null` ids reads every build's at once, cheaper than a huge IN list. */
async function supplyLabels(db: DbHandle, buildIds: string[] | null): Promise<Map<string, { labels: string[]; batteryIds: string[] }>> {
  let query = db
    .selectFrom('supplyPacks')
    .innerJoin('supplies', 'supplies.id', 'supplyPacks.supplyId')
    .innerJoin('batteries', 'batteries.id', 'supplyPacks.batteryId')
    .select(['supplies.buildId', 'supplies.id as supplyId', 'supplies.arrangement', 'batteries.id as batteryId', 'batteries.name'])
    .orderBy('supplies.buildId')
    .orderBy('supplies.position')
    .orderBy('supplyPacks.position');
  if (buildIds !== null) {
    if (buildIds.length === 0) return new Map();
    query = query.where('supplies.buildId', 'in', buildIds);
  }
  const rows = await query.execute();
  const out = new Map<string, { labels: string[]; batteryIds: string[] }>();
  let lastSupply = '';
  for (const r of rows) {
    let entry = out.get(r.buildId);
    if (!entry) {
      entry = { labels: [], batteryIds: [] };
      out.set(r.buildId, entry);
    }
    entry.batteryIds.push(r.batteryId);
    const joiner = r.arrangement === 'series' ? ' + ' : ' ∥ ';
    if (r.supplyId === lastSupply) entry.labels[entry.labels.length - 1] += joiner + r.name;
    else entry.labels.push(r.name);
    lastSupply = r.supplyId;
  }
  return out;
}
