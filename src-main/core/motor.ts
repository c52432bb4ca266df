// First-order DC motor model (M. Drela, "First-Order DC Electric Motor Model", MIT Aero &
// Astro, 2007): a back-EMF source ω/Kv behind a resistance R, with a no-load current I0 that
// stands for friction and iron losses. Series resistance of the pack and the controller is
// simply added to R; the voltage is then the supply's open voltage.
//
// The hot path writes into a caller-owned OperatingPoint so that solvers and chart loops do
// not allocate.

import { RAD_PER_S_PER_RPM } from './units';

/** Torque constant Kt = 60 / (2π·Kv) in N·m/A, Kv in rpm/V (the trade's convention). */
export function torqueConstant(kvRpmPerV: number): number {
  return 60 / (2 * Math.PI * kvRpmPerV);
}

/** Kv in rad/s per volt, as the model uses it. */
export function kvRadPerSecondPerVolt(kvRpmPerV: number): number {
  return kvRpmPerV * RAD_PER_S_PER_RPM;
}

/** The model's parameters in SI. */
export interface MotorParams {
  /** Kv in rad/s per volt. */
  kvRad: number;
  /** Total series resistance: winding plus whatever else is in the loop. */
  resistanceOhm: number;
  noLoadCurrentA: number;
}

export function motorParams(kvRpmPerV: number, resistanceOhm: number, noLoadCurrentA: number): MotorParams {
  return { kvRad: kvRadPerSecondPerVolt(kvRpmPerV), resistanceOhm, noLoadCurrentA };
}

export interface OperatingPoint {
  omegaRadS: number;
  rpm: number;
  currentA: number;
  torqueNm: number;
  shaftPowerW: number;
  /** Power taken from the source voltage: V·I. */
  inputPowerW: number;
  /** Shaft ÷ input, 0 where the motor delivers no shaft power. */
  efficiency: number;
}

export function emptyOperatingPoint(): OperatingPoint {
  return { omegaRadS: 0, rpm: 0, currentA: 0, torqueNm: 0, shaftPowerW: 0, inputPowerW: 0, efficiency: 0 };
}

/** I = (V − ω/Kv)/R. */
export function currentAt(m: MotorParams, voltageV: number, omegaRadS: number): number {
  return (voltageV - omegaRadS / m.kvRad) / m.resistanceOhm;
}

/** Q = (I − I0)/Kv. */
export function torqueAt(m: MotorParams, voltageV: number, omegaRadS: number): number {
  return (currentAt(m, voltageV, omegaRadS) - m.noLoadCurrentA) / m.kvRad;
}

/** Speed at which the motor delivers no torque: ω = Kv·(V − I0·R). */
export function noLoadOmega(m: MotorParams, voltageV: number): number {
  return m.kvRad * (voltageV - m.noLoadCurrentA * m.resistanceOhm);
}

export function stallCurrent(m: MotorParams, voltageV: number): number {
  return voltageV / m.resistanceOhm;
}

/** Current at which η peaks: dη/dI = 0 gives I = √(V·I0/R). */
export function peakEfficiencyCurrent(m: MotorParams, voltageV: number): number {
  return Math.sqrt((voltageV * m.noLoadCurrentA) / m.resistanceOhm);
}

/** The operating point at a given speed and source voltage, written into `out`. */
export function operatingPointAt(m: MotorParams, voltageV: number, omegaRadS: number, out: OperatingPoint): OperatingPoint {
  const i = (voltageV - omegaRadS / m.kvRad) / m.resistanceOhm;
  const shaft = (voltageV - i * m.resistanceOhm) * (i - m.noLoadCurrentA);
  const input = voltageV * i;
  out.omegaRadS = omegaRadS;
  out.rpm = omegaRadS / RAD_PER_S_PER_RPM;
  out.currentA = i;
  out.torqueNm = (i - m.noLoadCurrentA) / m.kvRad;
  out.shaftPowerW = shaft;
  out.inputPowerW = input;
  // η = (1 − IR/V)(1 − I0/I) is shaft ÷ input; outside the motoring range it means nothing.
  out.efficiency = shaft > 0 && input > 0 ? shaft / input : 0;
  return out;
}
