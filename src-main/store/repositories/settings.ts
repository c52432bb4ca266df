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
}

export const DEFAULT_SETTINGS: Settings = { units: 'metric', numberLocale: '', tightThreshold: 0.15, demoOffered: false, engineVersion: 0 };

export async function readSettings(db: DbHandle): Promise<Settings> {
  const rows = await db.selectFrom('settings').select(['key', 'value']).execute();
  const out: Settings = { ...DEFAULT_SETTINGS };
  for (const row of rows) {
    if (row.key in out) Object.assign(out, { [row.key]: JSON.parse(row.value) as unknown });
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
