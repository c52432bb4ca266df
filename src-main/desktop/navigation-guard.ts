import { shell, type Session, type WebContents } from 'electron';
import { allowedExternalUrl, isAppUrl } from './url-policy';

function openOutside(rawUrl: string): void {
  const external = allowedExternalUrl(rawUrl);
  if (external) void shell.openExternal(external);
}

/**
 * Keeps every web contents on our own origin: navigation elsewhere is stopped (an https link
 * goes to the system browser instead), new windows are never created, webviews never attach.
 */
export function guardWebContents(contents: WebContents): void {
  contents.on('will-navigate', (event) => {
    if (isAppUrl(event.url)) return;
    event.preventDefault();
    openOutside(event.url);
  });
  contents.on('will-redirect', (event) => {
    if (!isAppUrl(event.url)) event.preventDefault();
  });
  contents.on('will-attach-webview', (event) => event.preventDefault());
  contents.setWindowOpenHandler(({ url }) => {
    openOutside(url);
    return { action: 'deny' };
  });
}

/** Permission requests are granted unless a handler says otherwise: refuse them all. */
export function denyAllPermissions(session: Session): void {
  session.setPermissionRequestHandler((_contents, _permission, callback) => callback(false));
  session.setPermissionCheckHandler(() => false);
  session.setDevicePermissionHandler(() => false);
}
