// The per-build inputs of the evaluation, checked once and shared by every supply. A missing
// part makes each of its fields lack the build's reference to it (e.g. `build.motorId`), so a
// finding says to pick the part rather than to fill in one of its fields.

import { CONTROLLER_VOLTS_PER_RATED_CELL } from './constants';
import { VEHICLE_KINDS, type BuildContext, type VehicleKind } from './domain';
import { finalDriveRatio } from './drivetrain';
import { count, known, lacking, nonNegative, positive, type Known } from './known';

export interface BuildInputs {
  kind: Known<VehicleKind>;
  motorCount: Known;
  kv: Known;
  motorResistanceOhm: Known;
  noLoadCurrentA: Known;
  motorMaxVoltageV: Known;
  motorMaxRpm: Known;
  motorMaxCurrentA: Known;
  motorMaxPowerW: Known;
  /** Unknown controller resistance counts as zero (currents on the high side). */
  controllerResistanceOhm: number;
  controllerResistanceAssumed: boolean;
  controllerMaxVoltageV: Known;
  controllerContinuousA: Known;
  controllerBurstA: Known;
  finalDrive: Known;
  tireDiameterMm: Known;
  drivetrainEfficiency: Known;
  massKg: Known;
  dragAreaM2: Known;
  rollingCoefficient: Known;
  tractionCoefficient: Known;
  hasPropeller: boolean;
  propDiameterM: Known;
  powerCoefficient: Known;
  thrustCoefficient: Known;
  /** Null where nothing was measured. */
  measuredPeakA: Known | null;
  measuredAverageA: Known | null;
}

function measured(x: number | null | undefined, field: string): Known | null {
  return x === null || x === undefined ? null : positive(x, field);
}

export function buildInputs(ctx: BuildContext): BuildInputs {
  const { build, motor, controller, vehicle, propeller } = ctx;
  const gearing = build.gearing;
  const noMotor = lacking('build.motorId');
  const noController = lacking('build.controllerId');
  const noVehicle = lacking('build.vehicleId');
  const noProp = lacking('build.propellerId');

  let controllerMaxVoltageV: Known = noController;
  if (controller) {
    const volts = positive(controller.maxVoltageV, 'controller.maxVoltageV');
    const cells = count(controller.maxCells, 'controller.maxVoltageV');
    controllerMaxVoltageV =
      volts.value !== null ? volts : cells.value !== null ? known(cells.value * CONTROLLER_VOLTS_PER_RATED_CELL) : volts;
  }

  const pinion = positive(gearing?.pinionTeeth, 'gearing.pinionTeeth');
  const spur = positive(gearing?.spurTeeth, 'gearing.spurTeeth');
  const internal = positive(gearing?.internalRatio, 'gearing.internalRatio');
  const finalDrive =
    pinion.value !== null && spur.value !== null && internal.value !== null
      ? known(finalDriveRatio(spur.value, pinion.value, internal.value))
      : lacking(...[pinion, spur, internal].flatMap((k) => k.missing ?? []));
  const eff = gearing?.drivetrainEfficiency;
  const drivetrainEfficiency =
    typeof eff === 'number' && eff > 0 && eff <= 1 ? known(eff) : lacking('gearing.drivetrainEfficiency');

  const controllerR = controller ? nonNegative(controller.resistanceOhm, 'controller.resistanceOhm') : known(0);
  const diameterMm = propeller ? positive(propeller.diameterMm, 'propeller.diameterMm') : noProp;

  return {
    kind: vehicle
      ? (VEHICLE_KINDS as readonly string[]).includes(vehicle.kind)
        ? known(vehicle.kind)
        : lacking<VehicleKind>('vehicle.kind')
      : lacking<VehicleKind>('build.vehicleId'),
    motorCount: count(build.motorCount, 'build.motorCount'),
    kv: motor ? positive(motor.kv, 'motor.kv') : noMotor,
    motorResistanceOhm: motor ? positive(motor.resistanceOhm, 'motor.resistanceOhm') : noMotor,
    noLoadCurrentA: motor ? nonNegative(motor.noLoadCurrentA, 'motor.noLoadCurrentA') : noMotor,
    motorMaxVoltageV: motor ? positive(motor.maxVoltageV, 'motor.maxVoltageV') : noMotor,
    motorMaxRpm: motor ? positive(motor.maxRpm, 'motor.maxRpm') : noMotor,
    motorMaxCurrentA: motor ? positive(motor.maxCurrentA, 'motor.maxCurrentA') : noMotor,
    motorMaxPowerW: motor ? positive(motor.maxPowerW, 'motor.maxPowerW') : noMotor,
    controllerResistanceOhm: controllerR.value ?? 0,
    controllerResistanceAssumed: controllerR.value === null,
    controllerMaxVoltageV,
    controllerContinuousA: controller ? positive(controller.continuousCurrentA, 'controller.continuousCurrentA') : noController,
    controllerBurstA: controller ? positive(controller.burstCurrentA, 'controller.burstCurrentA') : noController,
    finalDrive,
    tireDiameterMm: positive(gearing?.tireDiameterMm, 'gearing.tireDiameterMm'),
    drivetrainEfficiency,
    massKg: vehicle ? positive(vehicle.massKg, 'vehicle.massKg') : noVehicle,
    dragAreaM2: vehicle ? nonNegative(vehicle.dragAreaM2, 'vehicle.dragAreaM2') : noVehicle,
    rollingCoefficient: vehicle ? nonNegative(vehicle.rollingCoefficient, 'vehicle.rollingCoefficient') : noVehicle,
    tractionCoefficient: vehicle ? positive(vehicle.tractionCoefficient, 'vehicle.tractionCoefficient') : noVehicle,
    hasPropeller: propeller !== null,
    propDiameterM: diameterMm.value === null ? diameterMm : known(diameterMm.value / 1000),
    powerCoefficient: propeller ? positive(propeller.powerCoefficient, 'propeller.powerCoefficient') : noProp,
    thrustCoefficient: propeller ? positive(propeller.thrustCoefficient, 'propeller.thrustCoefficient') : noProp,
    measuredPeakA: measured(build.measuredPeakCurrentA, 'build.measuredPeakCurrentA'),
    measuredAverageA: measured(build.measuredAverageCurrentA, 'build.measuredAverageCurrentA'),
  };
}
