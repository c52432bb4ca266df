// The build sheet's figure tables, drawn from the core's figure catalogue: a figure added
// there is listed here under its stage, with its label, unit and decimals.
import { FIGURE_KEYS, FIGURES, type FigureApplies, type FigureKey, type FigureStage } from '$core/catalogue/figures';
import type { Figures, VehicleKind } from '$core/domain';
import type { DisplayQuantity, UnitSystem } from '$core/units';
import { MISSING, fixed } from '../format/number';
import { displayUnit, toDisplay } from '$core/units';
import { thrustAsMass } from '../format/units';

export interface FigureDef {
  key: FigureKey;
  label: string;
  /** A unit that reads the same in both systems (V, A, W, rpm). */
  unit?: string;
  /** A quantity shown in the user's system (km/h or mph, mm or in). */
  quantity?: DisplayQuantity;
  decimals: number;
  /** Decimals in imperial units where they differ (a rollout of 1.30 in, not 1.3). */
  imperialDecimals?: number;
  /** Stored value × scale is shown (ohm → milliohm). */
  scale?: number;
  hint?: string;
  /** Shown only where the figure has a value (it belongs to some builds only). */
  optional?: true;
  /** A second reading beside the figure: thrust as the mass it lifts (g or oz). */
  alt?: 'thrustMass';
}

export interface FigureGroup {
  id: 'supply' | 'motor' | 'drivetrain' | 'propeller';
  title: string;
  figures: readonly FigureDef[];
}

/** A catalogue figure as a sheet row; a propeller build reads some figures its own way. */
function figureDef(key: FigureKey, propeller: boolean): FigureDef {
  const spec = FIGURES[key];
  const words = propeller && spec.asPropeller ? spec.asPropeller : spec;
  const def: FigureDef = { key, label: words.label, decimals: spec.decimals };
  if (spec.display) def.quantity = spec.display;
  else def.unit = spec.shown?.unit ?? spec.unit;
  if (spec.shown) def.scale = spec.shown.scale;
  if (spec.imperialDecimals !== undefined) def.imperialDecimals = spec.imperialDecimals;
  if (words.hint !== undefined) def.hint = words.hint;
  if (spec.optional) def.optional = true;
  if (spec.alt) def.alt = spec.alt;
  return def;
}

/**
 * The wider figures a sheet shows outside the figure tables, on screen and in print: energy and
 * run time, motor heat and electrical rpm, and for propeller builds the lift they give.
 */
export const WIDER_FIGURE_KEYS: readonly FigureKey[] = ['packEnergyWh', 'runTimeMin', 'motorLossW', 'erpm', 'allUpMassKg', 'thrustToWeight', 'hoverThrottle', 'hoverCurrentA', 'fluidDensityKgM3'];

export function widerFigures(propeller: boolean): { id: 'wider'; title: string; figures: readonly FigureDef[] } {
  // Every one is listed only where it has a value: each belongs to some builds only.
  return { id: 'wider', title: 'Energy, run time, heat and lift', figures: WIDER_FIGURE_KEYS.map((k) => ({ ...figureDef(k, propeller), optional: true })) };
}

/**
 * The catalogue's listed figures of some stages, in catalogue order. `applies` keeps the
 * figures of one kind of vehicle (all of them when 'all'); `propeller` takes the wording of a
 * propeller build.
 */
function groupOf(id: FigureGroup['id'], title: string, stages: readonly FigureStage[], applies: FigureApplies, propeller: boolean): FigureGroup {
  const keys = FIGURE_KEYS.filter((k) => {
    const spec = FIGURES[k];
    return !spec.unlisted && stages.includes(spec.stage) && (applies === 'all' || spec.applies === 'all' || spec.applies === applies);
  });
  return { id, title, figures: keys.map((k) => figureDef(k, propeller)) };
}

export const SUPPLY_FIGURES: FigureGroup = groupOf('supply', 'Supply', ['supply'], 'all', false);
export const MOTOR_FIGURES: FigureGroup = groupOf('motor', 'Motor', ['controller', 'motor'], 'all', false);
/** The motor's figures as a propeller build reads them (its loaded speed is the static point). */
export const PROPELLER_MOTOR_FIGURES: FigureGroup = groupOf('motor', 'Motor', ['controller', 'motor'], 'all', true);
export const DRIVETRAIN_FIGURES: FigureGroup = groupOf('drivetrain', 'Drivetrain', ['drive', 'output'], 'ground', false);
export const PROPELLER_FIGURES: FigureGroup = groupOf('propeller', 'Propeller', ['drive', 'output'], 'propeller', true);

const GROUND: readonly VehicleKind[] = ['car', 'truck'];

/** Supply, motor, then drivetrain for cars and trucks or propeller for the rest. */
export function figureGroupsFor(kind: VehicleKind | null): FigureGroup[] {
  if (kind === null) return [SUPPLY_FIGURES, MOTOR_FIGURES, DRIVETRAIN_FIGURES, PROPELLER_FIGURES];
  return GROUND.includes(kind) ? [SUPPLY_FIGURES, MOTOR_FIGURES, DRIVETRAIN_FIGURES] : [SUPPLY_FIGURES, PROPELLER_MOTOR_FIGURES, PROPELLER_FIGURES];
}

export function figureUnit(def: FigureDef, system: UnitSystem): string {
  return def.quantity ? displayUnit(def.quantity, system) : (def.unit ?? '');
}

/** The figure's number alone, in display units; an en dash where the figure is missing. */
export function figureNumber(def: FigureDef, figures: Figures | null | undefined, system: UnitSystem): string {
  const raw = figures?.[def.key];
  if (typeof raw !== 'number' || !Number.isFinite(raw)) return MISSING;
  const scaled = raw * (def.scale ?? 1);
  const shown = def.quantity ? toDisplay(scaled, def.quantity, system) : scaled;
  return fixed(shown, system === 'imperial' ? (def.imperialDecimals ?? def.decimals) : def.decimals);
}

/** The second reading of a figure ("1 254 g" beside the thrust in newtons), or null. */
export function figureAlt(def: FigureDef, figures: Figures | null | undefined, system: UnitSystem): string | null {
  const raw = figures?.[def.key];
  if (def.alt !== 'thrustMass' || typeof raw !== 'number' || !Number.isFinite(raw)) return null;
  return thrustAsMass(raw, system);
}

export function figureText(def: FigureDef, figures: Figures | null | undefined, system: UnitSystem): string {
  const n = figureNumber(def, figures, system);
  if (n === MISSING) return n;
  const unit = figureUnit(def, system);
  const alt = figureAlt(def, figures, system);
  return unit === ':1' ? `${n}:1` : `${n} ${unit}${alt ? ` (${alt})` : ''}`;
}
