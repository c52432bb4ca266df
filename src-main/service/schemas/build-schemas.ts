import * as v from 'valibot';
import { ARRANGEMENTS } from '../../core/domain';
import { count, id, name, newId, notes, nullable, number, oneOf, plausible, positive, record } from './field-builders';

export const gearingSchema = record({
  pinionTeeth: v.optional(nullable(count(5, 200)), null),
  spurTeeth: v.optional(nullable(count(5, 500)), null),
  internalRatio: v.optional(positive(1000), 1),
  tireDiameterMm: v.optional(nullable(positive(5000)), null),
  drivetrainEfficiency: v.optional(plausible('gearing.drivetrainEfficiency'), 0.9),
});

export const supplySchema = record({
  id: v.optional(id()),
  arrangement: v.optional(oneOf(ARRANGEMENTS), 'series'),
  batteryIds: v.pipe(v.array(id(), 'must be a list of pack ids'), v.minLength(1, 'needs at least one pack'), v.maxLength(12, 'may hold at most 12 packs')),
});

const supplies = () => v.pipe(v.array(supplySchema, 'must be a list of supplies'), v.maxLength(8, 'may hold at most 8 supplies'));

const buildEntries = {
  name: name(),
  vehicleId: id(),
  motorId: nullable(id()),
  motorCount: count(1, 16),
  controllerId: nullable(id()),
  propellerId: nullable(id()),
  gearing: gearingSchema,
  supplies: supplies(),
  measuredPeakCurrentA: nullable(positive(20_000)),
  measuredAverageCurrentA: nullable(positive(20_000)),
  measuredSupplyId: nullable(id()),
  runLengthS: nullable(plausible('build.runLengthS')),
  tightThreshold: nullable(number({ min: 0, max: 0.9 })),
  notes: notes(),
};

export const buildCreateSchema = record({
  id: v.optional(newId()),
  name: buildEntries.name,
  vehicleId: buildEntries.vehicleId,
  motorId: v.optional(buildEntries.motorId, null),
  motorCount: v.optional(buildEntries.motorCount, 1),
  controllerId: v.optional(buildEntries.controllerId, null),
  propellerId: v.optional(buildEntries.propellerId, null),
  gearing: v.optional(gearingSchema, {}),
  supplies: v.optional(buildEntries.supplies, []),
  measuredPeakCurrentA: v.optional(buildEntries.measuredPeakCurrentA, null),
  measuredAverageCurrentA: v.optional(buildEntries.measuredAverageCurrentA, null),
  measuredSupplyId: v.optional(buildEntries.measuredSupplyId, null),
  runLengthS: v.optional(buildEntries.runLengthS, null),
  tightThreshold: v.optional(buildEntries.tightThreshold, null),
  notes: v.optional(buildEntries.notes, ''),
});

/** A patch replaces gearing and supplies whole: they are small and edited as a unit. */
export const buildPatchSchema = v.partial(record(buildEntries));
