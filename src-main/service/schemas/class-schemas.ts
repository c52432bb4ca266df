import * as v from 'valibot';
import { FIGURE_KEYS } from '../../core/catalogue/figures';
import { id, name, newId, notes, nullable, number, oneOf, record, text } from './field-builders';

/** One limit of a class as the Classes screen sends it: a figure of the catalogue, never free text. */
export const classLimitInput = record({
  /** The stored limit this row edits; left out for a new one. */
  id: v.optional(id()),
  figure: oneOf(FIGURE_KEYS),
  // The figure's own unit (the catalogue's); at or under it is allowed, like a maker's rating.
  limit: number({ above: 0, max: 1e9 }),
  tightThreshold: v.optional(nullable(number({ min: 0, max: 0.9 })), null),
});

export type ClassLimitInput = v.InferOutput<typeof classLimitInput>;

/** A whole class as its editor saves it: name, notes and every limit in use (a limit left out is archived). */
export const classSaveInput = record({
  /** The class being edited; left out to add one. */
  id: v.optional(id()),
  newId: v.optional(newId()),
  expectedVersion: v.optional(v.pipe(v.number('must be a number'), v.integer('must be a whole number'), v.minValue(1, 'must be 1 or more'))),
  name: name(),
  notes: v.optional(notes(), ''),
  limits: v.pipe(v.array(classLimitInput, 'must be a list of limits'), v.maxLength(60, 'must hold at most 60 limits')),
  reason: v.optional(text(500), ''),
});

export type ClassSaveInput = v.InferInput<typeof classSaveInput>;
