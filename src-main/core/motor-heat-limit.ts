// The heat a motor may shed continuously: the maker's rating where one is entered, else a rule
// of thumb per gram of motor mass. A verdict against the rule of thumb reads no better than
// tight (see typical-marks.ts): only the maker's rating can clear it.

/**
 * Continuous heat loss a motor sheds per gram of its own mass, in W/g (common practice, from
 * memory). Set on the low side on purpose: what a motor sheds depends on its surface and its
 * cooling air, and this assumes little of either (a car motor under its body, a propeller motor
 * held static), so most motors shed more than it says and the check warns early rather than late.
 */
export const LOSS_W_PER_GRAM = 0.15;

/** The field a rule-of-thumb heat limit stands in for: a finding marks it in `typical`, the supply lists it among its values used. */
export const HEAT_LIMIT_FIELD = 'motor.maxLossW';

/** Whether a finding was judged against the rule of thumb (typical-marks.ts marks it with the field it stands in for). */
export function judgedByRuleOfThumb(finding: { readonly typical?: readonly string[] }): boolean {
  return finding.typical?.includes(HEAT_LIMIT_FIELD) ?? false;
}

export interface MotorHeatLimit {
  /** The most heat loss per motor, W. */
  lossW: number;
  /** True where the limit comes from the motor's mass rather than the maker's rating. */
  ruleOfThumb: boolean;
}

/** The maker's rated heat loss where entered (it always wins), else the rule of thumb on the motor's mass; null with neither. */
export function motorHeatLimit(maxLossW: number | null | undefined, massKg: number | null | undefined): MotorHeatLimit | null {
  if (typeof maxLossW === 'number' && maxLossW > 0) return { lossW: maxLossW, ruleOfThumb: false };
  if (typeof massKg === 'number' && massKg > 0 && Number.isFinite(massKg)) return { lossW: massKg * 1000 * LOSS_W_PER_GRAM, ruleOfThumb: true };
  return null;
}
