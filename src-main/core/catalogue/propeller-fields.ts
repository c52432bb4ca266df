import { NAME, NOTES } from './common-fields';
import type { FieldCatalogue } from './field-spec';

export const PROPELLER_FIELDS = {
  name: NAME,
  diameterMm: { type: 'number', label: 'Diameter', unit: 'mm', quantity: 'lengthMm', bounds: { above: 0, max: 10_000 }, typical: [10, 3000], need: 'the propeller diameter' },
  pitchMm: { type: 'number', label: 'Pitch', unit: 'mm', quantity: 'lengthMm', nullable: true, fallback: null, bounds: { above: 0, max: 10_000 }, typical: [5, 3000], need: 'the propeller pitch' },
  blades: { type: 'integer', label: 'Blades', unit: 'count', bounds: { min: 1, max: 12 }, fallback: 2 },
  thrustCoefficient: {
    type: 'number',
    label: 'Thrust coefficient C_T',
    unit: 'no unit',
    hint: "T = C_T·ρ·n²·D⁴ (n in rev/s). Static values of small 2-blade air propellers are typically 0.08–0.15, a boat propeller's at bollard (K_T) about 0.3–0.6 (from memory); take it from the maker's data or published propeller test tables. Left empty, it is estimated from diameter and pitch.",
    nullable: true,
    fallback: null,
    bounds: { above: 0, max: 10 },
    typical: [0.005, 1],
    need: 'the propeller thrust coefficient (C_T)',
  },
  powerCoefficient: {
    type: 'number',
    label: 'Power coefficient C_P',
    unit: 'no unit',
    hint: "P = C_P·ρ·n³·D⁵ (n in rev/s). Static values of air propellers are typically 0.03–0.08, higher for high-pitch propellers; a boat propeller's at bollard (2π·K_Q) about 0.3–2 (from memory); from the same tables as C_T. Left empty, it is estimated from diameter and pitch.",
    nullable: true,
    fallback: null,
    bounds: { above: 0, max: 10 },
    typical: [0.002, 3],
    need: 'the propeller power coefficient (C_P)',
  },
  maxRpm: {
    type: 'number',
    label: 'Propeller rpm limit',
    unit: 'rpm',
    hint: "the maker's limit, often printed as a constant ÷ diameter; leave empty if none",
    nullable: true,
    fallback: null,
    optional: true,
    plausible: { min: 1000, max: 500_000, why: 'the maker\u2019s limit for this diameter' },
  },
  notes: NOTES,
} as const satisfies FieldCatalogue;
