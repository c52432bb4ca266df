// Full-throttle operating points of one build on one supply: cars and trucks through gearing
// and road load, boats, multirotors and planes through a propeller in water or air.

import type { BuildInputs } from './build-inputs';
import { groundOperatingPoint } from './ground-operating-point';
import type { Known } from './known';
import { allOf, baseNeeds, lackingAll, type Operation } from './operation';
import { propellerOperatingPoint } from './propeller-operating-point';
import type { SupplyModel } from './supply';

export function operate(inp: BuildInputs, supply: Known<SupplyModel>): Operation {
  const kind = inp.kind.value;
  if (kind === null) {
    // Without a kind nothing says how the motor is loaded: every result lacks the same inputs.
    const none = lackingAll(baseNeeds(inp, supply), []);
    return allOf(none, none, true);
  }
  return kind === 'car' || kind === 'truck' ? groundOperatingPoint(inp, supply) : propellerOperatingPoint(inp, supply);
}
