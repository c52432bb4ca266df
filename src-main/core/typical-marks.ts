// Where an input was left empty and the engine took a typical value (a car's coefficients) or
// an estimate (a propeller's coefficients), every figure resting on it is marked, and until the
// user confirms the values a verdict resting on them reads no better than tight: the model is
// less sure than the headroom says.

import type { BuildInputs } from './build-inputs';
import { FIGURE_KEYS, FIGURES, type FigureKey } from './catalogue/figures';
import type { Figures, Finding, ValueUsed, VehicleKind } from './domain';
import { messageNumber } from './message-number';
import { HEAT_LIMIT_FIELD, LOSS_W_PER_GRAM } from './motor-heat-limit';
import { ESTIMATE } from './propeller-estimate';
import { WATER_ESTIMATE } from './water-propeller-estimate';

export interface TypicalMarks {
  valuesUsed: ValueUsed[];
  markedFigures: FigureKey[];
}

/** Figures that need no coefficient: the unloaded propeller turns at the motor's no-load speed. */
const UNAFFECTED: ReadonlySet<FigureKey> = new Set(['propellerRpmUnloaded', 'tipSpeedMps']);
const PEAK_FIGURES: ReadonlySet<FigureKey> = new Set(['peakCurrentA', 'motorPeakCurrentA', 'motorPeakPowerW', 'peakPowerW', 'peakPowerNoSagW', 'loadedVoltageV']);

const FIELD_WORDS: Readonly<Record<string, string>> = {
  'vehicle.dragAreaM2': 'drag area Cd·A',
  'vehicle.rollingCoefficient': 'rolling coefficient',
  'vehicle.tractionCoefficient': 'tyre grip μ',
  'propeller.thrustCoefficient': 'thrust coefficient C_T',
  'propeller.powerCoefficient': 'power coefficient C_P',
  [HEAT_LIMIT_FIELD]: 'a rule of thumb per motor mass',
};

function valueOf(inp: BuildInputs, field: string): number | null {
  switch (field) {
    case 'vehicle.dragAreaM2':
      return inp.dragAreaM2.value;
    case 'vehicle.rollingCoefficient':
      return inp.rollingCoefficient.value;
    case 'vehicle.tractionCoefficient':
      return inp.tractionCoefficient.value;
    case 'propeller.thrustCoefficient':
      return inp.thrustCoefficient.value;
    case 'propeller.powerCoefficient':
      return inp.powerCoefficient.value;
    default:
      return null;
  }
}

export function markTypical(inp: BuildInputs, findings: Finding[], figures: Figures, messages: boolean): TypicalMarks {
  const valuesUsed: ValueUsed[] = [];
  for (const field of inp.typicalFields) {
    const v = valueOf(inp, field);
    if (v !== null) valuesUsed.push({ field, value: v, basis: 'typical' });
  }
  for (const field of inp.estimatedFields) {
    const v = valueOf(inp, field);
    if (v !== null) valuesUsed.push(inp.estimateMethod === null ? { field, value: v, basis: 'estimated' } : { field, value: v, basis: 'estimated', method: inp.estimateMethod });
  }
  const heat = inp.motorHeatLimit;
  if (heat?.ruleOfThumb) markHeatLimit(findings, messages);
  const heatUsed: ValueUsed[] = heat?.ruleOfThumb ? [{ field: HEAT_LIMIT_FIELD, value: heat.lossW, basis: 'rule-of-thumb' }] : [];
  if (valuesUsed.length === 0) return { valuesUsed: heatUsed, markedFigures: [] };
  const markedFigures: FigureKey[] = [];
  for (const key of FIGURE_KEYS) {
    const spec = FIGURES[key];
    if (figures[key] === null || UNAFFECTED.has(key)) continue;
    if (spec.origin === 'model') markedFigures.push(key);
    else if (spec.origin === 'model-or-measured') {
      const source = PEAK_FIGURES.has(key) ? figures.peakCurrentSource : figures.continuousCurrentSource;
      if (source !== 'measured') markedFigures.push(key);
    }
  }
  if (!inp.typicalConfirmed) {
    const fields = valuesUsed.map((u) => u.field);
    for (const f of findings) {
      if (f.source !== 'model' || f.value === null) continue;
      f.typical = [...fields, ...(f.typical ?? [])];
      if (f.status !== 'clear') continue;
      f.status = 'tight';
      if (messages)
        f.message += ` Rests on ${valuesUsed.some((u) => u.basis === 'estimated') ? 'estimated' : 'typical'} values not yet confirmed (${fields.map((x) => FIELD_WORDS[x] ?? x).join(', ')}), so it reads no better than tight: enter measured values, or confirm them on the vehicle.`;
    }
  }
  // The heat limit is a limit, not an input of the model: no figure rests on it.
  return { valuesUsed: [...valuesUsed, ...heatUsed], markedFigures };
}

/**
 * A motor-heat finding judged against the rule of thumb reads no better than tight whatever the
 * vehicle's confirmation says: that flag vouches for the vehicle's values, and only the maker's
 * rated heat loss, entered on the motor, can clear the motor.
 */
function markHeatLimit(findings: Finding[], messages: boolean): void {
  for (const f of findings) {
    if (f.rule !== 'motor-heat' || f.value === null) continue;
    f.typical = [HEAT_LIMIT_FIELD];
    if (f.status !== 'clear') continue;
    f.status = 'tight';
    if (messages) f.message += ` The limit is ${FIELD_WORDS[HEAT_LIMIT_FIELD]}, not the maker's rating, so it reads no better than tight: enter the motor's rated heat loss where the maker gives one.`;
  }
}

const fmt = (x: number): string => messageNumber(x);

/** The sheet's sentences about the air, the typical and estimated values, run time and hover. */
export function typicalSentences(inp: BuildInputs, kind: VehicleKind | null, marks: TypicalMarks): string[] {
  const out: string[] = [];
  const airProp = kind === 'multirotor' || kind === 'plane';
  if (airProp) {
    const a = inp.air;
    out.push(
      inp.fieldAltitudeM === null && a.standardTemperature
        ? `Air: ${fmt(a.densityKgM3)} kg/m\u00b3, sea level at 15 \u00b0C (ISO 2533 standard atmosphere); set the field altitude and air temperature on the build for thinner air.`
        : `Air: ${fmt(a.densityKgM3)} kg/m\u00b3 at ${fmt(inp.fieldAltitudeM ?? 0)} m and ${fmt(a.temperatureC)} \u00b0C (${a.standardTemperature ? 'the standard temperature for the altitude' : 'as entered'}; pressure from the ISO 2533 standard atmosphere).`,
    );
  }
  const typical = marks.valuesUsed.filter((u) => u.basis === 'typical');
  if (typical.length > 0) {
    const surface = inp.surface === null ? 'surface not recorded: the highest of any surface' : `on ${inp.surface}`;
    out.push(
      `Typical values used, not entered: ${typical.map((u) => `${FIELD_WORDS[u.field] ?? u.field} ${fmt(u.value)}${u.field === 'vehicle.dragAreaM2' ? ' m\u00b2 (from the body kind and mass)' : ''}`).join(', ')} (${surface}; each from the top of its range, the high-current side). ` +
        (inp.typicalConfirmed ? 'Confirmed on the vehicle.' : 'Until they are confirmed on the vehicle, a check resting on them reads no better than tight.'),
    );
  }
  const estimated = marks.valuesUsed.filter((u) => u.basis === 'estimated');
  if (estimated.length > 0) {
    const values = estimated.map((u) => `${FIELD_WORDS[u.field] ?? u.field} ${fmt(u.value)}`).join(', ');
    const until = inp.typicalConfirmed ? 'Confirmed on the vehicle.' : 'Until confirmed, a check resting on them reads no better than tight; measured coefficients replace them.';
    if (inp.estimateMethod === 'water-b-series') {
      out.push(
        `Estimated from the propeller's diameter, pitch and blade count (water propeller, B-series at bollard, about \u00b1${Math.round(WATER_ESTIMATE.accuracy * 100)} %): ${values}. ` +
          `Taken fully submerged and held still at full throttle, with a blade-area ratio of ${fmt(WATER_ESTIMATE.assumedAreaRatio)} to ${fmt(WATER_ESTIMATE.areaRatio.max)} (not recorded; the more torque), the most current the propeller can ask for; a surface-piercing propeller under way draws less. ` +
          until,
      );
    } else {
      out.push(`Estimated from the propeller's diameter, pitch and blade count (blade-element momentum theory, about \u00b1${Math.round(ESTIMATE.accuracy * 100)} %): ${values}. ` + until);
    }
  }
  const heat = marks.valuesUsed.find((u) => u.basis === 'rule-of-thumb');
  if (heat) {
    out.push(
      `Motor heat limit: ${fmt(heat.value)} W per motor, a rule of thumb of ${LOSS_W_PER_GRAM} W per gram of motor mass (common practice, set on the low side), since the motor has no rated heat loss; the check reads no better than tight until the maker's rating is entered on the motor.`,
    );
  }
  out.push(`Run time: ${Math.round(inp.depthOfDischarge * 100)} % of the capacity (${inp.depthOfDischargeDefault ? 'the default depth of discharge; set one on the build' : 'as set on the build'}).`);
  if (kind === 'multirotor') out.push('Hover and thrust-to-weight: all-up mass is the vehicle mass plus the packs of this supply; hover at nominal voltage, the pack drop taken at the whole motor current.');
  return out;
}
