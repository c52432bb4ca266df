import { describeCounts, type ImportReport } from '../service/fleet/import-fleet';
import { problemLine } from '../service/fleet/fleet-problems';
import { STATUSES } from '../core/domain';
import { OVER_CAUTION } from './check-output';

const MAX_CHANGES_SHOWN = 20;

export function importReportText(file: string, report: ImportReport): string {
  const lines: string[] = [];
  const lead = report.dryRun ? 'Dry run (nothing was written):' : 'Imported';
  lines.push(`${lead} ${file} (${report.mode}): ${describeCounts(report.counts)}.`);
  if (report.removed) {
    const removed = Object.entries(report.removed).filter(([, n]) => n > 0);
    lines.push(removed.length > 0 ? `Replaced what the store held: ${removed.map(([k, n]) => `${n} ${k}`).join(', ')}.` : 'The store was empty before.');
  }
  lines.push(`Re-checked ${report.rechecked} build${report.rechecked === 1 ? '' : 's'}: ${STATUSES.map((s) => `${report.statuses[s]} ${s}`).join(', ')}.`);
  // A new build's first verdict is not a change; only builds that had one before are listed.
  const changed = report.verdictChanges.filter((c) => c.from !== null);
  if (changed.length > 0) {
    lines.push('Verdicts that changed:');
    for (const c of changed.slice(0, MAX_CHANGES_SHOWN)) lines.push(`  ${c.buildId}: ${c.from} → ${c.to}`);
    if (changed.length > MAX_CHANGES_SHOWN) lines.push(`  … and more (${report.verdictChangeCount} verdict changes in all, new builds included)`);
  }
  if (report.statuses.over > 0) lines.push(`${report.statuses.over} build${report.statuses.over === 1 ? ' is' : 's are'} over a rating. ${OVER_CAUTION}`);
  return `${lines.join('\n')}\n`;
}

export function problemsText(file: string, report: ImportReport): string {
  const n = report.problems.length;
  const head = report.unreadable ? `Cannot read ${file}:` : `${file} was not imported (${n} problem${n === 1 ? '' : 's'}; nothing was written):`;
  return `${head}\n${report.problems.map((p) => `  ${problemLine(p)}\n`).join('')}`;
}
