import * as v from 'valibot';
import type { ServiceContext } from '../service-context';
import { ServiceError } from '../contract';
import { defineHandler } from '../define-handler';
import { flag, oneOf, record, text } from '../schemas/field-builders';
import { CSV_KIND_ALIASES, CSV_KIND_NAMES } from '../fleet/csv-columns';
import { exportFleet } from '../fleet/export-fleet';
import { exportCsv, importCsv } from '../fleet/fleet-csv';
import { IMPORT_MODES, importFleet, importFleetText } from '../fleet/import-fleet';
import type { OnProgress } from '../fleet/progress';

/** Large enough for a 10 000-build file, small enough that a mistaken upload is refused early. */
const MAX_FILE_CHARS = 256 * 1024 * 1024;

const reason = () => v.optional(text(500), '');
const fileText = () => v.pipe(v.string('must be text'), v.maxLength(MAX_FILE_CHARS, 'is too large for one import (split the file)'));
const csvKind = () => oneOf(CSV_KIND_NAMES);

/** Progress of a long task, as service events a window can show as a bar. */
export function progressEvents(ctx: ServiceContext, kind: string): OnProgress {
  return (p) => ctx.emit({ type: 'progress', kind, task: p.task, done: p.done, total: p.total });
}

/** The whole store as a rigbook-fleet object (the file's text is its JSON). */
export const exportFleetHandler = defineHandler(v.optional(record({}), {}), async (ctx) => exportFleet(ctx.db, progressEvents(ctx, 'fleet')));

/**
 * Imports a rigbook-fleet file, given as its text or as the parsed object. The answer is a
 * report: `ok: false` with every problem and its place means nothing was written. The report
 * lists every stored record the import changes, field by field (a dry run is the window's
 * preview); a change that looks like a spreadsheet's damage refuses the import
 * (`needsConfirmation`) until it is called again with `acceptChanges: true`.
 */
export const importFleetHandler = defineHandler(
  record({
    text: v.optional(fileText()),
    fleet: v.optional(v.unknown()),
    mode: v.optional(oneOf(IMPORT_MODES), 'merge'),
    dryRun: v.optional(flag(), false),
    acceptChanges: v.optional(flag(), false),
    reason: reason(),
  }),
  async (ctx, input) => {
    const options = { mode: input.mode, dryRun: input.dryRun, acceptChanges: input.acceptChanges, reason: input.reason, source: 'file', onProgress: progressEvents(ctx, 'fleet') };
    if (input.text !== undefined && input.fleet === undefined) return importFleetText(ctx, input.text, options);
    if (input.fleet !== undefined && input.text === undefined) return importFleet(ctx, input.fleet, options);
    throw new ServiceError('invalid', 'text: give either the file text or a fleet object, not both and not neither', 'text');
  },
);

/** One part kind as CSV text (`packs` and `batteries` name the same kind). */
export const exportCsvHandler = defineHandler(record({ kind: csvKind() }), async (ctx, input) => {
  const kind = CSV_KIND_ALIASES[input.kind];
  return { kind, text: await exportCsv(ctx.db, kind) };
});

/** Merges a CSV of one part kind; the report names each problem by row and column. */
export const importCsvHandler = defineHandler(record({ kind: csvKind(), text: fileText(), dryRun: v.optional(flag(), false), acceptChanges: v.optional(flag(), false), reason: reason() }), async (ctx, input) =>
  importCsv(ctx, CSV_KIND_ALIASES[input.kind], input.text, { dryRun: input.dryRun, acceptChanges: input.acceptChanges, reason: input.reason, onProgress: progressEvents(ctx, 'fleet') }),
);
