// The built-in rule catalogue. Ids are part of the rigbook-fleet interchange format.

export const BUILT_IN_RULE_IDS = [
  'controller-voltage',
  'motor-voltage',
  'motor-speed',
  'battery-continuous',
  'battery-burst',
  'controller-continuous',
  'controller-burst',
  'motor-current',
  'motor-power',
  'prop-tip-speed',
] as const;
export type BuiltInRuleId = (typeof BUILT_IN_RULE_IDS)[number];

/**
 * Packs combined in parallel at different voltages. Not a figure-against-rating rule, but it
 * reports in the same shape: the higher pack voltage against the lower.
 */
export const SUPPLY_MATCH_RULE_ID = 'supply-match';

/** A pack marked retired is in the build: over, whatever the figures say. */
export const PACK_RETIRED_RULE_ID = 'pack-retired';

/** One physical pack named twice in one build (in one supply or in two): over. */
export const PACK_REPEATED_RULE_ID = 'pack-repeated';

export const RESERVED_RULE_IDS: readonly string[] = [...BUILT_IN_RULE_IDS, SUPPLY_MATCH_RULE_ID, PACK_RETIRED_RULE_ID, PACK_REPEATED_RULE_ID];

export interface RuleText {
  readonly unit: string;
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

const PACK_RISK =
  'A pack pushed past its rating heats up, loses capacity fast and can be damaged; wires and connectors heat up too.';
const PACK_RISK_LITHIUM =
  'A lithium pack pushed past its rating heats up and swells and can catch fire; wires and connectors heat up too.';

export const RULE_TEXT: Readonly<Record<BuiltInRuleId, RuleText>> = {
  'controller-voltage': {
    unit: 'V',
    what: 'Full-charge supply voltage',
    limitName: "the controller's maximum input",
    risk: 'Too high a voltage can destroy the controller at once, and a failing controller can catch fire.',
    fix: 'Use fewer cells or a controller rated for this voltage.',
    tightHint: 'There is no room for a higher-voltage pack (for example LiHV cells or one more cell).',
    perMotor: false,
    ratedMaximum: true,
  },
  'motor-voltage': {
    unit: 'V',
    what: 'Full-charge supply voltage',
    limitName: "the motor's rated voltage",
    risk: 'The motor spins faster and draws more current than it is built for, and can overheat or fail.',
    fix: 'Use fewer cells or a motor rated for this voltage.',
    tightHint: 'There is no room for a higher-voltage pack (for example LiHV cells or one more cell).',
    perMotor: false,
    ratedMaximum: true,
  },
  'motor-speed': {
    unit: 'rpm',
    what: 'No-load speed at full charge',
    limitName: "the motor's rated speed",
    risk: 'Above its rated speed the rotor and bearings are over-stressed and the motor can come apart.',
    fix: 'Use a lower-Kv motor or fewer cells.',
    tightHint: 'There is no room for more cells or a higher Kv.',
    perMotor: false,
  },
  'battery-continuous': {
    unit: 'A',
    what: 'Continuous current from the supply',
    limitName: 'what the packs are rated for continuously (C rating × capacity)',
    risk: PACK_RISK,
    riskLithium: PACK_RISK_LITHIUM,
    fix: 'Use packs with a higher C rating or more capacity, or gear down / fit a smaller propeller.',
    tightHint: 'Little headroom: check temperatures after a run.',
    perMotor: false,
  },
  'battery-burst': {
    unit: 'A',
    what: 'Peak current from the supply',
    limitName: 'what the packs are rated for in bursts (burst C rating × capacity)',
    risk: PACK_RISK,
    riskLithium: PACK_RISK_LITHIUM,
    fix: 'Use packs with a higher burst rating, or gear down / fit a smaller propeller.',
    tightHint: 'Little headroom: check temperatures after a run.',
    perMotor: false,
  },
  'controller-continuous': {
    unit: 'A',
    what: 'Continuous current through the controller',
    limitName: "the controller's continuous rating",
    risk: 'The controller overheats and can cut out or burn; wires and connectors heat up too.',
    fix: 'Use a controller rated for more current, or gear down / fit a smaller propeller.',
    tightHint: 'Little headroom: check temperatures after a run.',
    perMotor: true,
  },
  'controller-burst': {
    unit: 'A',
    what: 'Peak current through the controller',
    limitName: "the controller's burst rating",
    risk: 'Current spikes above the burst rating can burn out the controller.',
    fix: 'Use a controller rated for more current, or gear down / fit a smaller propeller.',
    tightHint: 'Little headroom: check temperatures after a run.',
    perMotor: true,
  },
  'motor-current': {
    unit: 'A',
    what: 'Peak motor current',
    limitName: "the motor's rated current",
    risk: 'The windings overheat: the magnets can weaken and the insulation can burn.',
    fix: 'Gear down, fit a smaller propeller or use a motor rated for more current.',
    tightHint: 'Little headroom: check temperatures after a run.',
    perMotor: true,
  },
  'motor-power': {
    unit: 'W',
    what: 'Peak power into the motor',
    limitName: "the motor's rated power",
    risk: 'The motor turns the extra power into heat and can burn out.',
    fix: 'Gear down, fit a smaller propeller or use a bigger motor.',
    tightHint: 'Little headroom: check temperatures after a run.',
    perMotor: true,
  },
  'prop-tip-speed': {
    unit: 'm/s',
    what: 'Propeller tip speed at the highest rpm it can reach (unloaded, full charge)',
    limitName: '85 % of the speed of sound (340.294 m/s at 15 °C, ISA)',
    risk:
      'Near the speed of sound the propeller loses thrust, gets very loud and is stressed beyond its design; ' +
      'a propeller that breaks at speed throws pieces that injure. Keep clear of turning propellers.',
    fix: 'Use a smaller propeller, a lower-Kv motor or fewer cells.',
    tightHint: 'Little headroom: do not fit a larger propeller, more cells or a higher-Kv motor without checking again.',
    perMotor: true,
  },
};
