import Ajv from 'ajv';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { generateFleet } from '../../demo-fixtures/generate-fleet';
import { FLEET_SCHEMA_PATH, fleetJsonSchema, fleetJsonSchemaText } from '../../src-main/build/fleet-json-schema';
import { fleetText } from '../../src-main/service/fleet/export-fleet';
import { FLEET_SCHEMA_ID } from '../../src-main/service/fleet/fleet-format';
import { serviceFixture, seedTwoBuggies, type ServiceFixture } from '../helpers/service-fixture';

// The shipped schema is checked with ajv, a validator that shares no code with the importer
// (which uses valibot). ajv leaves `format` to a plug-in; date-time is RFC 3339 §5.6's
// date-time, written here as a regular expression from that grammar.
const RFC3339_DATE_TIME = /^\d{4}-\d{2}-\d{2}[Tt]\d{2}:\d{2}:\d{2}(\.\d+)?([Zz]|[+-]\d{2}:\d{2})$/;

function validator() {
  const shipped = JSON.parse(readFileSync(join(process.cwd(), FLEET_SCHEMA_PATH), 'utf8')) as object;
  const ajv = new Ajv({ strict: true, allErrors: true });
  ajv.addFormat('date-time', RFC3339_DATE_TIME);
  return ajv.compile(shipped);
}

const fixtures: ServiceFixture[] = [];
let f: ServiceFixture;
beforeEach(async () => {
  f = await serviceFixture();
  fixtures.push(f);
});
afterEach(async () => {
  for (const x of fixtures.splice(0)) await x.close();
});

describe('the rigbook-fleet JSON Schema', () => {
  it('the shipped file is what the importer’s schemas generate today (run npm run schema when this fails)', () => {
    expect(readFileSync(join(process.cwd(), FLEET_SCHEMA_PATH), 'utf8')).toBe(fleetJsonSchemaText());
    expect(fleetJsonSchema().$id).toBe(FLEET_SCHEMA_ID);
  });

  it.each(['demo-fleet.json', 'example-fleet.json'])('validates the shipped %s', (name) => {
    const validate = validator();
    const file = JSON.parse(readFileSync(join(process.cwd(), 'demo-fixtures', name), 'utf8')) as unknown;
    expect(validate(file), JSON.stringify(validate.errors)).toBe(true);
  });

  it('validates an exported file, which names the schema in $schema', async () => {
    const validate = validator();
    await f.call('demo.load', {});
    const seed = await seedTwoBuggies(f);
    await f.call('motors.archive', { id: seed.motor.id, expectedVersion: 1, reason: 'worn bearings' });
    await f.call('classRules.create', { className: 'Stock 2S', ruleId: 'class-max-kv', figure: 'noLoadRpm', limit: 40000, unit: 'rpm' });
    const text = fleetText(await f.call('fleet.export', {}));
    const file = JSON.parse(text) as { $schema: string; builds: unknown[] };
    expect(file.$schema).toBe(FLEET_SCHEMA_ID);
    expect(file.builds.length).toBeGreaterThan(10);
    expect(validate(file), JSON.stringify(validate.errors)).toBe(true);
  });

  it('validates a large generated fleet', () => {
    const validate = validator();
    expect(validate(JSON.parse(JSON.stringify(generateFleet({ builds: 300, seed: 7 })))), JSON.stringify(validate.errors?.slice(0, 3))).toBe(true);
  });

  it('refuses what the importer refuses: an id a spreadsheet can rewrite, an unknown field, a wrong format, a bad value', () => {
    const validate = validator();
    const example = () => JSON.parse(readFileSync(join(process.cwd(), 'demo-fixtures', 'example-fleet.json'), 'utf8')) as Record<string, Record<string, unknown>[]>;
    const digitId = example();
    digitId.batteries![0]!.id = '001';
    expect(validate(digitId)).toBe(false);
    const unknownField = example();
    unknownField.motors![0]!.kV = 3200;
    expect(validate(unknownField)).toBe(false);
    const badChemistry = example();
    badChemistry.batteries![0]!.chemistry = 'lead-acid';
    expect(validate(badChemistry)).toBe(false);
    const blankName = example();
    blankName.vehicles![0]!.name = '   ';
    expect(validate(blankName)).toBe(false);
    const wrongFormat = { ...example(), format: 'other' };
    expect(validate(wrongFormat)).toBe(false);
    const newer = { ...example(), version: 3 };
    expect(validate(newer)).toBe(false);
  });
});
