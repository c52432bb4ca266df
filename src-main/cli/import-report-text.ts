import { describeCounts, type ImportReport } from '../service/fleet/import-fleet';
import { problemLine } from '../service/fleet/fleet-problems';
import { STATUSES } from '../core/domain';
import { KIND_WORDS } from '../service/fleet/fleet-format';
import { fieldChangeText } from '../service/fleet/fleet-changes';
import { OVER_CAUTION } from './check-output';

const MAX_CHANGES_SHOWN = 20;

/** "1 pack", "3 class rules", in the screens' words; any other table name as it is. */
export function countOf(n: number, kind: string): string {
  const words = (KIND_WORDS as Record<string, { one: string; many: string } | undefined>)[kind];
  if (!words) return `${n} ${kind}`;
  return `${n} ${n === 1 ? words.one : words.many}`;
}

export function importReportText(file: string, report: ImportReport): string {
  const lines: string[] = [];
  const lead = report.dryRun ? 'Dry run (nothing was written):' : 'Imported';
  lines.push(`${lead} ${file} (${report.mode}): ${describeCounts(report.counts)}.`);
  if (report.removed) {
    const removed = Object.entries(report.removed).filter(([, n]) => n > 0);
    lines.push(removed.length > 0 ? `Replaced what the store held: ${removed.map(([k, n]) => countOf(n, k)).join(', ')}.` : 'The store was empty before.');
  }
  lines.push(`Re-checked ${report.rechecked} build${report.rechecked === 1 ? '' : 's'}: ${STATUSES.map((s) => `${report.statuses[s]} ${s}`).join(', ')}.`);
  // A new build's first verdict is not a change; only builds that had one before are listed.
  const changed = report.verdictChanges.filter((c) => c.from !== null);
  if (changed.length > 0) {
    lines.push('Verdicts that changed:');
    for (const c of changed.slice(0, MAX_CHANGES_SHOWN)) lines.push(`  ${c.buildId}: ${c.from} → ${c.to}`);
    if (changed.length > MAX_CHANGES_SHOWN) lines.push(`  … and more (${report.verdictChangeCount} verdict changes in all, new builds included)`);
  }
  lines.push(...changesText(report, report.dryRun ? Infinity : MAX_RECORDS_SHOWN));
  if (report.skippedRows > 0) lines.push(`Skipped ${report.skippedRows} empty row${report.skippedRows === 1 ? '' : 's'} (nothing but commas).`);
  if (report.statuses.over > 0) lines.push(`${report.statuses.over} build${report.statuses.over === 1 ? ' is' : 's are'} over a rating. ${OVER_CAUTION}`);
  return `${lines.join('\n')}\n`;
}

export function problemsText(file: string, report: ImportReport): string {
  const n = report.problems.length;
  const head = report.unreadable ? `Cannot read ${file}:` : `${file} was not imported (${n} problem${n === 1 ? '' : 's'}; nothing was written):`;
  const lines = [head, ...report.problems.map((p) => `  ${problemLine(p)}`)];
  if (report.needsConfirmation) {
    lines.push(...changesText(report, Infinity));
    lines.push('If every change above is intended, import again with --accept-changes.');
  }
  return `${lines.join('\n')}\n`;
}

const MAX_RECORDS_SHOWN = 20;

/** Every stored record the import changes, field by field: `motor "3660 can" [motor-3660]` then `  resistanceOhm: 0.008 → 8`. */
function changesText(report: ImportReport, maxRecords: number): string[] {
  if (report.changedRecordCount === 0) return [];
  const n = report.changedRecordCount;
  const lines = [`${report.dryRun ? 'Would change' : report.ok ? 'Changed' : 'Would change'} ${n} stored record${n === 1 ? '' : 's'} (before → after):`];
  const listed = report.recordChanges.slice(0, maxRecords);
  for (const record of listed) {
    lines.push(`  ${KIND_WORDS[record.kind].one} "${record.name}" [${record.id}]`);
    for (const f of record.fields) lines.push(`    ${fieldChangeText(f)}${f.suspect ? `   ← needs confirming: ${f.suspect}` : ''}`);
  }
  if (n > listed.length) lines.push(`  … and ${n - listed.length} more (rigbook import --dry-run --json lists ${report.recordChanges.length} of them)`);
  return lines;
}
