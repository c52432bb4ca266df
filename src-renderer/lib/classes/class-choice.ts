import type { FieldDef } from '../parts/part-fields';

/**
 * A vehicle's class as a pick-list of the stored classes rather than free text. The value it
 * holds is kept even when no class of that name is listed (one archived, or renamed elsewhere
 * meanwhile), so opening a form never changes a vehicle by itself.
 */
export function classFieldDef(def: FieldDef, names: readonly string[] | null, current: string): FieldDef {
  if (def.key !== 'className' || names === null) return def;
  const options = ['', ...names];
  if (current !== '' && !options.includes(current)) options.push(current);
  return { ...def, type: 'select', options, optionLabels: { '': 'No class' }, hint: 'Classes and their limits are kept on the Classes screen.' };
}
