import type { Battery, ClassRule, Controller, Customer, Motor, Propeller, Vehicle, VehicleClass } from '../../core/domain';
import type { FieldSpec } from '../../core/catalogue/field-spec';
import { FIELD_CATALOGUES } from '../../core/catalogue/record-kinds';
import type { PartTableName } from '../schema';

/** The record type each part table holds. */
export interface PartRecords {
  batteries: Battery;
  motors: Motor;
  controllers: Controller;
  propellers: Propeller;
  vehicles: Vehicle;
  classes: VehicleClass;
  classRules: ClassRule;
  customers: Customer;
}

/** Fields a caller may set: everything but the bookkeeping. */
export type PartFields<T extends PartTableName> = Omit<PartRecords[T], 'id' | 'version' | 'archivedAt'>;

/** The columns that hold booleans as 0/1, per table: the catalogue's flags. */
const BOOLEAN_COLUMNS: Partial<Record<PartTableName, readonly string[]>> = Object.fromEntries(
  Object.entries(FIELD_CATALOGUES).map(([table, fields]) => [
    table,
    Object.entries<FieldSpec>(fields)
      .filter(([, spec]) => spec.type === 'flag')
      .map(([key]) => key),
  ]),
);

export function rowToRecord<T extends PartTableName>(table: T, row: Record<string, unknown>): PartRecords[T] {
  const { createdAt: _c, updatedAt: _u, ...rest } = row;
  for (const column of BOOLEAN_COLUMNS[table] ?? []) rest[column] = rest[column] === 1 || rest[column] === true;
  return rest as unknown as PartRecords[T];
}

export function fieldsToColumns(table: PartTableName, fields: object): Record<string, unknown> {
  const out: Record<string, unknown> = { ...fields };
  for (const column of BOOLEAN_COLUMNS[table] ?? []) if (column in out) out[column] = out[column] ? 1 : 0;
  return out;
}
