import type { FleetFile } from '../../service/fleet/fleet-format';
import { fleetText } from '../../service/fleet/export-fleet';
import { CSV_KIND_NAMES } from '../../service/fleet/csv-columns';
import { CliFailure } from '../cli-io';
import { textValue, type Command } from '../command';
import { EXIT } from '../exit-codes';
import { callOrFail, withStore } from '../open-store';
import { writeOutputFile } from '../write-output-file';

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
               spreadsheet would run as a formula (= + - @) get a leading apostrophe`,
  options: { csv: { type: 'string' } },
  positionals: { min: 0, max: 1 },
  async run({ positionals, values, io, dbPath }) {
    const file = positionals[0];
    const csv = textValue(values, 'csv');
    if (csv !== undefined && !(CSV_KIND_NAMES as readonly string[]).includes(csv)) throw new CliFailure(EXIT.usage, `--csv must name a part kind: ${KINDS} (not "${csv}").`);
    const { text, summary } = await withStore(io, dbPath, { mustExist: true }, async (host) => {
      if (csv !== undefined) {
        const out = (await callOrFail(host, 'fleet.exportCsv', { kind: csv })) as { kind: string; text: string };
        const rows = out.text.split('\r\n').length - 2;
        return { text: out.text, summary: `${rows} ${out.kind}` };
      }
      const fleet = (await callOrFail(host, 'fleet.export', {})) as FleetFile;
      return { text: fleetText(fleet), summary: `${fleet.builds.length} builds, ${fleet.batteries.length} packs, ${fleet.motors.length} motors, ${fleet.controllers.length} controllers, ${fleet.propellers.length} propellers, ${fleet.vehicles.length} vehicles` };
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
