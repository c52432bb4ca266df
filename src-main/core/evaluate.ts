// One build's verdict: every supply on its own (figures, findings, status), the build taking
// the worst supply's status. Pure: it runs inside the store's re-check transaction for
// thousands of builds at a time, and in the renderer for swap previews.

import { buildInputs, type BuildInputs } from './build-inputs';
import { classFindings, classRulesFor } from './class-rules';
import { FRESH_WATER_DENSITY, PROP_TIP_MACH_LIMIT, SEA_WATER_DENSITY, SPEED_OF_SOUND_SEA_LEVEL } from './constants';
import { FIGURE_KEYS, FIGURES, type FigureKey } from './catalogue/figures';
import type { Battery, BuildContext, BuildVerdict, Figures, Finding, PackShare, Status, Supply, SupplyVerdict } from './domain';
import { rolloutMm, speedKmhAt } from './drivetrain';
import { known, lacking, missingOf, type Known } from './known';
import { messageNumber } from './message-number';
import { LOSS_W_PER_GRAM } from './motor-heat-limit';
import { torqueConstant } from './motor';
import { operate } from './operating-point';
import { NOT_APPLICABLE } from './operation';
import type { PackModel } from './pack';
import type { HealthProblem } from './pack-log';
import { tipSpeed } from './propeller';
import { checkLimit, type LimitCheck } from './rule-check';
import { PACK_HEALTH_RULE_ID, PACK_REPEATED_RULE_ID, PACK_RETIRED_RULE_ID, packHealthMessage, packRuleMessage, ratingRule, SUPPLY_MATCH_RULE_ID, type BuiltInRuleId } from './catalogue/rules';
import { compareStatus } from './status';
import { supplyModel, type SupplyModel } from './supply';
import { tightThresholdFor } from './threshold';
import { mpsToKmh, newtonToGramForce } from './units';
import { checkMinimum } from './minimum-check';
import { markTypical, typicalSentences, type TypicalMarks } from './typical-marks';
import { widerEntries } from './wider-entries';
import { chassisAmpacity } from './wire-ampacity';

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
  // One physical pack cannot be in two places at once: count every id across the build.
  const uses = new Map<string, number>();
  for (const supply of supplies) for (const id of supply.batteryIds) uses.set(id, (uses.get(id) ?? 0) + 1);
  // Measured currents belong to the supply they were logged on; with one supply, that one.
  const named = ctx.build.measuredSupplyId ?? null;
  const measuredOn = named ?? (ctx.build.supplies.length === 1 ? (ctx.build.supplies[0]?.id ?? null) : null);
  const measuredOnKnown = measuredOn !== null && ctx.build.supplies.some((s) => s.id === measuredOn);
  const verdicts: SupplyVerdict[] = [];
  for (const supply of supplies) {
    const model = supply === NO_SUPPLY ? lacking<SupplyModel>('build.supplies') : supplyModel(supply, ctx.batteries);
    const site: SupplySite = {
      repeated: supply.batteryIds.filter((id, i, all) => (uses.get(id) ?? 0) > 1 && all.indexOf(id) === i),
      measuredHere: measuredOnKnown && supply.id === measuredOn,
      measuredElsewhere: measuredOnKnown && supply.id !== measuredOn,
      names: ctx.batteries,
      health: ctx.packHealth,
    };
    verdicts.push(evaluateSupply(inputs, supply, model, classRules, threshold, messages, site));
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

/** What a supply's verdict needs to know about the rest of the build. */
interface SupplySite {
  /** Pack ids of this supply that the build names more than once. */
  repeated: string[];
  /** The measured currents were logged on this supply. */
  measuredHere: boolean;
  /** They were logged on another supply of the build. */
  measuredElsewhere: boolean;
  names: BuildContext['batteries'];
  health: BuildContext['packHealth'];
}

interface RuleOverride {
  what?: string;
  limitName?: string;
  batteryId?: string;
}

interface RuleEnv {
  findings: Finding[];
  threshold: number;
  lithium: boolean;
  several: boolean;
  modelAssumed: readonly string[];
  messages: boolean;
}

function pushRule(env: RuleEnv, id: BuiltInRuleId, value: Known, limit: Known, source?: 'model' | 'measured', over?: RuleOverride): void {
  const spec = ratingRule(id);
  const t = spec.text;
  const what = over?.what ?? t.what;
  const check: LimitCheck = {
    rule: id,
    unit: FIGURES[spec.figure].unit,
    value: finite(value),
    limit: finite(limit),
    tightThreshold: t.ratedMaximum ? 0 : env.threshold,
    what: env.several && t.perMotor ? `${what} per motor` : what,
    limitName: over?.limitName ?? t.limitName,
    risk: env.lithium && t.riskLithium ? t.riskLithium : t.risk,
    fix: t.fix,
    tightHint: t.tightHint,
    messages: env.messages,
  };
  if (source) check.source = source;
  if (source === 'model' && env.modelAssumed.length > 0) check.assumed = env.modelAssumed;
  const finding = checkLimit(check);
  if (over?.batteryId) finding.batteryId = over.batteryId;
  env.findings.push(finding);
}

const pct = (x: number): string => `${Math.round(x * 100)} %`;

/**
 * A pack rule judged pack by pack: each pack's share of the supply current against its own
 * rating. The finding reports the worst pack; a pack past its rating wins over one whose
 * rating is missing, which wins over the smallest margin.
 */
function pushPackRule(env: RuleEnv, id: 'battery-continuous' | 'battery-burst', totalA: Known, s: SupplyModel | null, noSupply: Known, source: 'model' | 'measured'): void {
  if (s === null) {
    pushRule(env, id, totalA, noSupply, source);
    return;
  }
  const limitOf = (p: PackModel): Known => (id === 'battery-continuous' ? p.continuousLimitA : p.burstLimitA);
  const single = s.packs.length === 1;
  let worst = -1;
  let worstMargin = Infinity;
  const lacks: Known[] = [];
  s.packs.forEach((p, k) => {
    const limit = limitOf(p).value;
    if (limit === null) {
      lacks.push(limitOf(p));
      return;
    }
    if (totalA.value === null || !(limit > 0)) return;
    const margin = (limit - totalA.value * (s.shares[k]?.share ?? 1)) / limit;
    if (margin < worstMargin) {
      worstMargin = margin;
      worst = k;
    }
  });
  const pack = s.packs[worst];
  if (totalA.value === null || pack === undefined || (worstMargin >= 0 && lacks.length > 0)) {
    pushRule(env, id, totalA, lacks.length > 0 ? lacking(...missingOf(...lacks)) : pack ? limitOf(pack) : lacking(...missingOf(...s.packs.map(limitOf))), source);
    return;
  }
  const share = s.shares[worst] ?? { share: 1, bound: false };
  const value = known(totalA.value * share.share);
  if (single) {
    pushRule(env, id, value, limitOf(pack), source, { batteryId: pack.id });
    return;
  }
  const kind = id === 'battery-continuous' ? 'continuous' : 'burst';
  let what = '';
  if (env.messages) {
    const label = id === 'battery-continuous' ? 'Continuous current' : 'Peak current';
    const split =
      s.arrangement === 'series'
        ? 'packs in series each carry the whole current'
        : share.bound
          ? `up to ${pct(share.share)} of the supply's ${messageNumber(totalA.value)} A: not every pack's resistance is measured, so the most it could carry`
          : `${pct(share.share)} of the supply's ${messageNumber(totalA.value)} A, split by conductance`;
    what = `${label} through pack "${pack.name}" (${split})`;
  }
  pushRule(env, id, value, limitOf(pack), source, {
    what,
    limitName: `that pack's ${kind} rating (${kind === 'burst' ? 'burst ' : ''}C rating × capacity)`,
    batteryId: pack.id,
  });
}

function evaluateSupply(inp: BuildInputs, supply: Supply, model: Known<SupplyModel>, classRules: BuildContext['classRules'], threshold: number, messages: boolean, site: SupplySite): SupplyVerdict {
  const s = model.value;
  const supplyLack = model.missing ?? [];
  const noSupply = lacking(...supplyLack);
  const nominalV = s ? known(s.nominalV) : noSupply;
  const fullV = s ? known(s.fullV) : noSupply;
  const cutoffV = s ? known(s.cutoffV) : noSupply;
  const capacityMah = s ? known(s.capacityMah) : noSupply;
  const packR: Known = s ? (s.resistanceOhm === null ? lacking('battery.cellResistanceOhm') : known(s.resistanceOhm)) : noSupply;
  const kind = inp.kind.value;
  const ground = kind === 'car' || kind === 'truck';
  const propellerBuild = kind !== null ? !ground : inp.hasPropeller;
  const notApplicable = lacking(NOT_APPLICABLE);
  const assumptions: string[] = [];
  const say = (text: string): void => {
    if (messages) assumptions.push(text);
  };

  const kt = inp.kv.value !== null ? known(torqueConstant(inp.kv.value)) : inp.kv;
  const noLoadRpm = times(inp.kv, nominalV, product);
  const noLoadRpmFull = times(inp.kv, fullV, product);
  // A propeller build has no tyre: its speed figure is the pitch speed, through its gearbox.
  const finalDrive = propellerBuild ? known(inp.propGearRatio) : inp.finalDrive;
  const rollout = propellerBuild ? notApplicable : times(inp.tireDiameterMm, inp.finalDrive, rolloutMm);
  const theoretical = propellerBuild
    ? notApplicable
    : noLoadRpm.value !== null && inp.finalDrive.value !== null && inp.tireDiameterMm.value !== null
      ? known(speedKmhAt(noLoadRpm.value, inp.finalDrive.value, inp.tireDiameterMm.value))
      : lacking(...missingOf(noLoadRpm, inp.finalDrive, inp.tireDiameterMm));
  const pitchSpeed = !propellerBuild
    ? notApplicable
    : noLoadRpm.value !== null && inp.pitchMm.value !== null
      ? known(mpsToKmh((inp.pitchMm.value / 1000) * (noLoadRpm.value / inp.propGearRatio / 60)))
      : lacking(...missingOf(noLoadRpm, inp.pitchMm));

  const op = operate(inp, model);
  const n = inp.motorCount.value;

  // Measured currents are for the whole supply they were logged on; the model's are per motor.
  const measuredPeak = site.measuredHere ? inp.measuredPeakA : null;
  const measuredAvg = site.measuredHere ? inp.measuredAverageA : null;
  const modelPeakA = times(op.peakMotorA, inp.motorCount, product);
  const modelContA = times(op.continuousMotorA, inp.motorCount, product);
  // A measured peak below the model's continuous current is more likely a logging slip than a
  // kinder truth: it does not replace the model.
  const suspect = measuredPeak !== null && measuredPeak.value !== null && modelContA.value !== null && measuredPeak.value < modelContA.value;
  const usePeak = measuredPeak !== null && !suspect ? measuredPeak : null;
  const peakSource = usePeak ? 'measured' : 'model';
  const contSource = measuredAvg ? 'measured' : 'model';
  const peakA: Known = usePeak ?? modelPeakA;
  const contA: Known = measuredAvg ?? modelContA;
  const motorPeakA = times(peakA, inp.motorCount, quotient);
  const motorContA = times(contA, inp.motorCount, quotient);

  const rPackModel = s?.modelResistanceOhm ?? 0;
  const loadedV = peakA.value !== null && fullV.value !== null ? known(Math.max(0, fullV.value - peakA.value * rPackModel)) : lacking(...missingOf(peakA, fullV));
  const peakPower = peakA.value !== null && loadedV.value !== null ? known(peakA.value * loadedV.value) : loadedV;
  // Without a measured pack resistance there is no sag to take off: the figure is shown only
  // under its own name, which says so.
  const peakPowerW = packR.value === null ? lacking(...missingOf(peakPower, packR)) : peakPower;
  const peakPowerNoSagW = packR.value === null ? peakPower : notApplicable;
  const loadedVoltageV = packR.value === null ? lacking(...missingOf(loadedV, packR)) : loadedV;
  // Power at the motor's own terminals: the pack drop of all motors and its controller's drop come off.
  const motorPeakPowerW =
    motorPeakA.value !== null && fullV.value !== null && n !== null
      ? known(motorPeakA.value * Math.max(0, fullV.value - motorPeakA.value * (n * rPackModel + inp.controllerResistanceOhm)))
      : lacking(...missingOf(motorPeakA, fullV, inp.motorCount));

  // The tip speed limit: a fraction of the speed of sound, or the maker's rpm limit where stricter.
  const machLimit = PROP_TIP_MACH_LIMIT * SPEED_OF_SOUND_SEA_LEVEL;
  const makerLimit = inp.propMaxRpm !== null && inp.propDiameterM.value !== null ? tipSpeed(inp.propMaxRpm / 60, inp.propDiameterM.value) : null;
  const tipLimit = makerLimit !== null && makerLimit < machLimit ? makerLimit : machLimit;

  const anyCurrent = peakA.value !== null || contA.value !== null;
  const wider = widerEntries({
    inp,
    supply: model,
    batteries: site.names,
    batteryIds: supply.batteryIds,
    nominalV,
    fullV,
    capacityMah,
    noLoadRpmFull,
    contA,
    measuredAvgA: measuredAvg,
    runAverageA: times(op.runAverageMotorA, inp.motorCount, product),
    motorContA,
    thrustN: op.thrustN,
  });
  // The sag at cut-off needs a measured pack resistance: taken as zero it would read the voltage high.
  const loadedCutoffV = peakA.value !== null && cutoffV.value !== null && packR.value !== null ? known(Math.max(0, cutoffV.value - peakA.value * packR.value)) : lacking(...missingOf(peakA, cutoffV, packR));
  // Written out key by key: a spread here turns the object into a slow dictionary on the hot path.
  const entries: Record<FigureKey, Known> = {
    packEnergyWh: wider.packEnergyWh,
    runTimeMin: wider.runTimeMin,
    hoverCurrentA: wider.hoverCurrentA,
    hoverMotorCurrentA: wider.hoverMotorCurrentA,
    hoverThrottle: wider.hoverThrottle,
    erpm: wider.erpm,
    motorLossW: wider.motorLossW,
    becLoadA: inp.becLoadA === null ? lacking('build.becLoadA') : known(inp.becLoadA),
    allUpMassKg: wider.allUpMassKg,
    thrustToWeight: wider.thrustToWeight,
    thrustGrams: op.thrustN.value === null ? op.thrustN : known(newtonToGramForce(op.thrustN.value)),
    loadedCutoffVoltageV: loadedCutoffV,
    packVoltageNominalV: nominalV,
    packVoltageFullV: fullV,
    packVoltageCutoffV: cutoffV,
    packResistanceOhm: packR,
    capacityMah,
    seriesCells: s ? known(s.seriesCells) : noSupply,
    motorKv: inp.kv,
    pinionTeeth: inp.pinionTeeth,
    torqueConstantNmPerA: kt,
    noLoadRpm,
    noLoadRpmFull,
    finalDriveRatio: finalDrive,
    rolloutMm: rollout,
    theoreticalSpeedKmh: theoretical,
    pitchSpeedKmh: pitchSpeed,
    loadedTopSpeedKmh: op.loadedTopSpeedKmh,
    peakCurrentA: peakA,
    continuousCurrentA: contA,
    steadyCurrentA: times(op.steadyMotorA, inp.motorCount, product),
    runRmsCurrentA: times(op.runRmsMotorA, inp.motorCount, product),
    runAverageCurrentA: times(op.runAverageMotorA, inp.motorCount, product),
    runLengthS: ground ? known(inp.runLengthS) : notApplicable,
    peakPowerW,
    peakPowerNoSagW,
    loadedVoltageV,
    thrustN: op.thrustN,
    tipSpeedMps: op.tipSpeedMps,
    tipSpeedStaticMps: op.tipSpeedStaticMps,
    tipSpeedLimitMps: propellerBuild && inp.propDiameterM.value !== null ? known(tipLimit) : notApplicable,
    propellerRpmStatic: op.propRpmStatic,
    propellerRpmUnloaded: op.propRpmUnloaded,
    drivenWeightShare: ground ? known(inp.drivenShare) : notApplicable,
    fluidDensityKgM3: propellerBuild ? known(inp.fluidDensity) : notApplicable,
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
    seriesCells: null,
    motorKv: null,
    pinionTeeth: null,
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
    // Every key up front: one object shape for every supply, which keeps the hot path fast.
    pitchSpeedKmh: null,
    steadyCurrentA: null,
    runRmsCurrentA: null,
    runAverageCurrentA: null,
    runLengthS: null,
    peakPowerNoSagW: null,
    tipSpeedStaticMps: null,
    tipSpeedLimitMps: null,
    propellerRpmStatic: null,
    propellerRpmUnloaded: null,
    drivenWeightShare: null,
    fluidDensityKgM3: null,
    loadedRpm: null,
    loadedRpmFull: null,
    motorPeakCurrentA: null,
    motorContinuousCurrentA: null,
    motorPeakPowerW: null,
    packEnergyWh: null,
    loadedCutoffVoltageV: null,
    runTimeMin: null,
    hoverCurrentA: null,
    erpm: null,
    motorLossW: null,
    becLoadA: null,
    hoverMotorCurrentA: null,
    allUpMassKg: null,
    thrustToWeight: null,
    thrustGrams: null,
    hoverThrottle: null,
    currentSource: anyCurrent ? (usePeak || measuredAvg ? 'measured' : 'model') : null,
    peakCurrentSource: peakA.value !== null ? peakSource : null,
    continuousCurrentSource: contA.value !== null ? contSource : null,
  };
  const figureMissing: Partial<Record<FigureKey, readonly string[]>> = {};
  for (const key of FIGURE_KEYS) {
    const k = entries[key];
    // Absurd inputs can overflow; a figure is a finite number or null, never NaN or Infinity.
    if (k.value !== null && Number.isFinite(k.value)) figures[key] = k.value;
    else figureMissing[key] = k.missing ?? [];
  }

  const findings: Finding[] = [];
  if (s?.mismatch) findings.push(mismatchFinding(s));
  for (const id of site.repeated) findings.push(packFinding(PACK_REPEATED_RULE_ID, id, site.names.get(id)?.name ?? id, messages));
  for (const id of new Set(supply.batteryIds)) {
    const b = site.names.get(id);
    if (b?.retired) findings.push(packFinding(PACK_RETIRED_RULE_ID, id, b.name, messages));
  }
  if (site.health) {
    for (const id of new Set(supply.batteryIds)) {
      const problems = site.health.get(id);
      if (problems && problems.length > 0) findings.push(healthFinding(id, site.names.get(id)?.name ?? id, problems, s?.lithium ?? true, messages));
    }
  }

  const modelAssumed: string[] = [];
  if (s && s.resistanceOhm === null) modelAssumed.push('battery.cellResistanceOhm');
  if (inp.controllerResistanceAssumed) modelAssumed.push('controller.resistanceOhm');
  const env: RuleEnv = { findings, threshold, lithium: s?.lithium ?? true, several: n !== null && n > 1, modelAssumed, messages };
  pushRule(env, 'controller-voltage', fullV, inp.controllerMaxVoltageV);
  pushRule(env, 'motor-voltage', fullV, inp.motorMaxVoltageV);
  pushRule(env, 'motor-speed', noLoadRpmFull, inp.motorMaxRpm);
  pushPackRule(env, 'battery-continuous', contA, s, noSupply, contSource);
  pushPackRule(env, 'battery-burst', peakA, s, noSupply, peakSource);
  pushRule(env, 'controller-continuous', motorContA, inp.controllerContinuousA, contSource);
  pushRule(env, 'controller-burst', motorPeakA, inp.controllerBurstA, peakSource);
  pushRule(env, 'motor-current', motorPeakA, inp.motorMaxCurrentA, peakSource);
  pushRule(env, 'motor-power', motorPeakPowerW, inp.motorMaxPowerW, peakSource);
  if ((kind !== null && AIR_KINDS.includes(kind)) || (kind === null && inp.hasPropeller)) {
    const byMaker = makerLimit !== null && makerLimit < machLimit;
    pushRule(env, 'prop-tip-speed', op.tipSpeedMps, known(tipLimit), undefined, byMaker ? { limitName: `the propeller maker's limit of ${messageNumber(inp.propMaxRpm ?? 0)} rpm` } : undefined);
  }
  // The wider checks: each judged where its rating is entered (thrust-to-weight on every multirotor).
  const heat = inp.motorHeatLimit;
  if (heat !== null) pushRule(env, 'motor-heat', wider.motorLossW, known(heat.lossW), contSource, heat.ruleOfThumb ? { limitName: RULE_OF_THUMB_LIMIT_NAME } : undefined);
  if (inp.controllerMaxErpm !== null) pushRule(env, 'controller-erpm', wider.erpm, known(inp.controllerMaxErpm));
  if (kind === 'multirotor') {
    findings.push(
      checkMinimum({ rule: 'thrust-to-weight', unit: ':1', value: wider.thrustToWeight, overBelow: THRUST_TO_WEIGHT_OVER, tightBelow: THRUST_TO_WEIGHT_TIGHT, text: ratingRule('thrust-to-weight').text, source: 'model', messages }),
    );
  }
  if (inp.controllerMinVoltageV !== null) {
    const least = inp.controllerMinVoltageV;
    findings.push(
      checkMinimum({ rule: 'controller-min-voltage', unit: 'V', value: finite(loadedCutoffV), overBelow: least, tightBelow: least * (1 + threshold), text: ratingRule('controller-min-voltage').text, source: peakSource, messages }),
    );
  }
  // The BEC load is the user's own figure: with none entered there is nothing to judge. A load
  // entered on a controller whose BEC rating is not known asks for a check that cannot be made:
  // incomplete, naming the rating, never left out as if nothing were asked.
  if (inp.becLoadA !== null) pushRule(env, 'bec-current', known(inp.becLoadA), inp.controllerBecA === null ? lacking('controller.becCurrentA') : known(inp.controllerBecA));
  pushPackLimit(env, 'wire-current', contA, s, contSource, (b) => (typeof b.wireGaugeAwg === 'number' ? chassisAmpacity(b.wireGaugeAwg) : null), site.names);
  pushPackLimit(env, 'connector-current', contA, s, contSource, (b) => (typeof b.connectorRatingA === 'number' && b.connectorRatingA > 0 ? b.connectorRatingA : null), site.names);
  const marks: TypicalMarks = markTypical(inp, findings, figures, messages);
  for (const f of classFindings(classRules, figures, figureMissing, threshold)) findings.push(f);

  const packShares: PackShare[] = [];
  if (s) {
    s.packs.forEach((p, k) => {
      const share = s.shares[k] ?? { share: 1, bound: false };
      packShares.push({
        batteryId: p.id,
        name: p.name,
        share: share.share,
        bound: share.bound,
        continuousA: contA.value === null ? null : contA.value * share.share,
        peakA: peakA.value === null ? null : peakA.value * share.share,
        continuousLimitA: p.continuousLimitA.value,
        burstLimitA: p.burstLimitA.value,
      });
    });
  }

  if (messages) {
    if (s && s.arrangement === 'parallel' && s.packs.length > 1) {
      const bound = s.shares.some((x) => x.bound);
      say(
        bound
          ? 'Parallel packs: not every pack\u2019s resistance is measured, so the split of the current is not known. Each unmeasured pack is judged as if it carried the whole current, and each measured pack on its share among the measured ones only: the most pessimistic split the data allows.'
          : 'Parallel packs share the current by conductance (1 \u00f7 resistance): each carries I \u00b7 G\u2096 \u00f7 \u03a3G and is judged against its own rating.',
      );
    }
    if (s && s.resistanceOhm === null) say('Pack resistance not measured: taken as zero, which reads every current on the high side; peak power is shown assuming no sag.');
    if (inp.controllerResistanceAssumed) say('Controller resistance not known: taken as zero, which reads every current on the high side.');
    if (ground && op.runRmsMotorA.value !== null) {
      say(
        `Continuous current: the larger of the RMS current over a ${messageNumber(inp.runLengthS)} s full-throttle run from standstill (${inp.runLengthDefault ? 'the default run length; set one on the build' : 'as set on the build'}) and the steady current at top speed. The run ignores the inertia of wheels, gears and rotor.`,
      );
      if (inp.tractionCoefficient.value === null) say('Traction coefficient not recorded: the run takes no wheelspin limit, which reads the current on the high side.');
    }
    if (ground) {
      const src =
        inp.drivenShareSource === 'recorded'
          ? 'as recorded for the vehicle'
          : inp.drivenShareSource === '2wd'
            ? '2WD default; record the measured share for a closer figure'
            : inp.drivenShareSource === '4wd'
              ? '4WD: all of the weight'
              : 'drive layout not recorded: all of the weight, the high-current side';
      say(`Weight on the driven wheels: ${pct(inp.drivenShare)} (${src}).`);
    }
    if (propellerBuild) {
      say(
        'Propeller: the static full-throttle current stands for both peak and continuous current. Tip speed is judged at the highest rpm the propeller can reach, Kv \u00d7 (full-charge voltage \u2212 no-load current \u00d7 resistance), which it approaches as it unloads on the move.',
      );
      if (inp.propGeared) say(`Gearbox: the propeller turns at motor rpm \u00f7 ${messageNumber(inp.propGearRatio)}, with the drivetrain efficiency taken off.`);
      if (kind === 'boat') {
        say(
          inp.waterAssumed
            ? `Water type not recorded: sea water taken (${SEA_WATER_DENSITY} kg/m\u00b3), the denser and so the higher current.`
            : inp.fluidDensity === SEA_WATER_DENSITY
              ? `Sea water, ${SEA_WATER_DENSITY} kg/m\u00b3.`
              : `Fresh water, ${FRESH_WATER_DENSITY} kg/m\u00b3.`,
        );
      }
    }
    for (const text of typicalSentences(inp, kind, marks)) say(text);
    if (suspect && measuredPeak?.value != null && modelContA.value !== null) {
      say(
        `The measured peak of ${messageNumber(measuredPeak.value)} A is below the model's continuous current of ${messageNumber(modelContA.value)} A: it looks suspect (a logger set to average, or logged on another pack), so the model's peak is judged instead.`,
      );
    }
    if ((inp.measuredPeakA || inp.measuredAverageA) && !site.measuredHere) {
      say(
        site.measuredElsewhere
          ? 'The measured currents were logged on another supply of this build; this supply is judged on the model.'
          : 'The measured currents are not tied to a supply of this build (name the supply they were logged on); every supply is judged on the model.',
      );
    }
  }

  const verdict: SupplyVerdict = {
    supplyId: supply.id,
    batteryIds: [...supply.batteryIds],
    status: worstFindingStatus(findings),
    figures,
    findings,
    packShares,
    assumptions,
  };
  if (marks.valuesUsed.length > 0) verdict.valuesUsed = marks.valuesUsed;
  if (marks.markedFigures.length > 0) verdict.markedFigures = marks.markedFigures;
  return verdict;
}

/** The motor-heat limit's name where the maker rates no heat loss. */
const RULE_OF_THUMB_LIMIT_NAME = `a rule of thumb of ${LOSS_W_PER_GRAM} W per gram of motor mass (common practice, set on the low side), not the maker's rating`;

/** Multirotor thrust-to-weight under which the check reads over, and under which tight (common practice). */
const THRUST_TO_WEIGHT_OVER = 1.3;
const THRUST_TO_WEIGHT_TIGHT = 2;

/**
 * A per-pack rating entered on some packs only (lead gauge, connector): each pack that has one
 * is judged on its share of the current; the finding names the pack with the least headroom.
 * Not judged at all where no pack of the supply has the rating.
 */
function pushPackLimit(env: RuleEnv, id: 'wire-current' | 'connector-current', totalA: Known, s: SupplyModel | null, source: 'model' | 'measured', limitOf: (b: Battery) => number | null, names: BuildContext['batteries']): void {
  if (s === null) return;
  let w: { limit: number; share: number; id: string; margin: number } | null = null;
  for (let k = 0; k < s.packs.length; k++) {
    const p = s.packs[k]!;
    const b = names.get(p.id);
    const limit = b ? limitOf(b) : null;
    if (limit === null) continue;
    const share = s.shares[k]?.share ?? 1;
    const margin = totalA.value === null ? Infinity : (limit - totalA.value * share) / limit;
    if (w === null || margin < w.margin) w = { limit, share, id: p.id, margin };
  }
  if (w === null) return;
  const value = totalA.value === null ? totalA : known(totalA.value * w.share);
  pushRule(env, id, value, known(w.limit), source, { batteryId: w.id });
}

/** A pack that must not be in the build as it is (retired, or named twice): over, naming it. */
function packFinding(rule: typeof PACK_RETIRED_RULE_ID | typeof PACK_REPEATED_RULE_ID, batteryId: string, name: string, messages: boolean): Finding {
  const message = messages ? packRuleMessage(rule, name) : '';
  return { rule, status: 'over', value: null, limit: null, unit: '', margin: null, message, batteryId };
}

/** What a pack's log shows against the health thresholds: over where worn or damaged, tight where only left charged. */
function healthFinding(batteryId: string, name: string, problems: readonly HealthProblem[], lithium: boolean, messages: boolean): Finding {
  const status: Status = problems.some((p) => p.status === 'over') ? 'over' : 'tight';
  const message = messages ? packHealthMessage(name, problems, lithium) : '';
  return { rule: PACK_HEALTH_RULE_ID, status, value: null, limit: null, unit: '', margin: null, message, batteryId };
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
