// One build's verdict: every supply on its own (figures, findings, status), the build taking
// the worst supply's status. Pure: it runs inside the store's re-check transaction for
// thousands of builds at a time, and in the renderer for swap previews.

import { buildInputs, type BuildInputs } from './build-inputs';
import { classFindings, classRulesFor } from './class-rules';
import { PROP_TIP_MACH_LIMIT, SPEED_OF_SOUND_SEA_LEVEL } from './constants';
import type { BuildContext, BuildVerdict, Figures, Finding, Status, Supply, SupplyVerdict } from './domain';
import { rolloutMm, speedKmhAt } from './drivetrain';
import { known, lacking, missingOf, type Known } from './known';
import { torqueConstant } from './motor';
import { operate } from './operating-model';
import { checkLimit, type LimitCheck } from './rule-check';
import { RULE_TEXT, SUPPLY_MATCH_RULE_ID, type BuiltInRuleId } from './rules';
import { compareStatus } from './status';
import { supplyModel, type SupplyModel } from './supply';
import { tightThresholdFor } from './threshold';

/** Stands in for a build without supplies, so its verdict still says what is missing. */
const NO_SUPPLY: Supply = { id: '', arrangement: 'series', batteryIds: [] };

const AIR_KINDS: readonly string[] = ['multirotor', 'plane'];

export interface EvaluateOptions {
  /**
   * Write the findings' sentences (default true). A re-check stores statuses and list figures
   * only, so it skips them: composing text is most of an evaluation's cost.
   */
  messages?: boolean;
}

export function evaluateBuild(ctx: BuildContext, options?: EvaluateOptions): BuildVerdict {
  const messages = options?.messages ?? true;
  const inputs = buildInputs(ctx);
  const classRules = classRulesFor(ctx.classRules, ctx.vehicle?.className);
  const threshold = tightThresholdFor(ctx.build.tightThreshold, classRules, ctx.defaultTightThreshold);
  const supplies = ctx.build.supplies.length > 0 ? ctx.build.supplies : [NO_SUPPLY];
  const verdicts: SupplyVerdict[] = [];
  for (const supply of supplies) {
    const model =
      supply === NO_SUPPLY ? lacking<SupplyModel>('build.supplies') : supplyModel(supply, ctx.batteries);
    verdicts.push(evaluateSupply(inputs, supply, model, classRules, threshold, messages));
  }
  let status: Status = 'clear';
  for (const v of verdicts) if (compareStatus(v.status, status) < 0) status = v.status;
  return { buildId: ctx.build.id, status, supplies: verdicts };
}

function times(a: Known, b: Known, f: (x: number, y: number) => number): Known {
  return a.value !== null && b.value !== null ? known(f(a.value, b.value)) : lacking(...missingOf(a, b));
}

const product = (x: number, y: number): number => x * y;
const quotient = (x: number, y: number): number => x / y;

/** Overflowed values from absurd inputs count as unusable rather than reaching a finding. */
function finite(k: Known): Known {
  return k.value === null || Number.isFinite(k.value) ? k : lacking();
}

interface RuleEnv {
  findings: Finding[];
  threshold: number;
  lithium: boolean;
  several: boolean;
  modelAssumed: readonly string[];
  messages: boolean;
}

function pushRule(env: RuleEnv, id: BuiltInRuleId, value: Known, limit: Known, source?: 'model' | 'measured'): void {
  const t = RULE_TEXT[id];
  const check: LimitCheck = {
    rule: id,
    unit: t.unit,
    value: finite(value),
    limit: finite(limit),
    tightThreshold: t.ratedMaximum ? 0 : env.threshold,
    what: env.several && t.perMotor ? `${t.what} per motor` : t.what,
    limitName: t.limitName,
    risk: env.lithium && t.riskLithium ? t.riskLithium : t.risk,
    fix: t.fix,
    tightHint: t.tightHint,
    messages: env.messages,
  };
  if (source) check.source = source;
  if (source === 'model' && env.modelAssumed.length > 0) check.assumed = env.modelAssumed;
  env.findings.push(checkLimit(check));
}

function evaluateSupply(
  inp: BuildInputs,
  supply: Supply,
  model: Known<SupplyModel>,
  classRules: BuildContext['classRules'],
  threshold: number,
  messages: boolean,
): SupplyVerdict {
  const s = model.value;
  const supplyLack = model.missing ?? [];
  const noSupply = lacking(...supplyLack);
  const nominalV = s ? known(s.nominalV) : noSupply;
  const fullV = s ? known(s.fullV) : noSupply;
  const cutoffV = s ? known(s.cutoffV) : noSupply;
  const capacityMah = s ? known(s.capacityMah) : noSupply;
  const packR: Known = s ? (s.resistanceOhm === null ? lacking('battery.cellResistanceOhm') : known(s.resistanceOhm)) : noSupply;

  const kt = inp.kv.value !== null ? known(torqueConstant(inp.kv.value)) : inp.kv;
  const noLoadRpm = times(inp.kv, nominalV, product);
  const noLoadRpmFull = times(inp.kv, fullV, product);
  const rollout = times(inp.tireDiameterMm, inp.finalDrive, rolloutMm);
  const theoretical =
    noLoadRpm.value !== null && inp.finalDrive.value !== null && inp.tireDiameterMm.value !== null
      ? known(speedKmhAt(noLoadRpm.value, inp.finalDrive.value, inp.tireDiameterMm.value))
      : lacking(...missingOf(noLoadRpm, inp.finalDrive, inp.tireDiameterMm));

  const op = operate(inp, model);
  const n = inp.motorCount.value;

  // Measured currents are for the whole supply; the model's are per motor.
  const peakSource = inp.measuredPeakA ? 'measured' : 'model';
  const contSource = inp.measuredAverageA ? 'measured' : 'model';
  const peakA: Known = inp.measuredPeakA ?? times(op.peakMotorA, inp.motorCount, product);
  const contA: Known = inp.measuredAverageA ?? times(op.continuousMotorA, inp.motorCount, product);
  const motorPeakA = times(peakA, inp.motorCount, quotient);
  const motorContA = times(contA, inp.motorCount, quotient);

  const rPackModel = s?.modelResistanceOhm ?? 0;
  const loadedV =
    peakA.value !== null && fullV.value !== null ? known(Math.max(0, fullV.value - peakA.value * rPackModel)) : lacking(...missingOf(peakA, fullV));
  const peakPowerW = peakA.value !== null && loadedV.value !== null ? known(peakA.value * loadedV.value) : loadedV;
  const loadedVoltageV = packR.value === null ? lacking(...missingOf(loadedV, packR)) : loadedV;
  // Power at the motor's own terminals: the pack drop of all motors and its controller's drop come off.
  const motorPeakPowerW =
    motorPeakA.value !== null && fullV.value !== null && n !== null
      ? known(motorPeakA.value * Math.max(0, fullV.value - motorPeakA.value * (n * rPackModel + inp.controllerResistanceOhm)))
      : lacking(...missingOf(motorPeakA, fullV, inp.motorCount));

  const anyCurrent = peakA.value !== null || contA.value !== null;
  const entries: Record<string, Known> = {
    packVoltageNominalV: nominalV,
    packVoltageFullV: fullV,
    packVoltageCutoffV: cutoffV,
    packResistanceOhm: packR,
    capacityMah,
    torqueConstantNmPerA: kt,
    noLoadRpm,
    noLoadRpmFull,
    finalDriveRatio: inp.finalDrive,
    rolloutMm: rollout,
    theoreticalSpeedKmh: theoretical,
    loadedTopSpeedKmh: op.loadedTopSpeedKmh,
    peakCurrentA: peakA,
    continuousCurrentA: contA,
    peakPowerW,
    loadedVoltageV,
    thrustN: op.thrustN,
    tipSpeedMps: op.tipSpeedMps,
    loadedRpm: op.loadedRpm,
    loadedRpmFull: op.loadedRpmFull,
    motorPeakCurrentA: motorPeakA,
    motorContinuousCurrentA: motorContA,
    motorPeakPowerW,
  };
  const figures: Figures = {
    packVoltageNominalV: null,
    packVoltageFullV: null,
    packVoltageCutoffV: null,
    packResistanceOhm: null,
    capacityMah: null,
    torqueConstantNmPerA: null,
    noLoadRpm: null,
    noLoadRpmFull: null,
    finalDriveRatio: null,
    rolloutMm: null,
    theoreticalSpeedKmh: null,
    loadedTopSpeedKmh: null,
    peakCurrentA: null,
    continuousCurrentA: null,
    peakPowerW: null,
    loadedVoltageV: null,
    thrustN: null,
    tipSpeedMps: null,
    currentSource: anyCurrent ? (inp.measuredPeakA || inp.measuredAverageA ? 'measured' : 'model') : null,
    peakCurrentSource: peakA.value !== null ? peakSource : null,
    continuousCurrentSource: contA.value !== null ? contSource : null,
  };
  const figureMissing: Record<string, readonly string[]> = {};
  for (const key in entries) {
    const k = entries[key];
    if (!k) continue;
    // Absurd inputs can overflow; a figure is a finite number or null, never NaN or Infinity.
    if (k.value !== null && Number.isFinite(k.value)) figures[key] = k.value;
    else figureMissing[key] = k.missing ?? [];
  }

  const findings: Finding[] = [];
  if (s?.mismatch) findings.push(mismatchFinding(s));

  const modelAssumed: string[] = [];
  if (s && s.resistanceOhm === null) modelAssumed.push('battery.cellResistanceOhm');
  if (inp.controllerResistanceAssumed) modelAssumed.push('controller.resistanceOhm');
  const env: RuleEnv = { findings, threshold, lithium: s?.lithium ?? true, several: n !== null && n > 1, modelAssumed, messages };
  pushRule(env, 'controller-voltage', fullV, inp.controllerMaxVoltageV);
  pushRule(env, 'motor-voltage', fullV, inp.motorMaxVoltageV);
  pushRule(env, 'motor-speed', noLoadRpmFull, inp.motorMaxRpm);
  pushRule(env, 'battery-continuous', contA, s ? s.continuousLimitA : noSupply, contSource);
  pushRule(env, 'battery-burst', peakA, s ? s.burstLimitA : noSupply, peakSource);
  pushRule(env, 'controller-continuous', motorContA, inp.controllerContinuousA, contSource);
  pushRule(env, 'controller-burst', motorPeakA, inp.controllerBurstA, peakSource);
  pushRule(env, 'motor-current', motorPeakA, inp.motorMaxCurrentA, peakSource);
  pushRule(env, 'motor-power', motorPeakPowerW, inp.motorMaxPowerW, peakSource);
  const kind = inp.kind.value;
  if ((kind !== null && AIR_KINDS.includes(kind)) || (kind === null && inp.hasPropeller)) {
    pushRule(env, 'prop-tip-speed', op.tipSpeedMps, known(PROP_TIP_MACH_LIMIT * SPEED_OF_SOUND_SEA_LEVEL));
  }
  for (const f of classFindings(classRules, figures, figureMissing, threshold)) findings.push(f);

  return {
    supplyId: supply.id,
    batteryIds: [...supply.batteryIds],
    status: worstFindingStatus(findings),
    figures,
    findings,
  };
}

function worstFindingStatus(findings: readonly Finding[]): Status {
  let status: Status = 'clear';
  for (const f of findings) if (compareStatus(f.status, status) < 0) status = f.status;
  return status;
}

/** Parallel packs at different voltages, reported as the higher voltage against the lower. */
function mismatchFinding(s: SupplyModel): Finding {
  let hi = -Infinity;
  let lo = Infinity;
  for (const p of s.packs) {
    hi = Math.max(hi, p.fullV);
    lo = Math.min(lo, p.fullV);
  }
  if (hi === lo) {
    // Same full voltage from different chemistries: the nominal voltages still differ.
    hi = -Infinity;
    lo = Infinity;
    for (const p of s.packs) {
      hi = Math.max(hi, p.nominalV);
      lo = Math.min(lo, p.nominalV);
    }
  }
  return {
    rule: SUPPLY_MATCH_RULE_ID,
    status: 'over',
    value: hi,
    limit: lo,
    unit: 'V',
    margin: lo > 0 ? (lo - hi) / lo : -1,
    message: s.mismatch ?? '',
  };
}
