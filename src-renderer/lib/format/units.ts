import { displayUnit, toDisplay, type DisplayQuantity, type UnitSystem } from '../../../src-main/core/units';
import { MISSING, fixed, smart } from './number';

/** A stored value (unit in its field name) shown in the user's unit system, with its symbol. */
export function showQuantity(value: number | null | undefined, quantity: DisplayQuantity, system: UnitSystem, decimals?: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return MISSING;
  const shown = toDisplay(value, quantity, system);
  return `${decimals === undefined ? smart(shown) : fixed(shown, decimals)} ${displayUnit(quantity, system)}`;
}

export { displayUnit };
export type { DisplayQuantity, UnitSystem };
