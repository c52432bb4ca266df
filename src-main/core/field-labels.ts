// Plain words for the inputs a finding can lack, so an incomplete verdict tells a technician
// what to fill in. Messages carry the words only; the field paths stay in a finding's
// `missing` list, which the screens turn into links to the field itself.

const LABELS: Readonly<Record<string, string>> = {
  'build.vehicleId': 'a vehicle for the build',
  'build.motorId': 'a motor for the build',
  'build.controllerId': 'a speed controller for the build',
  'build.propellerId': 'a propeller for the build',
  'build.motorCount': 'the number of motors',
  'build.supplies': 'at least one supply (a set of packs)',
  'build.measuredPeakCurrentA': 'a usable measured peak current',
  'build.measuredAverageCurrentA': 'a usable measured average current',
  'supply.batteryIds': 'packs that exist in the records',
  'battery.chemistry': 'the pack chemistry',
  'battery.cellsSeries': 'the cell count in series (S)',
  'battery.cellsParallel': 'the cell count in parallel (P)',
  'battery.capacityMah': 'the pack capacity',
  'battery.cRatingContinuous': 'the continuous C rating of the pack',
  'battery.cRatingBurst': 'the burst C rating of the pack',
  'battery.cellResistanceOhm': 'the measured cell resistance',
  'motor.kv': 'the motor Kv',
  'motor.resistanceOhm': 'the motor winding resistance',
  'motor.noLoadCurrentA': 'the motor no-load current',
  'motor.maxCurrentA': 'the motor rated current',
  'motor.maxPowerW': 'the motor rated power',
  'motor.maxVoltageV': 'the motor rated voltage',
  'motor.maxRpm': 'the motor rated rpm',
  'controller.maxVoltageV': 'the controller maximum voltage (or maximum cell count)',
  'controller.continuousCurrentA': 'the controller continuous current rating',
  'controller.burstCurrentA': 'the controller burst current rating',
  'controller.resistanceOhm': 'the controller resistance',
  'vehicle.kind': 'the vehicle kind',
  'vehicle.massKg': 'the vehicle mass',
  'vehicle.dragAreaM2': 'the drag area (Cd·A)',
  'vehicle.rollingCoefficient': 'the rolling coefficient',
  'vehicle.tractionCoefficient': 'the traction coefficient',
  'gearing.pinionTeeth': 'the pinion tooth count',
  'gearing.spurTeeth': 'the spur tooth count',
  'gearing.internalRatio': 'the internal (gearbox) ratio',
  'gearing.tireDiameterMm': 'the tyre diameter',
  'gearing.drivetrainEfficiency': 'the drivetrain efficiency (above 0, at most 1)',
  'propeller.diameterMm': 'the propeller diameter',
  'propeller.pitchMm': 'the propeller pitch',
  'propeller.powerCoefficient': 'the propeller power coefficient (C_P)',
  'propeller.thrustCoefficient': 'the propeller thrust coefficient (C_T)',
  'classRule.limit': 'a class limit above zero',
  'classRule.figure': 'a figure Rigbook computes',
  'figure.notApplicable': 'a figure this kind of vehicle has',
};

export function fieldLabel(field: string): string {
  return LABELS[field] ?? field;
}

/** "the motor Kv and the pack capacity"; a path without words is named as "an input Rigbook needs". */
export function describeMissing(fields: readonly string[]): string {
  const parts = [...new Set(fields.map((f) => LABELS[f] ?? 'an input Rigbook needs'))];
  if (parts.length <= 1) return parts[0] ?? 'inputs that are out of range';
  return `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}
