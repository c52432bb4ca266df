import { DEFAULT_PACK_HEALTH, type PackHealthThresholds } from '../../core/pack-log';
import type { DbHandle } from '../db-handle';

export interface Settings {
  units: 'metric' | 'imperial';
  /** Locale whose marks numbers are shown and typed with ("de-DE"); '' follows the system. */
  numberLocale: string;
  /** Margin under which a finding reads `tight`, when neither build nor class sets one. */
  tightThreshold: number;
  /** Whether the first-start offer of the demo fleet was answered. */
  demoOffered: boolean;
  /** The rules engine that computed the stored verdicts; 0 before any. */
  engineVersion: number;
  /** The pack-health rule's thresholds (core/pack-log.ts says their basis). */
  packHealth: PackHealthThresholds;
}

export const DEFAULT_SETTINGS: Settings = { units: 'metric', numberLocale: '', tightThreshold: 0.15, demoOffered: false, engineVersion: 0, packHealth: DEFAULT_PACK_HEALTH };

export async function readSettings(db: DbHandle): Promise<Settings> {
  const rows = await db.selectFrom('settings').select(['key', 'value']).execute();
  const out: Settings = { ...DEFAULT_SETTINGS };
  for (const row of rows) {
    if (!(row.key in out)) continue;
    const value = JSON.parse(row.value) as unknown;
    // Thresholds stored by an older version may lack one added since: the default fills it.
    Object.assign(out, { [row.key]: row.key === 'packHealth' ? { ...DEFAULT_PACK_HEALTH, ...(value as object) } : value });
  }
  return out;
}

export async function writeSettings(db: DbHandle, patch: Partial<Settings>): Promise<void> {
  for (const [key, value] of Object.entries(patch)) {
    if (value === undefined) continue;
    await db
      .insertInto('settings')
      .values({ key, value: JSON.stringify(value) })
      .onConflict((oc) => oc.column('key').doUpdateSet({ value: JSON.stringify(value) }))
      .execute();
  }
}
