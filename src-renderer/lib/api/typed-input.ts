import * as v from 'valibot';
import { ServiceError } from '$service/contract';
import { validate } from '$service/validate';
import { ApiCallError } from './client';

/**
 * A value a form assembled from the user's typing, given the type its handler takes once the
 * handler's own schema accepts it. Forms check every field before saving, so a refusal here
 * means a field the form does not show; it is refused like the service would refuse it (the
 * same message, naming the field at `at`), and nothing is sent.
 */
export function typedInput<S extends v.GenericSchema>(schema: S, value: unknown, at = ''): v.InferInput<S> {
  if (v.is(schema, value)) return value;
  try {
    validate(schema, value, at);
  } catch (error) {
    if (error instanceof ServiceError) throw new ApiCallError(error.field === undefined ? { kind: error.kind, message: error.message } : { kind: error.kind, message: error.message, field: error.field });
    throw error;
  }
  // A schema whose check passes on a second look: refuse rather than send what was not checked.
  throw new ApiCallError({ kind: 'invalid', message: 'Input could not be checked' });
}
