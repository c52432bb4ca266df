import type { Status, VehicleKind } from '$core/domain';
import { decodeRuleStatuses } from '$core/rule-statuses';
import { CLASS_RULE, RULE_IDS, ruleName } from '$core/catalogue/rules';
import { statusRank } from '../verdict/status-words';
import type { BuildSummary } from './build-summary';
import { collator, compareText, textOrderKey } from './text-order';

export interface BuildFilter {
  text: string;
  statuses: readonly Status[];
  kinds: readonly VehicleKind[];
  /** '' for every customer; SHOP_OWN ('-') for the shop's own vehicles; else a customer id. */
  customer: string;
  /** '' for every part; else a pack, motor, controller, propeller or vehicle id. */
  partId: string;
  /**
   * '' for any check; else a rule id: only builds where that check is not clear, and the verdict
   * filter then reads that check's status rather than the build's.
   */
  rule: string;
}

/** The customer filter's value for the shop's own vehicles, as the address writes it (`customer=-`). */
export const SHOP_OWN = '-';

export const EMPTY_FILTER: BuildFilter = { text: '', statuses: [], kinds: [], customer: '', partId: '', rule: '' };

export const SORT_KEYS = ['status', 'name', 'vehicle', 'customer', 'supply', 'voltage', 'speed', 'peak'] as const;
export type SortKey = (typeof SORT_KEYS)[number];
export type SortDir = 1 | -1;

/** Everything the text search looks in, lower-cased once per load rather than per keystroke. */
export function haystackOf(s: BuildSummary): string {
  return [s.name, s.vehicleName, s.customerName, s.className, s.motorName ?? '', s.controllerName ?? '', ...s.supplyLabels, s.kind].join('\u0001').toLowerCase();
}

export function usesPart(s: BuildSummary, partId: string): boolean {
  return s.vehicleId === partId || s.motorId === partId || s.controllerId === partId || s.propellerId === partId || s.batteryIds.includes(partId);
}

/** True when the filter lets every row through. */
export function isEmptyFilter(filter: BuildFilter): boolean {
  return filter.text.trim() === '' && filter.statuses.length === 0 && filter.kinds.length === 0 && filter.customer === '' && filter.partId === '' && filter.rule === '';
}

/** The words a search text looks for, each to be found somewhere in a row (case aside). */
function searchWords(text: string): string[] {
  return text
    .trim()
    .toLowerCase()
    .split(/\s+/)
    .filter((w) => w !== '');
}

/** One text for everything that decides which rows a filter lets through, as matchingPositions reads it. */
export function filterKey(filter: BuildFilter): string {
  return [searchWords(filter.text).join(' '), filter.statuses.join(','), filter.kinds.join(','), filter.customer, filter.partId, filter.rule].join('\u0000');
}

/** A row's stored checks read as rule → status, once for each distinct text (a list holds few). */
export class RuleFlags {
  readonly #decoded = new Map<string, ReadonlyMap<string, Status>>();

  of(s: BuildSummary): ReadonlyMap<string, Status> {
    let flags = this.#decoded.get(s.ruleStatuses);
    if (flags === undefined) {
      flags = decodeRuleStatuses(s.ruleStatuses);
      this.#decoded.set(s.ruleStatuses, flags);
    }
    return flags;
  }

  /**
   * Each row's status for one check, by position: undefined where the check raised nothing
   * (clear, or not made for that build). Worked out once per list and check, so a keystroke
   * reads an array rather than a row's text.
   */
  statusesOf(rows: readonly BuildSummary[], rule: string): (Status | undefined)[] {
    const out = new Array<Status | undefined>(rows.length);
    for (let i = 0; i < rows.length; i++) out[i] = this.of(rows[i]!).get(rule);
    return out;
  }

  /** The class checks some row flags, for the check filter's options. */
  classRules(rows: readonly BuildSummary[]): string[] {
    const seen = new Set<string>();
    for (const s of rows) for (const rule of this.of(s).keys()) if (rule.startsWith(CLASS_RULE.idPrefix)) seen.add(rule);
    return [...seen].sort((a, b) => collator.compare(ruleName(a), ruleName(b)) || (a < b ? -1 : 1));
  }
}

/** The check filter's options: every rule of the catalogue, then the class checks of the list (and the chosen one, if neither). */
export function ruleOptions(classRules: readonly string[], chosen: string): { builtIn: { id: string; name: string }[]; classes: { id: string; name: string }[] } {
  const builtIn = RULE_IDS.map((id) => ({ id, name: ruleName(id) }));
  const classes = classRules.map((id) => ({ id, name: ruleName(id) }));
  if (chosen !== '' && !builtIn.some((o) => o.id === chosen) && !classes.some((o) => o.id === chosen)) classes.push({ id: chosen, name: ruleName(chosen) });
  return { builtIn, classes };
}

/**
 * The positions in `rows` of the summaries that pass the filter, in order, looking only at
 * `candidates` when given (positions a wider filter let through). Runs on every keystroke over
 * up to 10 000 rows: one pass, the haystack of a row asked for only when there is text to find.
 */
export function matchingPositions(
  rows: readonly BuildSummary[],
  filter: BuildFilter,
  haystackAt: (position: number) => string,
  candidates?: readonly number[],
  /** Each row's status for the filter's check, by position (RuleFlags.statusesOf); worked out here when missing. */
  ruleStatuses?: readonly (Status | undefined)[],
): number[] {
  const words = searchWords(filter.text);
  const statuses = filter.statuses.length > 0 ? new Set<Status | null>(filter.statuses) : null;
  const kinds = filter.kinds.length > 0 ? new Set<VehicleKind>(filter.kinds) : null;
  const byRule = filter.rule === '' ? null : (ruleStatuses ?? new RuleFlags().statusesOf(rows, filter.rule));
  const out: number[] = [];
  const count = candidates ? candidates.length : rows.length;
  for (let c = 0; c < count; c++) {
    const i = candidates ? candidates[c]! : c;
    const s = rows[i]!;
    if (byRule) {
      const status = byRule[i];
      if (status === undefined || (statuses && !statuses.has(status))) continue;
    } else if (statuses && !statuses.has(s.status)) continue;
    if (kinds && !kinds.has(s.kind)) continue;
    if (filter.customer !== '' && !ofCustomer(s, filter.customer)) continue;
    if (filter.partId !== '' && !usesPart(s, filter.partId)) continue;
    if (words.length > 0) {
      const hay = haystackAt(i);
      let all = true;
      for (const w of words) {
        if (!hay.includes(w)) {
          all = false;
          break;
        }
      }
      if (!all) continue;
    }
    out.push(i);
  }
  return out;
}

/** The summaries that pass the filter, in the given order. */
export function filterSummaries(rows: readonly BuildSummary[], filter: BuildFilter, haystacks: ReadonlyMap<string, string>): BuildSummary[] {
  return matchingPositions(rows, filter, (i) => haystacks.get(rows[i]!.id) ?? haystackOf(rows[i]!)).map((i) => rows[i]!);
}

const sameList = <T>(a: readonly T[], b: readonly T[]) => a.length === b.length && a.every((x, i) => x === b[i]);

/**
 * True when every row `next` lets through, `previous` let through too, so the next filter may
 * run over the previous result instead of every build: only the search text grew, at its end
 * (each typed word then still holds the word it extends). Typing forward narrows; a deletion
 * does not.
 */
export function narrows(previous: BuildFilter, next: BuildFilter): boolean {
  return (
    previous.customer === next.customer &&
    previous.partId === next.partId &&
    previous.rule === next.rule &&
    sameList(previous.statuses, next.statuses) &&
    sameList(previous.kinds, next.kinds) &&
    next.text.toLowerCase().startsWith(previous.text.toLowerCase())
  );
}

function numberOrNull(a: number | null, b: number | null): number {
  // Missing figures sort last whichever way the column is sorted.
  if (a === null && b === null) return 0;
  if (a === null) return Number.POSITIVE_INFINITY;
  if (b === null) return Number.NEGATIVE_INFINITY;
  return a - b;
}

/** Share of the tightest current limit the peak uses; the list's "96 A / 120 A" column sorts by it. */
export function peakShare(s: BuildSummary): number | null {
  return s.peakCurrentA !== null && s.peakCurrentLimitA !== null && s.peakCurrentLimitA > 0 ? s.peakCurrentA / s.peakCurrentLimitA : null;
}

const TEXT_COLUMN: Partial<Record<SortKey, (s: BuildSummary) => string>> = {
  name: (s) => s.name,
  vehicle: (s) => s.vehicleName,
  customer: (s) => s.customerName,
  supply: (s) => s.supplyLabels.join(', '),
};

/** A row with its sort keys worked out once, not once per comparison. */
interface Keyed {
  s: BuildSummary;
  nameKey: string | null;
  text: string;
  textKey: string | null;
}

export function sortSummaries(rows: readonly BuildSummary[], key: SortKey, dir: SortDir): BuildSummary[] {
  const column = TEXT_COLUMN[key];
  const keyed: Keyed[] = rows.map((s) => {
    const text = column ? column(s) : '';
    return { s, nameKey: textOrderKey(s.name), text, textKey: column ? textOrderKey(text) : null };
  });
  const num = (pick: (s: BuildSummary) => number | null) => (a: Keyed, b: Keyed) => {
    const d = numberOrNull(pick(a.s), pick(b.s));
    return Number.isFinite(d) ? dir * d : d;
  };
  const text = (a: Keyed, b: Keyed) => dir * compareText(a.text, a.textKey, b.text, b.textKey);
  const compare: Record<SortKey, (a: Keyed, b: Keyed) => number> = {
    status: (a, b) => dir * (statusRank(a.s.status) - statusRank(b.s.status)),
    name: text,
    vehicle: text,
    customer: text,
    supply: text,
    voltage: num((s) => s.supplyVoltageFullV),
    speed: num((s) => s.theoreticalSpeedKmh),
    peak: num(peakShare),
  };
  const byKey = compare[key];
  // Ties keep a stable, readable order: by name, then id.
  keyed.sort((a, b) => byKey(a, b) || compareText(a.s.name, a.nameKey, b.s.name, b.nameKey) || (a.s.id < b.s.id ? -1 : a.s.id > b.s.id ? 1 : 0));
  return keyed.map((k) => k.s);
}

/** Whether a row belongs to the filter's customer (SHOP_OWN: to no customer). */
export function ofCustomer(s: BuildSummary, customer: string): boolean {
  return customer === SHOP_OWN ? s.customerId === null : s.customerId === customer;
}

/** Customers present in the list, by name, for the customer filter. */
export function customersOf(rows: readonly BuildSummary[]): { id: string; name: string }[] {
  const byId = new Map<string, string>();
  for (const s of rows) if (s.customerId !== null) byId.set(s.customerId, s.customerName);
  return [...byId].map(([id, name]) => ({ id, name })).sort((a, b) => collator.compare(a.name, b.name) || (a.id < b.id ? -1 : 1));
}

/** Builds by verdict; with a check's statuses by position, by that check's status (clear: none, the check filter lists flagged builds only). */
export function countByStatus(rows: readonly BuildSummary[], ruleStatuses?: readonly (Status | undefined)[]): Record<Status, number> {
  const out: Record<Status, number> = { over: 0, tight: 0, incomplete: 0, clear: 0 };
  if (ruleStatuses) {
    for (const status of ruleStatuses) if (status !== undefined && status !== 'clear') out[status] += 1;
    return out;
  }
  for (const s of rows) if (s.status !== null) out[s.status] += 1;
  return out;
}
