import type { Battery, Controller, Motor, Propeller, Vehicle } from '$core/domain';
import type { Client } from '../api/client';
import type { PartTable } from './part-kinds';

// The five record kinds share one set of operations (`<kind>.get`, `.create`, `.update`,
// `.archive`, `.list`); the forms are generic over the kind, so they reach them by name.

export type PartRecord = Battery | Motor | Controller | Propeller | Vehicle;

export interface VerdictChangeLite {
  buildId: string;
  supplyId: string | null;
  from: 'over' | 'tight' | 'incomplete' | 'clear' | null;
  to: 'over' | 'tight' | 'incomplete' | 'clear';
}

export interface PartWriteResult {
  record: PartRecord;
  verdictChanges: VerdictChangeLite[];
  rechecked: number;
}

export const partApi = {
  list: (client: Client, table: PartTable, includeArchived: boolean) => client.callUntyped(`${table}.list`, { includeArchived }) as Promise<PartRecord[]>,
  get: (client: Client, table: PartTable, id: string) => client.callUntyped(`${table}.get`, { id }) as Promise<PartRecord>,
  create: (client: Client, table: PartTable, fields: Record<string, unknown>) => client.callUntyped(`${table}.create`, fields) as Promise<PartRecord>,
  update: (client: Client, table: PartTable, id: string, expectedVersion: number, changes: Record<string, unknown>, reason: string) =>
    client.callUntyped(`${table}.update`, { id, expectedVersion, changes, reason }) as Promise<PartWriteResult>,
  archive: (client: Client, table: PartTable, id: string, expectedVersion: number, archived: boolean, reason: string) =>
    client.callUntyped(`${table}.archive`, { id, expectedVersion, archived, reason }) as Promise<PartWriteResult>,
};
