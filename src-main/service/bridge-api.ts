// The one object the desktop preload puts on `window`. The renderer imports this type-only
// (`import type { RigbookBridge } from '$service/bridge-api'`) so both sides agree.
import type { CallResult, ServiceEvent } from './contract';

/** The property name on `window`. */
export const BRIDGE_KEY = 'rigbook';

export interface RigbookBridge {
  /** Calls a handler by name; shell-level names start with `desktop.` and the desktop relay answers them itself (desktop/call-relay.ts). */
  call(name: string, args: unknown): Promise<CallResult>;
  /** Listens for change events; returns the function that stops listening. */
  onEvent(listener: (event: ServiceEvent) => void): () => void;
}
