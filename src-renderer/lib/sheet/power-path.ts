import type { Battery, Controller, Figures, Finding, Motor, Propeller, Status, SupplyVerdict, Vehicle } from '$core/domain';
import { FIGURES, type FigureKey } from '$core/catalogue/figures';
import { isMinimumRule, isRuleId, RULES } from '$core/catalogue/rules';
import { HEAT_LIMIT_FIELD, judgedByRuleOfThumb } from '$core/motor-heat-limit';
import { compareStatus } from '$core/status';
import { displayUnit, quantityOfUnit, toDisplay, type UnitSystem } from '$core/units';
import { DRIVETRAIN_FIGURES, MOTOR_FIGURES, PROPELLER_FIGURES, SUPPLY_FIGURES, figureText, type FigureDef } from '../figures/figure-groups';
import { MISSING, fixed, smart } from '../format/number';
import { formatRoute } from '../router/routes';
import { ruleName } from '../verdict/rule-names';
import { STAGES, stageOfRule, type Stage } from './path-stages';

// The power path of one supply, stage by stage, as plain data: what each stage is, which part
// it is, what the build asks of it against its rating, and what that figure assumed.

export interface StageLink {
  label: string;
  href: string;
}

export interface PathStage {
  stage: Stage;
  title: string;
  /** The part(s) the stage is made of, each opening its record. */
  parts: StageLink[];
  /** Said where the stage has no part chosen. */
  missing: string | null;
  /** Worst verdict of the stage's checks; null where nothing at this stage is checked. */
  status: Status | null;
  /** The deciding check of the stage, in words: "35.8 A of 60 A continuous". */
  asked: string | null;
  /** The rule that decided, for tests and links. */
  rule: string | null;
  /** A figure that describes the stage whatever the checks say: "16.80 V full charge". */
  figure: string | null;
  /** What the deciding figure assumed: "model, full charge". */
  assumed: string | null;
  /** The stage's checks, worst first. */
  findings: Finding[];
}

export interface PathParts {
  vehicle: Vehicle | null;
  motor: Motor | null;
  controller: Controller | null;
  propeller: Propeller | null;
  batteries: readonly Battery[];
  motorCount: number;
  buildId: string;
}

/** The word that says which rating a check's limit is. */
const LIMIT_WORD: Readonly<Record<string, string>> = {
  'battery-continuous': 'continuous',
  'battery-burst': 'burst',
  'controller-continuous': 'continuous',
  'controller-burst': 'burst',
  'controller-voltage': 'maximum input',
  'motor-voltage': 'rated',
  'motor-speed': 'rated',
  'motor-current': 'rated',
  'motor-power': 'rated',
  'prop-tip-speed': 'limit',
  'motor-heat': 'rated loss',
  'controller-erpm': 'eRPM limit',
  'wire-current': 'lead gauge',
  'connector-current': 'connector rating',
  'bec-current': 'BEC rating',
};

/** Which of the model's operating points a check judged, besides the charge state. */
const POINT_WORD: Readonly<Record<string, string>> = {
  'battery-continuous': 'continuous',
  'battery-burst': 'peak',
  'controller-continuous': 'continuous',
  'controller-burst': 'peak',
  'motor-current': 'peak',
  'motor-power': 'peak',
  'motor-speed': 'no load',
  'prop-tip-speed': 'unloaded',
  'motor-heat': 'continuous',
  'controller-erpm': 'no load',
  'wire-current': 'continuous',
  'connector-current': 'continuous',
  'thrust-to-weight': 'static',
  'controller-min-voltage': 'peak',
};

/** A check whose figure the user entered (the figure catalogue's `input` origin): no model, no charge state. */
function judgesEnteredFigure(rule: string): boolean {
  if (!isRuleId(rule)) return false;
  const spec = RULES[rule];
  return spec.kind === 'rating' && FIGURES[spec.figure].origin === 'input';
}

const RESISTANCE_WORDS: Readonly<Record<string, string>> = {
  'battery.cellResistanceOhm': 'pack resistance not measured, taken as zero',
  'controller.resistanceOhm': 'controller resistance not known, taken as zero',
};

/** A value in the user's units with its symbol: "35.8 A", "62.1 mph". */
export function amount(value: number | null, unit: string, system: UnitSystem): string {
  if (value === null || !Number.isFinite(value)) return MISSING;
  const q = quantityOfUnit(unit);
  const shown = q ? toDisplay(value, q, system) : value;
  // A whole rating reads as typed ("60 A"), not padded to the figure's precision.
  return `${Number.isInteger(shown) ? fixed(shown, 0) : smart(shown)} ${q ? displayUnit(q, system) : unit}`;
}

/** "35.8 A of 60 A continuous"; for a check without numbers, its name and what it lacks. */
export function askedText(f: Finding, system: UnitSystem): string {
  if (f.value === null || f.limit === null) {
    if (f.status === 'incomplete') return `${ruleName(f.rule)}: cannot be checked`;
    return ruleName(f.rule);
  }
  if (isMinimumRule(f.rule)) return `${amount(f.value, f.unit, system)}, at least ${amount(f.limit, f.unit, system)} needed`;
  const word = judgedByRuleOfThumb(f) ? 'rule-of-thumb limit' : (LIMIT_WORD[f.rule] ?? (f.rule.startsWith('class-') ? 'class limit' : 'limit'));
  return `${amount(f.value, f.unit, system)} of ${amount(f.limit, f.unit, system)} ${word}`;
}

/** What the figure behind a check assumed: charge state, model or measured, which point. */
export function assumedText(f: Finding): string | null {
  if (f.value === null) return null;
  if (judgesEnteredFigure(f.rule)) return 'as entered on the build';
  const parts: string[] = [];
  const point = POINT_WORD[f.rule];
  if (point) parts.push(point);
  if (f.unit === 'A' || f.unit === 'W') parts.push(f.source === 'measured' ? 'measured' : 'model');
  else if (f.unit === 'rpm' || f.unit === 'm/s') parts.push('model');
  parts.push(f.rule === 'controller-min-voltage' ? 'cut-off' : 'full charge');
  for (const a of f.assumed ?? []) parts.push(RESISTANCE_WORDS[a] ?? `${a} taken as zero`);
  const inputs = (f.typical ?? []).filter((t) => t !== HEAT_LIMIT_FIELD);
  if (inputs.length > 0) parts.push(inputs.some((t) => t.startsWith('propeller.')) ? 'estimated propeller values' : 'typical values used');
  if (judgedByRuleOfThumb(f)) parts.push('limit by rule of thumb per motor mass');
  return parts.join(', ');
}

/** Worst first: over, incomplete, tight, clear; the smaller margin first within a verdict. */
export function worstFirst(findings: readonly Finding[]): Finding[] {
  return [...findings].sort((a, b) => compareStatus(a.status, b.status) || (a.margin ?? Infinity) - (b.margin ?? Infinity));
}

/** The checks that decide a supply's verdict: every one that shares the supply's (worst) status, or none when all are clear. */
export function decidingChecks(v: Pick<SupplyVerdict, 'status' | 'findings'>): Finding[] {
  if (v.status === 'clear') return [];
  return worstFirst(v.findings.filter((f) => f.status !== 'clear'));
}

function findFigure(key: FigureKey): FigureDef | undefined {
  for (const g of [SUPPLY_FIGURES, MOTOR_FIGURES, DRIVETRAIN_FIGURES, PROPELLER_FIGURES]) {
    const d = g.figures.find((f) => f.key === key);
    if (d) return d;
  }
  return undefined;
}

/** A figure with a short description after it, or null where the figure has no value. */
function described(key: FigureKey, words: string, figures: Figures, system: UnitSystem): string | null {
  const def = findFigure(key);
  if (!def || typeof figures[key] !== 'number') return null;
  return `${figureText(def, figures, system)} ${words}`;
}

function firstOf(...lines: (string | null)[]): string | null {
  return lines.find((l) => l !== null) ?? null;
}

const isGround = (p: PathParts) => p.vehicle?.kind === 'car' || p.vehicle?.kind === 'truck' || (!p.vehicle && !p.propeller);

/** The five stages of one supply's power path, packs first, output last. */
export function powerPath(v: SupplyVerdict, p: PathParts, system: UnitSystem): PathStage[] {
  const ground = isGround(p);
  const byStage = new Map<Stage, Finding[]>(STAGES.map((s) => [s, []]));
  for (const f of v.findings) byStage.get(stageOfRule(f.rule, f.unit))!.push(f);
  const packs = v.batteryIds.map((id) => p.batteries.find((b) => b.id === id)).filter((b): b is Battery => !!b);
  const fig = v.figures;
  const partHref = (slug: 'packs' | 'motors' | 'controllers' | 'propellers', id: string) => formatRoute({ name: 'parts', slug, id });

  const base: Record<Stage, Omit<PathStage, 'status' | 'asked' | 'rule' | 'assumed' | 'findings'>> = {
    supply: {
      stage: 'supply',
      title: packs.length > 1 ? 'Packs' : 'Pack',
      parts: [...new Map(packs.map((b) => [b.id, b])).values()].map((b) => ({ label: b.name, href: partHref('packs', b.id) })),
      missing: packs.length === 0 ? 'no pack chosen' : null,
      figure: firstOf(described('packVoltageFullV', 'full charge', fig, system)),
    },
    controller: {
      stage: 'controller',
      title: 'Speed controller',
      parts: p.controller ? [{ label: p.controller.name, href: partHref('controllers', p.controller.id) }] : [],
      missing: p.controller ? null : 'no speed controller chosen',
      figure: firstOf(described('continuousCurrentA', 'continuous', fig, system)),
    },
    motor: {
      stage: 'motor',
      title: p.motorCount > 1 ? `Motors × ${p.motorCount}` : 'Motor',
      parts: p.motor ? [{ label: p.motor.name, href: partHref('motors', p.motor.id) }] : [],
      missing: p.motor ? null : 'no motor chosen',
      figure: firstOf(described('noLoadRpmFull', 'no load, full charge', fig, system), described('noLoadRpm', 'no load, nominal', fig, system)),
    },
    drive: ground
      ? {
          stage: 'drive',
          title: 'Gearing',
          // Gearing is kept on the build itself: its stage opens the build's form.
          parts: [{ label: 'pinion, spur and tyre', href: formatRoute({ name: 'build-edit', id: p.buildId }) }],
          missing: null,
          figure: firstOf(described('finalDriveRatio', 'final drive', fig, system)),
        }
      : {
          stage: 'drive',
          title: 'Propeller',
          parts: p.propeller ? [{ label: p.propeller.name, href: partHref('propellers', p.propeller.id) }] : [],
          missing: p.propeller ? null : 'no propeller chosen',
          figure: firstOf(described('propellerRpmStatic', 'static, full charge', fig, system)),
        },
    output: {
      stage: 'output',
      title: ground ? 'Wheels' : 'Thrust',
      parts: p.vehicle ? [{ label: p.vehicle.name, href: formatRoute({ name: 'vehicles', id: p.vehicle.id }) }] : [],
      missing: p.vehicle ? null : 'no vehicle chosen',
      figure: ground
        ? firstOf(described('loadedTopSpeedKmh', 'loaded top speed, nominal', fig, system), described('theoreticalSpeedKmh', 'theoretical speed, nominal', fig, system))
        : firstOf(described('thrustN', 'static, full charge', fig, system)),
    },
  };

  return STAGES.map((stage) => {
    const findings = worstFirst(byStage.get(stage) ?? []);
    const lead = findings[0] ?? null;
    return {
      ...base[stage],
      status: lead?.status ?? null,
      asked: lead ? askedText(lead, system) : null,
      rule: lead?.rule ?? null,
      assumed: lead ? assumedText(lead) : null,
      findings,
    };
  });
}
