import { join } from 'node:path';
import { app, BrowserWindow, dialog } from 'electron';
import type { CallResult, ServiceHost } from '../service/contract';
import type { ShellCalls } from '../service/bridge-api';
import type { ShellCallContext } from './print-to-pdf';

/** The service handler that copies the open store to a file (online backup). */
export const BACKUP_HANDLER = 'store.backup';

/** The page's "Back up the store now": the same dialog as File › Back up…. */
export const BACK_UP = 'desktop.backUp' satisfies keyof ShellCalls;
type BackUpResult = ShellCalls[typeof BACK_UP]['output'];

function today(): string {
  return new Date().toISOString().slice(0, 10);
}

/** Asks where, then lets the service write a consistent copy there; `saved` is false when the person cancelled. */
async function chooseAndBackUp(host: Pick<ServiceHost, 'call'>, owner: BrowserWindow | null): Promise<CallResult> {
  const options = {
    title: 'Back up Rigbook records',
    defaultPath: join(app.getPath('documents'), `rigbook-backup-${today()}.sqlite`),
    filters: [{ name: 'Rigbook records', extensions: ['sqlite'] }],
  };
  const choice = owner ? await dialog.showSaveDialog(owner, options) : await dialog.showSaveDialog(options);
  if (choice.canceled || !choice.filePath) return { ok: true, value: { saved: false } satisfies BackUpResult };
  const result = await host.call(BACKUP_HANDLER, { destination: choice.filePath });
  return result.ok ? { ok: true, value: { saved: true, path: choice.filePath } satisfies BackUpResult } : result;
}

/** File › Back up…: asks where, then lets the service write a consistent copy there. */
export async function backUpInteractively(host: ServiceHost, owner: BrowserWindow | null): Promise<void> {
  const result = await chooseAndBackUp(host, owner);
  if (result.ok) {
    const value = result.value as BackUpResult;
    if (!value.saved) return;
    const info = { type: 'info' as const, title: 'Backup written', message: `Your records were copied to\n${value.path ?? ''}` };
    if (owner) await dialog.showMessageBox(owner, info);
    else await dialog.showMessageBox(info);
  } else {
    dialog.showErrorBox('Backup not written', result.error.message);
  }
}

/** `desktop.backUp`, the page's backup button: the shell's own dialog chooses the file, never the page. */
export function backUpFromPage(host: Pick<ServiceHost, 'call'>) {
  return (context: ShellCallContext): Promise<CallResult> => chooseAndBackUp(host, BrowserWindow.fromWebContents(context.sender));
}
