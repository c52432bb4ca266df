import { createClient, type Client } from './client';
import { httpTransport, takeToken } from './http-transport';
import { findBridge, ipcTransport } from './ipc-transport';

/** The desktop shell's bridge when present, else the loopback API of the page's own origin. */
export function connect(): Client {
  const bridge = findBridge();
  return createClient(bridge ? ipcTransport(bridge) : httpTransport(takeToken()));
}
