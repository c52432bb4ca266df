import type { FieldSpec } from '$core/catalogue/field-spec';
import type { FieldDef, FieldType } from '../parts/part-fields';

// A catalogue field as a form shows it: the label, unit, hint and bounds come from the core's
// catalogue; the form adds only what is about the screen (option labels, table columns).

function formType(spec: FieldSpec): FieldType {
  switch (spec.type) {
    case 'notes':
      return 'notes';
    case 'number':
    case 'integer':
    case 'flag':
      return spec.type;
    case 'choice':
    case 'ref':
      return 'select';
    default:
      return 'text';
  }
}

/** The form field for `key` (its path in the form: `gearing.pinionTeeth` for a nested one). */
export function formField(key: string, spec: FieldSpec, screen: Pick<FieldDef, 'optionLabels' | 'column'> = {}): FieldDef {
  const def: FieldDef = { key, label: spec.label, type: formType(spec), ...screen };
  const unit = spec.entry?.unit ?? spec.unit;
  if (spec.quantity) def.quantity = spec.quantity;
  else if (unit !== undefined) def.unit = unit;
  if (spec.entry?.scale !== undefined) def.scale = spec.entry.scale;
  if (spec.entry?.percent) def.percent = true;
  if (spec.entry?.inputDecimals !== undefined) def.inputDecimals = spec.entry.inputDecimals;
  if (spec.entry?.emptyText !== undefined) def.emptyText = spec.entry.emptyText;
  if (spec.hint !== undefined) def.hint = spec.hint;
  if (spec.nullable) def.nullable = true;
  // A choice that may be unknown offers "not recorded" first.
  if (spec.options) def.options = spec.nullable ? ['', ...spec.options] : spec.options;
  return def;
}
