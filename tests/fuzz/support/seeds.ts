import fc from 'fast-check';
import { pick, type Gen } from './payloads';
import type { FuzzStore } from './fuzz-store';
import { draftFieldKeys, isDraftKind } from '../../../src-main/core/catalogue/draft-fields';

// One valid payload per handler, built against what the store holds right now (real ids, the
// current version), so that a payload bent by one field still reaches the handler's own checks.

const PART_BASES: Record<string, Record<string, unknown>> = {
  batteries: { name: 'Fuzz 3S 2200', chemistry: 'lipo', cellsSeries: 3, cellsParallel: 1, capacityMah: 2200, cRatingContinuous: 40, cRatingBurst: 80, cellResistanceOhm: 0.004, massKg: 0.19, cycleCount: 3, retired: false, notes: 'fuzz' },
  motors: { name: 'Fuzz 2300', kv: 2300, resistanceOhm: 0.03, noLoadCurrentA: 1.2, maxCurrentA: 40, maxPowerW: 600, maxVoltageV: 16.8, maxRpm: 40000, poles: 14, massKg: 0.05, notes: '' },
  controllers: { name: 'Fuzz 60A', maxVoltageV: 25.2, maxCells: 6, continuousCurrentA: 60, burstCurrentA: 80, resistanceOhm: 0.002, massKg: 0.06, notes: '' },
  propellers: { name: 'Fuzz 5x4', diameterMm: 127, pitchMm: 102, blades: 3, thrustCoefficient: 0.11, powerCoefficient: 0.05, notes: '' },
  vehicles: { name: 'Fuzz racer', kind: 'car', massKg: 1.5, dragAreaM2: 0.03, rollingCoefficient: 0.03, tractionCoefficient: 1, owner: 'Shop', className: 'club', notes: '' },
  classRules: { className: 'club', ruleId: 'class-peak', figure: 'peakCurrentA', limit: 90, unit: 'A', notes: '' },
};

/** A draft part: mostly only the fields a draft takes (so most are tried), sometimes a whole record (refused by field). */
function draftPart(g: Gen, kind: string): Record<string, unknown> {
  const whole = { ...PART_BASES[kind], ...someFields(g, kind) };
  if (!isDraftKind(kind) || g(fc.integer, { min: 0, max: 3 }) === 0) return whole;
  const keys: readonly string[] = draftFieldKeys(kind);
  return Object.fromEntries(Object.entries(whole).filter(([key]) => keys.includes(key)));
}

/** Second valid values, so an update changes something (and verdicts move). */
const PART_ALTERNATES: Record<string, Record<string, unknown>> = {
  batteries: { cRatingContinuous: 5, cellsSeries: 6, chemistry: 'lihv', retired: true, cellResistanceOhm: null },
  motors: { kv: 900, maxCurrentA: 10, maxVoltageV: null, resistanceOhm: 0.2 },
  controllers: { maxVoltageV: 8.4, continuousCurrentA: 15, maxCells: null },
  propellers: { diameterMm: 254, powerCoefficient: 0.09, blades: 2 },
  vehicles: { kind: 'plane', className: '', massKg: 4, tractionCoefficient: null },
  classRules: { limit: 5, figure: 'packVoltageFullV', className: 'other', unit: 'V' },
};

const PART_KINDS = Object.keys(PART_BASES);

function someFields(g: Gen, kind: string): Record<string, unknown> {
  const base = PART_BASES[kind]!;
  const alt = PART_ALTERNATES[kind]!;
  const keys = Object.keys(base);
  const out: Record<string, unknown> = {};
  const count = g(fc.integer, { min: 1, max: 3 });
  for (let i = 0; i < count; i++) {
    const key = pick(g, keys);
    out[key] = key in alt && g(fc.boolean) ? alt[key] : base[key];
  }
  return out;
}

function gearing(g: Gen): Record<string, unknown> {
  return { pinionTeeth: g(fc.integer, { min: 10, max: 30 }), spurTeeth: pick(g, [76, 87, 100]), internalRatio: 2.6, tireDiameterMm: pick(g, [84, 110, null]), drivetrainEfficiency: 0.9 };
}

function buildFields(g: Gen, store: FuzzStore): Record<string, unknown> {
  const packs = store.ids('batteries');
  return {
    name: 'Fuzz build',
    vehicleId: pick(g, store.ids('vehicles')),
    motorId: pick(g, [...store.ids('motors'), null]),
    motorCount: pick(g, [1, 2, 4]),
    controllerId: pick(g, [...store.ids('controllers'), null]),
    propellerId: pick(g, [...store.ids('propellers'), null]),
    gearing: gearing(g),
    supplies: [{ arrangement: pick(g, ['series', 'parallel']), batteryIds: [pick(g, packs), ...(g(fc.boolean) ? [pick(g, packs)] : [])] }],
    measuredPeakCurrentA: pick(g, [null, 80]),
    measuredAverageCurrentA: pick(g, [null, 25]),
    tightThreshold: pick(g, [null, 0.2]),
    notes: '',
  };
}

function someBuildChanges(g: Gen, store: FuzzStore): Record<string, unknown> {
  const all = buildFields(g, store);
  const keys = Object.keys(all);
  const out: Record<string, unknown> = {};
  const count = g(fc.integer, { min: 1, max: 3 });
  for (let i = 0; i < count; i++) {
    const key = pick(g, keys);
    out[key] = all[key];
  }
  return out;
}

function target(g: Gen, store: FuzzStore, kind: string): { id: string; expectedVersion: number } {
  const id = pick(g, store.ids(kind));
  const current = store.version(kind, id);
  // Mostly the current version; sometimes a stale or future one, to reach the conflict path.
  return { id, expectedVersion: pick(g, [current, current, current, current, Math.max(1, current - 1), current + 1]) };
}

/** What the fleet handlers need that is read from the store before the run: its export, as an object and as CSV. */
export interface SeedFiles {
  fleet: unknown;
  csv: Map<string, string>;
  /** A folder the fuzz may write files into. */
  sandbox: string;
}

/** A valid payload for the handler, or null for a handler this file does not know (it still gets the malformed fuzz). */
export function validPayload(name: string, g: Gen, store: FuzzStore, files: SeedFiles): unknown {
  const [kind = '', verb = ''] = name.split('.');
  if (PART_KINDS.includes(kind)) {
    if (verb === 'list') return pick(g, [{}, { includeArchived: true }, undefined]);
    if (verb === 'get') return { id: pick(g, store.ids(kind)) };
    if (verb === 'create') return { ...PART_BASES[kind], ...(g(fc.boolean) ? someFields(g, kind) : {}), ...(g(fc.boolean) ? { id: pick(g, [`${kind}-fuzz`, ...store.ids(kind)]) } : {}) };
    if (verb === 'update') return { ...target(g, store, kind), changes: someFields(g, kind), reason: 'fuzz' };
    if (verb === 'archive') return { ...target(g, store, kind), archived: g(fc.boolean), reason: 'fuzz' };
  }
  if (kind === 'builds') {
    if (verb === 'list') {
      return {
        text: pick(g, ['', 'fuzz', '%', '_', 'seed build 1']),
        statuses: [pick(g, ['over', 'tight', 'incomplete', 'clear'])],
        kinds: [pick(g, ['car', 'truck', 'boat', 'multirotor', 'plane'])],
        owner: pick(g, ['', 'Shop']),
        partId: pick(g, [...store.ids('batteries'), ...store.ids('motors')]),
        includeArchived: g(fc.boolean),
        limit: g(fc.integer, { min: 1, max: 50 }),
      };
    }
    if (verb === 'get') return { id: pick(g, store.ids('builds')) };
    if (verb === 'create') return { ...buildFields(g, store), ...(g(fc.boolean) ? { id: pick(g, ['build-fuzz', ...store.ids('builds')]) } : {}) };
    if (verb === 'update') return { ...target(g, store, 'builds'), changes: someBuildChanges(g, store), reason: 'fuzz' };
    if (verb === 'archive') return { ...target(g, store, 'builds'), archived: g(fc.boolean), reason: 'fuzz' };
    if (verb === 'preview') {
      if (g(fc.integer, { min: 0, max: 3 }) === 0) {
        // A draft part: a whole part of its kind (which may carry fields a draft does not take), tried on a build or its vehicle.
        const draftKind = pick(g, ['batteries', 'motors', 'controllers', 'propellers', 'vehicles']);
        return {
          draft: {
            kind: draftKind,
            part: draftPart(g, draftKind),
            buildId: pick(g, store.ids('builds')),
            scope: pick(g, ['build', 'vehicle']),
            ...(g(fc.boolean) ? { packAt: { supply: g(fc.integer, { min: 0, max: 2 }), pack: g(fc.integer, { min: 0, max: 2 }) } } : {}),
          },
        };
      }
      if (g(fc.boolean)) return { build: { ...target(g, store, 'builds'), changes: someBuildChanges(g, store), reason: '' } };
      const partKind = pick(g, ['batteries', 'motors', 'controllers', 'propellers', 'vehicles']);
      return { part: { kind: partKind, ...target(g, store, partKind), changes: someFields(g, partKind), reason: '' } };
    }
  }
  if (name === 'history.list') {
    return {
      entityKind: pick(g, [...PART_KINDS, 'builds', 'settings']),
      entityId: pick(g, store.ids('batteries')),
      buildId: pick(g, store.ids('builds')),
      beforeId: g(fc.integer, { min: 1, max: 500 }),
      limit: g(fc.integer, { min: 1, max: 1000 }),
    };
  }
  if (name === 'settings.get' || name === 'store.info') return pick(g, [{}, undefined]);
  if (name === 'fleet.export') return pick(g, [{}, undefined]);
  if (name === 'fleet.exportCsv') return { kind: pick(g, ['packs', 'batteries', 'motors', 'controllers', 'propellers', 'vehicles']) };
  if (name === 'fleet.import') {
    const mode = pick(g, ['merge', 'merge', 'replace']);
    return g(fc.boolean) ? { fleet: structuredClone(files.fleet), mode, dryRun: g(fc.boolean), reason: 'fuzz' } : { text: JSON.stringify(files.fleet), mode, dryRun: g(fc.boolean) };
  }
  if (name === 'fleet.importCsv') {
    const kind = pick(g, [...files.csv.keys()]);
    return { kind, text: files.csv.get(kind), dryRun: g(fc.boolean), reason: 'fuzz' };
  }
  if (name === 'store.backup') return { destination: `${files.sandbox}/backup-${g(fc.nat, { max: 3 })}.sqlite` };
  if (name === 'demo.load') return pick(g, [{}, { merge: true }, { merge: false }, undefined]);
  if (name === 'packLog.list') return { batteryId: pick(g, store.ids('batteries')) };
  if (name === 'packLog.add') {
    const kind = pick(g, ['charge', 'discharge', 'storage', 'resistance', 'inspection']);
    const base = { batteryId: pick(g, store.ids('batteries')), at: pick(g, ['2026-11-01', '2026-11-20T18:30', '2026-12-01']), kind, note: 'fuzz' };
    if (kind === 'charge') return { ...base, mah: g(fc.integer, { min: 100, max: 6000 }), voltagePerCellV: 4.2 };
    if (kind === 'discharge') return { ...base, mah: g(fc.integer, { min: 100, max: 6000 }), capacityCheck: g(fc.boolean), voltagePerCellV: 3.7 };
    if (kind === 'storage') return { ...base, voltagePerCellV: pick(g, [3.8, 3.85, 4.2]) };
    if (kind === 'resistance') return { ...base, cellResistancesOhm: [pick(g, [0.002, 0.004, 0.02])], temperatureC: 22 };
    return { ...base, puffed: g(fc.boolean), damaged: g(fc.boolean) };
  }
  if (name === 'settings.packHealth') return pick(g, [{}, undefined]);
  if (name === 'settings.updatePackHealth') return { resistanceGrowthShare: pick(g, [0.3, 0.5, 1]), capacityShareOfRated: pick(g, [0.7, 0.8, 0.9]), storageDays: pick(g, [1, 7, 30]) };
  if (name === 'runLogs.preview') return { text: pick(g, ['Time (s),Current (A)\n0,1\n1,2', 'time;amps;volts\n0;1,5;8,4\n1;2;8,3']) };
  if (name === 'runLogs.import') return { buildId: pick(g, store.ids('builds')), text: 'Time (s),Current (A),Voltage (V)\n0,10,8.3\n1,20,8.1\n2,15,8.2', name: 'fuzz' };
  if (name === 'runLogs.list') return { buildId: pick(g, store.ids('builds')) };
  if (name === 'settings.update') return { units: pick(g, ['metric', 'imperial']), tightThreshold: pick(g, [0, 0.1, 0.15, 0.3, 0.9]), demoOffered: g(fc.boolean) };
  return null;
}
