import * as v from 'valibot';
import { DRAFT_CATALOGUES, DRAFT_KINDS, draftFieldKeys, type DraftKind } from '../../core/catalogue/draft-fields';
import { createEntries } from './catalogue-schemas';
import { id, oneOf, record } from './field-builders';

// A draft part: only the fields the checks read (core `draftFieldKeys`), with the same rules as
// a new record of its kind; the rest take their fallbacks when the draft is tried.

function draftSchema(kind: DraftKind) {
  const entries: v.ObjectEntries = createEntries(DRAFT_CATALOGUES[kind], {});
  return record(Object.fromEntries(draftFieldKeys(kind).map((key) => [key, entries[key] ?? v.never()])));
}

export const draftPartSchemas = {
  batteries: draftSchema('batteries'),
  motors: draftSchema('motors'),
  controllers: draftSchema('controllers'),
  propellers: draftSchema('propellers'),
} as const satisfies Record<DraftKind, v.GenericSchema>;

export const DRAFT_SCOPES = ['build', 'vehicle'] as const;

const place = (max: number) => v.pipe(v.number('must be a number'), v.integer('must be a whole number'), v.minValue(0, 'must be 0 or more'), v.maxValue(max, `must be ${max} or less`));

/**
 * A draft part tried against a build (`scope: 'build'`) or every active build of its vehicle.
 * `part` is checked by `kind` in the handler, so its problems name `draft.part.<field>`. A pack
 * goes in at `packAt` (supply and position, counted from 0; the first pack where not given).
 */
export const draftPreviewSchema = record({
  kind: oneOf(DRAFT_KINDS),
  part: v.record(v.string(), v.unknown(), 'must be a part record'),
  buildId: id(),
  packAt: v.optional(record({ supply: place(7), pack: place(11) })),
  scope: v.optional(oneOf(DRAFT_SCOPES), 'build'),
});
