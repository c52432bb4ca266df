import { evaluateFleet } from '../../service/fleet/evaluate-fleet';
import { problemLine } from '../../service/fleet/fleet-problems';
import { inspectFleet } from '../../service/fleet/inspect-fleet';
import { readJsonText } from '../../service/fleet/read-fleet-text';
import { checkJson, checkText } from '../check-output';
import { encodingOption, ENCODING_HELP, flagValue, type Command } from '../command';
import { EXIT } from '../../shell-common/exit-codes';
import { readInputFile } from '../read-input-file';
import { JSON_SIGNIFICANT_DIGITS, TEXT_SIGNIFICANT_DIGITS } from '../format-number';

export const checkCommand: Command = {
  name: 'check',
  summary: 'check every build in a fleet file against its parts’ ratings (no store needed)',
  help: `Usage: rigbook check FILE [--json] [--encoding utf-8|windows-1252]

Reads a rigbook-fleet file (- reads standard input), checks that it is valid (the same checks as an import), and
evaluates every build and supply with nothing but the file: no store is opened or changed.
Archived builds are left out. The default tight threshold (15 %) applies unless a build or
its class sets one.

  --json   print { "builds": [ { "id", "name", "status", "supplies": [ { "id", "name",
           "batteryIds", "status", "figures", "findings" } ] } ] } instead of the table;
           figures, values, limits and margins to ${JSON_SIGNIFICANT_DIGITS} significant digits
           (the table shows ${TEXT_SIGNIFICANT_DIGITS})
${ENCODING_HELP}

Exits 0 when nothing is over, 1 when something is over, 2 when the file cannot be read,
3 when it is not a valid rigbook-fleet file (every problem is listed with its place).`,
  options: { encoding: { type: 'string' } },
  positionals: { min: 1, max: 1 },
  async run({ positionals, values, io }) {
    const { label: file, text } = await readInputFile(io, positionals[0]!, encodingOption(values));
    const read = readJsonText(text);
    if (!read.ok && read.unreadable) {
      io.err(`Cannot read ${file}: ${read.reason}\n`);
      return EXIT.unreadable;
    }
    if (!read.ok) {
      io.err(`${file} is not a valid rigbook-fleet file (1 problem):\n  ${problemLine({ place: read.place, message: read.reason })}\n`);
      return EXIT.invalid;
    }
    const inspection = inspectFleet(read.value);
    if (!inspection.ok) {
      io.err(`${file} is not a valid rigbook-fleet file (${inspection.problems.length} problem${inspection.problems.length === 1 ? '' : 's'}):\n`);
      for (const p of inspection.problems) io.err(`  ${problemLine(p)}\n`);
      return EXIT.invalid;
    }
    // A version 2 file's pack logs count as they do in the store (default thresholds, judged today).
    const verdicts = evaluateFleet(inspection.fleet, undefined, { packEvents: inspection.logs.packEvents, asOf: io.now().toISOString() });
    if (flagValue(values, 'json')) io.out(`${JSON.stringify(checkJson(inspection.fleet, verdicts), null, 2)}\n`);
    else io.out(checkText(inspection.fleet, verdicts));
    return verdicts.some((v) => v.status === 'over') ? EXIT.over : EXIT.ok;
  },
};
