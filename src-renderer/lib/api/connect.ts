import { createClient, type Client } from './client';
import { dropToken, httpTransport, takeToken } from './http-transport';
import { findBridge, ipcTransport } from './ipc-transport';

/**
 * The desktop shell's bridge when present, else the loopback API of the page's own origin; null
 * when the page was opened over loopback without its token (there is nothing it may read).
 * `onRefused` runs when the shell refuses the tab's token: it is from an earlier start.
 */
export function connect(onRefused: () => void): Client | null {
  const bridge = findBridge();
  if (bridge) return createClient(ipcTransport(bridge));
  const token = takeToken();
  if (!token) return null;
  return createClient(
    httpTransport(token, () => {
      dropToken();
      onRefused();
    }),
  );
}
