import type { RigbookBridge } from '$service/bridge-api';
import type { Transport } from './transport';

export function ipcTransport(bridge: RigbookBridge): Transport {
  return { kind: 'desktop', call: (name, args) => bridge.call(name, args), onEvent: (listener) => bridge.onEvent(listener) };
}

export function findBridge(): RigbookBridge | undefined {
  return (window as unknown as { rigbook?: RigbookBridge }).rigbook;
}
