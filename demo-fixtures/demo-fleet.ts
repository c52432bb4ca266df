// The demo fleet: an invented repair shop with a few customers and a racer's own stable.
// The records are in demo-fleet.json (a rigbook-fleet file, so it doubles as an example of
// the format); this hands out a fresh copy each time, as an import may fill in defaults.

import demo from './demo-fleet.json';

export function demoFleet(): unknown {
  return structuredClone(demo) as unknown;
}
