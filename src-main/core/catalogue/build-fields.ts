import { NOTES } from './common-fields';
import type { FieldCatalogue } from './field-spec';

// One vehicle's configuration. Gearing is a nested record of its own; its fields are named by
// their path (`gearing.pinionTeeth`) in messages, forms and history.

export const GEARING_FIELDS = {
  pinionTeeth: { type: 'integer', label: 'Pinion', unit: 'teeth', nullable: true, fallback: null, bounds: { min: 5, max: 200 }, need: 'the pinion tooth count' },
  spurTeeth: { type: 'integer', label: 'Spur', unit: 'teeth', nullable: true, fallback: null, bounds: { min: 5, max: 500 }, need: 'the spur tooth count' },
  internalRatio: {
    type: 'number',
    label: 'Internal ratio',
    entry: { unit: ':1' },
    hint: 'gearbox or transmission after the spur; 1 where there is none',
    fallback: 1,
    bounds: { above: 0, max: 1000 },
    need: 'the internal (gearbox) ratio',
  },
  tireDiameterMm: {
    type: 'number',
    label: 'Tyre diameter',
    unit: 'mm',
    quantity: 'lengthMm',
    nullable: true,
    fallback: null,
    bounds: { above: 0, max: 5000 },
    typical: [10, 1000],
    need: 'the tyre diameter',
  },
  drivetrainEfficiency: {
    type: 'number',
    label: 'Drivetrain efficiency',
    entry: { unit: '%', scale: 100, percent: true },
    hint: 'in percent: 90 for 90 %; spur and gearbox together, typically 85–95 % (common practice)',
    fallback: 0.9,
    plausible: { min: 0.3, max: 1, why: 'a fraction: 0.9 for 90 %; below 0.3 is no working drivetrain' },
    need: 'the drivetrain efficiency (above 0, at most 1)',
  },
} as const satisfies FieldCatalogue;

const MEASURED_HINT = 'whole supply; replaces the model on the supply it was logged on';

export const BUILD_FIELDS = {
  name: { type: 'name', label: 'Build name' },
  vehicleId: { type: 'ref', label: 'Vehicle', need: 'a vehicle for the build' },
  motorId: { type: 'ref', label: 'Motor', nullable: true, fallback: null, need: 'a motor for the build' },
  motorCount: { type: 'integer', label: 'Motor count', unit: 'count', fallback: 1, bounds: { min: 1, max: 16 }, need: 'the number of motors' },
  controllerId: { type: 'ref', label: 'Speed controller', nullable: true, fallback: null, need: 'a speed controller for the build' },
  propellerId: { type: 'ref', label: 'Propeller', nullable: true, fallback: null, need: 'a propeller for the build' },
  gearing: { type: 'group', label: 'Gearing', fields: GEARING_FIELDS, fallback: {} },
  supplies: { type: 'supplies', label: 'Supplies', fallback: [], need: 'at least one supply (a set of packs)' },
  measuredPeakCurrentA: {
    type: 'number',
    label: 'Measured peak current',
    unit: 'A',
    hint: MEASURED_HINT,
    nullable: true,
    fallback: null,
    bounds: { above: 0, max: 20_000 },
    typical: [0.1, 5000],
    need: 'a usable measured peak current',
  },
  measuredAverageCurrentA: {
    type: 'number',
    label: 'Measured average current',
    unit: 'A',
    hint: MEASURED_HINT,
    nullable: true,
    fallback: null,
    bounds: { above: 0, max: 20_000 },
    typical: [0.1, 5000],
    need: 'a usable measured average current',
  },
  measuredSupplyId: {
    type: 'ref',
    label: 'Measured on supply',
    hint: 'the pack arrangement the currents were logged on; with one supply, that one',
    nullable: true,
    fallback: null,
    optional: true,
  },
  runLengthS: {
    type: 'number',
    label: 'Run length',
    unit: 's',
    entry: { emptyText: 'default 4 s' },
    hint: 'full throttle from standstill; the continuous current is judged over it (cars and trucks)',
    nullable: true,
    fallback: null,
    optional: true,
    plausible: { min: 0.5, max: 600, why: 'seconds of full throttle from standstill' },
  },
  tightThreshold: {
    type: 'number',
    label: 'Tight threshold',
    entry: { unit: '% headroom', scale: 100, percent: true, emptyText: 'default' },
    hint: 'empty: the class or default threshold',
    nullable: true,
    fallback: null,
    bounds: { min: 0, max: 0.9 },
  },
  notes: NOTES,
} as const satisfies FieldCatalogue;
