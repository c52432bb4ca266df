import { CHEMISTRIES } from '../domain';
import { NAME, NOTES, PART_MASS } from './common-fields';
import type { FieldCatalogue } from './field-spec';

// A battery pack, in the order a technician reads its label.
export const BATTERY_FIELDS = {
  name: NAME,
  chemistry: { type: 'choice', label: 'Chemistry', options: CHEMISTRIES, need: 'the pack chemistry' },
  cellsSeries: { type: 'integer', label: 'Cells in series', unit: 'S', bounds: { min: 1, max: 30 }, need: 'the cell count in series (S)' },
  cellsParallel: { type: 'integer', label: 'Cells in parallel', unit: 'P', bounds: { min: 1, max: 20 }, fallback: 1, need: 'the cell count in parallel (P)' },
  capacityMah: { type: 'number', label: 'Capacity', unit: 'mAh', bounds: { above: 0, max: 1_000_000 }, typical: [20, 100_000], need: 'the pack capacity' },
  cRatingContinuous: {
    type: 'number',
    label: 'Continuous C rating',
    unit: 'C',
    hint: 'as printed by the maker',
    nullable: true,
    fallback: null,
    bounds: { above: 0, max: 1000 },
    typical: [0.5, 300],
    need: 'the continuous C rating of the pack',
  },
  cRatingBurst: { type: 'number', label: 'Burst C rating', unit: 'C', nullable: true, fallback: null, bounds: { above: 0, max: 2000 }, typical: [0.5, 600], need: 'the burst C rating of the pack' },
  cellResistanceOhm: {
    type: 'number',
    label: 'Cell resistance, measured',
    unit: 'Ω',
    entry: { unit: 'mΩ', scale: 1000 },
    hint: 'per cell; leave empty if never measured',
    nullable: true,
    fallback: null,
    plausible: {
      label: 'Cell resistance',
      above: 0,
      max: 1,
      why: 'a measured cell is never exactly 0 Ω; leave it empty where it was never measured (milliohms as ohms: 0.003, not 3)',
    },
    // Pack cells measure 0.2–50 mΩ (common practice, from memory).
    typical: [0.0001, 0.1],
    need: 'the measured cell resistance',
  },
  massKg: { ...PART_MASS, typical: [0.003, 30] },
  wireGaugeAwg: {
    type: 'integer',
    label: 'Lead wire gauge',
    unit: 'AWG',
    hint: 'the pack’s leads up to the controller',
    nullable: true,
    fallback: null,
    optional: true,
    bounds: { min: 4, max: 30 },
    need: 'the lead wire gauge',
  },
  connectorRatingA: {
    type: 'number',
    label: 'Connector rating',
    unit: 'A',
    hint: 'continuous current the connector maker rates it for',
    nullable: true,
    fallback: null,
    optional: true,
    bounds: { above: 0, max: 10_000 },
    need: 'the connector current rating',
  },
  cycleCount: { type: 'integer', label: 'Cycles', unit: 'count', hint: 'before the pack log began; each logged charge adds one', bounds: { min: 0, max: 100_000 }, fallback: 0 },
  retired: { type: 'flag', label: 'Retired (no longer used in new builds)', fallback: false },
  notes: NOTES,
} as const satisfies FieldCatalogue;
