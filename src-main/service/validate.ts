import * as v from 'valibot';
import { ServiceError } from './contract';

/** Parses a handler's input; the first problem becomes an `invalid` error that names its field. */
export function validate<S extends v.GenericSchema>(schema: S, input: unknown): v.InferOutput<S> {
  const result = v.safeParse(schema, input, { abortPipeEarly: true });
  if (result.success) return result.output;
  const issue = result.issues[0];
  const field = v.getDotPath(issue) ?? undefined;
  const message = field ? `${field}: ${issue.message}` : `Input ${issue.message}`;
  throw new ServiceError('invalid', message, field);
}
