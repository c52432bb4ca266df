import { describe, expect, it } from 'vitest';
import { valueUsedText } from '../../src-renderer/lib/sheet/values-used';
import { propeller, quadContext, supplyOf, vehicle } from '../unit/core/fixtures';

// The sheet's list of values the engine took where the record was empty: each says what it is
// and how it was come by, a boat's propeller as the water estimate, an air propeller's as its own.

describe('values used on the sheet', () => {
  const bySize = propeller({ diameterMm: 40, pitchMm: 56, blades: 2, thrustCoefficient: null, powerCoefficient: null });

  it("a boat's propeller coefficients read as estimated for a water propeller, B-series at bollard", () => {
    const base = quadContext();
    const s = supplyOf({ ...base, vehicle: vehicle({ id: 'boat-a', kind: 'boat', massKg: 2, water: 'fresh' }), build: { ...base.build, motorCount: 1 }, propeller: bySize });
    const lines = (s.valuesUsed ?? []).map(valueUsedText);
    expect(lines).toHaveLength(2);
    for (const line of lines) expect(line).toMatch(/estimated \(water propeller, B-series at bollard, about ±30 %\)$/);
    expect(lines[1]).toMatch(/^Power coefficient C_P: /);
  });

  it("a quad's read as estimated from diameter, pitch and blades, about ±20 %", () => {
    const lines = (supplyOf(quadContext({ propeller: bySize })).valuesUsed ?? []).map(valueUsedText);
    expect(lines).toHaveLength(2);
    for (const line of lines) expect(line).toMatch(/estimated from diameter, pitch and blades \(about ±20 %\)$/);
  });
});
