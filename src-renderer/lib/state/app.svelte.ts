import type { Client } from '../api/client';
import { Router } from '../router/router.svelte';
import { BuildsListState } from './builds-list.svelte';
import { CatalogState } from './catalog.svelte';
import { OverConfirmState } from './over-confirm.svelte';
import { SettingsState } from './settings.svelte';
import { StoreInfoState } from './store-info.svelte';

/** What every screen shares: the client, the address, the preferences and the loaded list. */
export class AppState {
  readonly router: Router;
  readonly settings: SettingsState;
  readonly builds: BuildsListState;
  readonly info: StoreInfoState;
  readonly catalog: CatalogState;
  /** The question asked before a save that makes a build OVER. */
  readonly overConfirm: OverConfirmState;

  constructor(readonly client: Client) {
    this.router = new Router();
    this.settings = new SettingsState(client);
    this.builds = new BuildsListState(client);
    this.info = new StoreInfoState(client);
    this.catalog = new CatalogState(client);
    this.overConfirm = new OverConfirmState(client);
  }

  get units() {
    return this.settings.units;
  }

  /** Loads what the first screen needs and starts following the address and the service. */
  start(): () => void {
    const stops = [this.router.start(), this.builds.follow(), this.info.follow(), this.catalog.follow()];
    void this.settings.load();
    void this.info.load();
    void this.builds.load();
    void this.catalog.load();
    return () => stops.forEach((stop) => stop());
  }
}
