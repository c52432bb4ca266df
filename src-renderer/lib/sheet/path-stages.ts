// Which stage of the power path each figure and each check belongs to, read from the core's
// catalogues: a figure's stage is its catalogue entry's, a rule's is the part whose rating it
// holds the figure against (a pack's current check sits on the packs, the controller's on the
// controller). Nothing here is a list of its own.

import { FIGURE_STAGES, FIGURES, isFigureKey, type FigureStage } from '$core/catalogue/figures';
import { isRuleId, RULES } from '$core/catalogue/rules';

export const STAGES = FIGURE_STAGES;
export type Stage = FigureStage;

/** The record a rating comes from → the stage that part stands on. */
const PART_STAGE: ReadonlyMap<string, Stage> = new Map([
  ['battery', 'supply'],
  ['supply', 'supply'],
  ['controller', 'controller'],
  ['motor', 'motor'],
  ['propeller', 'drive'],
  ['build', 'drive'],
]);

const UNIT_STAGE: Readonly<Record<string, Stage>> = {
  V: 'supply',
  A: 'controller',
  W: 'motor',
  rpm: 'motor',
  'm/s': 'drive',
  'km/h': 'output',
  N: 'output',
};

export function stageOfFigure(key: string): Stage {
  return isFigureKey(key) ? FIGURES[key].stage : 'supply';
}

/** A built-in rule stands where its rating comes from; a class rule has no part, so it is placed by the unit of what it limits. */
export function stageOfRule(rule: string, unit: string): Stage {
  if (isRuleId(rule)) {
    const spec = RULES[rule];
    const part = PART_STAGE.get(spec.limit[0]?.split('.')[0] ?? '');
    if (part !== undefined) return part;
    if (spec.figure !== null) return FIGURES[spec.figure].stage;
  }
  return UNIT_STAGE[unit] ?? 'supply';
}
