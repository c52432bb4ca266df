import * as v from 'valibot';
import { ARRANGEMENTS } from '../../core/domain';
import { BUILD_FIELDS, GEARING_FIELDS } from '../../core/catalogue/build-fields';
import { createEntries, fieldEntries, groupSchema } from './catalogue-schemas';
import { id, newId, oneOf, record } from './field-builders';

export const gearingSchema = groupSchema(GEARING_FIELDS);

export const supplySchema = record({
  id: v.optional(id()),
  arrangement: v.optional(oneOf(ARRANGEMENTS), 'series'),
  batteryIds: v.pipe(v.array(id(), 'must be a list of pack ids'), v.minLength(1, 'needs at least one pack'), v.maxLength(12, 'may hold at most 12 packs')),
});

const supplies = () => v.pipe(v.array(supplySchema, 'must be a list of supplies'), v.maxLength(8, 'may hold at most 8 supplies'));

const given = { gearing: gearingSchema, supplies: supplies() };

export const buildCreateSchema = record({ id: v.optional(newId()), ...createEntries(BUILD_FIELDS, given) });

/** A patch replaces gearing and supplies whole: they are small and edited as a unit. */
export const buildPatchSchema = v.partial(record(fieldEntries(BUILD_FIELDS, given)));
