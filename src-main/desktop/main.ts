// Desktop shell entry (bundled to dist-main/desktop-main.cjs). Opens the service on the shared
// store, serves the renderer on app://rigbook/ and relays the one IPC channel.
import { join } from 'node:path';
import { app, BrowserWindow, dialog, ipcMain, Menu, session } from 'electron';
import type { ServiceHost } from '../service/contract';
import { AUTO_BACKUP_AFTER_START_MS, AUTO_BACKUPS_KEPT, openServiceHost } from '../service/open-service-host';
import { demoFleet } from '../../demo-fixtures/demo-fleet';
import { defaultDataDir } from '../store/data-location';
import { handleAppProtocol, registerAppScheme } from './app-protocol';
import { BACK_UP, backUpFromPage, backUpInteractively } from './back-up';
import { exportFleetInteractively, showFleetImport } from './fleet-file-menu';
import { createCallRelay } from './call-relay';
import { CALL_CHANNEL, EVENT_CHANNEL } from './channels';
import { redactUrl, withoutSecret } from '../store/store-location';
import { dbPathFromArgv } from './command-line';
import { menuTemplate } from './menu';
import { denyAllPermissions, guardWebContents } from './navigation-guard';
import { PRINT_TO_PDF, printToPdf, type ShellCallContext } from './print-to-pdf';
import { isTrustedSender } from './sender-check';
import { APP_ENTRY_URL, isAppUrl } from './url-policy';
import { secureWebPreferences } from './web-preferences';
import { pageCallRefusal } from '../service/page-call-policy';
import { describeStorageError } from '../store/storage-errors';

// The bundle sits in dist-main/, next to preload.cjs, with dist-renderer/ beside dist-main/
// both in the checkout and inside the packaged app.asar.
const RENDERER_DIR = join(__dirname, '..', 'dist-renderer');
const PRELOAD_PATH = join(__dirname, 'preload.cjs');

// Before ready: the scheme's privileges and the data folder cannot change afterwards. The
// data folder is the same one the loopback shell and the command line use.
registerAppScheme();
app.setName('Rigbook');
app.setPath('userData', defaultDataDir());

const dbChoice = dbPathFromArgv(process.argv);
if (!dbChoice.ok) {
  console.error(dbChoice.message);
  app.exit(2);
} else if (!app.requestSingleInstanceLock()) {
  // A second launch hands over to the running one instead of opening the store twice.
  app.quit();
} else {
  run(dbChoice.dbPath);
}

function run(dbPath: string): void {
  let host: ServiceHost | null = null;
  let closed = false;

  app.on('web-contents-created', (_event, contents) => guardWebContents(contents));

  app.on('second-instance', () => {
    const win = BrowserWindow.getAllWindows()[0];
    if (!win) return;
    if (win.isMinimized()) win.restore();
    win.focus();
  });

  app.on('window-all-closed', () => {
    if (process.platform !== 'darwin') app.quit();
  });

  app.on('will-quit', (event) => {
    if (closed || !host) return;
    event.preventDefault();
    const closing = host;
    host = null;
    closing
      .close()
      .catch((error: unknown) => console.error('Closing the store failed:', error))
      .finally(() => {
        closed = true;
        app.quit();
      });
  });

  app
    .whenReady()
    .then(async () => {
      denyAllPermissions(session.defaultSession);
      handleAppProtocol(RENDERER_DIR);
      const opened = await openServiceHost({ dbPath, demoFleet, autoBackup: { keep: AUTO_BACKUPS_KEPT, afterStartMs: AUTO_BACKUP_AFTER_START_MS } });
      host = opened;
      wireIpc(opened);
      Menu.setApplicationMenu(
        Menu.buildFromTemplate(
          menuTemplate({
            backUp: () => {
              backUpInteractively(opened, BrowserWindow.getFocusedWindow()).catch((error: unknown) => dialog.showErrorBox('Backup not written', error instanceof Error ? error.message : String(error)));
            },
            importFleet: () => {
              showFleetImport(BrowserWindow.getFocusedWindow() ?? BrowserWindow.getAllWindows()[0] ?? null).catch((error: unknown) => console.error('Opening the import failed:', error));
            },
            exportFleet: () => {
              exportFleetInteractively(opened, BrowserWindow.getFocusedWindow()).catch((error: unknown) => dialog.showErrorBox('Fleet file not written', error instanceof Error ? error.message : String(error)));
            },
            about: () => {
              void dialog.showMessageBox({
                type: 'info',
                title: 'About Rigbook',
                message: `Rigbook ${app.getVersion()}`,
                detail: `Build records and rating checks for electric RC vehicles.\nRecords: ${opened.dbPath}`,
              });
            },
          }),
        ),
      );
      createWindow();
      app.on('activate', () => {
        if (BrowserWindow.getAllWindows().length === 0) createWindow();
      });
    })
    .catch((error: unknown) => {
      const storage = describeStorageError(error, redactUrl(dbPath));
      console.error('Rigbook could not start:', error instanceof Error ? withoutSecret(error.message, dbPath) : error);
      dialog.showErrorBox('Rigbook could not start', storage ? storage.message : error instanceof Error ? error.message : String(error));
      app.exit(1);
    });
}

function wireIpc(host: ServiceHost): void {
  const relay = createCallRelay<ShellCallContext>(host, { [PRINT_TO_PDF]: printToPdf, [BACK_UP]: backUpFromPage(host) }, (error) => console.error('Desktop call failed:', error));
  ipcMain.handle(CALL_CHANNEL, (event, name: unknown, args: unknown) => {
    if (!isTrustedSender(event.senderFrame)) throw new Error('Refused: the call did not come from the Rigbook page.');
    const refused = typeof name === 'string' ? pageCallRefusal('desktop', host.dbPath, name, args) : null;
    if (refused) return { ok: false, error: refused };
    return relay({ sender: event.sender, storePath: host.dbPath }, name, args);
  });
  host.subscribe((serviceEvent) => {
    for (const win of BrowserWindow.getAllWindows()) {
      const contents = win.webContents;
      if (!contents.isDestroyed() && isAppUrl(contents.getURL())) contents.send(EVENT_CHANNEL, serviceEvent);
    }
  });
}

function createWindow(): BrowserWindow {
  const win = new BrowserWindow({
    title: 'Rigbook',
    width: 1280,
    height: 820,
    minWidth: 900,
    minHeight: 600,
    show: false,
    webPreferences: secureWebPreferences(PRELOAD_PATH),
  });
  win.once('ready-to-show', () => win.show());
  void win.loadURL(APP_ENTRY_URL);
  return win;
}
