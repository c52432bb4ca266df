// The figures a class limit may be set on: every figure of the catalogue, by stage, each
// labelled with its unit. A limit is typed in the unit shown and stored in the figure's own.
import { FIGURE_KEYS, FIGURE_STAGES, FIGURES, type FigureKey, type FigureStage } from '$core/catalogue/figures';
import type { UnitSystem } from '$core/units';
import { fieldUnit } from '../forms/draft';
import type { FieldDef } from '../parts/part-fields';

const STAGE_TITLES: Readonly<Record<FigureStage, string>> = {
  supply: 'Packs',
  controller: 'Speed controller',
  motor: 'Motor',
  drive: 'Gearing and drive',
  output: 'What the vehicle does',
};

/** A limit's input as a form field: the figure's unit, converted where the settings show another. */
export function limitField(figure: FigureKey): FieldDef {
  const spec = FIGURES[figure];
  const def: FieldDef = { key: 'limit', label: 'Limit', type: 'number' };
  if (spec.display) def.quantity = spec.display;
  else def.unit = spec.shown?.unit ?? spec.unit;
  if (spec.shown) def.scale = spec.shown.scale;
  return def;
}

export function limitUnit(figure: FigureKey, units: UnitSystem): string {
  return fieldUnit(limitField(figure), units);
}

/** "Full-charge voltage (V)": what the pick-list and the list of limits show. */
export function figureChoiceLabel(figure: FigureKey, units: UnitSystem): string {
  const unit = limitUnit(figure, units);
  return unit === '' ? FIGURES[figure].label : `${FIGURES[figure].label} (${unit})`;
}

export interface FigureChoiceGroup {
  title: string;
  figures: readonly FigureKey[];
}

/** The pick-list, grouped by stage of the power path in catalogue order. */
export const FIGURE_CHOICES: readonly FigureChoiceGroup[] = FIGURE_STAGES.map((stage) => ({ title: STAGE_TITLES[stage], figures: FIGURE_KEYS.filter((k) => FIGURES[k].stage === stage) })).filter((g) => g.figures.length > 0);

export function isLimitFigure(key: string): key is FigureKey {
  return (FIGURE_KEYS as readonly string[]).includes(key);
}
