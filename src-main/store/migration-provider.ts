import type { Migration, MigrationProvider } from 'kysely';
import * as initial from '../../migrations/20261202-0001-initial';
import * as safeSideInputs from '../../migrations/20261202-0002-safe-side-inputs';
import * as verdictCurrentRule from '../../migrations/20261202-0004-verdict-current-rule';
import * as historySelectors from '../../migrations/20261202-0005-history-selectors';
import * as fieldAndTypicalValues from '../../migrations/20261203-0006-field-and-typical-values';
import * as packLogRunLogs from '../../migrations/20261203-0007-pack-log-run-logs';
import * as customersAndWorkOrders from '../../migrations/20261203-0008-customers-and-work-orders';
import * as classRecords from '../../migrations/20261203-0009-class-records';
import * as becCurrent from '../../migrations/20261204-0010-bec-current';
import * as verdictRules from '../../migrations/20261204-0011-verdict-rules';

// Static imports rather than a folder read at run time: bundlers follow these, so the
// packaged app carries every migration. Add each new migration here, in name order.
export const MIGRATIONS: Record<string, Migration> = {
  '20261202-0001-initial': initial,
  '20261202-0002-safe-side-inputs': safeSideInputs,
  '20261202-0004-verdict-current-rule': verdictCurrentRule,
  '20261202-0005-history-selectors': historySelectors,
  '20261203-0006-field-and-typical-values': fieldAndTypicalValues,
  '20261203-0007-pack-log-run-logs': packLogRunLogs,
  '20261203-0008-customers-and-work-orders': customersAndWorkOrders,
  '20261203-0009-class-records': classRecords,
  '20261204-0010-bec-current': becCurrent,
  '20261204-0011-verdict-rules': verdictRules,
};

export const staticMigrationProvider: MigrationProvider = {
  getMigrations: async () => MIGRATIONS,
};

export const LATEST_MIGRATION = Object.keys(MIGRATIONS).sort().at(-1) ?? '';
