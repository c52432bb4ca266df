import type { Selectable } from 'kysely';
import type { LogSamples, RunLogSummary } from '../../core/run-log';
import type { ColumnUse } from '../../core/run-log-csv';
import type { DbHandle } from '../db-handle';
import type { RunLogTable } from '../schema';

/** A run log as the list shows it: everything but the samples. */
export interface RunLogInfo extends RunLogSummary {
  id: string;
  buildId: string;
  supplyId: string;
  name: string;
  /** When the run was, as the person gave it ('' where not given). */
  recordedAt: string;
  importedAt: string;
  /** Samples in the file; the kept copy may be thinned. */
  sampleCount: number;
  mapping: ColumnUse[];
  note: string;
}

export interface RunLog extends RunLogInfo {
  samples: LogSamples;
}

function parseJson<T>(text: string, fallback: T): T {
  try {
    return JSON.parse(text) as T;
  } catch {
    return fallback;
  }
}

function rowToInfo(row: Omit<Selectable<RunLogTable>, 'samples'>): RunLogInfo {
  return {
    id: row.id,
    buildId: row.buildId,
    supplyId: row.supplyId,
    name: row.name,
    recordedAt: row.recordedAt,
    importedAt: row.importedAt,
    sampleCount: Number(row.sampleCount),
    durationS: row.durationS,
    peakCurrentA: row.peakCurrentA,
    averageCurrentA: row.averageCurrentA,
    rmsCurrentA: row.rmsCurrentA,
    minVoltageV: row.minVoltageV,
    maxTemperatureC: row.maxTemperatureC,
    usedMah: row.usedMah,
    mapping: parseJson<ColumnUse[]>(row.mapping, []),
    note: row.note,
  };
}

const INFO_COLUMNS = ['id', 'buildId', 'supplyId', 'name', 'recordedAt', 'importedAt', 'sampleCount', 'durationS', 'peakCurrentA', 'averageCurrentA', 'rmsCurrentA', 'minVoltageV', 'maxTemperatureC', 'usedMah', 'mapping', 'note'] as const;

/** A build's logs, newest import first. */
export async function listRunLogs(db: DbHandle, buildId: string): Promise<RunLogInfo[]> {
  const rows = await db.selectFrom('runLogs').select(INFO_COLUMNS).where('buildId', '=', buildId).orderBy('importedAt', 'desc').orderBy('id', 'desc').execute();
  return rows.map(rowToInfo);
}

export async function getRunLog(db: DbHandle, id: string): Promise<RunLog | undefined> {
  const row = await db.selectFrom('runLogs').selectAll().where('id', '=', id).executeTakeFirst();
  return row ? { ...rowToInfo(row), samples: parseJson<LogSamples>(row.samples, { timeS: [] }) } : undefined;
}

/** Every log of the store with its samples (for a fleet file and a backup's export). */
export async function listAllRunLogs(db: DbHandle): Promise<RunLog[]> {
  const rows = await db.selectFrom('runLogs').selectAll().orderBy('buildId').orderBy('importedAt').orderBy('id').execute();
  return rows.map((row) => ({ ...rowToInfo(row), samples: parseJson<LogSamples>(row.samples, { timeS: [] }) }));
}

export async function insertRunLog(db: DbHandle, log: RunLog): Promise<void> {
  const { samples, mapping, ...rest } = log;
  await db
    .insertInto('runLogs')
    .values({ ...rest, samples: JSON.stringify(samples), mapping: JSON.stringify(mapping) })
    .execute();
}

export async function deleteRunLog(db: DbHandle, id: string): Promise<number> {
  const result = await db.deleteFrom('runLogs').where('id', '=', id).executeTakeFirst();
  return Number(result.numDeletedRows);
}
