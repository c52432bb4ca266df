import { NAME, NOTES, PART_MASS } from './common-fields';
import type { FieldCatalogue } from './field-spec';

// A speed controller.
export const CONTROLLER_FIELDS = {
  name: NAME,
  maxVoltageV: {
    type: 'number',
    label: 'Maximum input voltage',
    unit: 'V',
    nullable: true,
    fallback: null,
    bounds: { above: 0, max: 2000 },
    typical: [2, 400],
    need: 'the controller maximum voltage (or maximum cell count)',
  },
  maxCells: { type: 'integer', label: 'Maximum cells', unit: 'S', hint: 'used at 4.2 V per cell when no voltage is given', nullable: true, fallback: null, bounds: { min: 1, max: 100 } },
  continuousCurrentA: {
    type: 'number',
    label: 'Continuous current',
    unit: 'A',
    nullable: true,
    fallback: null,
    bounds: { above: 0, max: 10_000 },
    typical: [0.5, 2000],
    need: 'the controller continuous current rating',
  },
  burstCurrentA: { type: 'number', label: 'Burst current', unit: 'A', nullable: true, fallback: null, bounds: { above: 0, max: 20_000 }, typical: [0.5, 5000], need: 'the controller burst current rating' },
  resistanceOhm: {
    type: 'number',
    label: 'Own resistance',
    unit: 'Ω',
    entry: { unit: 'mΩ', scale: 1000 },
    nullable: true,
    fallback: null,
    bounds: { min: 0, max: 10 },
    // Controllers measure under 50 mΩ (common practice, from memory).
    typical: [0, 0.05],
    need: 'the controller resistance',
  },
  massKg: { ...PART_MASS, typical: [0.001, 10] },
  notes: NOTES,
} as const satisfies FieldCatalogue;
