import type { Chemistry } from './domain';

export interface CellVoltages {
  readonly nominalV: number;
  readonly fullV: number;
  readonly cutoffV: number;
}

/**
 * Per-cell voltages by chemistry. LiPo, LiFePO4 and Li-ion NMC follow cell makers'
 * specification sheets (LiFePO4 nominal is printed as 3.2 or 3.3 V; the lower figure is
 * taken). LiHV and NiMH follow common practice; NiMH "full" is the usual resting peak after
 * charge, not the voltage under charge.
 */
export const CELL_VOLTAGES: Readonly<Record<Chemistry, CellVoltages>> = {
  lipo: { nominalV: 3.7, fullV: 4.2, cutoffV: 3.0 },
  lihv: { nominalV: 3.8, fullV: 4.35, cutoffV: 3.0 },
  lifepo4: { nominalV: 3.2, fullV: 3.65, cutoffV: 2.5 },
  liion: { nominalV: 3.6, fullV: 4.2, cutoffV: 2.5 },
  nimh: { nominalV: 1.2, fullV: 1.45, cutoffV: 1.0 },
};

export function cellVoltages(chemistry: Chemistry): CellVoltages | null {
  // Records from files may carry a chemistry this version does not know.
  return Object.hasOwn(CELL_VOLTAGES, chemistry) ? CELL_VOLTAGES[chemistry] : null;
}

/**
 * Volts rounded to the millivolt. Cell voltages are whole millivolts, so a pack's or a
 * supply's voltage is too; in binary floating point 3 × 4.2 is 12.600000000000001, which would
 * read as past a 12.6 V rating by noise alone. Rounding here gives the nearest double to the
 * decimal figure the user reads.
 */
export function millivoltExact(volts: number): number {
  // Past about 1.8e305 V the product overflows to Infinity; a figure that large has no
  // millivolt noise worth removing, so it is kept as it is rather than turned infinite.
  const millivolts = volts * 1000;
  return Number.isFinite(millivolts) ? Math.round(millivolts) / 1000 : volts;
}

/** Lithium chemistries can burn when abused; messages say so only for these. */
export function isLithium(chemistry: Chemistry): boolean {
  return chemistry !== 'nimh';
}
