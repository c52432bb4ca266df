// Runs in the sandboxed renderer before the page. Exposes exactly one object, `rigbook`,
// with two functions; neither ipcRenderer nor the IPC event object reaches the page.
import { contextBridge, ipcRenderer, type IpcRendererEvent } from 'electron';
import type { CallResult, ServiceEvent } from '../service/contract';
import { BRIDGE_KEY, type RigbookBridge } from '../service/bridge-api';
import { CALL_CHANNEL, EVENT_CHANNEL } from './channels';

const bridge = {
  call(name: string, args: unknown): Promise<CallResult> {
    return ipcRenderer.invoke(CALL_CHANNEL, name, args);
  },
  onEvent(listener: (event: ServiceEvent) => void): () => void {
    const relay = (_event: IpcRendererEvent, payload: ServiceEvent) => listener(payload);
    ipcRenderer.on(EVENT_CHANNEL, relay);
    return () => {
      ipcRenderer.removeListener(EVENT_CHANNEL, relay);
    };
  },
} satisfies RigbookBridge;

contextBridge.exposeInMainWorld(BRIDGE_KEY, bridge);
