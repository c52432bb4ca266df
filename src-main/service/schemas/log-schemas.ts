import * as v from 'valibot';
import { PACK_EVENT_KINDS } from '../../core/pack-log';
import { flag, id, number, oneOf, record, text } from './field-builders';

// A day (2026-12-03) or a moment (2026-12-03T18:40, seconds and zone optional), as a log entry's date.
const DATE_TEXT = /^\d{4}-\d{2}-\d{2}(T\d{2}:\d{2}(:\d{2}(\.\d{1,3})?)?(Z|[+-]\d{2}:\d{2})?)?$/;

/** True where the YYYY-MM-DD part names a day on the calendar (no 31 April) and the whole text parses. */
function onCalendar(s: string): boolean {
  const [y, m, d] = s.slice(0, 10).split('-').map(Number) as [number, number, number];
  const day = new Date(Date.UTC(y, m - 1, d));
  return day.getUTCFullYear() === y && day.getUTCMonth() === m - 1 && day.getUTCDate() === d && Number.isFinite(Date.parse(s));
}

export const logDate = () => v.pipe(v.string('must be text'), v.trim(), v.regex(DATE_TEXT, 'must be a date as YYYY-MM-DD (a time may follow: YYYY-MM-DDTHH:MM)'), v.check(onCalendar, 'is not a day on the calendar'));

/** What a person types for one entry of a pack's log; which fields apply depends on the kind. */
export const packEventInput = record({
  batteryId: id(),
  at: logDate(),
  kind: oneOf(PACK_EVENT_KINDS),
  mah: v.optional(v.nullable(number({ above: 0, max: 1_000_000 })), null),
  voltagePerCellV: v.optional(v.nullable(number({ above: 0, max: 5 })), null),
  cellResistancesOhm: v.optional(v.nullable(v.pipe(v.array(number({ above: 0, max: 1 }), 'must be a list of readings in ohms'), v.minLength(1, 'must hold at least one reading'), v.maxLength(30, 'must hold at most 30 readings'))), null),
  temperatureC: v.optional(v.nullable(number({ min: -40, max: 120 })), null),
  capacityCheck: v.optional(flag(), false),
  puffed: v.optional(flag(), false),
  damaged: v.optional(flag(), false),
  note: v.optional(text(1000), ''),
});

export type PackEventInput = v.InferOutput<typeof packEventInput>;

/** The pack-health thresholds as a person may set them; each within a range that keeps the rule meaningful. */
export const packHealthPatch = record({
  resistanceGrowthShare: v.optional(number({ above: 0, max: 5 })),
  capacityShareOfRated: v.optional(number({ above: 0, max: 1 })),
  storageDays: v.optional(number({ min: 1, max: 365, integer: true })),
});
