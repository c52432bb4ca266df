import { homedir } from 'node:os';
import { isAbsolute, join } from 'node:path';

export const APP_FOLDER_NAME = 'Rigbook';
export const DB_FILE_NAME = 'rigbook.sqlite';

/**
 * The per-user data folder, the same one Electron calls userData for an app named Rigbook,
 * so that the desktop shell, the loopback shell and the command line share one store.
 */
export function defaultDataDir(env: NodeJS.ProcessEnv = process.env, platform: NodeJS.Platform = process.platform): string {
  if (platform === 'win32') return join(env.APPDATA ?? join(homedir(), 'AppData', 'Roaming'), APP_FOLDER_NAME);
  if (platform === 'darwin') return join(homedir(), 'Library', 'Application Support', APP_FOLDER_NAME);
  // The XDG base directory spec: unset or empty means the default, and only an absolute path counts.
  const xdg = env.XDG_CONFIG_HOME;
  return join(xdg !== undefined && isAbsolute(xdg) ? xdg : join(homedir(), '.config'), APP_FOLDER_NAME);
}

/** `--db PATH` wins, then RIGBOOK_DB, then the user's data folder. */
export function resolveDbPath(explicit: string | undefined, env: NodeJS.ProcessEnv = process.env): string {
  if (explicit) return explicit;
  if (env.RIGBOOK_DB) return env.RIGBOOK_DB;
  return join(defaultDataDir(env), DB_FILE_NAME);
}
