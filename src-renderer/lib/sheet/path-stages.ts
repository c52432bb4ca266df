// Which stage of the power path each figure and each check belongs to. Kept in one small table
// keyed by figure key and rule id, so the sheet's grouping can follow a catalogue field later
// without touching the components.

export const STAGES = ['supply', 'controller', 'motor', 'drive', 'output'] as const;
export type Stage = (typeof STAGES)[number];

/** Figure key → stage. A figure not listed here falls under the supply (see stageOfFigure). */
export const FIGURE_STAGE: Readonly<Record<string, Stage>> = {
  packVoltageNominalV: 'supply',
  packVoltageFullV: 'supply',
  packVoltageCutoffV: 'supply',
  capacityMah: 'supply',
  packResistanceOhm: 'supply',
  loadedVoltageV: 'supply',
  peakPowerW: 'supply',
  peakPowerNoSagW: 'supply',
  // The supply current is what the controller passes on; it is judged there and at the packs.
  peakCurrentA: 'controller',
  continuousCurrentA: 'controller',
  runRmsCurrentA: 'controller',
  runAverageCurrentA: 'controller',
  steadyCurrentA: 'controller',
  noLoadRpm: 'motor',
  noLoadRpmFull: 'motor',
  loadedRpm: 'motor',
  loadedRpmFull: 'motor',
  torqueConstantNmPerA: 'motor',
  motorPeakCurrentA: 'motor',
  motorContinuousCurrentA: 'motor',
  motorPeakPowerW: 'motor',
  finalDriveRatio: 'drive',
  rolloutMm: 'drive',
  propellerRpmStatic: 'drive',
  propellerRpmUnloaded: 'drive',
  tipSpeedStaticMps: 'drive',
  tipSpeedMps: 'drive',
  tipSpeedLimitMps: 'drive',
  fluidDensityKgM3: 'drive',
  theoreticalSpeedKmh: 'output',
  loadedTopSpeedKmh: 'output',
  runLengthS: 'output',
  drivenWeightShare: 'output',
  pitchSpeedKmh: 'output',
  thrustN: 'output',
};

/** Rule id → stage, for the built-in rules and the pack checks. */
export const RULE_STAGE: Readonly<Record<string, Stage>> = {
  'battery-continuous': 'supply',
  'battery-burst': 'supply',
  'supply-match': 'supply',
  'pack-retired': 'supply',
  'pack-repeated': 'supply',
  'controller-voltage': 'controller',
  'controller-continuous': 'controller',
  'controller-burst': 'controller',
  'motor-voltage': 'motor',
  'motor-speed': 'motor',
  'motor-current': 'motor',
  'motor-power': 'motor',
  'prop-tip-speed': 'drive',
};

const UNIT_STAGE: Readonly<Record<string, Stage>> = {
  V: 'supply',
  A: 'controller',
  W: 'motor',
  rpm: 'motor',
  'm/s': 'drive',
  'km/h': 'output',
  N: 'output',
};

export function stageOfFigure(key: string): Stage {
  return FIGURE_STAGE[key] ?? 'supply';
}

/** A class rule has no fixed stage: it is placed by the unit of what it limits. */
export function stageOfRule(rule: string, unit: string): Stage {
  return RULE_STAGE[rule] ?? UNIT_STAGE[unit] ?? 'supply';
}
