import { describe, expect, it } from 'vitest';
import { GEARING_FIELDS } from '../../src-main/core/catalogue/build-fields';
import type { FieldCatalogue } from '../../src-main/core/catalogue/field-spec';
import { FIELD_CATALOGUES } from '../../src-main/core/catalogue/record-kinds';
import { MIGRATIONS } from '../../src-main/store/migration-provider';
import { referenceShape } from '../../src-main/store/schema-shape';

// The database Rigbook's own migrations make, read back from SQLite, against the field
// catalogues: a catalogue entry without its migration (or a migration without its entry) fails
// here, naming the column. The compiler checks the store's table types the same way (tests/types).

const BOOKKEEPING = new Set(['id', 'version', 'archivedAt', 'notes', 'createdAt', 'updatedAt']);

/** name → "null" or "not null", as the catalogue says the column must be. */
function expected(...catalogues: FieldCatalogue[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const catalogue of catalogues) {
    for (const [name, spec] of Object.entries(catalogue)) {
      if (BOOKKEEPING.has(name) || spec.type === 'group' || spec.type === 'supplies') continue;
      out[name] = spec.nullable ? 'null' : 'not null';
    }
  }
  return out;
}

describe('field catalogues and the migrated store', () => {
  it('every catalogue field is a column of its table, nullable exactly where the catalogue says', async () => {
    const shape = await referenceShape(Object.keys(MIGRATIONS));
    const kinds = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles', 'builds', 'customers'] as const satisfies readonly (keyof typeof FIELD_CATALOGUES)[];
    expect(Object.keys(FIELD_CATALOGUES)).toEqual(kinds);
    for (const kind of kinds) {
      const catalogues: FieldCatalogue[] = kind === 'builds' ? [FIELD_CATALOGUES.builds, GEARING_FIELDS] : [FIELD_CATALOGUES[kind]];
      const columns = shape.tables.get(kind) ?? [];
      const actual = Object.fromEntries(columns.filter((c) => !BOOKKEEPING.has(c.name)).map((c) => [c.name, c.notNull ? 'not null' : 'null']));
      expect({ kind, columns: actual }).toEqual({ kind, columns: expected(...catalogues) });
    }
  });
});
