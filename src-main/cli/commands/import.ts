import type { ImportReport } from '../../service/fleet/import-fleet';
import { CSV_KIND_ALIASES, CSV_KIND_NAMES, type CsvKindName } from '../../service/fleet/csv-columns';
import { CliFailure } from '../cli-io';
import { encodingOption, ENCODING_HELP, flagValue, textValue, type Command, type CommandInput } from '../command';
import type { RunLogInfo } from '../../store/repositories/run-logs';
import { formatNumber } from '../format-number';
import { EXIT } from '../../shell-common/exit-codes';
import { importReportText, problemsText } from '../import-report-text';
import { AUTO_BACKUPS_KEPT, callOrFail, withStore } from '../open-store';
import { backupFolderFor, rollingBackup } from '../../store/backup';
import { readJsonText } from '../../service/fleet/read-fleet-text';
import { validateFleet } from '../../service/fleet/validate-fleet';
import { readCsvRecords } from '../../service/fleet/fleet-csv';
import { readInputFile } from '../read-input-file';

const KINDS = CSV_KIND_NAMES.join(', ');

export const importCommand: Command = {
  name: 'import',
  summary: 'import a rigbook-fleet file (or a CSV of one part kind) into the store',
  help: `Usage: rigbook import FILE [--mode merge|replace] [--dry-run] [--csv KIND] [--accept-changes]
                    [--reason TEXT] [--encoding E] [--json]
       rigbook import FILE --run-log --build ID [--supply N] [--name TEXT] [--json]

Checks the whole file (- reads standard input) first and lists every problem with its
place; then writes all of it or nothing, re-checks every build it touched and adds one
history entry.

  --mode merge     (default) records whose id is stored are updated (their version goes
                   up), identical ones are left alone, new ones are added; nothing is removed
  --mode replace   every part and build in the store is removed first (history stays);
                   (before any import writes, a copy of the store goes to backups/ beside it)
  --dry-run        do everything, report it (every stored record and field that would
                   change, before → after), and write nothing
  --accept-changes confirm changes that look like a spreadsheet's damage: a number
                   that grows or shrinks by a factor of 100 or more, or leaves the
                   range such a part plausibly has; without it they refuse the import
  --csv KIND       FILE is a CSV of one part kind (${KINDS}); always merged
  --reason TEXT    said in the history entry
  --json           print the import report as JSON
  --run-log        FILE is a telemetry CSV of one run (time plus any of current, voltage,
                   rpm, temperature, throttle, units in the header: "Current (A)"); it is
                   attached to the build --build names, on its supply --supply N (1 for the
                   first; may be left out when the build has one supply), all or nothing
  --name TEXT      the run log's name (with --run-log)
${ENCODING_HELP}

Exits 0 when imported, 2 when the file cannot be read, 3 when it is refused (problems
listed), 4 when the store cannot be opened or written.`,
  options: {
    mode: { type: 'string' },
    'dry-run': { type: 'boolean' },
    csv: { type: 'string' },
    reason: { type: 'string' },
    'accept-changes': { type: 'boolean' },
    encoding: { type: 'string' },
    'run-log': { type: 'boolean' },
    build: { type: 'string' },
    supply: { type: 'string' },
    name: { type: 'string' },
  },
  positionals: { min: 1, max: 1 },
  async run(input) {
    if (flagValue(input.values, 'run-log')) return importRunLog(input);
    for (const only of ['build', 'supply', 'name']) if (textValue(input.values, only) !== undefined) throw new CliFailure(EXIT.usage, `--${only} goes with --run-log.`);
    const { positionals, values, io, dbPath } = input;
    const mode = textValue(values, 'mode') ?? 'merge';
    if (mode !== 'merge' && mode !== 'replace') throw new CliFailure(EXIT.usage, `--mode must be merge or replace (not "${mode}").`);
    const csv = textValue(values, 'csv');
    if (csv !== undefined && !(CSV_KIND_NAMES as readonly string[]).includes(csv)) throw new CliFailure(EXIT.usage, `--csv must name a part kind: ${KINDS} (not "${csv}").`);
    if (csv !== undefined && mode === 'replace') throw new CliFailure(EXIT.usage, '--csv imports always merge: a CSV holds one kind of part, and replacing would drop every other record.');
    const dryRun = flagValue(values, 'dry-run');
    const reason = textValue(values, 'reason') ?? '';
    const acceptChanges = flagValue(values, 'accept-changes');
    const { label: file, text } = await readInputFile(io, positionals[0]!, encodingOption(values));
    const report = (await withStore(io, dbPath, {}, async (host, existed) => {
      // The rolling copy is taken only for a file that looks writable, so refused files do not push older copies out.
      if (!dryRun && existed && host.ctx.raw && looksImportable(text, csv)) await rollingBackup(host.ctx.raw, backupFolderFor(dbPath), AUTO_BACKUPS_KEPT, io.now());
      return csv !== undefined ? callOrFail(host, 'fleet.importCsv', { kind: csv, text, dryRun, acceptChanges, reason }) : callOrFail(host, 'fleet.import', { text, mode, dryRun, acceptChanges, reason });
    })) as ImportReport;
    if (flagValue(values, 'json')) io.out(`${JSON.stringify(report, null, 2)}\n`);
    if (!report.ok) {
      io.err(problemsText(file, report));
      return report.unreadable ? EXIT.unreadable : EXIT.invalid;
    }
    if (!flagValue(values, 'json')) io.out(importReportText(file, report));
    return EXIT.ok;
  },
};

/** `--run-log`: one telemetry CSV attached to a build's supply, through the same handler as the window's import. */
async function importRunLog({ positionals, values, io, dbPath }: CommandInput): Promise<number> {
  const buildId = textValue(values, 'build');
  if (buildId === undefined) throw new CliFailure(EXIT.usage, '--run-log needs --build ID: the build the log was recorded on.');
  for (const other of ['csv', 'mode', 'dry-run', 'accept-changes', 'reason']) if (values[other] !== undefined) throw new CliFailure(EXIT.usage, `--${other} does not go with --run-log.`);
  const supplyText = textValue(values, 'supply');
  const supplyNumber = supplyText === undefined ? null : Number(supplyText);
  if (supplyNumber !== null && !(Number.isInteger(supplyNumber) && supplyNumber >= 1)) throw new CliFailure(EXIT.usage, `--supply must be a supply's number, 1 for the first (not "${supplyText}").`);
  const { label: file, text } = await readInputFile(io, positionals[0]!, encodingOption(values));
  const log = (await withStore(io, dbPath, { mustExist: true }, async (host) => {
    let supplyId: string | undefined;
    if (supplyNumber !== null) {
      const sheet = (await callOrFail(host, 'builds.get', { id: buildId })) as { build: { name: string; supplies: { id: string }[] } };
      const supply = sheet.build.supplies[supplyNumber - 1];
      if (!supply) throw new CliFailure(EXIT.usage, `--supply ${supplyNumber}: build "${sheet.build.name}" has ${sheet.build.supplies.length} ${sheet.build.supplies.length === 1 ? 'supply' : 'supplies'}.`);
      supplyId = supply.id;
    }
    return callOrFail(host, 'runLogs.import', { buildId, text, name: textValue(values, 'name') ?? '', ...(supplyId ? { supplyId } : {}) });
  })) as RunLogInfo;
  if (flagValue(values, 'json')) {
    io.out(`${JSON.stringify(log, null, 2)}\n`);
    return EXIT.ok;
  }
  const figure = (x: number | null, unit: string): string => (x === null ? 'not logged' : `${formatNumber(x)} ${unit}`);
  io.out(
    `Imported ${file} as run log "${log.name}" (${log.sampleCount} samples over ${figure(log.durationS, 's')}) for build ${log.buildId}, supply ${log.supplyId}.\n` +
      `  measured peak current ${figure(log.peakCurrentA, 'A')}, average ${figure(log.averageCurrentA, 'A')}, RMS ${figure(log.rmsCurrentA, 'A')}; ` +
      `lowest voltage ${figure(log.minVoltageV, 'V')}; highest temperature ${figure(log.maxTemperatureC, '°C')}; used ${figure(log.usedMah, 'mAh')}\n`,
  );
  return EXIT.ok;
}

/** The checks that need no store: the file reads, and every record passes its schema. */
function looksImportable(text: string, csv: string | undefined): boolean {
  if (csv !== undefined) return readCsvRecords(CSV_KIND_ALIASES[csv as CsvKindName], text).ok;
  const read = readJsonText(text);
  return read.ok && validateFleet(read.value).problems.length === 0;
}
