import type { BuildContext } from '$core/domain';
import { DEFAULT_TIGHT_THRESHOLD } from '$core/domain';
import type { BuildSheet } from '../state/build-sheet.svelte';

/** The evaluation context of a loaded sheet, for charts drawn from the same core as its verdict. */
export function sheetContext(sheet: BuildSheet): BuildContext {
  return {
    build: sheet.build,
    vehicle: sheet.vehicle,
    motor: sheet.motor,
    controller: sheet.controller,
    propeller: sheet.propeller,
    batteries: new Map(sheet.batteries.map((b) => [b.id, b] as const)),
    classRules: [],
    defaultTightThreshold: DEFAULT_TIGHT_THRESHOLD,
  };
}
