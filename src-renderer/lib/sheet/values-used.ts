import type { ValueUsed } from '$core/domain';
import { HEAT_LIMIT_FIELD } from '$core/motor-heat-limit';
import { ESTIMATE } from '$core/propeller-estimate';
import { WATER_ESTIMATE } from '$core/water-propeller-estimate';
import { smart } from '../format/number';

// A typical or estimated input as the sheet lists it: what it is, its value, and where it came from.

const WORDS: Readonly<Record<string, { label: string; unit: string }>> = {
  'vehicle.dragAreaM2': { label: 'Drag area Cd·A', unit: ' m²' },
  'vehicle.rollingCoefficient': { label: 'Rolling coefficient', unit: '' },
  'vehicle.tractionCoefficient': { label: 'Tyre grip μ', unit: '' },
  'propeller.thrustCoefficient': { label: 'Thrust coefficient C_T', unit: '' },
  'propeller.powerCoefficient': { label: 'Power coefficient C_P', unit: '' },
  // A limit rather than an input: the motor has no rated heat loss.
  [HEAT_LIMIT_FIELD]: { label: 'Motor heat limit', unit: ' W' },
};

export function valueUsedText(u: ValueUsed): string {
  const w = WORDS[u.field] ?? { label: u.field, unit: '' };
  const basis =
    u.basis === 'rule-of-thumb'
      ? 'rule of thumb per motor mass (no better than tight until the motor maker’s rating is entered)'
      : u.basis === 'typical'
        ? 'typical value for the kind and surface'
        : u.method === 'water-b-series'
          ? `estimated (water propeller, B-series at bollard, about ±${Math.round(WATER_ESTIMATE.accuracy * 100)} %)`
          : `estimated from diameter, pitch and blades (about ±${Math.round(ESTIMATE.accuracy * 100)} %)`;
  return `${w.label}: ${smart(u.value)}${w.unit}, ${basis}`;
}
