// Continuous current a copper wire of a gauge carries in chassis wiring (single wire in free
// air), the "chassis wiring" column of the American Wire Gauge ampacity table reproduced in
// the Handbook of Electronic Tables and Formulas for American Wire Gauge (Howard W. Sams) and
// many wire tables since (from memory). The column is conservative for the high-temperature
// silicone leads of hobby packs, whose makers rate them higher: the check errs toward warning,
// and the wire maker's own rating is the one to follow.

/** AWG → amperes, chassis wiring. */
export const CHASSIS_AMPACITY_A: Readonly<Record<number, number>> = {
  4: 135,
  5: 118,
  6: 101,
  7: 89,
  8: 73,
  9: 64,
  10: 55,
  11: 47,
  12: 41,
  13: 35,
  14: 32,
  15: 28,
  16: 22,
  17: 19,
  18: 16,
  19: 14,
  20: 11,
  21: 9,
  22: 7,
  23: 4.7,
  24: 3.5,
  25: 2.7,
  26: 2.2,
  27: 1.7,
  28: 1.4,
  29: 1.2,
  30: 0.86,
};

/** The chassis-wiring ampacity of a gauge, A; null for a gauge outside the table. */
export function chassisAmpacity(awg: number): number | null {
  return CHASSIS_AMPACITY_A[awg] ?? null;
}
