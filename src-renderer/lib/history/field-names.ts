import { PART_FIELDS } from '../parts/part-fields';
import { fieldLabel } from '../forms/draft';
import type { UnitSystem } from '$core/units';

// Plain names for the fields a history entry lists. Values in history are stored units, so
// the unit named is the stored one (mm, kg, ohm), not the display preference.

const BUILD_FIELDS: Readonly<Record<string, string>> = {
  name: 'Name',
  vehicleId: 'Vehicle',
  motorId: 'Motor',
  motorCount: 'Motor count',
  controllerId: 'Speed controller',
  propellerId: 'Propeller',
  supplies: 'Supplies',
  'gearing.pinionTeeth': 'Pinion (teeth)',
  'gearing.spurTeeth': 'Spur (teeth)',
  'gearing.internalRatio': 'Internal ratio',
  'gearing.tireDiameterMm': 'Tyre diameter (mm)',
  'gearing.drivetrainEfficiency': 'Drivetrain efficiency (0–1)',
  measuredPeakCurrentA: 'Measured peak current (A)',
  measuredAverageCurrentA: 'Measured average current (A)',
  tightThreshold: 'Tight threshold (0–1)',
  archivedAt: 'Archived',
  notes: 'Notes',
  units: 'Units',
  demoOffered: 'Demo offered',
};

const STORED: Record<string, string> = {};
for (const fields of Object.values(PART_FIELDS)) {
  for (const f of fields) {
    if (STORED[f.key]) continue;
    // History shows stored values: ohm fields stay in ohm, lengths in mm, masses in kg.
    const stored = f.scale === 1000 ? { ...f, unit: 'Ω', scale: undefined } : f.quantity === 'massSmallKg' ? { ...f, quantity: 'massKg' as const } : f;
    STORED[f.key] = fieldLabel(stored, 'metric' satisfies UnitSystem);
  }
}

export function historyFieldName(entityKind: string, field: string): string {
  if (entityKind === 'builds' || entityKind === 'settings') return BUILD_FIELDS[field] ?? field;
  return STORED[field] ?? BUILD_FIELDS[field] ?? field;
}
