import * as v from 'valibot';
import { CHEMISTRIES, DRIVE_LAYOUTS, VEHICLE_KINDS, WATER_TYPES } from '../../core/domain';
import { count, flag, id, name, newId, notes, nullable, number, oneOf, plausible, positive, record, text } from './field-builders';

// Each part kind lists its fields once; the create schema fills defaults and the patch
// schema makes every field optional. Limits are generous bounds against typing slips, not
// engineering limits: the rules engine judges the figures.

function schemasFor<const E extends v.ObjectEntries, const D extends { [K in keyof E]?: v.InferOutput<E[K]> }>(entries: E, defaults: D) {
  const createEntries = Object.fromEntries(
    Object.entries(entries).map(([key, schema]) => [key, key in defaults ? v.optional(schema, defaults[key as keyof D] as never) : schema]),
  ) as { [K in keyof E]: K extends keyof D ? v.OptionalSchema<E[K], never> : E[K] };
  const create = record({ id: v.optional(newId()), ...createEntries });
  const patch = v.partial(record(entries));
  return { create, patch };
}

export const batterySchemas = schemasFor(
  {
    name: name(),
    chemistry: oneOf(CHEMISTRIES),
    cellsSeries: count(1, 30),
    cellsParallel: count(1, 20),
    capacityMah: positive(1_000_000),
    cRatingContinuous: nullable(positive(1000)),
    cRatingBurst: nullable(positive(2000)),
    cellResistanceOhm: nullable(plausible('battery.cellResistanceOhm')),
    massKg: nullable(positive(1000)),
    cycleCount: count(0, 100_000),
    retired: flag(),
    notes: notes(),
  },
  { cellsParallel: 1, cRatingContinuous: null, cRatingBurst: null, cellResistanceOhm: null, massKg: null, cycleCount: 0, retired: false, notes: '' },
);

export const motorSchemas = schemasFor(
  {
    name: name(),
    kv: plausible('motor.kv'),
    resistanceOhm: nullable(plausible('motor.resistanceOhm')),
    noLoadCurrentA: nullable(number({ min: 0, max: 1000 })),
    maxCurrentA: nullable(positive(10_000)),
    maxPowerW: nullable(positive(1_000_000)),
    maxVoltageV: nullable(positive(2000)),
    maxRpm: nullable(positive(1_000_000)),
    poles: nullable(count(2, 100)),
    massKg: nullable(positive(1000)),
    notes: notes(),
  },
  { resistanceOhm: null, noLoadCurrentA: null, maxCurrentA: null, maxPowerW: null, maxVoltageV: null, maxRpm: null, poles: null, massKg: null, notes: '' },
);

export const controllerSchemas = schemasFor(
  {
    name: name(),
    maxVoltageV: nullable(positive(2000)),
    maxCells: nullable(count(1, 100)),
    continuousCurrentA: nullable(positive(10_000)),
    burstCurrentA: nullable(positive(20_000)),
    resistanceOhm: nullable(number({ min: 0, max: 10 })),
    massKg: nullable(positive(1000)),
    notes: notes(),
  },
  { maxVoltageV: null, maxCells: null, continuousCurrentA: null, burstCurrentA: null, resistanceOhm: null, massKg: null, notes: '' },
);

export const propellerSchemas = schemasFor(
  {
    name: name(),
    diameterMm: positive(10_000),
    pitchMm: nullable(positive(10_000)),
    blades: count(1, 12),
    thrustCoefficient: nullable(positive(10)),
    powerCoefficient: nullable(positive(10)),
    maxRpm: nullable(plausible('propeller.maxRpm')),
    notes: notes(),
  },
  { pitchMm: null, blades: 2, thrustCoefficient: null, powerCoefficient: null, maxRpm: null, notes: '' },
);

export const vehicleSchemas = schemasFor(
  {
    name: name(),
    kind: oneOf(VEHICLE_KINDS),
    massKg: nullable(positive(10_000)),
    dragAreaM2: nullable(positive(100)),
    rollingCoefficient: nullable(number({ min: 0, max: 1 })),
    tractionCoefficient: nullable(positive(5)),
    driveLayout: nullable(oneOf(DRIVE_LAYOUTS)),
    drivenWeightShare: nullable(plausible('vehicle.drivenWeightShare')),
    water: nullable(oneOf(WATER_TYPES)),
    owner: text(120),
    className: text(80),
    notes: notes(),
  },
  {
    massKg: null,
    dragAreaM2: null,
    rollingCoefficient: null,
    tractionCoefficient: null,
    driveLayout: null,
    drivenWeightShare: null,
    water: null,
    owner: '',
    className: '',
    notes: '',
  },
);

export const classRuleSchemas = schemasFor(
  {
    className: name(),
    ruleId: v.pipe(id(), v.regex(/^class-/, 'must start with "class-" so it never clashes with a built-in rule')),
    figure: v.pipe(text(60), v.minLength(1, 'is required')),
    limit: number({ min: -1e9, max: 1e9 }),
    unit: text(12),
    tightThreshold: nullable(number({ min: 0, max: 0.9 })),
    notes: notes(),
  },
  { unit: '', tightThreshold: null, notes: '' },
);
