import type { Battery, Controller, Customer, Motor, Propeller, Vehicle } from '$core/domain';
import type { Client } from '../api/client';
import { partOps } from '../parts/part-api';
import type { PartTable } from '../parts/part-kinds';
import { Loader } from './loader.svelte';

interface CatalogRecords {
  batteries: Battery[];
  motors: Motor[];
  controllers: Controller[];
  propellers: Propeller[];
  vehicles: Vehicle[];
}

const TABLES: readonly PartTable[] = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles'];
const ALL = { includeArchived: true };

/** How a vehicle without a customer is named. */
export const SHOP_OWN_WORDS = "shop's own";
const isTable = (kind: string): kind is PartTable => (TABLES as readonly string[]).includes(kind);

/**
 * Every part and vehicle, archived ones included (old builds and history still name them), for
 * pickers and filters. A kind is re-read when its records change.
 */
export class CatalogState {
  readonly sources: { readonly [T in PartTable]: Loader<CatalogRecords[T]> } = {
    batteries: new Loader(() => partOps(this.client).batteries.list(ALL)),
    motors: new Loader(() => partOps(this.client).motors.list(ALL)),
    controllers: new Loader(() => partOps(this.client).controllers.list(ALL)),
    propellers: new Loader(() => partOps(this.client).propellers.list(ALL)),
    vehicles: new Loader(() => partOps(this.client).vehicles.list(ALL)),
  };
  batteries = $derived(this.sources.batteries.value ?? []);
  motors = $derived(this.sources.motors.value ?? []);
  controllers = $derived(this.sources.controllers.value ?? []);
  propellers = $derived(this.sources.propellers.value ?? []);
  vehicles = $derived(this.sources.vehicles.value ?? []);
  /** The shop's customers, archived ones included (their vehicles and work orders still name them). */
  readonly customerSource = new Loader<Customer[]>(() => this.client.call('customers.list', ALL));
  customers = $derived(this.customerSource.value ?? []);
  customerNames = $derived(new Map(this.customers.map((c) => [c.id, c.name] as const)));
  loaded = $derived(TABLES.every((t) => this.sources[t].loaded));

  names = $derived(new Map<string, string>([...this.batteries, ...this.motors, ...this.controllers, ...this.propellers, ...this.vehicles].map((r) => [r.id, r.name] as const)));

  constructor(private readonly client: Client) {}

  async load(tables: readonly PartTable[] = TABLES): Promise<void> {
    await Promise.all([...tables.map((t) => this.sources[t].load()), this.customerSource.load()]);
  }

  follow(): () => void {
    return this.client.onEvent((event) => {
      if (event.type === 'records-changed' && isTable(event.kind)) void this.sources[event.kind].load();
      if (event.type === 'records-changed' && event.kind === 'customers') void this.customerSource.load();
    });
  }

  /** Records still in use, for pickers of new choices; the current choice is kept even if archived. */
  active<T extends { archivedAt: string | null; id: string }>(list: readonly T[], keep: string | null = null): T[] {
    return list.filter((r) => r.archivedAt === null || r.id === keep);
  }

  /** A vehicle's customer as the screens name it: the shop's own when there is none. */
  customerName(id: string | null | undefined): string {
    if (!id) return SHOP_OWN_WORDS;
    return this.customerNames.get(id) ?? id;
  }

  nameOf(id: string | null | undefined): string {
    if (!id) return '';
    return this.names.get(id) ?? id;
  }
}
