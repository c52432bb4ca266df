// Bounds past anything a hobby part has. One table, used by the engine (an implausible
// stored value counts as missing) and by the service's schemas (it is refused at the edge),
// so the command line, imports and forms agree. The bounds catch typing slips and unit mix-ups
// (ohm typed for milliohm, a percentage for a fraction); they are not engineering limits.

export interface PlausibleRange {
  /** The field's label, in the user's words. */
  readonly label: string;
  readonly unit: string;
  /** Lowest plausible value; `above` makes it exclusive. */
  readonly min?: number;
  readonly above?: number;
  readonly max: number;
  /** Why, said after the range. */
  readonly why: string;
}

export const PLAUSIBLE = {
  'motor.kv': { label: 'Kv', unit: 'rpm/V', min: 10, max: 100_000, why: 'hobby motors lie in this range' },
  'motor.resistanceOhm': { label: 'Winding resistance', unit: 'Ω', above: 0, max: 10, why: 'hobby motors measure well under 10 Ω; milliohms must be entered as ohms (0.012, not 12)' },
  'battery.cellResistanceOhm': { label: 'Cell resistance', unit: 'Ω', above: 0, max: 1, why: 'a measured cell is never exactly 0 Ω; leave it empty where it was never measured (milliohms as ohms: 0.003, not 3)' },
  'gearing.drivetrainEfficiency': { label: 'Drivetrain efficiency', unit: '', min: 0.3, max: 1, why: 'a fraction: 0.9 for 90 %; below 0.3 is no working drivetrain' },
  'vehicle.drivenWeightShare': { label: 'Weight on driven wheels', unit: '', above: 0, max: 1, why: 'a fraction of the vehicle weight: 1 for 4WD, about 0.6 to 0.7 for 2WD' },
  'propeller.maxRpm': { label: 'Propeller rpm limit', unit: 'rpm', min: 1000, max: 500_000, why: 'the maker\u2019s limit for this diameter' },
  'build.runLengthS': { label: 'Run length', unit: 's', min: 0.5, max: 600, why: 'seconds of full throttle from standstill' },
} as const satisfies Record<string, PlausibleRange>;

export type PlausibleField = keyof typeof PLAUSIBLE;

/** True where the value lies inside the field's plausible range. */
export function isPlausible(field: PlausibleField, x: number): boolean {
  const r: PlausibleRange = PLAUSIBLE[field];
  if (!Number.isFinite(x) || x > r.max) return false;
  if (r.above !== undefined && !(x > r.above)) return false;
  if (r.min !== undefined && x < r.min) return false;
  return true;
}

/** "Kv must be from 10 to 100000 rpm/V (hobby motors lie in this range)". */
export function plausibleMessage(field: PlausibleField): string {
  const r: PlausibleRange = PLAUSIBLE[field];
  const unit = r.unit ? ` ${r.unit}` : '';
  const range = r.above !== undefined ? `above ${r.above}${unit} and at most ${r.max}${unit}` : `from ${r.min ?? 0} to ${r.max}${unit}`;
  return `${r.label} must be ${range} (${r.why})`;
}
