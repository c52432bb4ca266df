// The pure computation core: importable from the store, the service, the command line and the
// renderer alike. No I/O here.

export * from './domain';
export * from './constants';
export * from './units';
export * from './chemistry';
export { packModel, packResistance, loadedVoltage, cRatingCurrent, type PackModel } from './pack';
export { supplyModel, combineSeries, combineParallel, parallelShares, type SupplyModel, type ShareOfCurrent } from './supply';
export * from './motor';
export * from './motor-curve';
export * from './drivetrain';
export * from './road-load';
export * from './ground-load';
export * from './propeller';
export { findRoot, type RootFunction } from './solve';
export * from './catalogue/figures';
export * from './catalogue/rules';
export * from './catalogue/cautions';
export { checkLimit, type LimitCheck } from './rule-check';
export { worstStatus, compareStatus, marginOf, statusOf } from './status';
export { tightThresholdFor } from './threshold';
export { classRulesFor, classFindings } from './class-rules';
export { fieldLabel, describeMissing } from './field-labels';
export { NOT_APPLICABLE } from './operation';
export { evaluateBuild } from './evaluate';
export { fullThrottleRun, RUN_SAMPLES, type RunModel, type RunResult } from './run';
export { runTrace, type RunTrace } from './run-trace';
export { isPlausible, plausibleMessage, plausibleRange, type PlausibleField } from './plausibility';
export type { Known } from './known';
