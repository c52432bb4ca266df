import type { Battery, Controller, Motor, Propeller, Vehicle } from '$core/domain';
import type { Client } from '../api/client';
import type { PartTable } from '../parts/part-kinds';

const TABLES: readonly PartTable[] = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles'];

/**
 * Every part and vehicle, archived ones included (old builds and history still name them), for
 * pickers and filters. Re-read when records of a kind change.
 */
export class CatalogState {
  batteries = $state.raw<Battery[]>([]);
  motors = $state.raw<Motor[]>([]);
  controllers = $state.raw<Controller[]>([]);
  propellers = $state.raw<Propeller[]>([]);
  vehicles = $state.raw<Vehicle[]>([]);
  loaded = $state(false);

  names = $derived(
    new Map<string, string>(
      [...this.batteries, ...this.motors, ...this.controllers, ...this.propellers, ...this.vehicles].map((r) => [r.id, r.name] as const),
    ),
  );

  constructor(private readonly client: Client) {}

  async load(tables: readonly PartTable[] = TABLES): Promise<void> {
    await Promise.all(tables.map((t) => this.loadTable(t)));
    this.loaded = true;
  }

  private async loadTable(table: PartTable): Promise<void> {
    const args = { includeArchived: true };
    switch (table) {
      case 'batteries':
        this.batteries = await this.client.call('batteries.list', args);
        break;
      case 'motors':
        this.motors = await this.client.call('motors.list', args);
        break;
      case 'controllers':
        this.controllers = await this.client.call('controllers.list', args);
        break;
      case 'propellers':
        this.propellers = await this.client.call('propellers.list', args);
        break;
      case 'vehicles':
        this.vehicles = await this.client.call('vehicles.list', args);
        break;
    }
  }

  follow(): () => void {
    return this.client.onEvent((event) => {
      if (event.type === 'records-changed' && (TABLES as readonly string[]).includes(event.kind)) void this.load([event.kind as PartTable]);
    });
  }

  /** Records still in use, for pickers of new choices; the current choice is kept even if archived. */
  active<T extends { archivedAt: string | null; id: string }>(list: readonly T[], keep: string | null = null): T[] {
    return list.filter((r) => r.archivedAt === null || r.id === keep);
  }

  nameOf(id: string | null | undefined): string {
    if (!id) return '';
    return this.names.get(id) ?? id;
  }
}
