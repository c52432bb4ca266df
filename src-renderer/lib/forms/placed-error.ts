import type { ApiError } from '$service/contract';
import type { UnitSystem } from '$core/units';
import { asApiError } from '../api/client';
import { errorFieldKey, fieldLabel, messageForField } from './draft';
import type { FieldDef } from '../parts/part-fields';

export interface PlacedError {
  /** The form key the service's field path names (`changes.` and `build.changes.` taken off); null for none. */
  key: string | null;
  /** The message as shown beside that field, without its path; null when it names no field. */
  beside: string | null;
  /** The message as the form's summary shows it: the field named by its label, as the user sees it. */
  summary: ApiError;
}

/** Where a refusal from the service goes on a form, by the field it names. */
export function placeError(error: unknown, defOf: (key: string) => FieldDef | undefined, units: UnitSystem): PlacedError {
  const e = asApiError(error);
  const key = errorFieldKey(e.field);
  const def = key ? defOf(key) : undefined;
  const beside = key ? messageForField(e.message, e.field) : null;
  return { key, beside, summary: def && beside !== null ? { ...e, message: `${fieldLabel(def, units)}: ${beside}` } : e };
}
