import type { Build, Supply } from '$core/domain';
import { BUILD_FIELDS as BUILD_CATALOGUE, GEARING_FIELDS as GEARING_CATALOGUE } from '$core/catalogue/build-fields';
import type { FieldCatalogue } from '$core/catalogue/field-spec';
import { formField } from '../forms/catalogue-field';
import type { FieldDef } from '../parts/part-fields';

// The build form's scalar fields, read from the build's field catalogue. Gearing fields carry
// their nested path as the key, which is also the path the service names in its errors
// (`gearing.pinionTeeth`); supplies have their own editor.

type FormKey = Exclude<keyof typeof BUILD_CATALOGUE, 'gearing' | 'supplies'> | keyof typeof GEARING_CATALOGUE;

// One overload names the form's keys for the views; the body builds them from the catalogue.
function buildFormFields(): Readonly<Record<FormKey, FieldDef>>;
function buildFormFields(): Readonly<Record<string, FieldDef>> {
  const scalar: FieldCatalogue = BUILD_CATALOGUE;
  const gearing: FieldCatalogue = GEARING_CATALOGUE;
  const out: Record<string, FieldDef> = {};
  for (const [key, spec] of Object.entries(scalar)) {
    if (spec.type === 'group') for (const [inner, innerSpec] of Object.entries(gearing)) out[inner] = formField(`${key}.${inner}`, innerSpec);
    else if (spec.type !== 'supplies') out[key] = formField(key, spec);
  }
  return out;
}

export const BUILD_FIELDS = buildFormFields();

export const BUILD_FIELD_LIST: readonly FieldDef[] = Object.values(BUILD_FIELDS);

export const GEARING_KEYS = ['pinionTeeth', 'spurTeeth', 'internalRatio', 'tireDiameterMm', 'drivetrainEfficiency'] as const satisfies readonly (keyof typeof GEARING_CATALOGUE)[];

/** A build as a flat record of the form's keys (`gearing.spurTeeth`). */
export function flattenBuild(b: Build): Record<string, unknown> {
  const out: Record<string, unknown> = { ...b };
  for (const k of GEARING_KEYS) out[`gearing.${k}`] = b.gearing[k];
  return out;
}

/** The form's flat values back into the shape the service takes. */
export function nestBuild(flat: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  let gearing: Record<string, unknown> | null = null;
  for (const [key, value] of Object.entries(flat)) {
    if (key.startsWith('gearing.')) {
      gearing ??= {};
      gearing[key.slice('gearing.'.length)] = value;
    } else out[key] = value;
  }
  if (gearing) out.gearing = gearing;
  return out;
}

export interface SupplyDraft {
  id?: string;
  arrangement: Supply['arrangement'];
  batteryIds: string[];
}

export function suppliesEqual(a: readonly SupplyDraft[], b: readonly SupplyDraft[]): boolean {
  return JSON.stringify(a.map((s) => [s.arrangement, s.batteryIds])) === JSON.stringify(b.map((s) => [s.arrangement, s.batteryIds]));
}
