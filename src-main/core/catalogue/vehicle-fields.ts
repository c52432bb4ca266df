import { DRIVE_LAYOUTS, VEHICLE_KINDS, WATER_TYPES } from '../domain';
import { NAME, NOTES } from './common-fields';
import type { FieldCatalogue } from './field-spec';

// A vehicle: the body the build's parts push along.
export const VEHICLE_FIELDS = {
  name: NAME,
  kind: { type: 'choice', label: 'Kind', options: VEHICLE_KINDS, need: 'the vehicle kind' },
  massKg: { type: 'number', label: 'Mass', unit: 'kg', quantity: 'massKg', nullable: true, fallback: null, bounds: { above: 0, max: 10_000 }, typical: [0.01, 500], need: 'the vehicle mass' },
  dragAreaM2: {
    type: 'number',
    label: 'Drag area Cd·A',
    unit: 'm²',
    quantity: 'areaM2',
    entry: { inputDecimals: 4 },
    hint: 'Drag coefficient × frontal area. A 1/10 car or truck is about 0.02–0.06 m² (0.2–0.65 ft²): Cd near 0.8–1.0 for a boxy body times its frontal area (from memory).',
    nullable: true,
    fallback: null,
    bounds: { above: 0, max: 100 },
    typical: [0.0001, 5],
    need: 'the drag area (Cd·A)',
  },
  rollingCoefficient: {
    type: 'number',
    label: 'Rolling coefficient C_rr',
    unit: 'no unit',
    hint: 'Rolling resistance ÷ weight. About 0.02–0.04 for rubber tyres on pavement or carpet, 0.05–0.1 on dirt or grass (from memory).',
    nullable: true,
    fallback: null,
    bounds: { min: 0, max: 1 },
    typical: [0, 0.5],
    need: 'the rolling coefficient',
  },
  tractionCoefficient: {
    type: 'number',
    label: 'Traction coefficient μ',
    unit: 'no unit',
    hint: 'Grip: the most drive force ÷ weight before the tyres spin. About 0.7–1.0 on pavement or carpet, 0.4–0.7 on loose dirt (from memory). It sets the launch current, so round up.',
    nullable: true,
    fallback: null,
    bounds: { above: 0, max: 5 },
    typical: [0.05, 3],
    need: 'the traction coefficient',
  },
  driveLayout: { type: 'choice', label: 'Drive', options: DRIVE_LAYOUTS, hint: 'cars and trucks', nullable: true, fallback: null, optional: true },
  drivenWeightShare: {
    type: 'number',
    label: 'Weight on driven wheels',
    entry: { unit: '%', scale: 100, percent: true, emptyText: '4WD 100 %, 2WD 70 %' },
    hint: 'share of the weight on the driven wheels',
    nullable: true,
    fallback: null,
    optional: true,
    plausible: { above: 0, max: 1, why: 'a fraction of the vehicle weight: 1 for 4WD, about 0.6 to 0.7 for 2WD' },
  },
  water: {
    type: 'choice',
    label: 'Water',
    options: WATER_TYPES,
    hint: 'boats: sea water (1025 kg/m³) loads a propeller more than fresh',
    nullable: true,
    fallback: null,
    optional: true,
  },
  // The customer whose vehicle this is; null is the shop's own. Replaced the free-text owner: files
  // written before it carry `owner` text, which an import maps to customers.
  customerId: { type: 'ref', label: 'Customer', hint: "empty: the shop's own", nullable: true, fallback: null, optional: true },
  className: { type: 'text', label: 'Class', maxLength: 80, fallback: '' },
  notes: NOTES,
} as const satisfies FieldCatalogue;
