import * as v from 'valibot';
import type { UnitSystem } from '$core/units';
import type { FieldDef } from '../parts/part-fields';
import { issueMessage, readDraftValue, type Draft } from './draft';

// Every problem of a form at once, each on its field, before anything is sent: the text that
// cannot be read as a number, then the service's own schema (the same valibot schema the
// service checks at its edge) with its bounds said in the units the field is typed in.

export type Problems = Record<string, string>;

/**
 * `assemble` turns the read values (stored units, keyed by field) into the payload the schema
 * takes; `keyOf` maps a schema path back to a field key (or a group such as `supplies`).
 */
export function draftProblems(
  fields: readonly FieldDef[],
  draft: Draft,
  system: UnitSystem,
  schema: v.GenericSchema,
  assemble: (values: Record<string, unknown>) => unknown = (values) => values,
  keyOf: (path: string) => string = (path) => path,
): Problems {
  const problems: Problems = {};
  const values: Record<string, unknown> = {};
  for (const def of fields) {
    const reading = readDraftValue(def, draft[def.key] ?? '', system);
    if (reading.ok) values[def.key] = reading.value;
    else problems[def.key] = reading.message;
  }
  const result = v.safeParse(schema, assemble(values));
  if (!result.success) {
    for (const issue of result.issues) {
      const path = v.getDotPath(issue);
      if (path === null || path === '') continue;
      const key = keyOf(path);
      if (key in problems) continue;
      const def = fields.find((f) => f.key === key);
      // A field the form could not read is left out of the payload: its own message stands.
      if (def && !(def.key in values)) continue;
      problems[key] = def ? issueMessage(def, issue, system) : issue.message;
    }
  }
  return problems;
}
