import type { Customer } from '$core/domain';
import type { ApiOutput } from '$service/handlers';
import type { Client } from '../api/client';
import { Loader } from './loader.svelte';

type WorkOrderRow = ApiOutput<'workOrders.list'>[number];

/** The customers screen's lists: the customers, and every work order (a customer's are picked out of it). */
export class CustomersState {
  includeArchived = $state(false);
  readonly customers = new Loader<Customer[]>(() => this.client.call('customers.list', { includeArchived: this.includeArchived }));
  readonly workOrders = new Loader<WorkOrderRow[]>(() => this.client.call('workOrders.list', {}));
  rows = $derived(this.customers.value ?? []);
  orders = $derived(this.workOrders.value ?? []);
  /** Jobs not yet handed over, newest first: what the bench is working on. */
  openOrders = $derived(this.orders.filter((o) => o.status !== 'handed-over'));

  constructor(private readonly client: Client) {}

  async load(): Promise<void> {
    await Promise.all([this.customers.load(), this.workOrders.load()]);
  }

  follow(): () => void {
    const stops = [
      this.customers.follow(this.client, (e) => e.type === 'records-changed' && (e.kind === 'customers' || e.kind === 'fleet')),
      this.workOrders.follow(this.client, (e) => e.type === 'records-changed' && (e.kind === 'workOrders' || e.kind === 'vehicles')),
    ];
    return () => stops.forEach((stop) => stop());
  }

  ordersOf(customerId: string): WorkOrderRow[] {
    return this.orders.filter((o) => o.customerId === customerId);
  }

  showArchived(on: boolean): void {
    this.includeArchived = on;
    void this.customers.load();
  }
}
