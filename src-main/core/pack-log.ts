// A pack's log: what was done to it and measured on it, entry by entry. From the log come the
// cycle count, the newest resistance measurement (which the model's sag uses) and the pack's
// health problems. Pure: the service reads the entries and hands them in with today's date.

import { cellVoltages, isLithium } from './chemistry';
import type { Battery, Chemistry } from './domain';

export const PACK_EVENT_KINDS = ['charge', 'discharge', 'storage', 'resistance', 'inspection'] as const;
export type PackEventKind = (typeof PACK_EVENT_KINDS)[number];

/** Plain words for each kind of entry, as the pack's page shows them. */
export const PACK_EVENT_LABELS: Readonly<Record<PackEventKind, string>> = {
  charge: 'Charge',
  discharge: 'Run or discharge',
  storage: 'Storage',
  resistance: 'Resistance measured',
  inspection: 'Inspection',
};

export interface PackEvent {
  id: string;
  batteryId: string;
  /** The day (YYYY-MM-DD) or moment (ISO time) the entry is about, as typed. */
  at: string;
  kind: PackEventKind;
  /** Charge: mAh put in. Discharge: mAh used. */
  mah: number | null;
  /** Charge: end voltage per cell. Discharge: resting voltage per cell after. Storage: voltage per cell. */
  voltagePerCellV: number | null;
  /** Resistance: one reading per series cell lead, in ohms, as a charger or meter shows them. */
  cellResistancesOhm: number[] | null;
  /** Resistance: the pack temperature at the measurement. */
  temperatureC: number | null;
  /** Discharge: from full charge down to cut-off, so `mah` is a measure of the capacity. */
  capacityCheck: boolean;
  /** Inspection: swollen. */
  puffed: boolean;
  /** Inspection: damaged wrap, leads, plugs or cells. */
  damaged: boolean;
  note: string;
}

/** Oldest first; entries on the same day keep the order they were added in (by id). */
export function sortEvents(events: readonly PackEvent[]): PackEvent[] {
  return [...events].sort((a, b) => (a.at < b.at ? -1 : a.at > b.at ? 1 : a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
}

/**
 * Cycles: the hand-set starting count (for a pack with a past before its log) plus one per
 * logged charge. A charge is what the trade counts as a cycle (common practice).
 */
export function cycleCount(startingCount: number, events: readonly PackEvent[]): number {
  let n = 0;
  for (const e of events) if (e.kind === 'charge') n++;
  return startingCount + n;
}

/** The sum of one measurement's per-lead readings: the series resistance of the pack, one parallel group after another. */
function readingsSum(readings: readonly number[]): number {
  let sum = 0;
  for (const r of readings) sum += r;
  return sum;
}

function usableReadings(e: PackEvent): e is PackEvent & { cellResistancesOhm: number[] } {
  return e.kind === 'resistance' && e.cellResistancesOhm !== null && e.cellResistancesOhm.length > 0 && e.cellResistancesOhm.every((r) => Number.isFinite(r) && r > 0);
}

/** The resistance measurements, oldest first. */
export function resistanceMeasurements(events: readonly PackEvent[]): (PackEvent & { cellResistancesOhm: number[] })[] {
  return sortEvents(events).filter(usableReadings);
}

/**
 * The pack's resistance from one measurement: each reading is one series position (a parallel
 * group, where the pack has parallel cells), so the pack's resistance is their sum.
 */
export function packOhmOf(readings: readonly number[]): number {
  return readingsSum(readings);
}

/**
 * The per-cell figure the pack record carries (pack = cells in series × cell ÷ cells in
 * parallel), that gives the measured pack resistance: sum × parallel ÷ series.
 */
export function cellOhmEquivalent(readings: readonly number[], cellsSeries: number, cellsParallel: number): number {
  return (packOhmOf(readings) * cellsParallel) / cellsSeries;
}

/**
 * The pack as the evaluation sees it: the newest logged resistance measurement, where there is
 * one, takes the place of the typed cell resistance, so every build using the pack sags by
 * what was last measured. The stored record keeps what the user typed.
 */
export function withLoggedResistance(battery: Battery, events: readonly PackEvent[]): Battery {
  const newest = resistanceMeasurements(events).at(-1);
  if (!newest || !(battery.cellsSeries >= 1) || !(battery.cellsParallel >= 1)) return battery;
  return { ...battery, cellResistanceOhm: cellOhmEquivalent(newest.cellResistancesOhm, battery.cellsSeries, battery.cellsParallel) };
}

export interface PackHealthThresholds {
  /** Resistance grown by more than this share over the pack's first measurement (0.5: half as much again). */
  resistanceGrowthShare: number;
  /** A capacity check under this share of the rated capacity. */
  capacityShareOfRated: number;
  /** A lithium pack left above storage voltage longer than this many days. */
  storageDays: number;
}

/**
 * Defaults, all common practice (no standard sets them for hobby packs; from memory): a pack
 * whose resistance has grown by half over its first reading sags and heats noticeably more;
 * 80 % of rated capacity is the end of life cell makers' cycle-life figures are usually quoted
 * to; a lithium pack left charged for more than about a week ages faster than one at storage
 * voltage.
 */
export const DEFAULT_PACK_HEALTH: PackHealthThresholds = { resistanceGrowthShare: 0.5, capacityShareOfRated: 0.8, storageDays: 7 };

export const PACK_HEALTH_BASIS: Readonly<Record<keyof PackHealthThresholds, string>> = {
  resistanceGrowthShare: 'Common practice: a pack whose internal resistance has grown by about half over its first measurement sags and heats noticeably more and is near the end of its racing life.',
  capacityShareOfRated: 'Common practice: cell makers usually quote cycle life to 80 % of rated capacity; below that a pack is considered worn.',
  storageDays: 'Common practice: a lithium pack left at full charge for more than a few days to a week ages faster; store it at storage voltage.',
};

/**
 * Storage voltage per cell, lithium chemistries only (common practice, from memory: LiPo and
 * LiHV 3.8–3.85 V, Li-ion about 3.7 V, LiFePO4 about 3.3 V). A pack is "above storage" when it
 * sits more than STORAGE_TOLERANCE_V over this.
 */
export const STORAGE_VOLTAGE_PER_CELL: Readonly<Record<Chemistry, number | null>> = { lipo: 3.85, lihv: 3.85, liion: 3.7, lifepo4: 3.3, nimh: null };
export const STORAGE_TOLERANCE_V = 0.05;

export type HealthProblemKind = 'resistance' | 'capacity' | 'inspection' | 'storage';

export interface HealthProblem {
  kind: HealthProblemKind;
  /** Worn or damaged packs are over; a pack left charged is tight (a caution, not a failed rating). */
  status: 'over' | 'tight';
  /** What was found, as a clause: "resistance up 62 % over its first measurement (…)". */
  text: string;
  /** The entry the problem was read from. */
  eventId: string;
}

const DAY_MS = 86_400_000;

function dayCount(from: string, to: string): number | null {
  const a = Date.parse(from);
  const b = Date.parse(to);
  return Number.isFinite(a) && Number.isFinite(b) ? (b - a) / DAY_MS : null;
}

const pct = (x: number): string => `${Math.round(x * 100)} %`;
const mOhm = (ohm: number): string => `${Math.round(ohm * 10000) / 10} mΩ`;

/** The voltage per cell the pack was left at by an entry; a charge without a figure is taken as full (the warning side). */
function leftAt(e: PackEvent, chemistry: Chemistry): number | null {
  if (e.voltagePerCellV !== null) return e.voltagePerCellV;
  if (e.kind === 'charge') return cellVoltages(chemistry)?.fullV ?? null;
  return null;
}

/** The pack's health problems as of `asOf` (an ISO time), by the thresholds; none for a clean log. */
export function packHealthProblems(battery: Battery, events: readonly PackEvent[], thresholds: PackHealthThresholds, asOf: string): HealthProblem[] {
  const sorted = sortEvents(events);
  const problems: HealthProblem[] = [];

  const bad = sorted.filter((e) => e.kind === 'inspection' && (e.puffed || e.damaged));
  const lastBad = bad.at(-1);
  if (lastBad) {
    const what = lastBad.puffed && lastBad.damaged ? 'found puffed and damaged' : lastBad.puffed ? 'found puffed' : 'found damaged';
    problems.push({ kind: 'inspection', status: 'over', text: `${what} at the inspection of ${lastBad.at}`, eventId: lastBad.id });
  }

  const measured = sorted.filter(usableReadings);
  const first = measured[0];
  const newest = measured.at(-1);
  if (first && newest && first !== newest) {
    // Compared per reading, so a measurement that skipped a lead still compares like with like.
    const firstMean = readingsSum(first.cellResistancesOhm) / first.cellResistancesOhm.length;
    const newestMean = readingsSum(newest.cellResistancesOhm) / newest.cellResistancesOhm.length;
    const growth = (newestMean - firstMean) / firstMean;
    if (growth > thresholds.resistanceGrowthShare) {
      problems.push({
        kind: 'resistance',
        status: 'over',
        text: `resistance up ${pct(growth)} over its first measurement (${mOhm(firstMean)} a cell on ${first.at}, ${mOhm(newestMean)} on ${newest.at}; more than ${pct(thresholds.resistanceGrowthShare)})`,
        eventId: newest.id,
      });
    }
  }

  const check = sorted.filter((e) => e.kind === 'discharge' && e.capacityCheck && e.mah !== null && e.mah > 0).at(-1);
  if (check && check.mah !== null && battery.capacityMah > 0) {
    const share = check.mah / battery.capacityMah;
    if (share < thresholds.capacityShareOfRated) {
      problems.push({
        kind: 'capacity',
        status: 'over',
        text: `capacity check of ${check.at} gave ${Math.round(check.mah)} mAh, ${pct(share)} of the rated ${Math.round(battery.capacityMah)} mAh (under ${pct(thresholds.capacityShareOfRated)})`,
        eventId: check.id,
      });
    }
  }

  const storage = STORAGE_VOLTAGE_PER_CELL[battery.chemistry] ?? null;
  if (storage !== null && isLithium(battery.chemistry)) {
    const state = sorted.filter((e) => e.kind === 'charge' || e.kind === 'discharge' || e.kind === 'storage').at(-1);
    const volts = state ? leftAt(state, battery.chemistry) : null;
    const days = state ? dayCount(state.at, asOf) : null;
    if (state && volts !== null && days !== null && volts > storage + STORAGE_TOLERANCE_V && days > thresholds.storageDays) {
      problems.push({
        kind: 'storage',
        status: 'tight',
        text: `left at ${volts.toFixed(2)} V a cell since ${state.at} (${Math.floor(days)} days; storage is about ${storage.toFixed(2)} V a cell, limit ${thresholds.storageDays} days)`,
        eventId: state.id,
      });
    }
  }
  return problems;
}
