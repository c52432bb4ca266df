import { displayUnit, quantityOfUnit, toDisplay, newtonToGramForce, newtonToOunceForce, type DisplayQuantity, type UnitSystem } from '$core/units';
import { MISSING, fixed, smart } from './number';

/** A stored value (unit in its field name) shown in the user's unit system, with its symbol. */
export function showQuantity(value: number | null | undefined, quantity: DisplayQuantity, system: UnitSystem, decimals?: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return MISSING;
  const shown = toDisplay(value, quantity, system);
  return `${decimals === undefined ? smart(shown) : fixed(shown, decimals)} ${displayUnit(quantity, system)}`;
}

/** A finding's value and limit in the user's units: "41.2 / 37.3 mph". */
export function valueAndLimit(value: number | null, limit: number | null, unit: string, system: UnitSystem, missingLimit = true): string {
  if (value === null && limit === null) return MISSING;
  const q = quantityOfUnit(unit);
  const shown = (n: number | null) => (n === null ? MISSING : smart(q ? toDisplay(n, q, system) : n));
  return `${shown(value)}${limit === null && !missingLimit ? '' : ` / ${shown(limit)}`} ${q ? displayUnit(q, system) : unit}`.trimEnd();
}

/**
 * The engine's sentences carry metric figures ("95 m/s"); in imperial each one is rewritten in
 * the user's unit. The numbers in sentences are plain (no thousands marks), as messageNumber writes them.
 */
export function messageInUnits(message: string, system: UnitSystem): string {
  if (system === 'metric') return message;
  return message.replace(/(-?\d+(?:\.\d+)?) (km\/h|m\/s|mm|kg|N·m|N|m²)(?![\w·/²])/gu, (whole, n: string, unit: string) => {
    const q = quantityOfUnit(unit);
    return q ? `${smart(toDisplay(Number(n), q, system))} ${displayUnit(q, system)}` : whole;
  });
}

/** Thrust as the mass it holds up: grams in metric, ounces in imperial. */
export function thrustAsMass(newtons: number | null | undefined, system: UnitSystem): string {
  if (newtons === null || newtons === undefined || !Number.isFinite(newtons)) return MISSING;
  return system === 'metric' ? `${fixed(newtonToGramForce(newtons), 0)} g` : `${smart(newtonToOunceForce(newtons))} oz`;
}

export { displayUnit };
export type { DisplayQuantity, UnitSystem };
