// What can happen when a figure is over, in the plain words a workshop poster would use. A
// finding's own message says what to change; these say why it matters. Each rule of the rule
// catalogue names its topics, so the sheet and the command line warn alike.

import type { Finding } from '../domain';

export const CAUTION_TOPICS = ['fire', 'storage', 'heat', 'propeller', 'voltage', 'mechanical', 'flight', 'brownout', 'receiver'] as const;
export type CautionTopic = (typeof CAUTION_TOPICS)[number];

export const CAUTION_TEXT: Readonly<Record<CautionTopic, string>> = {
  fire: 'Fire risk: a lithium pack driven past its rating heats up, swells and can catch fire. Charge and store packs on a fire-safe surface, never unattended.',
  storage:
    'Storage: keep lithium packs at storage voltage (about 3.8 V a cell for LiPo) when not in use for more than a few days, in a fire-safe container away from heat and things that burn; charge only on a fire-safe surface, never unattended. Follow the pack maker\u2019s instructions and local rules.',
  heat: 'Heat: current above the rating heats wires, connectors and solder joints; insulation can melt and short.',
  propeller: 'Injury risk: a propeller near the speed of sound is stressed beyond its design and can break and throw pieces. Keep clear of turning propellers.',
  voltage: 'Over-voltage can destroy a controller or motor at once; a failing controller can catch fire.',
  mechanical: 'Above its rated speed a motor’s rotor and bearings are over-stressed and can come apart.',
  brownout: 'Brown-out: a controller that drops below its minimum input voltage cuts out or resets; a craft in the air loses power and comes down, a vehicle stops or lurches.',
  receiver:
    'Receiver supply: a BEC asked for more than it gives lets the receiver brown out, and control is lost: a vehicle or aircraft can run away or come down. Follow the maker\u2019s BEC rating, count the servos\u2019 stall current, and use a separate regulator when in doubt.',
  flight: 'Flight risk: a craft with little thrust to spare can fail to climb or recover and come down without warning. Fly away from people and follow local rules for flying.',
};

/** The finding fields the cautions are chosen by. */
export type CautionFinding = Pick<Finding, 'rule' | 'status' | 'unit'>;

/**
 * Topics of a rule outside the catalogue (a class or shop rule), judged by its unit and id:
 * a current or power limit heats wiring, a voltage limit guards the electronics.
 */
export function cautionsOfOtherRule(finding: CautionFinding): CautionTopic[] {
  if (finding.unit === 'A' || finding.unit === 'W') return ['heat'];
  if (finding.rule.endsWith('-voltage') || finding.unit === 'V') return ['voltage'];
  return [];
}
