import { motorCurve, type MotorCurve } from '$core/motor-curve';
import type { Controller, Figures, Motor } from '$core/domain';

export interface OperatingMark {
  label: string;
  rpm: number;
  currentA: number;
}

export interface MotorChartData {
  voltageV: number;
  curve: MotorCurve;
  marks: OperatingMark[];
}

/** Linear interpolation of the rpm where the curve's current falls to a value (current drops as speed rises). */
export function rpmAtCurrent(curve: MotorCurve, currentA: number): number | null {
  const { rpm, currentA: amps } = curve;
  for (let k = 1; k < rpm.length; k++) {
    const a0 = amps[k - 1]!;
    const a1 = amps[k]!;
    if ((a0 - currentA) * (a1 - currentA) <= 0 && a0 !== a1) {
      const t = (a0 - currentA) / (a0 - a1);
      return rpm[k - 1]! + t * (rpm[k]! - rpm[k - 1]!);
    }
  }
  return null;
}

/**
 * One motor's curves at the supply's full-charge voltage (where the checks take currents), with
 * the loop resistance the model uses: winding, controller and this motor's share of the pack.
 * Null where the motor lacks Kv, resistance or no-load current.
 */
export function motorChartData(motor: Motor | null, controller: Controller | null, figures: Figures, motorCount: number, ground = true): MotorChartData | null {
  const voltageV = figures.packVoltageFullV;
  if (!motor || motor.resistanceOhm === null || motor.noLoadCurrentA === null || voltageV === null) return null;
  const packR = typeof figures.packResistanceOhm === 'number' ? figures.packResistanceOhm : 0;
  const curve = motorCurve({
    kv: motor.kv,
    resistanceOhm: motor.resistanceOhm,
    noLoadCurrentA: motor.noLoadCurrentA,
    voltageV,
    extraResistanceOhm: (controller?.resistanceOhm ?? 0) + Math.max(1, motorCount) * packR,
    points: 60,
  });
  if (curve.rpm.length === 0) return null;
  const marks: OperatingMark[] = [];
  // The chart is drawn at full charge, so its marks sit at the full-charge operating point.
  const loadedRpm = figures.loadedRpmFull ?? figures.loadedRpm;
  const contA = figures.motorContinuousCurrentA;
  const peakA = figures.motorPeakCurrentA;
  if (typeof peakA === 'number') {
    const at = rpmAtCurrent(curve, peakA);
    if (at !== null) marks.push({ label: 'Peak', rpm: at, currentA: peakA });
  }
  if (typeof loadedRpm === 'number' && typeof contA === 'number' && !(typeof peakA === 'number' && Math.abs(peakA - contA) < 1e-9)) {
    marks.push({ label: 'Loaded top speed', rpm: loadedRpm, currentA: contA });
  } else if (typeof loadedRpm === 'number' && typeof contA === 'number') {
    // One point is both: a propeller's static point, or a car whose top-speed draw exceeds its launch draw.
    marks.length = 0;
    marks.push({ label: ground ? 'Peak, at loaded top speed' : 'Full throttle, static (peak and continuous)', rpm: loadedRpm, currentA: contA });
  }
  return { voltageV, curve, marks };
}
