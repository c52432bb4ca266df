import { NAME, NOTES, PART_MASS } from './common-fields';
import type { FieldCatalogue } from './field-spec';

export const MOTOR_FIELDS = {
  name: NAME,
  kv: {
    type: 'number',
    label: 'Kv',
    unit: 'rpm/V',
    hint: 'rpm per volt, no-load',
    plausible: { min: 10, max: 100_000, why: 'hobby motors lie in this range' },
    typical: [20, 100_000],
    need: 'the motor Kv',
  },
  resistanceOhm: {
    type: 'number',
    label: 'Winding resistance',
    unit: 'Ω',
    entry: { unit: 'mΩ', scale: 1000 },
    hint: 'phase to phase',
    nullable: true,
    fallback: null,
    plausible: { above: 0, max: 10, why: 'hobby motors measure well under 10 Ω; milliohms must be entered as ohms (0.012, not 12)' },
    // Motor windings measure 1 mΩ to a few Ω (common practice, from memory).
    typical: [0.0003, 5],
    need: 'the motor winding resistance',
  },
  noLoadCurrentA: { type: 'number', label: 'No-load current', unit: 'A', nullable: true, fallback: null, bounds: { min: 0, max: 1000 }, typical: [0.01, 30], need: 'the motor no-load current' },
  maxCurrentA: { type: 'number', label: 'Rated current', unit: 'A', nullable: true, fallback: null, bounds: { above: 0, max: 10_000 }, typical: [0.5, 2000], need: 'the motor rated current' },
  maxPowerW: { type: 'number', label: 'Rated power', unit: 'W', nullable: true, fallback: null, bounds: { above: 0, max: 1_000_000 }, typical: [1, 100_000], need: 'the motor rated power' },
  maxVoltageV: { type: 'number', label: 'Rated voltage', unit: 'V', nullable: true, fallback: null, bounds: { above: 0, max: 2000 }, typical: [1, 400], need: 'the motor rated voltage' },
  maxRpm: { type: 'number', label: 'Rated speed', unit: 'rpm', nullable: true, fallback: null, bounds: { above: 0, max: 1_000_000 }, typical: [500, 300_000], need: 'the motor rated rpm' },
  maxLossW: {
    type: 'number',
    label: 'Rated heat loss',
    unit: 'W',
    hint: 'the most heat the motor may shed continuously, where the maker rates it',
    nullable: true,
    fallback: null,
    optional: true,
    bounds: { above: 0, max: 100_000 },
    need: 'the motor rated heat loss',
  },
  poles: { type: 'integer', label: 'Poles', unit: 'count', nullable: true, fallback: null, bounds: { min: 2, max: 100 }, need: 'the motor pole count' },
  massKg: { ...PART_MASS, typical: [0.001, 30] },
  notes: NOTES,
} as const satisfies FieldCatalogue;
