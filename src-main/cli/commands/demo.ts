import type { ImportReport } from '../../service/fleet/import-fleet';
import { flagValue, type Command } from '../command';
import { EXIT } from '../../shell-common/exit-codes';
import { importReportText } from '../import-report-text';
import { callOrFail, withStore } from '../open-store';

export const demoCommand: Command = {
  name: 'demo',
  summary: 'load the invented demo fleet (a small repair shop and a racer’s stable)',
  help: `Usage: rigbook demo [--merge] [--json]

Loads the demo fleet: twelve invented vehicles with shared packs, chosen so that every
verdict shows up for a real reason. It refuses a store that already holds records, so
invented builds never mix with yours, unless --merge is given.`,
  options: { merge: { type: 'boolean' } },
  positionals: { min: 0, max: 0 },
  async run({ values, io, dbPath }) {
    // Without --merge the store must be empty, so only a merge has anything worth a copy first.
    const merge = flagValue(values, 'merge');
    const report = (await withStore(io, dbPath, { autoBackup: merge }, (host) => callOrFail(host, 'demo.load', { merge }))) as ImportReport;
    if (flagValue(values, 'json')) io.out(`${JSON.stringify(report, null, 2)}\n`);
    else io.out(importReportText('the demo fleet', report));
    return EXIT.ok;
  },
};
