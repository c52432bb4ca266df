import type { ApiInput, ApiOutput } from '$service/handlers';
import type { PackEventKind } from '$core/pack-log';
import { asApiError, type Client } from '../api/client';
import { Loader } from './loader.svelte';

export type PackLogView = ApiOutput<'packLog.list'>;

/** The entry being typed: text as typed, read into numbers only when saved. */
export interface PackEntryDraft {
  at: string;
  kind: PackEventKind;
  mah: string;
  voltagePerCellV: string;
  /** Per-cell readings in mΩ, separated by spaces or commas. */
  readingsMilliohm: string;
  temperatureC: string;
  capacityCheck: boolean;
  puffed: boolean;
  damaged: boolean;
  note: string;
}

const today = (): string => new Date().toISOString().slice(0, 10);

export function emptyDraft(): PackEntryDraft {
  return { at: today(), kind: 'charge', mah: '', voltagePerCellV: '', readingsMilliohm: '', temperatureC: '', capacityCheck: false, puffed: false, damaged: false, note: '' };
}

/** A number field of the draft: empty is "not given"; anything else must read as a number. */
function numberOf(text: string, field: string): number | null {
  const t = text.trim().replace(',', '.');
  if (t === '') return null;
  const x = Number(t);
  if (!Number.isFinite(x)) throw new Error(`${field}: "${text}" is not a number`);
  return x;
}

/** A pack's log on its page: the entries, what is read from them, and the form for a new entry. */
export class PackLogState {
  readonly source = new Loader(() => this.client.call('packLog.list', { batteryId: this.batteryId }));
  draft = $state<PackEntryDraft>(emptyDraft());
  error = $state<string | null>(null);
  message = $state<string | null>(null);
  saving = $state(false);

  constructor(
    private readonly client: Client,
    readonly batteryId: string,
  ) {}

  load(): Promise<boolean> {
    return this.source.load();
  }

  follow(): () => void {
    return this.source.follow(this.client, (e) => e.type === 'records-changed' && (e.kind === 'packEvents' || (e.kind === 'batteries' && e.ids.includes(this.batteryId)) || e.kind === 'settings'));
  }

  /** The entry as the service takes it; throws with the field's name where a number does not read. */
  input(): ApiInput<'packLog.add'> {
    const d = this.draft;
    const base: ApiInput<'packLog.add'> = { batteryId: this.batteryId, at: d.at, kind: d.kind, note: d.note };
    switch (d.kind) {
      case 'charge':
        return { ...base, mah: numberOf(d.mah, 'mAh put in'), voltagePerCellV: numberOf(d.voltagePerCellV, 'End voltage per cell') };
      case 'discharge':
        return { ...base, mah: numberOf(d.mah, 'mAh used'), voltagePerCellV: numberOf(d.voltagePerCellV, 'Resting voltage per cell'), capacityCheck: d.capacityCheck };
      case 'storage':
        return { ...base, voltagePerCellV: numberOf(d.voltagePerCellV, 'Voltage per cell') };
      case 'resistance': {
        const readings = d.readingsMilliohm
          .split(/[\s;]+/)
          .filter((x) => x !== '')
          .map((x) => numberOf(x, 'Readings'));
        return { ...base, cellResistancesOhm: readings.length === 0 ? null : readings.map((x) => (x ?? 0) / 1000), temperatureC: numberOf(d.temperatureC, 'Temperature') };
      }
      case 'inspection':
        return { ...base, puffed: d.puffed, damaged: d.damaged };
    }
  }

  async add(): Promise<boolean> {
    this.error = null;
    this.message = null;
    this.saving = true;
    try {
      const result = await this.client.call('packLog.add', this.input());
      this.message = result.verdictChanges.length > 0 ? `Logged. ${result.verdictChanges.filter((c) => c.supplyId === null).length} build verdict(s) changed.` : 'Logged.';
      this.draft = { ...emptyDraft(), kind: this.draft.kind };
      await this.load();
      return true;
    } catch (error) {
      this.error = error instanceof Error && !('kind' in error) ? error.message : asApiError(error).message;
      return false;
    } finally {
      this.saving = false;
    }
  }

  async remove(id: string): Promise<void> {
    this.error = null;
    try {
      await this.client.call('packLog.remove', { id });
      await this.load();
    } catch (error) {
      this.error = asApiError(error).message;
    }
  }
}
