// The per-build inputs of the evaluation, checked once and shared by every supply. A missing
// part makes each of its fields lack the build's reference to it (e.g. `build.motorId`), so a
// finding says to pick the part rather than to fill in one of its fields.

import { fieldAir, type FieldAir } from './atmosphere';
import { millivoltExact } from './chemistry';
import { AIR_DENSITY, CONTROLLER_VOLTS_PER_RATED_CELL, DEFAULT_2WD_DRIVEN_SHARE, DEFAULT_RUN_LENGTH_S, FRESH_WATER_DENSITY, SEA_WATER_DENSITY } from './constants';
import { SURFACES, VEHICLE_KINDS, type BuildContext, type PropellerEstimateMethod, type Surface, type VehicleKind } from './domain';
import { finalDriveRatio } from './drivetrain';
import { count, known, lacking, nonNegative, positive, type Known } from './known';
import { motorHeatLimit, type MotorHeatLimit } from './motor-heat-limit';
import { isPlausible, type PlausibleField } from './plausibility';
import { estimateStaticCoefficients } from './propeller-estimate';
import { estimateWaterCoefficients } from './water-propeller-estimate';
import { typicalDragArea, typicalRollingCoefficient, typicalTractionCoefficient } from './typical-values';

/** A positive value inside the field's plausible range, else lacking the field. */
function plausible(x: number | null | undefined, field: PlausibleField): Known {
  const k = positive(x, field);
  return k.value !== null && !isPlausible(field, k.value) ? lacking(field) : k;
}

/** Where the share of weight on the driven wheels came from. */
export type DrivenShareSource = 'recorded' | '4wd' | '2wd' | 'unknown';

export interface BuildInputs {
  kind: Known<VehicleKind>;
  motorCount: Known;
  kv: Known;
  pinionTeeth: Known;
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
  /** Share of the weight on the driven wheels, 0 to 1, and where it came from. */
  drivenShare: number;
  drivenShareSource: DrivenShareSource;
  /** Density of what the propeller turns in, kg/m³, and whether the water type was assumed. */
  fluidDensity: number;
  waterAssumed: boolean;
  /** Motor turns per propeller turn (1 for direct drive). */
  propGearRatio: number;
  /** True where a gearbox sits between motor and propeller: its efficiency then applies. */
  propGeared: boolean;
  pitchMm: Known;
  /** Maker's rpm limit of the propeller; null where none is recorded. */
  propMaxRpm: number | null;
  runLengthS: number;
  runLengthDefault: boolean;
  // The wider checks' inputs.
  /** Air at the field (ISA pressure for the altitude, the given or standard temperature). */
  air: FieldAir;
  fieldAltitudeM: number | null;
  /** Vehicle coefficients left empty and taken from the typical values (field paths). */
  typicalFields: string[];
  /** Propeller coefficients left empty and estimated from the geometry (field paths). */
  estimatedFields: string[];
  /** How they were estimated; null where none was. */
  estimateMethod: PropellerEstimateMethod | null;
  /** The user confirmed the typical and estimated values: verdicts resting on them may read clear. */
  typicalConfirmed: boolean;
  surface: Surface | null;
  /** Share of the capacity a run uses, 0 to 1, and whether it is the default. */
  depthOfDischarge: number;
  depthOfDischargeDefault: boolean;
  motorPoles: Known;
  /** The motor's heat-loss limit: the maker's rating, else the rule of thumb by mass; null with neither. */
  motorHeatLimit: MotorHeatLimit | null;
  controllerMaxErpm: number | null;
  controllerMinVoltageV: number | null;
  /** The controller's BEC rating and the receiver and servo load entered on the build; null where not entered. */
  controllerBecA: number | null;
  becLoadA: number | null;
  vehicleMassKg: Known;
}

/** Share of a pack's capacity a run is taken to use where the build sets none (common practice for lithium packs). */
export const DEFAULT_DEPTH_OF_DISCHARGE = 0.8;

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
    controllerMaxVoltageV = volts.value !== null ? volts : cells.value !== null ? known(millivoltExact(cells.value * CONTROLLER_VOLTS_PER_RATED_CELL)) : volts;
  }

  const pinion = positive(gearing?.pinionTeeth, 'gearing.pinionTeeth');
  const spur = positive(gearing?.spurTeeth, 'gearing.spurTeeth');
  const internal = positive(gearing?.internalRatio, 'gearing.internalRatio');
  const finalDrive = pinion.value !== null && spur.value !== null && internal.value !== null ? known(finalDriveRatio(spur.value, pinion.value, internal.value)) : lacking(...[pinion, spur, internal].flatMap((k) => k.missing ?? []));
  const drivetrainEfficiency = plausible(gearing?.drivetrainEfficiency, 'gearing.drivetrainEfficiency');

  // A propeller build's ratio: the gearbox (internal ratio), times spur ÷ pinion where both are given.
  const propGearRatio = (internal.value ?? 1) * (pinion.value !== null && spur.value !== null ? spur.value / pinion.value : 1);
  const propGeared = propGearRatio !== 1;

  const recordedShare = vehicle?.drivenWeightShare;
  const layout = vehicle?.driveLayout ?? null;
  let drivenShare = 1;
  let drivenShareSource: DrivenShareSource = layout === '2wd' ? '2wd' : layout === '4wd' ? '4wd' : 'unknown';
  if (typeof recordedShare === 'number' && isPlausible('vehicle.drivenWeightShare', recordedShare)) {
    drivenShare = recordedShare;
    drivenShareSource = 'recorded';
  } else if (layout === '2wd') {
    drivenShare = DEFAULT_2WD_DRIVEN_SHARE;
  }
  const boat = vehicle?.kind === 'boat';
  const water = vehicle?.water ?? null;
  const altitude = typeof build.fieldAltitudeM === 'number' && isPlausible('build.fieldAltitudeM', build.fieldAltitudeM) ? build.fieldAltitudeM : null;
  const temperature = typeof build.airTemperatureC === 'number' && isPlausible('build.airTemperatureC', build.airTemperatureC) ? build.airTemperatureC : null;
  const air = altitude === null && temperature === null ? { densityKgM3: AIR_DENSITY, pressurePa: 101_325, temperatureC: 15, standardTemperature: true } : fieldAir(altitude, temperature);
  const fluidDensity = !boat ? air.densityKgM3 : water === 'fresh' ? FRESH_WATER_DENSITY : SEA_WATER_DENSITY;

  const run = build.runLengthS;
  const runGiven = typeof run === 'number' && isPlausible('build.runLengthS', run);
  const propMaxRpm = propeller?.maxRpm;

  const controllerR = controller ? nonNegative(controller.resistanceOhm, 'controller.resistanceOhm') : known(0);
  const diameterMm = propeller ? positive(propeller.diameterMm, 'propeller.diameterMm') : noProp;
  const pitchMm = propeller ? positive(propeller.pitchMm, 'propeller.pitchMm') : noProp;

  // A car's or truck's empty coefficients take their typical values; an entered value wins.
  const kindValue = vehicle?.kind ?? null;
  const groundKind = kindValue === 'car' || kindValue === 'truck' ? kindValue : null;
  const surface = vehicle?.surface != null && (SURFACES as readonly string[]).includes(vehicle.surface) ? vehicle.surface : null;
  const massKg = vehicle ? positive(vehicle.massKg, 'vehicle.massKg') : noVehicle;
  const typicalFields: string[] = [];
  let dragAreaM2: Known = vehicle ? nonNegative(vehicle.dragAreaM2, 'vehicle.dragAreaM2') : noVehicle;
  let rollingCoefficient: Known = vehicle ? nonNegative(vehicle.rollingCoefficient, 'vehicle.rollingCoefficient') : noVehicle;
  let tractionCoefficient: Known = vehicle ? positive(vehicle.tractionCoefficient, 'vehicle.tractionCoefficient') : noVehicle;
  if (vehicle && groundKind !== null) {
    if (dragAreaM2.value === null && vehicle.dragAreaM2 == null) {
      dragAreaM2 = massKg.value === null ? massKg : known(typicalDragArea(groundKind, massKg.value));
      typicalFields.push('vehicle.dragAreaM2');
    }
    if (rollingCoefficient.value === null && vehicle.rollingCoefficient == null) {
      rollingCoefficient = known(typicalRollingCoefficient(surface));
      typicalFields.push('vehicle.rollingCoefficient');
    }
    if (tractionCoefficient.value === null && vehicle.tractionCoefficient == null) {
      tractionCoefficient = known(typicalTractionCoefficient(surface));
      typicalFields.push('vehicle.tractionCoefficient');
    }
  }

  // A propeller without coefficients gets them estimated from its geometry: an air propeller's
  // by blade-element momentum theory, a boat's from the B-series at the bollard point. An
  // entered coefficient always wins.
  const estimatedFields: string[] = [];
  let thrustCoefficient: Known = propeller ? positive(propeller.thrustCoefficient, 'propeller.thrustCoefficient') : noProp;
  let powerCoefficient: Known = propeller ? positive(propeller.powerCoefficient, 'propeller.powerCoefficient') : noProp;
  const airProp = kindValue === 'multirotor' || kindValue === 'plane';
  const propEstimate: PropellerEstimateMethod | null = airProp ? 'air-blade-element' : boat ? 'water-b-series' : null;
  if (propeller && propEstimate !== null && (propeller.thrustCoefficient == null || propeller.powerCoefficient == null) && diameterMm.value !== null && pitchMm.value !== null) {
    const estimate = propEstimate === 'water-b-series' ? estimateWaterCoefficients : estimateStaticCoefficients;
    const est = estimate(diameterMm.value / 1000, pitchMm.value / 1000, propeller.blades);
    if (propeller.thrustCoefficient == null) {
      thrustCoefficient = known(est.thrustCoefficient);
      estimatedFields.push('propeller.thrustCoefficient');
    }
    if (propeller.powerCoefficient == null) {
      powerCoefficient = known(est.powerCoefficient);
      estimatedFields.push('propeller.powerCoefficient');
    }
  }
  const dod = build.depthOfDischarge;
  const dodGiven = typeof dod === 'number' && isPlausible('build.depthOfDischarge', dod);
  const maxErpm = controller?.maxErpm;
  const minVoltage = controller?.minVoltageV;
  const becA = controller?.becCurrentA;
  const becLoad = build.becLoadA;

  return {
    kind: vehicle ? ((VEHICLE_KINDS as readonly string[]).includes(vehicle.kind) ? known(vehicle.kind) : lacking<VehicleKind>('vehicle.kind')) : lacking<VehicleKind>('build.vehicleId'),
    motorCount: count(build.motorCount, 'build.motorCount'),
    kv: motor ? plausible(motor.kv, 'motor.kv') : noMotor,
    motorResistanceOhm: motor ? plausible(motor.resistanceOhm, 'motor.resistanceOhm') : noMotor,
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
    pinionTeeth: pinion,
    tireDiameterMm: positive(gearing?.tireDiameterMm, 'gearing.tireDiameterMm'),
    drivetrainEfficiency,
    massKg,
    dragAreaM2,
    rollingCoefficient,
    tractionCoefficient,
    hasPropeller: propeller !== null,
    propDiameterM: diameterMm.value === null ? diameterMm : known(diameterMm.value / 1000),
    powerCoefficient,
    thrustCoefficient,
    measuredPeakA: measured(build.measuredPeakCurrentA, 'build.measuredPeakCurrentA'),
    measuredAverageA: measured(build.measuredAverageCurrentA, 'build.measuredAverageCurrentA'),
    drivenShare,
    drivenShareSource,
    fluidDensity,
    waterAssumed: boat && water !== 'fresh' && water !== 'sea',
    propGearRatio,
    propGeared,
    pitchMm,
    propMaxRpm: typeof propMaxRpm === 'number' && isPlausible('propeller.maxRpm', propMaxRpm) ? propMaxRpm : null,
    runLengthS: runGiven ? run : DEFAULT_RUN_LENGTH_S,
    runLengthDefault: !runGiven,
    air,
    fieldAltitudeM: altitude,
    typicalFields,
    estimatedFields,
    estimateMethod: estimatedFields.length > 0 ? propEstimate : null,
    typicalConfirmed: vehicle?.typicalValuesConfirmed === true,
    surface,
    depthOfDischarge: dodGiven ? dod : DEFAULT_DEPTH_OF_DISCHARGE,
    depthOfDischargeDefault: !dodGiven,
    motorPoles: motor ? count(motor.poles, 'motor.poles') : noMotor,
    motorHeatLimit: motor ? motorHeatLimit(motor.maxLossW, motor.massKg) : null,
    controllerMaxErpm: typeof maxErpm === 'number' && maxErpm > 0 ? maxErpm : null,
    controllerMinVoltageV: typeof minVoltage === 'number' && minVoltage > 0 ? minVoltage : null,
    controllerBecA: typeof becA === 'number' && becA > 0 ? becA : null,
    becLoadA: typeof becLoad === 'number' && becLoad >= 0 && Number.isFinite(becLoad) ? becLoad : null,
    vehicleMassKg: massKg,
  };
}
