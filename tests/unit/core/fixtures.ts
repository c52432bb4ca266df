// Invented parts for the core tests: a 1:8-scale-like basher truck, a quad and a boat. Values
// are plausible round numbers, not any product's data.

import type { Battery, BuildContext, ClassRule, Controller, Finding, Motor, Propeller, SupplyVerdict, Vehicle } from '../../../src-main/core/domain';
import { evaluateBuild } from '../../../src-main/core/evaluate';

const meta = { version: 1, archivedAt: null, notes: '' };

export function battery(over: Partial<Battery> = {}): Battery {
  return {
    ...meta,
    id: 'pack-a',
    name: 'Pack A',
    chemistry: 'lipo',
    cellsSeries: 4,
    cellsParallel: 1,
    capacityMah: 5000,
    cRatingContinuous: 50,
    cRatingBurst: 100,
    cellResistanceOhm: 0.003,
    massKg: 0.5,
    cycleCount: 0,
    retired: false,
    ...over,
  };
}

export function motor(over: Partial<Motor> = {}): Motor {
  return {
    ...meta,
    id: 'motor-a',
    name: 'Motor A',
    kv: 2200,
    resistanceOhm: 0.011,
    noLoadCurrentA: 2.5,
    maxCurrentA: 120,
    maxPowerW: 1800,
    maxVoltageV: 25,
    maxRpm: 60000,
    poles: 4,
    // A rated heat loss, so the heat check is judged on a rating rather than the rule of thumb by mass.
    maxLossW: 120,
    massKg: 0.3,
    ...over,
  };
}

export function controller(over: Partial<Controller> = {}): Controller {
  return {
    ...meta,
    id: 'esc-a',
    name: 'Controller A',
    maxVoltageV: 26,
    maxCells: null,
    continuousCurrentA: 150,
    burstCurrentA: 800,
    resistanceOhm: 0.001,
    massKg: 0.1,
    ...over,
  };
}

export function vehicle(over: Partial<Vehicle> = {}): Vehicle {
  return {
    ...meta,
    id: 'truck-a',
    name: 'Truck A',
    kind: 'truck',
    massKg: 3.2,
    dragAreaM2: 0.03,
    rollingCoefficient: 0.03,
    tractionCoefficient: 0.9,
    customerId: null,
    className: '',
    ...over,
  };
}

export function propeller(over: Partial<Propeller> = {}): Propeller {
  return {
    ...meta,
    id: 'prop-a',
    name: 'Prop A',
    diameterMm: 127,
    pitchMm: 114,
    blades: 3,
    thrustCoefficient: 0.11,
    powerCoefficient: 0.05,
    ...over,
  };
}

export function classRule(over: Partial<ClassRule> = {}): ClassRule {
  return {
    ...meta,
    id: 'rule-a',
    className: 'Club Stock',
    ruleId: 'class-speed',
    figure: 'theoreticalSpeedKmh',
    limit: 100,
    unit: 'km/h',
    ...over,
  };
}

/** A truck build on one 4S pack; `over` replaces whole parts of the context. */
export function truckContext(over: Partial<BuildContext> = {}): BuildContext {
  const pack = battery();
  return {
    build: {
      ...meta,
      id: 'build-a',
      name: 'Build A',
      vehicleId: 'truck-a',
      motorId: 'motor-a',
      motorCount: 1,
      controllerId: 'esc-a',
      propellerId: null,
      gearing: { pinionTeeth: 15, spurTeeth: 46, internalRatio: 2.6, tireDiameterMm: 115, drivetrainEfficiency: 0.85 },
      supplies: [{ id: 'supply-a', arrangement: 'series', batteryIds: [pack.id] }],
      measuredPeakCurrentA: null,
      measuredAverageCurrentA: null,
      tightThreshold: null,
    },
    vehicle: vehicle(),
    motor: motor(),
    controller: controller(),
    propeller: null,
    batteries: new Map([[pack.id, pack]]),
    classRules: [],
    defaultTightThreshold: 0.15,
    ...over,
  };
}

/** A quad: four motors, one propeller type, one 4S pack. */
export function quadContext(over: Partial<BuildContext> = {}): BuildContext {
  const base = truckContext();
  return truckContext({
    // Direct drive: no pinion or spur, no gearbox.
    build: { ...base.build, motorCount: 4, propellerId: 'prop-a', gearing: { ...base.build.gearing, pinionTeeth: null, spurTeeth: null, internalRatio: 1 } },
    vehicle: vehicle({ id: 'quad-a', kind: 'multirotor', massKg: 1.2, dragAreaM2: null, rollingCoefficient: null, tractionCoefficient: null }),
    motor: motor({ kv: 1700, resistanceOhm: 0.05, noLoadCurrentA: 1.2, maxCurrentA: 40, maxPowerW: 700, maxRpm: 40000 }),
    controller: controller({ continuousCurrentA: 45, burstCurrentA: 55, resistanceOhm: 0.004 }),
    propeller: propeller(),
    ...over,
  });
}

/** The verdict of one supply of a build (the first by default); throws where there is none. */
export function supplyOf(ctx: BuildContext, i = 0): SupplyVerdict {
  const s = evaluateBuild(ctx).supplies[i];
  if (!s) throw new Error('no supply verdict');
  return s;
}

/** The finding of one rule in a supply's verdict; throws where there is none. */
export function finding(s: SupplyVerdict, rule: string): Finding {
  const f = s.findings.find((x) => x.rule === rule);
  if (!f) throw new Error(`no ${rule} finding`);
  return f;
}
