import type { Build, Supply } from '$core/domain';
import type { FieldDef } from '../parts/part-fields';

// The build form's scalar fields. Gearing fields carry their nested path as the key, which is
// also the path the service names in its errors (`gearing.pinionTeeth`).

export const BUILD_FIELDS = {
  name: { key: 'name', label: 'Build name', type: 'text' },
  vehicleId: { key: 'vehicleId', label: 'Vehicle', type: 'select' },
  motorId: { key: 'motorId', label: 'Motor', type: 'select', nullable: true },
  motorCount: { key: 'motorCount', label: 'Motor count', unit: 'count', type: 'integer' },
  controllerId: { key: 'controllerId', label: 'Speed controller', type: 'select', nullable: true },
  propellerId: { key: 'propellerId', label: 'Propeller', type: 'select', nullable: true },
  pinionTeeth: { key: 'gearing.pinionTeeth', label: 'Pinion', unit: 'teeth', type: 'integer', nullable: true },
  spurTeeth: { key: 'gearing.spurTeeth', label: 'Spur', unit: 'teeth', type: 'integer', nullable: true },
  internalRatio: { key: 'gearing.internalRatio', label: 'Internal ratio', unit: ':1', type: 'number', hint: 'gearbox or transmission after the spur; 1 where there is none' },
  tireDiameterMm: { key: 'gearing.tireDiameterMm', label: 'Tyre diameter', quantity: 'lengthMm', type: 'number', nullable: true },
  drivetrainEfficiency: { key: 'gearing.drivetrainEfficiency', label: 'Drivetrain efficiency', unit: '%', scale: 100, percent: true, type: 'number', hint: 'in percent: 90 for 90 %; spur and gearbox together, typically 85–95 % (common practice)' },
  measuredPeakCurrentA: { key: 'measuredPeakCurrentA', label: 'Measured peak current', unit: 'A', type: 'number', nullable: true, hint: 'whole supply; replaces the model on the supply it was logged on' },
  measuredAverageCurrentA: { key: 'measuredAverageCurrentA', label: 'Measured average current', unit: 'A', type: 'number', nullable: true, hint: 'whole supply; replaces the model on the supply it was logged on' },
  measuredSupplyId: {
    key: 'measuredSupplyId',
    label: 'Measured on supply',
    type: 'select',
    nullable: true,
    hint: 'the pack arrangement the currents were logged on; with one supply, that one',
  },
  runLengthS: {
    key: 'runLengthS',
    label: 'Run length',
    unit: 's',
    type: 'number',
    nullable: true,
    emptyText: 'default 4 s',
    hint: 'full throttle from standstill; the continuous current is judged over it (cars and trucks)',
  },
  tightThreshold: { key: 'tightThreshold', label: 'Tight threshold', unit: '% headroom', scale: 100, percent: true, type: 'number', nullable: true, emptyText: 'default', hint: 'empty: the class or default threshold' },
  notes: { key: 'notes', label: 'Notes', type: 'notes' },
} as const satisfies Record<string, FieldDef>;

export const BUILD_FIELD_LIST: readonly FieldDef[] = Object.values(BUILD_FIELDS);

export const GEARING_KEYS = ['pinionTeeth', 'spurTeeth', 'internalRatio', 'tireDiameterMm', 'drivetrainEfficiency'] as const;

/** A build as a flat record of the form's keys (`gearing.spurTeeth`). */
export function flattenBuild(b: Build): Record<string, unknown> {
  const out: Record<string, unknown> = { ...b };
  for (const k of GEARING_KEYS) out[`gearing.${k}`] = b.gearing[k];
  return out;
}

/** The form's flat values back into the shape the service takes. */
export function nestBuild(flat: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  let gearing: Record<string, unknown> | null = null;
  for (const [key, value] of Object.entries(flat)) {
    if (key.startsWith('gearing.')) {
      gearing ??= {};
      gearing[key.slice('gearing.'.length)] = value;
    } else out[key] = value;
  }
  if (gearing) out.gearing = gearing;
  return out;
}

export interface SupplyDraft {
  id?: string;
  arrangement: Supply['arrangement'];
  batteryIds: string[];
}

export function suppliesEqual(a: readonly SupplyDraft[], b: readonly SupplyDraft[]): boolean {
  return JSON.stringify(a.map((s) => [s.arrangement, s.batteryIds])) === JSON.stringify(b.map((s) => [s.arrangement, s.batteryIds]));
}
