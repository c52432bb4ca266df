import * as v from 'valibot';
import { plausibleRange, rangeMessage, type PlausibleField, type PlausibleRange } from '../../core/plausibility';

// Small builders so that every field's message reads the same way. The field's name is
// added in front of the message where the issue is turned into an ApiError.

export const MAX_NAME = 120;
export const MAX_NOTES = 4000;

const objectMessage = (issue: v.BaseIssue<unknown>): string => (issue.expected === 'never' ? 'is not a field Rigbook knows' : 'must be an object');

/** An object that refuses unknown fields (including prototype keys such as __proto__). */
export function record<const E extends v.ObjectEntries>(entries: E) {
  return v.strictObject(entries, objectMessage);
}

export const id = () => v.pipe(v.string('must be text'), v.minLength(1, 'is required'), v.maxLength(64, 'must be at most 64 characters'), v.regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, 'may hold only letters, digits, dot, dash and underscore'));

/**
 * The id of a record being created (by a form or an import). It starts with a letter:
 * spreadsheets rewrite anything that looks like a number (001 → 1, 1.50 → 1.5,
 * 1e5 → 1.00E+05), and a rewritten id would silently become another record. References to
 * records already stored still take any `id()`.
 */
export const newId = () =>
  v.pipe(
    id(),
    v.regex(/^[A-Za-z]/, (issue) => `must start with a letter (${JSON.stringify(issue.input)} does not): spreadsheets rewrite ids that look like numbers (001 becomes 1, 1e5 becomes 1.00E+05), so Rigbook's ids start with a letter`),
  );

export const name = () => v.pipe(v.string('must be text'), v.trim(), v.minLength(1, 'is required'), v.maxLength(MAX_NAME, `must be at most ${MAX_NAME} characters`));

export const text = (max: number) => v.pipe(v.string('must be text'), v.maxLength(max, `must be at most ${max} characters`));

export const notes = () => text(MAX_NOTES);

/** A finite number within [min, max]; `above` makes the lower bound exclusive. */
export function number(opts: { min?: number; max: number; above?: number; integer?: boolean }) {
  const checks: v.PipeItem<number, number, v.BaseIssue<unknown>>[] = [v.finite('must be a finite number')];
  if (opts.integer) checks.push(v.integer('must be a whole number'));
  if (opts.above !== undefined) checks.push(v.gtValue(opts.above, `must be greater than ${opts.above}`));
  if (opts.min !== undefined) checks.push(v.minValue(opts.min, `must be ${opts.min} or more`));
  checks.push(v.maxValue(opts.max, `must be ${opts.max} or less`));
  return v.pipe(v.number('must be a number'), ...checks);
}

export const positive = (max: number) => number({ above: 0, max });
export const count = (min: number, max: number) => number({ min, max, integer: true });

export function oneOf<const T extends readonly string[]>(options: T) {
  return v.picklist(options, `must be one of: ${options.join(', ')}`);
}

export const flag = () => v.boolean('must be true or false');

/** Required on create unless a default is given; optional in a patch. */
export function nullable<S extends v.GenericSchema>(schema: S) {
  return v.nullable(schema);
}

/**
 * A number inside the core's plausible range for the field, refused with one message that
 * says what was expected (the same bounds the engine applies to stored values).
 */
export function plausible(field: PlausibleField) {
  return plausibleNumber(plausibleRange(field));
}

/** A number inside a plausible range, refused with the range's one message. */
export function plausibleNumber(r: PlausibleRange) {
  const message = rangeMessage(r);
  // Bounds as value actions (not a free-form check), so the published JSON Schema carries them too;
  // they are exactly the core's isPlausible (finite, above, min, max).
  const checks: v.PipeItem<number, number, v.BaseIssue<unknown>>[] = [v.finite(message)];
  if (r.above !== undefined) checks.push(v.gtValue(r.above, message));
  if (r.min !== undefined) checks.push(v.minValue(r.min, message));
  checks.push(v.maxValue(r.max, message));
  return v.pipe(v.number('must be a number'), ...checks);
}
