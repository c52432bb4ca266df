// Import of a whole rigbook-fleet value: every problem first (shape, fields, duplicate ids,
// references to the file and the store), then all of it or nothing in one transaction
// together with the re-check of the builds it touched and one history entry.
//
// Policy for records that already exist:
//   merge    (default) a record whose id is stored is overwritten with the file's fields and
//            its stored version bumped; an identical one is left alone; new ones keep the
//            file's version (1 when left out). Nothing the file leaves out is removed.
//   replace  every part and build is removed first (history and settings stay), then the
//            file is written with its versions as given: a file exported and imported again
//            gives back the same records.

import type { BuildVerdict, Status } from '../../core/domain';
import { STATUSES } from '../../core/domain';
import type { DbHandle } from '../../store/db-handle';
import type { BuildSelector } from '../../store/build-selector';
import { buildIdsUsingAny, clearFleetTables, deleteSuppliesOf, insertBuildRows, insertPartRows, insertSupplyRows, readFleetIds, type ClearedCounts, type PartsInUse } from '../../store/fleet-rows';
import { getBuilds, updateBuildAtVersion } from '../../store/repositories/builds';
import type { VerdictChange } from '../../store/repositories/history';
import { getParts, updatePartAtVersion } from '../../store/repositories/parts';
import { existingHistoryIds, getWorkOrder, writeWholeWorkOrder } from '../../store/repositories/work-orders';
import type { PartRecords } from '../../store/repositories/part-records';
import { ServiceError } from '../contract';
import { runWrite } from '../run-write';
import type { ServiceContext } from '../service-context';
import { sameFields } from './canonical-record';
import { FLEET_KINDS, FLEET_PART_KINDS, KIND_WORDS, type FleetKind, type FleetPartKind, type FleetRecords } from './fleet-format';
import { sortProblems, type FleetProblem } from './fleet-problems';
import { NO_STORED_IDS, referenceProblems, type StoredIds } from './fleet-references';
import { numericTwin } from './numeric-twin';
import { progressCounter, type OnProgress } from './progress';
import { recordChange, suspectMessage, type RecordChange } from './fleet-changes';
import { validateFleet } from './validate-fleet';
import { readJsonText } from './read-fleet-text';
import { lossyDecodingReason } from './decode-file-bytes';
import { logReferenceProblems, writeLogs } from './fleet-logs';
import { ensureClasses } from '../../store/repositories/classes';
import { ID_PREFIXES } from '../record-labels';
import { placeOf } from './fleet-problems';

/** A class name is one class: refused where two ids in the file, or the file and the store, would share one. */
async function classNameProblems(db: DbHandle, fleet: FleetRecords, mode: ImportMode): Promise<FleetProblem[]> {
  const holder = new Map<string, string>();
  if (mode === 'merge') {
    const fileIds = new Set(fleet.classes.map((c) => c.id));
    // Stored classes the file rewrites give up their names to the file's.
    for (const c of await db.selectFrom('classes').select(['id', 'name']).execute()) if (!fileIds.has(c.id)) holder.set(c.name, `class "${c.id}" in the store`);
  }
  const problems: FleetProblem[] = [];
  fleet.classes.forEach((c, i) => {
    const other = holder.get(c.name);
    if (other !== undefined) problems.push({ place: placeOf('classes', i, 'name'), message: `"${c.name}" is already the name of ${other}; a class name names one class` });
    else holder.set(c.name, placeOf('classes', i));
  });
  return problems;
}

export const IMPORT_MODES = ['merge', 'replace'] as const;
export type ImportMode = (typeof IMPORT_MODES)[number];

export interface ImportOptions {
  mode: ImportMode;
  /** Runs everything, reports it, and rolls it back. */
  dryRun?: boolean;
  /** Said in the history entry. */
  reason?: string;
  /** What was imported, for the history entry: `file`, `csv`, `demo`. */
  source?: string;
  /** Refuse (as a conflict, nothing written) when the store already holds any part or build. */
  requireEmptyStore?: boolean;
  /** Confirms changes that look like a spreadsheet's damage (a number scaled by 100 or more, or out of its plausible range); without it they refuse the import. */
  acceptChanges?: boolean;
  onProgress?: OnProgress;
}

export interface KindCounts {
  added: number;
  updated: number;
  unchanged: number;
}

/** The most build-level verdict changes a report lists; the count says how many there were. */
export const MAX_LISTED_CHANGES = 500;
/** The most changed records a report lists field by field; `changedRecordCount` says how many there were. Changes that need confirming are always listed. */
export const MAX_LISTED_RECORD_CHANGES = 1000;

export interface ImportReport {
  /** False when the file was refused: `problems` says why, and nothing was written. */
  ok: boolean;
  /** Refused because the text is not JSON (or CSV) at all, rather than for what it holds. */
  unreadable: boolean;
  dryRun: boolean;
  mode: ImportMode;
  source: string;
  problems: FleetProblem[];
  counts: Record<FleetKind, KindCounts>;
  /** What a replace removed first; null for a merge. */
  removed: ClearedCounts | null;
  rechecked: number;
  /** How many re-checked builds ended at each verdict. */
  statuses: Record<Status, number>;
  /** Builds whose overall verdict changed (the first MAX_LISTED_CHANGES). */
  verdictChanges: VerdictChange[];
  verdictChangeCount: number;
  historyId: number | null;
  /** Stored records the import changes (or would change), field by field, before → after. */
  recordChanges: RecordChange[];
  changedRecordCount: number;
  /** How many field changes need confirming (`acceptChanges`); when not confirmed the import is refused and each is a problem. */
  suspectChangeCount: number;
  /** Refused only because changes need confirming: importing again with `acceptChanges` would go through. */
  needsConfirmation: boolean;
  /** CSV rows holding nothing but separators, skipped. */
  skippedRows: number;
}

function zeroCounts(): Record<FleetKind, KindCounts> {
  const out = {} as Record<FleetKind, KindCounts>;
  for (const kind of FLEET_KINDS) out[kind] = { added: 0, updated: 0, unchanged: 0 };
  return out;
}

function zeroStatuses(): Record<Status, number> {
  const out = {} as Record<Status, number>;
  for (const s of STATUSES) out[s] = 0;
  return out;
}

export function refusedReport(options: ImportOptions, problems: FleetProblem[], unreadable = false, changes: RecordChange[] = [], needsConfirmation = false): ImportReport {
  return {
    ok: false,
    unreadable,
    dryRun: options.dryRun ?? false,
    mode: options.mode,
    source: options.source ?? 'file',
    problems,
    counts: zeroCounts(),
    removed: null,
    rechecked: 0,
    statuses: zeroStatuses(),
    verdictChanges: [],
    verdictChangeCount: 0,
    historyId: null,
    ...listedChanges(changes),
    needsConfirmation,
    skippedRows: 0,
  };
}

function listedChanges(changes: readonly RecordChange[]): Pick<ImportReport, 'recordChanges' | 'changedRecordCount' | 'suspectChangeCount'> {
  const suspect = changes.filter((c) => c.fields.some((f) => f.suspect !== null));
  const rest = changes.filter((c) => !c.fields.some((f) => f.suspect !== null));
  return {
    recordChanges: [...suspect, ...rest.slice(0, Math.max(0, MAX_LISTED_RECORD_CHANGES - suspect.length))],
    changedRecordCount: changes.length,
    suspectChangeCount: suspect.reduce((n, c) => n + c.fields.filter((f) => f.suspect !== null).length, 0),
  };
}

/** Thrown inside the transaction to leave it with nothing written. */
class ImportRefused extends Error {
  constructor(
    readonly problems: FleetProblem[],
    readonly changes: RecordChange[] = [],
  ) {
    super('import refused');
  }
}

/** "added 3 packs, 1 build; updated 1 motor; 4 unchanged" */
export function describeCounts(counts: Record<FleetKind, KindCounts>): string {
  const list = (field: 'added' | 'updated') =>
    FLEET_KINDS.filter((k) => counts[k][field] > 0)
      .map((k) => `${counts[k][field]} ${counts[k][field] === 1 ? KIND_WORDS[k].one : KIND_WORDS[k].many}`)
      .join(', ');
  const unchanged = FLEET_KINDS.reduce((n, k) => n + counts[k].unchanged, 0);
  const parts: string[] = [];
  const added = list('added');
  const updated = list('updated');
  if (added) parts.push(`added ${added}`);
  if (updated) parts.push(`updated ${updated}`);
  if (unchanged > 0) parts.push(`${unchanged} unchanged`);
  return parts.length > 0 ? parts.join('; ') : 'nothing in the file';
}

/** Past this many builds a merge re-checks every build: one query instead of an id list too long for one statement. */
const RECHECK_ALL_ABOVE = 20_000;

interface Written {
  counts: Record<FleetKind, KindCounts>;
  removed: ClearedCounts | null;
  recheck: readonly string[] | BuildSelector;
  changedIds: Partial<Record<FleetKind, string[]>>;
  changes: RecordChange[];
}

async function writeParts<K extends FleetPartKind>(
  trx: DbHandle,
  kind: K,
  records: readonly PartRecords[K][],
  merging: boolean,
  at: string,
  written: Written,
  tick: () => void,
): Promise<{ changed: PartRecords[K][]; before: Map<string, PartRecords[K]> }> {
  const before = new Map<string, PartRecords[K]>();
  if (merging && records.length > 0)
    for (const r of await getParts(
      trx,
      kind,
      records.map((x) => x.id),
    ))
      before.set(r.id, r);
  const added: PartRecords[K][] = [];
  const changed: PartRecords[K][] = [];
  for (const record of records) {
    const stored = before.get(record.id);
    if (!stored) added.push(record);
    else if (!sameFields(kind, record, stored)) {
      changed.push(record);
      written.changes.push(recordChange(kind, stored, record));
    } else written.counts[kind].unchanged++;
  }
  await insertPartRows(trx, kind, added, at);
  for (const record of changed) {
    const stored = before.get(record.id)!;
    const { id, version: _fileVersion, ...fields } = record as PartRecords[K] & { version: number };
    const n = await updatePartAtVersion(trx, kind, id, stored.version, fields as never, at);
    if (n !== 1) throw new Error(`import: ${kind} ${id} was not updated`);
    tick();
  }
  written.counts[kind].added = added.length;
  written.counts[kind].updated = changed.length;
  written.changedIds[kind] = [...added, ...changed].map((r) => r.id);
  for (let i = 0; i < added.length; i++) tick();
  return { changed, before };
}

async function writeFleet(trx: DbHandle, fleet: FleetRecords, mode: ImportMode, at: string, newClassId: () => string, onProgress?: OnProgress): Promise<Written> {
  const merging = mode === 'merge';
  const written: Written = { counts: zeroCounts(), removed: null, recheck: [], changedIds: {}, changes: [] };
  if (!merging) written.removed = await clearFleetTables(trx);
  const total = FLEET_KINDS.reduce((n, k) => n + fleet[k].length, 0);
  const progress = progressCounter(onProgress, 'write', total);
  let done = 0;
  const tick = () => progress(++done);
  progress(0);

  const usedBy: { [K in keyof PartsInUse]: string[] } = { batteries: [], motors: [], controllers: [], propellers: [], vehicles: [] };
  const classNames = new Set<string>();
  for (const kind of FLEET_PART_KINDS) {
    const { changed, before } = await writeParts(trx, kind, fleet[kind] as PartRecords[typeof kind][], merging, at, written, tick);
    for (const record of changed) {
      // A customer's name or contact changes no build's figures.
      if (kind === 'customers') continue;
      if (kind === 'classRules') {
        const rule = record as PartRecords['classRules'];
        classNames.add(rule.className);
        classNames.add((before.get(rule.id) as PartRecords['classRules']).className);
      } else if (kind === 'classes') {
        // A class's name and notes change no verdict; its builds are re-checked all the same, as an edit in the window does.
        classNames.add((record as PartRecords['classes']).name);
      } else {
        usedBy[kind].push(record.id);
      }
    }
    for (let i = 0; i < written.counts[kind].unchanged; i++) tick();
  }
  // A file written before classes were records names them only on vehicles and limits: each gets its record.
  const derived = await ensureClasses(trx, [...fleet.vehicles.map((x) => x.className), ...fleet.classRules.map((r) => r.className)], at, newClassId);
  written.counts.classes.added += derived.length;
  written.changedIds.classes = [...(written.changedIds.classes ?? []), ...derived.map((c) => c.id)];

  const storedBuilds = new Map(
    (merging && fleet.builds.length > 0
      ? await getBuilds(
          trx,
          fleet.builds.map((b) => b.id),
        )
      : []
    ).map((b) => [b.id, b]),
  );
  const addedBuilds = fleet.builds.filter((b) => !storedBuilds.has(b.id));
  const changedBuilds = fleet.builds.filter((b) => {
    const stored = storedBuilds.get(b.id);
    return stored !== undefined && !sameFields('builds', b, stored);
  });
  for (const b of changedBuilds) written.changes.push(recordChange('builds', storedBuilds.get(b.id)!, b));
  written.counts.builds = { added: addedBuilds.length, updated: changedBuilds.length, unchanged: fleet.builds.length - addedBuilds.length - changedBuilds.length };
  written.changedIds.builds = [...addedBuilds, ...changedBuilds].map((b) => b.id);
  // Supplies of every rewritten build go first, so one may move a supply id to another.
  await deleteSuppliesOf(
    trx,
    changedBuilds.map((b) => b.id),
  );
  for (const build of changedBuilds) {
    const { id, version: _fileVersion, supplies: _supplies, ...fields } = build;
    const n = await updateBuildAtVersion(trx, id, storedBuilds.get(id)!.version, fields, at);
    if (n !== 1) throw new Error(`import: build ${id} was not updated`);
    tick();
  }
  await insertSupplyRows(trx, changedBuilds);
  const beforeNew = done;
  await insertBuildRows(trx, addedBuilds, at, (n) => progress(beforeNew + n));
  done += addedBuilds.length + written.counts.builds.unchanged;
  progress(done);

  await writeWorkOrders(trx, fleet.workOrders, merging, at, written);
  for (let i = 0; i < fleet.workOrders.length; i++) tick();

  if (!merging) {
    written.recheck = { by: 'all' };
  } else {
    const ids = new Set(fleet.builds.map((b) => b.id));
    for (const id of await buildIdsUsingAny(trx, usedBy, [...classNames])) ids.add(id);
    written.recheck = ids.size > RECHECK_ALL_ABOVE ? { by: 'all' } : [...ids];
  }
  return written;
}

/**
 * Work orders change no verdict: each is written whole (row and steps), a stored one of the same
 * id rewritten only where the file's differs, at the stored version + 1. A step's links to
 * history entries belong to the store they were made in: one is kept only where this store has
 * an entry of that number written no later than the step, so a file from another store does
 * not link a step to an unrelated entry.
 */
async function writeWorkOrders(trx: DbHandle, orders: FleetRecords['workOrders'], merging: boolean, at: string, written: Written): Promise<void> {
  const counts = written.counts.workOrders;
  const ids: string[] = [];
  for (const order of orders) {
    const stored = merging ? await getWorkOrder(trx, order.id) : undefined;
    if (stored && sameFields('workOrders', order, stored)) {
      counts.unchanged++;
      continue;
    }
    const linked = await existingHistoryIds(trx, [...new Set(order.steps.flatMap((s) => s.historyIds))]);
    const entryTimes = new Map(
      linked.size === 0
        ? []
        : (
            await trx
              .selectFrom('history')
              .select(['id', 'at'])
              .where('id', 'in', [...linked])
              .execute()
          ).map((r) => [Number(r.id), r.at] as const),
    );
    const steps = order.steps.map((s) => ({ ...s, historyIds: s.historyIds.filter((h) => (entryTimes.get(h) ?? '\uffff') <= s.at) }));
    await writeWholeWorkOrder(trx, { ...order, steps, version: stored ? stored.version + 1 : order.version }, at);
    if (stored) counts.updated++;
    else counts.added++;
    ids.push(order.id);
  }
  written.changedIds.workOrders = ids;
}

/** Counts of what the store holds, archived records included, as "3 builds, 12 packs". */
export async function describeStoreContents(db: DbHandle): Promise<string> {
  const held: string[] = [];
  for (const kind of FLEET_KINDS) {
    const row = await db
      .selectFrom(kind as 'builds')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .executeTakeFirstOrThrow();
    const n = Number(row.n);
    if (n > 0) held.push(`${n} ${n === 1 ? KIND_WORDS[kind].one : KIND_WORDS[kind].many}`);
  }
  return held.join(', ');
}

async function refuseUnlessEmpty(db: DbHandle): Promise<void> {
  const held = await describeStoreContents(db);
  if (held !== '') {
    throw new ServiceError(
      'conflict',
      `merge: the store already holds records (${held}). The demo fleet is invented; loading it would mix its records with yours. Nothing was loaded. Back up first and load it with merge to add it anyway.`,
      'merge',
    );
  }
}

const ID_PLACE = /^(batteries|motors|controllers|propellers|vehicles)\[(\d+)\]\.id$/;

/** An id refused for starting with a digit that equals a stored id as a number (`1` for `001`): say so, as the CSV import does. */
function hintRewrittenIds(input: unknown, problems: readonly FleetProblem[], stored: StoredIds): FleetProblem[] {
  return problems.map((p) => {
    const m = ID_PLACE.exec(p.place);
    if (!m) return p;
    const kind = m[1] as keyof Pick<StoredIds, 'batteries' | 'motors' | 'controllers' | 'propellers' | 'vehicles'>;
    const raw = ((input as Record<string, unknown[]>)[kind]?.[Number(m[2])] as { id?: unknown } | undefined)?.id;
    const twin = typeof raw === 'string' ? numericTwin(raw, stored[kind]) : null;
    if (twin === null) return p;
    return {
      place: p.place,
      message: `"${String(raw)}" matches no ${KIND_WORDS[kind].one} in the store, but "${twin}" is the same number written differently: a spreadsheet or script probably rewrote the id. Nothing was added; put the id back as "${twin}".`,
    };
  });
}

function tally(verdicts: readonly BuildVerdict[]): Record<Status, number> {
  const out = zeroStatuses();
  for (const v of verdicts) out[v.status]++;
  return out;
}

export async function importFleet(ctx: ServiceContext, input: unknown, options: ImportOptions): Promise<ImportReport> {
  const source = options.source ?? 'file';
  const validation = validateFleet(input, options.onProgress);
  if (!validation.envelopeOk) return refusedReport(options, validation.problems);
  let written: Written | null = null;
  try {
    const outcome = await runWrite(
      ctx,
      async (trx, at) => {
        // Checked inside the transaction, so no other writer can change what the references resolve to.
        const storedIds = options.mode === 'merge' ? await readFleetIds(trx) : null;
        const stored: StoredIds = storedIds ?? NO_STORED_IDS;
        if (options.requireEmptyStore) await refuseUnlessEmpty(trx);
        const fileSupplies = new Map(validation.fleet.builds.flatMap((b) => b.supplies.map((s) => [s.id, b.id] as const)));
        const logProblems = logReferenceProblems(validation.logs, { batteries: validation.fileIds.batteries, builds: validation.fileIds.builds, supplyOwners: fileSupplies }, storedIds);
        const problems = [...hintRewrittenIds(input, validation.problems, stored), ...referenceProblems(validation.fleet, validation.fileIds, stored, validation.buildPlaces), ...logProblems];
        if (problems.length > 0) throw new ImportRefused(sortProblems(problems, FLEET_KINDS));
        const taken = await classNameProblems(trx, validation.fleet, options.mode);
        if (taken.length > 0) throw new ImportRefused(taken);
        // A customer made from an old file's owner text leaves a stored one of that id as it is (its contact and notes were typed since).
        const fleet = { ...validation.fleet, customers: validation.fleet.customers.filter((c) => !(validation.ownerCustomerIds.has(c.id) && stored.customers.has(c.id))) };
        written = await writeFleet(trx, fleet, options.mode, at, () => ctx.newId(ID_PREFIXES.classes), options.onProgress);
        const logsWritten = await writeLogs(trx, validation.logs, at);
        // A pack's log sets its sag and health: builds using a pack whose log came in are re-checked.
        if (Array.isArray(written.recheck) && logsWritten.packIds.length > 0) {
          const ids = new Set(written.recheck);
          for (const buildId of await buildIdsUsingAny(trx, { batteries: logsWritten.packIds, motors: [], controllers: [], propellers: [], vehicles: [] }, [])) ids.add(buildId);
          written.recheck = ids.size > RECHECK_ALL_ABOVE ? { by: 'all' } : [...ids];
        }
        const logWords = [
          logsWritten.packEvents > 0 ? `${logsWritten.packEvents} pack log ${logsWritten.packEvents === 1 ? 'entry' : 'entries'}` : '',
          logsWritten.runLogs > 0 ? `${logsWritten.runLogs} run log${logsWritten.runLogs === 1 ? '' : 's'}` : '',
        ].filter((x) => x !== '');
        if (!options.acceptChanges) {
          const suspect = written.changes.flatMap((record) => record.fields.filter((f) => f.suspect !== null).map((f) => ({ place: '', message: suspectMessage(record, f) })));
          if (suspect.length > 0) throw new ImportRefused(suspect, written.changes);
        }
        const what = source === 'demo' ? 'the demo fleet' : source === 'csv' ? 'a CSV file' : 'a fleet file';
        return {
          result: null,
          history: {
            action: 'import',
            entityKind: 'fleet',
            entityId: source,
            summary: `Imported ${what} (${options.mode}): ${describeCounts(written.counts)}${logWords.length > 0 ? `; with ${logWords.join(' and ')}` : ''}${written.removed ? `; removed what the store held first` : ''}`,
            reason: options.reason ?? '',
            before: written.removed,
            after: { mode: options.mode, source, counts: written.counts },
          },
          recheck: written.recheck,
          changed: { kind: 'fleet', ids: [] },
        };
      },
      { preview: options.dryRun ?? false },
    );
    const done = written as Written | null;
    if (!done) throw new Error('import: nothing was written');
    if (!options.dryRun) {
      for (const kind of FLEET_KINDS) {
        const ids = done.changedIds[kind] ?? [];
        if (ids.length > 0) ctx.emit({ type: 'records-changed', kind, ids });
      }
    }
    const buildChanges = outcome.verdictChanges.filter((c) => c.supplyId === null);
    return {
      ok: true,
      unreadable: false,
      dryRun: options.dryRun ?? false,
      mode: options.mode,
      source,
      problems: [],
      counts: done.counts,
      removed: done.removed,
      rechecked: outcome.verdicts.length,
      statuses: tally(outcome.verdicts),
      verdictChanges: buildChanges.slice(0, MAX_LISTED_CHANGES),
      verdictChangeCount: buildChanges.length,
      historyId: options.dryRun ? null : outcome.historyId,
      ...listedChanges(done.changes),
      needsConfirmation: false,
      skippedRows: 0,
    };
  } catch (error) {
    if (error instanceof ImportRefused) return refusedReport(options, error.problems, false, error.changes, error.changes.length > 0);
    throw error;
  }
}

/** Import of a file's text: not JSON at all is refused as unreadable, with where reading stopped. */
export async function importFleetText(ctx: ServiceContext, text: string, options: ImportOptions): Promise<ImportReport> {
  const lossy = lossyDecodingReason(text);
  if (lossy !== null) return refusedReport(options, [{ place: '', message: `Cannot read the file: ${lossy}` }], true);
  const read = readJsonText(text);
  if (!read.ok) return refusedReport(options, [{ place: read.place, message: read.reason }], read.unreadable);
  return importFleet(ctx, read.value, options);
}
