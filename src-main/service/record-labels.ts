/** The plain words the UI and messages use for each kind of record. */
export const RECORD_LABELS = {
  batteries: 'pack',
  motors: 'motor',
  controllers: 'speed controller',
  propellers: 'propeller',
  vehicles: 'vehicle',
  classes: 'class',
  classRules: 'class rule',
  builds: 'build',
  customers: 'customer',
} as const;

export type RecordKind = keyof typeof RECORD_LABELS;

/** Prefixes for generated ids, so an id read in a file or a log says what it is. */
export const ID_PREFIXES: Record<RecordKind, string> = {
  batteries: 'pack',
  motors: 'motor',
  controllers: 'esc',
  propellers: 'prop',
  vehicles: 'veh',
  classes: 'cls',
  classRules: 'rule',
  builds: 'build',
  customers: 'cust',
};
