import * as v from 'valibot';
import { ServiceError } from './contract';

/**
 * Parses a handler's input; the first problem becomes an `invalid` error that names its field.
 * `at` is where the value sits in the handler's input when a part of it is parsed on its own.
 */
export function validate<S extends v.GenericSchema>(schema: S, input: unknown, at = ''): v.InferOutput<S> {
  const result = v.safeParse(schema, input, { abortPipeEarly: true });
  if (result.success) return result.output;
  const issue = result.issues[0];
  const path = v.getDotPath(issue);
  // A key that is the empty string has no name to show, so the problem is reported as the input's.
  const field = path === null || path === '' ? undefined : `${at}${path}`;
  // A field left out reads "is required", not the type its schema expected.
  const said = field !== undefined && issue.kind === 'schema' && issue.input === undefined ? 'is required' : issue.message;
  const message = field !== undefined ? `${field}: ${said}` : path === '' ? 'Input has a field with an empty name, which Rigbook does not know' : `Input ${issue.message}`;
  throw new ServiceError('invalid', message, field);
}
