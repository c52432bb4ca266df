// `npm run schema`: regenerates schema/rigbook-fleet.schema.json from the importer's schemas.
import { writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { FLEET_SCHEMA_PATH, fleetJsonSchemaText } from './fleet-json-schema';

const target = resolve(process.cwd(), FLEET_SCHEMA_PATH);
writeFileSync(target, fleetJsonSchemaText(), 'utf8');
process.stdout.write(`Wrote ${FLEET_SCHEMA_PATH}\n`);
