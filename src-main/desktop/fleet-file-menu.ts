import { writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { app, dialog, type BrowserWindow } from 'electron';
import type { ServiceHost } from '../service/contract';
import { storeFileClash } from '../store/file-identity';

/** Where the page shows its fleet files: the import there checks a file before writing it. */
export const FLEET_FILES_ROUTE = '#/settings';

/**
 * File › Export fleet file…: asks where, then writes the service's export there, the same text
 * as the command line's export. The window never names the file.
 */
export async function exportFleetInteractively(host: Pick<ServiceHost, 'call' | 'dbPath'>, owner: BrowserWindow | null): Promise<void> {
  const options = {
    title: 'Export Rigbook fleet file',
    defaultPath: join(app.getPath('documents'), `rigbook-fleet-${new Date().toISOString().slice(0, 10)}.json`),
    filters: [{ name: 'Rigbook fleet file', extensions: ['json'] }],
  };
  const choice = owner ? await dialog.showSaveDialog(owner, options) : await dialog.showSaveDialog(options);
  if (choice.canceled || !choice.filePath) return;
  const clash = storeFileClash(choice.filePath, host.dbPath);
  if (clash) {
    dialog.showErrorBox('Fleet file not written', `${choice.filePath} ${clash}. Choose another file.`);
    return;
  }
  const result = await host.call('fleet.export', {});
  if (!result.ok) {
    dialog.showErrorBox('Fleet file not written', result.error.message);
    return;
  }
  await writeFile(choice.filePath, `${JSON.stringify(result.value, null, 2)}\n`);
}

/**
 * File › Import fleet file…: opens the settings screen's import, which checks the file and
 * shows what it would change before anything is written.
 */
export async function showFleetImport(owner: BrowserWindow | null): Promise<void> {
  if (!owner) return;
  await owner.webContents.executeJavaScript(`window.location.hash = ${JSON.stringify(FLEET_FILES_ROUTE)}`);
}
