// The JSON Schema of the rigbook-fleet file, converted from the very valibot schemas the
// importer validates with (service/fleet/fleet-schemas.ts), so the published schema and the
// importer cannot disagree about a field. Written to schema/rigbook-fleet.schema.json by
// `npm run schema`; a test fails when the shipped file is stale.

import { toJsonSchema, type JsonSchema } from '@valibot/to-json-schema';
import { FLEET_FORMAT, FLEET_SCHEMA_ID, FLEET_VERSION } from '../service/fleet/fleet-format';
import { fleetFileSchema } from '../service/fleet/fleet-schemas';

export const FLEET_SCHEMA_PATH = 'schema/rigbook-fleet.schema.json';

export function fleetJsonSchema(): JsonSchema {
  const converted = toJsonSchema(fleetFileSchema, {
    target: 'draft-07',
    errorMode: 'throw',
    // JSON has no NaN or Infinity: every JSON number is finite.
    // A log date's calendar check (no 31 April) stays the importer's: JSON Schema has no word for it; the pattern is kept.
    ignoreActions: ['finite', 'check'],
    overrideAction({ valibotAction, jsonSchema }) {
      const action = valibotAction as { type: string; requirement?: unknown };
      // A name is trimmed, then must not be empty: in JSON Schema terms, it holds a character that is not a space.
      if (action.type === 'trim') return { ...jsonSchema, pattern: '\\S' };
      // A second pattern (an id that must also start with a letter) joins the first through allOf.
      if (action.type === 'regex' && action.requirement instanceof RegExp && typeof jsonSchema.pattern === 'string' && jsonSchema.pattern !== action.requirement.source) {
        const more = Array.isArray(jsonSchema.allOf) ? jsonSchema.allOf : [];
        return { ...jsonSchema, allOf: [...more, { pattern: action.requirement.source }] };
      }
      return null;
    },
  });
  return {
    $schema: 'http://json-schema.org/draft-07/schema#',
    $id: FLEET_SCHEMA_ID,
    title: `${FLEET_FORMAT} file, version ${FLEET_VERSION}`,
    description: 'The build records of a fleet of electric RC vehicles, as Rigbook exports and imports them. Generated from the importer’s own schemas (npm run schema); do not edit by hand.',
    ...Object.fromEntries(Object.entries(converted).filter(([key]) => key !== '$schema')),
  };
}

/** The file's text: two-space indented, ending with a newline, as the repository keeps it. */
export function fleetJsonSchemaText(): string {
  return `${JSON.stringify(fleetJsonSchema(), null, 2)}\n`;
}
