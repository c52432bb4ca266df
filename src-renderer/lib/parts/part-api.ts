import type { ApiInput, ApiOutput } from '$service/handlers';
import { partSchemasByTable } from '$service/schemas/part-schemas-by-table';
import type { Client } from '../api/client';
import { typedInput } from '../api/typed-input';
import type { PartTable } from './part-kinds';

// The five record kinds share one set of operations (`<kind>.list`, `.get`, `.create`,
// `.update`, `.archive`), each typed by its kind in the handler map. The forms are generic over
// the kind, so they reach a kind's operations through this table.

type PartOp = 'list' | 'get' | 'create' | 'update' | 'archive';

/** One kind's operations, with that kind's own input and output types. */
export type PartOps<T extends PartTable> = {
  [O in PartOp]: (args: ApiInput<`${T}.${O}`>) => Promise<ApiOutput<`${T}.${O}`>>;
};

export type PartRecord = ApiOutput<`${PartTable}.get`>;
export type PartWriteResult = ApiOutput<`${PartTable}.update`>;

/** Every kind's operations over one client; a name missing from the handler map fails the build. */
export function partOps(client: Client): { readonly [T in PartTable]: PartOps<T> } {
  return {
    batteries: {
      list: (a) => client.call('batteries.list', a),
      get: (a) => client.call('batteries.get', a),
      create: (a) => client.call('batteries.create', a),
      update: (a) => client.call('batteries.update', a),
      archive: (a) => client.call('batteries.archive', a),
    },
    motors: {
      list: (a) => client.call('motors.list', a),
      get: (a) => client.call('motors.get', a),
      create: (a) => client.call('motors.create', a),
      update: (a) => client.call('motors.update', a),
      archive: (a) => client.call('motors.archive', a),
    },
    controllers: {
      list: (a) => client.call('controllers.list', a),
      get: (a) => client.call('controllers.get', a),
      create: (a) => client.call('controllers.create', a),
      update: (a) => client.call('controllers.update', a),
      archive: (a) => client.call('controllers.archive', a),
    },
    propellers: {
      list: (a) => client.call('propellers.list', a),
      get: (a) => client.call('propellers.get', a),
      create: (a) => client.call('propellers.create', a),
      update: (a) => client.call('propellers.update', a),
      archive: (a) => client.call('propellers.archive', a),
    },
    vehicles: {
      list: (a) => client.call('vehicles.list', a),
      get: (a) => client.call('vehicles.get', a),
      create: (a) => client.call('vehicles.create', a),
      update: (a) => client.call('vehicles.update', a),
      archive: (a) => client.call('vehicles.archive', a),
    },
  };
}

/**
 * The operations a form uses without knowing its kind at compile time. Reads and archiving take
 * the same input for every kind; a new record or a change is typed by checking it against its
 * kind's own schema first (see typed-input.ts); a refusal comes back as a rejected call, like the service's.
 */
export const partApi = {
  list: (client: Client, table: PartTable, includeArchived: boolean): Promise<PartRecord[]> => partOps(client)[table].list({ includeArchived }),
  get: (client: Client, table: PartTable, id: string): Promise<PartRecord> => partOps(client)[table].get({ id }),
  async create(client: Client, table: PartTable, fields: Record<string, unknown>): Promise<PartRecord> {
    const ops = partOps(client);
    switch (table) {
      case 'batteries':
        return ops.batteries.create(typedInput(partSchemasByTable.batteries.create, fields));
      case 'motors':
        return ops.motors.create(typedInput(partSchemasByTable.motors.create, fields));
      case 'controllers':
        return ops.controllers.create(typedInput(partSchemasByTable.controllers.create, fields));
      case 'propellers':
        return ops.propellers.create(typedInput(partSchemasByTable.propellers.create, fields));
      case 'vehicles':
        return ops.vehicles.create(typedInput(partSchemasByTable.vehicles.create, fields));
    }
  },
  async update(client: Client, table: PartTable, id: string, expectedVersion: number, changes: Record<string, unknown>, reason: string): Promise<PartWriteResult> {
    const ops = partOps(client);
    const at = 'changes.';
    switch (table) {
      case 'batteries':
        return ops.batteries.update({ id, expectedVersion, changes: typedInput(partSchemasByTable.batteries.patch, changes, at), reason });
      case 'motors':
        return ops.motors.update({ id, expectedVersion, changes: typedInput(partSchemasByTable.motors.patch, changes, at), reason });
      case 'controllers':
        return ops.controllers.update({ id, expectedVersion, changes: typedInput(partSchemasByTable.controllers.patch, changes, at), reason });
      case 'propellers':
        return ops.propellers.update({ id, expectedVersion, changes: typedInput(partSchemasByTable.propellers.patch, changes, at), reason });
      case 'vehicles':
        return ops.vehicles.update({ id, expectedVersion, changes: typedInput(partSchemasByTable.vehicles.patch, changes, at), reason });
    }
  },
  archive: (client: Client, table: PartTable, id: string, expectedVersion: number, archived: boolean, reason: string): Promise<PartWriteResult> => partOps(client)[table].archive({ id, expectedVersion, archived, reason }),
};
