import { join } from 'node:path';
import { app, dialog, type BrowserWindow } from 'electron';
import type { ServiceHost } from '../service/contract';

/** The service handler that copies the open store to a file (online backup). */
export const BACKUP_HANDLER = 'store.backup';

function today(): string {
  return new Date().toISOString().slice(0, 10);
}

/** File › Back up…: asks where, then lets the service write a consistent copy there. */
export async function backUpInteractively(host: ServiceHost, owner: BrowserWindow | null): Promise<void> {
  const options = {
    title: 'Back up Rigbook records',
    defaultPath: join(app.getPath('documents'), `rigbook-backup-${today()}.sqlite`),
    filters: [{ name: 'Rigbook records', extensions: ['sqlite'] }],
  };
  const choice = owner ? await dialog.showSaveDialog(owner, options) : await dialog.showSaveDialog(options);
  if (choice.canceled || !choice.filePath) return;
  const result = await host.call(BACKUP_HANDLER, { destination: choice.filePath });
  if (result.ok) {
    const info = { type: 'info' as const, title: 'Backup written', message: `Your records were copied to\n${choice.filePath}` };
    if (owner) await dialog.showMessageBox(owner, info);
    else await dialog.showMessageBox(info);
  } else {
    dialog.showErrorBox('Backup not written', result.error.message);
  }
}
