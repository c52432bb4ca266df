// The rule catalogue: every rule a finding can name, with the figure it judges, the ratings it
// is held against, its sentences, its short name and the cautions it calls for. Ids are part
// of the rigbook-fleet interchange format. The evaluation, the build sheet, the cautions and
// the command line all read from here, so a rule missing an entry does not compile.

import type { Battery, Build, Controller, Motor, Propeller, RecordMeta, Supply, Vehicle } from '../domain';
import { cautionsOfOtherRule, CAUTION_TOPICS, type CautionFinding, type CautionTopic } from './cautions';
import type { FigureKey } from './figures';

/** The sentences of a rule that holds a figure against a rating. */
export interface RuleText {
  /** What is measured, as the start of a sentence. */
  readonly what: string;
  /** What it is held against. */
  readonly limitName: string;
  /** What can happen when over. */
  readonly risk: string;
  /** Replaces `risk` where lithium packs are involved. */
  readonly riskLithium?: string;
  readonly fix: string;
  /** Said when tight. */
  readonly tightHint: string;
  /** The figure is per motor when a build has several. */
  readonly perMotor: boolean;
  /**
   * The maker's rating is already a maximum at full charge (a "4S" controller is built for
   * 16.8 V), so reaching it exactly is within the rating: no tight band, only over.
   */
  readonly ratedMaximum?: true;
}

interface PartRecords {
  battery: Battery;
  motor: Motor;
  controller: Controller;
  propeller: Propeller;
  supply: Supply;
  build: Build;
  vehicle: Vehicle;
}

/** A field of a part record, as findings name missing inputs (`motor.maxCurrentA`). */
export type FieldPath = { [P in keyof PartRecords]: `${P}.${Exclude<keyof PartRecords[P], keyof RecordMeta> & string}` }[keyof PartRecords];

interface RuleBase {
  /** Short name for table rows, chart axes and the command line's summary. */
  readonly name: string;
  /** The record fields the limit comes from (the part maker's ratings). */
  readonly limit: readonly FieldPath[];
  /** Cautions an `over` finding calls for; `fire` only where the supply holds lithium packs. */
  readonly cautions: readonly CautionTopic[];
}

/** A figure held against a part's rating: over, tight or clear by margin. */
export interface RatingRule extends RuleBase {
  readonly kind: 'rating';
  readonly figure: FigureKey;
  readonly text: RuleText;
}

/** A pack that must not be in the build as it is: over whatever the figures say. */
export interface PackRule extends RuleBase {
  readonly kind: 'pack';
  readonly figure: null;
  /** The whole message, naming the pack. */
  readonly over: (packName: string) => string;
}

/** Packs in parallel that do not match: the higher pack voltage against the lower. */
export interface MatchRule extends RuleBase {
  readonly kind: 'match';
  readonly figure: FigureKey;
  readonly over: string;
}

export type RuleSpec = RatingRule | PackRule | MatchRule;

const PACK_RISK = 'A pack pushed past its rating heats up, loses capacity fast and can be damaged; wires and connectors heat up too.';
const PACK_RISK_LITHIUM = 'A lithium pack pushed past its rating heats up and swells and can catch fire; wires and connectors heat up too.';

const RATING_TEXT = {
  'controller-voltage': {
    what: 'Full-charge supply voltage',
    limitName: "the controller's maximum input",
    risk: 'Too high a voltage can destroy the controller at once, and a failing controller can catch fire.',
    fix: 'Use fewer cells or a controller rated for this voltage.',
    tightHint: 'There is no room for a higher-voltage pack (for example LiHV cells or one more cell).',
    perMotor: false,
    ratedMaximum: true,
  },
  'motor-voltage': {
    what: 'Full-charge supply voltage',
    limitName: "the motor's rated voltage",
    risk: 'The motor spins faster and draws more current than it is built for, and can overheat or fail.',
    fix: 'Use fewer cells or a motor rated for this voltage.',
    tightHint: 'There is no room for a higher-voltage pack (for example LiHV cells or one more cell).',
    perMotor: false,
    ratedMaximum: true,
  },
  'motor-speed': {
    what: 'No-load speed at full charge',
    limitName: "the motor's rated speed",
    risk: 'Above its rated speed the rotor and bearings are over-stressed and the motor can come apart.',
    fix: 'Use a lower-Kv motor or fewer cells.',
    tightHint: 'There is no room for more cells or a higher Kv.',
    perMotor: false,
  },
  'battery-continuous': {
    what: 'Continuous current from the supply',
    limitName: 'what the packs are rated for continuously (C rating × capacity)',
    risk: PACK_RISK,
    riskLithium: PACK_RISK_LITHIUM,
    fix: 'Use packs with a higher C rating or more capacity, or gear down / fit a smaller propeller.',
    tightHint: 'Little headroom: check temperatures after a run.',
    perMotor: false,
  },
  'battery-burst': {
    what: 'Peak current from the supply',
    limitName: 'what the packs are rated for in bursts (burst C rating × capacity)',
    risk: PACK_RISK,
    riskLithium: PACK_RISK_LITHIUM,
    fix: 'Use packs with a higher burst rating, or gear down / fit a smaller propeller.',
    tightHint: 'Little headroom: check temperatures after a run.',
    perMotor: false,
  },
  'controller-continuous': {
    what: 'Continuous current through the controller',
    limitName: "the controller's continuous rating",
    risk: 'The controller overheats and can cut out or burn; wires and connectors heat up too.',
    fix: 'Use a controller rated for more current, or gear down / fit a smaller propeller.',
    tightHint: 'Little headroom: check temperatures after a run.',
    perMotor: true,
  },
  'controller-burst': {
    what: 'Peak current through the controller',
    limitName: "the controller's burst rating",
    risk: 'Current spikes above the burst rating can burn out the controller.',
    fix: 'Use a controller rated for more current, or gear down / fit a smaller propeller.',
    tightHint: 'Little headroom: check temperatures after a run.',
    perMotor: true,
  },
  'motor-current': {
    what: 'Peak motor current',
    limitName: "the motor's rated current",
    risk: 'The windings overheat: the magnets can weaken and the insulation can burn.',
    fix: 'Gear down, fit a smaller propeller or use a motor rated for more current.',
    tightHint: 'Little headroom: check temperatures after a run.',
    perMotor: true,
  },
  'motor-power': {
    what: 'Peak power into the motor',
    limitName: "the motor's rated power",
    risk: 'The motor turns the extra power into heat and can burn out.',
    fix: 'Gear down, fit a smaller propeller or use a bigger motor.',
    tightHint: 'Little headroom: check temperatures after a run.',
    perMotor: true,
  },
  'prop-tip-speed': {
    what: 'Propeller tip speed at the highest rpm it can reach (unloaded, full charge)',
    limitName: '85 % of the speed of sound (340.294 m/s at 15 °C, ISA)',
    risk: 'Near the speed of sound the propeller loses thrust, gets very loud and is stressed beyond its design; ' + 'a propeller that breaks at speed throws pieces that injure. Keep clear of turning propellers.',
    fix: 'Use a smaller propeller, a lower-Kv motor or fewer cells.',
    tightHint: 'Little headroom: do not fit a larger propeller, more cells or a higher-Kv motor without checking again.',
    perMotor: true,
  },
  // The wider checks.
  'motor-heat': {
    what: 'Heat loss in the motor at the continuous current (I²·R + I₀·V)',
    limitName: "the motor's rated heat loss",
    risk: 'The windings get hotter than the motor is built for: the magnets can weaken and the insulation can burn.',
    fix: 'Gear down, fit a smaller propeller, improve the cooling or use a bigger motor.',
    tightHint: 'Little headroom: check the motor temperature after a run.',
    perMotor: true,
  },
  'controller-erpm': {
    what: 'Electrical rpm at no load, full charge (motor rpm × pole pairs)',
    limitName: "the controller's electrical rpm limit",
    risk: 'Past its eRPM limit the controller loses step with the motor: the motor stutters or stops and the current can spike.',
    fix: 'Use a lower-Kv motor, fewer cells, or a controller with a higher eRPM limit.',
    tightHint: 'There is no room for more cells or a higher Kv.',
    perMotor: false,
  },
  'thrust-to-weight': {
    what: 'Static thrust-to-weight ratio',
    limitName: 'the least a multirotor needs to hold a hover and still climb and steer (under 2 reads tight; common practice)',
    risk: 'With so little thrust to spare the craft may not climb, recover from a gust or stop a descent, and it can come down on people or property.',
    fix: 'Lighten the craft, or fit larger propellers, more cells or stronger motors within their ratings.',
    tightHint: 'Under 2:1 there is little thrust to spare for climbing, wind and control (common practice).',
    perMotor: false,
  },
  'controller-min-voltage': {
    what: 'Supply voltage at cut-off under the peak current',
    limitName: "the controller's minimum input voltage",
    risk: 'Near the end of a run the voltage sags below what the controller works on: it cuts out or resets without warning.',
    fix: 'Use one more cell in series, packs with a lower resistance, or a controller that works at a lower voltage; land or stop earlier.',
    tightHint: 'Little room: a colder or older pack sags further; stop the run before the pack reaches cut-off.',
    perMotor: false,
  },
  'wire-current': {
    what: 'Continuous current through the pack leads',
    limitName: 'what the lead gauge carries in chassis wiring (AWG ampacity table)',
    risk: 'Undersized leads heat up: insulation softens and can melt and short, and solder joints can let go.',
    fix: 'Use heavier leads (a lower AWG number), or gear down / fit a smaller propeller. The wire maker\u2019s own rating comes first.',
    tightHint: 'Little headroom: check how warm the leads get after a run.',
    perMotor: false,
  },
  'connector-current': {
    what: 'Continuous current through the pack connector',
    limitName: "the connector's rating",
    risk: 'An overloaded connector heats up, its contacts wear and can weld or melt the housing.',
    fix: 'Use a connector rated for more current, or gear down / fit a smaller propeller.',
    tightHint: 'Little headroom: check how warm the connector gets after a run.',
    perMotor: false,
  },
  'bec-current': {
    what: 'Receiver and servo load on the BEC (as entered)',
    limitName: "the controller's BEC rating",
    risk: 'An overloaded BEC lets its voltage sag or cuts out: the receiver browns out and control is lost, and a vehicle or aircraft can run away.',
    fix: 'Use a controller with a stronger BEC, lighter servos, or a separate regulator (UBEC) for the receiver and servos.',
    tightHint: 'Little headroom: servos at stall or several moving at once can draw more than entered.',
    perMotor: false,
  },
} as const satisfies Record<string, RuleText>;

const PACK_CAUTIONS = ['fire', 'heat'] as const satisfies readonly CautionTopic[];

// Order matters: findings come out in this order, and the design brief lists the rating
// rules in it.
const CATALOGUE = {
  'controller-voltage': {
    kind: 'rating',
    figure: 'packVoltageFullV',
    limit: ['controller.maxVoltageV', 'controller.maxCells'],
    name: 'Controller voltage',
    cautions: ['voltage'],
    text: RATING_TEXT['controller-voltage'],
  },
  'motor-voltage': {
    kind: 'rating',
    figure: 'packVoltageFullV',
    limit: ['motor.maxVoltageV'],
    name: 'Motor voltage',
    cautions: ['voltage'],
    text: RATING_TEXT['motor-voltage'],
  },
  'motor-speed': {
    kind: 'rating',
    figure: 'noLoadRpmFull',
    limit: ['motor.maxRpm'],
    name: 'Motor speed',
    cautions: ['mechanical'],
    text: RATING_TEXT['motor-speed'],
  },
  'battery-continuous': {
    kind: 'rating',
    figure: 'continuousCurrentA',
    limit: ['battery.cRatingContinuous', 'battery.capacityMah'],
    name: 'Pack continuous current',
    cautions: PACK_CAUTIONS,
    text: RATING_TEXT['battery-continuous'],
  },
  'battery-burst': {
    kind: 'rating',
    figure: 'peakCurrentA',
    limit: ['battery.cRatingBurst', 'battery.capacityMah'],
    name: 'Pack burst current',
    cautions: PACK_CAUTIONS,
    text: RATING_TEXT['battery-burst'],
  },
  'controller-continuous': {
    kind: 'rating',
    figure: 'motorContinuousCurrentA',
    limit: ['controller.continuousCurrentA'],
    name: 'Controller continuous current',
    cautions: ['heat'],
    text: RATING_TEXT['controller-continuous'],
  },
  'controller-burst': {
    kind: 'rating',
    figure: 'motorPeakCurrentA',
    limit: ['controller.burstCurrentA'],
    name: 'Controller burst current',
    cautions: ['heat'],
    text: RATING_TEXT['controller-burst'],
  },
  'motor-current': {
    kind: 'rating',
    figure: 'motorPeakCurrentA',
    limit: ['motor.maxCurrentA'],
    name: 'Motor current',
    cautions: ['heat'],
    text: RATING_TEXT['motor-current'],
  },
  'motor-power': {
    kind: 'rating',
    figure: 'motorPeakPowerW',
    limit: ['motor.maxPowerW'],
    name: 'Motor power',
    cautions: ['heat'],
    text: RATING_TEXT['motor-power'],
  },
  'prop-tip-speed': {
    // The limit is a fraction of the speed of sound unless the maker's rpm limit is stricter.
    kind: 'rating',
    figure: 'tipSpeedMps',
    limit: ['propeller.maxRpm', 'propeller.diameterMm'],
    name: 'Propeller tip speed',
    cautions: ['propeller'],
    text: RATING_TEXT['prop-tip-speed'],
  },
  'motor-heat': {
    kind: 'rating',
    figure: 'motorLossW',
    // The maker's rated loss; without one, a rule of thumb on the motor's mass (core/motor-heat-limit.ts).
    limit: ['motor.maxLossW', 'motor.massKg'],
    name: 'Motor heat',
    cautions: ['heat'],
    text: RATING_TEXT['motor-heat'],
  },
  'controller-erpm': {
    kind: 'rating',
    figure: 'erpm',
    limit: ['controller.maxErpm', 'motor.poles'],
    name: 'Controller eRPM',
    cautions: ['heat'],
    text: RATING_TEXT['controller-erpm'],
  },
  'thrust-to-weight': {
    // A least value rather than a most: judged by its own check (core/minimum-check.ts).
    kind: 'rating',
    figure: 'thrustToWeight',
    limit: ['vehicle.massKg', 'battery.massKg'],
    name: 'Thrust to weight',
    cautions: ['flight', 'propeller'],
    text: RATING_TEXT['thrust-to-weight'],
  },
  'controller-min-voltage': {
    // A least value: judged by the same check as thrust-to-weight.
    kind: 'rating',
    figure: 'loadedCutoffVoltageV',
    limit: ['controller.minVoltageV'],
    name: 'Controller minimum voltage',
    cautions: ['brownout'],
    text: RATING_TEXT['controller-min-voltage'],
  },
  'wire-current': {
    kind: 'rating',
    figure: 'continuousCurrentA',
    limit: ['battery.wireGaugeAwg'],
    name: 'Lead wire current',
    cautions: ['heat'],
    text: RATING_TEXT['wire-current'],
  },
  'connector-current': {
    kind: 'rating',
    figure: 'continuousCurrentA',
    limit: ['battery.connectorRatingA'],
    name: 'Connector current',
    cautions: ['heat'],
    text: RATING_TEXT['connector-current'],
  },
  'bec-current': {
    // Judged only where both the rating and the load are entered: without a load there is nothing to claim.
    kind: 'rating',
    figure: 'becLoadA',
    limit: ['controller.becCurrentA'],
    name: 'BEC current',
    cautions: ['receiver'],
    text: RATING_TEXT['bec-current'],
  },
  'supply-match': {
    kind: 'match',
    figure: 'packVoltageFullV',
    limit: ['battery.chemistry', 'battery.cellsSeries'],
    name: 'Packs matched in parallel',
    cautions: PACK_CAUTIONS,
    over:
      'Packs in parallel must have the same chemistry and cell count. Connected like this, the ' +
      'fuller pack pushes a large current into the other one at once: wires, connectors and ' +
      'lithium packs can overheat and catch fire. Use matched packs, and connect them only when ' +
      'their voltages are within 0.1 V per cell of each other (measure first).',
  },
  'pack-retired': {
    kind: 'pack',
    figure: null,
    limit: ['battery.retired'],
    name: 'Retired pack',
    cautions: PACK_CAUTIONS,
    over: (name: string): string => `Pack retired: "${name}" is marked retired and must not be used. Retired lithium packs can fail under load; take it out of the build and dispose of it as the pack maker and local rules say.`,
  },
  'pack-repeated': {
    kind: 'pack',
    figure: null,
    limit: ['supply.batteryIds'],
    name: 'Pack listed twice',
    cautions: PACK_CAUTIONS,
    over: (name: string): string => `Pack listed twice: "${name}" appears more than once in this build, but one physical pack can only be in one place. Pick a second pack or remove the repeat.`,
  },
  'pack-health': {
    // Read from the pack's log (resistance growth, capacity checks, inspections, storage); the thresholds are settings.
    kind: 'pack',
    figure: null,
    limit: ['battery.cellResistanceOhm', 'battery.capacityMah'],
    name: 'Pack health',
    cautions: ['fire', 'storage', 'heat'],
    over: (name: string): string => `Pack health: the log of "${name}" shows it worn, damaged or left charged.`,
  },
} as const satisfies Record<string, RuleSpec>;

/** Every rule a finding can name, except class rules (their ids start with `class-`). */
export type RuleId = keyof typeof CATALOGUE;

/** The rules that hold a figure against a part's rating. */
export type BuiltInRuleId = { [K in RuleId]: (typeof CATALOGUE)[K]['kind'] extends 'rating' ? K : never }[RuleId];

export const RULES: Readonly<Record<RuleId, RuleSpec>> = CATALOGUE;

export function isRuleId(id: string): id is RuleId {
  return Object.hasOwn(CATALOGUE, id);
}

export const RULE_IDS: readonly RuleId[] = Object.keys(CATALOGUE).filter(isRuleId);

function isBuiltIn(id: RuleId): id is BuiltInRuleId {
  return CATALOGUE[id].kind === 'rating';
}

export const BUILT_IN_RULE_IDS: readonly BuiltInRuleId[] = RULE_IDS.filter(isBuiltIn);

/** A rating rule's spec, typed as one. */
export function ratingRule(id: BuiltInRuleId): RatingRule {
  return CATALOGUE[id];
}

/** The message of a pack rule's finding, naming the pack. */
export function packRuleMessage(id: typeof PACK_RETIRED_RULE_ID | typeof PACK_REPEATED_RULE_ID, packName: string): string {
  return CATALOGUE[id].over(packName);
}

/** The message of a supply-match finding. */
export const SUPPLY_MATCH_MESSAGE: string = CATALOGUE['supply-match'].over;

export const SUPPLY_MATCH_RULE_ID = 'supply-match' satisfies RuleId;
export const PACK_RETIRED_RULE_ID = 'pack-retired' satisfies RuleId;
export const PACK_REPEATED_RULE_ID = 'pack-repeated' satisfies RuleId;
export const PACK_HEALTH_RULE_ID = 'pack-health' satisfies RuleId;

/**
 * The message of a pack-health finding: what the log shows, then what to do. A worn or
 * damaged lithium pack is taken out of use; one left charged is brought to storage voltage.
 */
export function packHealthMessage(packName: string, problems: readonly { text: string; status: 'over' | 'tight' }[], lithium: boolean): string {
  const worn = problems.some((p) => p.status === 'over');
  const what = problems.map((p) => p.text).join('; ');
  const advice = worn
    ? lithium
      ? "A worn or damaged lithium pack sags more, heats more and can swell or catch fire under load: check it against the pack maker's limits, and retire a puffed or damaged pack and dispose of it as the maker and local rules say."
      : "A worn or damaged pack sags and heats more under load: check it against the pack maker's limits before using it again."
    : 'Bring it to storage voltage (charge or discharge it there) and store it on a fire-safe surface, as the pack maker says.';
  return `Pack health: "${packName}" ${what}. ${advice}`;
}

/** Ids a class rule may not take. */
export const RESERVED_RULE_IDS: readonly string[] = RULE_IDS;

/**
 * Class and shop rules are records, not entries: a class names a figure key of the figure
 * catalogue and a limit. What they share lives here; their ids start with the prefix, so they
 * never clash with the catalogue's.
 */
export const CLASS_RULE = {
  idPrefix: 'class-',
  limitName: (className: string): string => `the ${className} class limit`,
  risk: 'The build does not meet the class rules.',
  fix: 'Change the parts or gearing, or run it in another class.',
  tightHint: 'Little room before the class limit.',
} as const;

/** Short name of a rule for rows and axes; a class rule is named by its own id. */
export function ruleName(rule: string): string {
  if (isRuleId(rule)) return CATALOGUE[rule].name;
  // Class rules are named by their shop or class: "class-max-voltage" → "Class: max voltage".
  if (rule.startsWith(CLASS_RULE.idPrefix)) return `Class: ${rule.slice(CLASS_RULE.idPrefix.length).replace(/-/g, ' ')}`;
  return rule;
}

/** True where the rating is a hard maximum (voltages): at the limit is still inside, so no tight band. */
export function isRatedMaximum(rule: string): boolean {
  if (!isRuleId(rule)) return false;
  const spec: RuleSpec = CATALOGUE[rule];
  return spec.kind === 'rating' && spec.text.ratedMaximum === true;
}

/** Rules whose figure must stay at or above the limit (the finding's limit is the least value). */
export const MINIMUM_RULE_IDS: readonly RuleId[] = ['thrust-to-weight', 'controller-min-voltage'];

export function isMinimumRule(rule: string): boolean {
  return (MINIMUM_RULE_IDS as readonly string[]).includes(rule);
}

/** The cautions an `over` finding calls for (a class rule's by its unit); none for any other status. */
export function cautionsFor(finding: CautionFinding, lithium: boolean): CautionTopic[] {
  if (finding.status !== 'over') return [];
  const topics = isRuleId(finding.rule) ? CATALOGUE[finding.rule].cautions : cautionsOfOtherRule(finding);
  // The fire and storage cautions are about lithium packs; other chemistries still heat their wiring.
  return topics.filter((t) => (t !== 'fire' && t !== 'storage') || lithium);
}

/** Every caution of a set of findings, once each, in a fixed order. */
export function cautionsOfAll(findings: readonly CautionFinding[], lithium: boolean): CautionTopic[] {
  const seen = new Set<CautionTopic>();
  for (const f of findings) for (const c of cautionsFor(f, lithium)) seen.add(c);
  return CAUTION_TOPICS.filter((c) => seen.has(c));
}
