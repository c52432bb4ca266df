// The one object the desktop preload puts on `window`. The renderer imports this type-only
// (`import type { RigbookBridge } from '$service/bridge-api'`) so both sides agree.
import type { CallResult, ServiceEvent } from './contract';

/**
 * The calls the desktop shell answers itself, before the service sees them: what each takes
 * and what it answers. The renderer's client is typed from this and the handler map.
 */
export interface ShellCalls {
  /** Asks where to save, then writes the current page as a PDF; `saved` is false when the user cancelled. */
  'desktop.printToPdf': { input: { suggestedName?: string; landscape?: boolean }; output: { saved: boolean; path?: string } };
  /** File › Back up… from the page: the shell's own save dialog chooses the file; `saved` is false when the user cancelled. */
  'desktop.backUp': { input: Record<string, never>; output: { saved: boolean; path?: string } };
}

/** The property name on `window`. */
export const BRIDGE_KEY = 'rigbook';

export interface RigbookBridge {
  /** Calls a handler by name; shell-level names start with `desktop.` (see ShellCalls) and the desktop relay answers them itself (desktop/call-relay.ts). */
  call(name: string, args: unknown): Promise<CallResult>;
  /** Listens for change events; returns the function that stops listening. */
  onEvent(listener: (event: ServiceEvent) => void): () => void;
}
