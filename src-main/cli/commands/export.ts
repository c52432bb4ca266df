import type { FleetFile } from '../../service/fleet/fleet-format';
import { fleetText } from '../../service/fleet/export-fleet';
import { CSV_KIND_NAMES } from '../../service/fleet/csv-columns';
import { CliFailure } from '../cli-io';
import { textValue, type Command } from '../command';
import { EXIT } from '../../shell-common/exit-codes';
import { callOrFail, withStore } from '../open-store';
import { writeOutputFile } from '../write-output-file';
import { countOf } from '../import-report-text';
import { parseCsv } from '../../service/fleet/csv';

const KINDS = CSV_KIND_NAMES.join(', ');

export const exportCommand: Command = {
  name: 'export',
  summary: 'write the store as a rigbook-fleet file (or one part kind as CSV)',
  help: `Usage: rigbook export [FILE] [--csv KIND]

Writes every record (archived ones too, with their version and archivedAt) as a
rigbook-fleet JSON file, to FILE or, without FILE (or with -), to standard output.
Two exports of the same records are the same bytes. Verdicts are not written: they
follow from the records.

  --csv KIND   one part kind as CSV instead (${KINDS}); text cells that a
               spreadsheet would run as a formula (= + - @, full-width forms, and
               a leading space, tab, line break or invisible character) get a
               leading apostrophe`,
  options: { csv: { type: 'string' } },
  positionals: { min: 0, max: 1 },
  async run({ positionals, values, io, dbPath }) {
    const file = positionals[0];
    const csv = textValue(values, 'csv');
    if (csv !== undefined && !(CSV_KIND_NAMES as readonly string[]).includes(csv)) throw new CliFailure(EXIT.usage, `--csv must name a part kind: ${KINDS} (not "${csv}").`);
    const { text, summary } = await withStore(io, dbPath, { mustExist: true }, async (host) => {
      if (csv !== undefined) {
        const out = (await callOrFail(host, 'fleet.exportCsv', { kind: csv })) as { kind: string; text: string };
        // Counted by record, not by line: a note may hold a line break inside its quoted cell.
        const parsed = parseCsv(out.text);
        const records = parsed.ok ? parsed.rows.length - 1 : 0;
        return { text: out.text, summary: countOf(records, out.kind) };
      }
      const fleet = (await callOrFail(host, 'fleet.export', {})) as FleetFile;
      const kinds = ['builds', 'batteries', 'motors', 'controllers', 'propellers', 'vehicles', 'classes', 'classRules'] as const;
      return { text: fleetText(fleet), summary: kinds.map((k) => countOf(fleet[k].length, k)).join(', ') };
    });
    if (file === undefined || file === '-') {
      io.out(text);
      return EXIT.ok;
    }
    const path = writeOutputFile(io, file, text, dbPath);
    io.err(`Wrote ${summary} to ${path}\n`);
    return EXIT.ok;
  },
};
