import type { Client, CallOutput } from '../api/client';
import { Loader } from './loader.svelte';

export type ClassSummary = CallOutput<'classes.list'>[number];

const NONE: ClassSummary[] = [];

/** Every class with its limits and how many vehicles and builds it holds. */
export class ClassesListState {
  readonly source = new Loader(() => this.client.call('classes.list', {}));
  rows = $derived(this.source.value ?? NONE);
  error = $derived(this.source.error?.message ?? null);

  constructor(private readonly client: Client) {}

  async load(): Promise<void> {
    await this.source.load();
  }

  follow(): () => void {
    // A vehicle moved to a class, a limit or a class changed, a file imported: the counts move.
    return this.source.follow(this.client, (event) => event.type === 'records-changed' && ['classes', 'classRules', 'vehicles', 'builds', 'fleet'].includes(event.kind), { settleMs: 100 });
  }
}
