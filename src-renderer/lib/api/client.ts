import type { ApiError, ServiceEvent } from '$service/contract';
import type { ApiInput, ApiOutput, HandlerName } from '$service/handlers';
import type { ShellCalls } from '$service/bridge-api';
import type { Transport } from './transport';

/** A failed call, carrying the field the service named so a form can show it beside the input. */
export class ApiCallError extends Error {
  readonly kind: ApiError['kind'];
  readonly field: string | undefined;
  constructor(error: ApiError) {
    super(error.message);
    this.kind = error.kind;
    this.field = error.field;
  }
}

/** Every name the renderer may call: the service's handlers and the desktop shell's own calls. */
export type CallName = HandlerName | keyof ShellCalls;
export type CallInput<K extends CallName> = K extends HandlerName ? ApiInput<K> : K extends keyof ShellCalls ? ShellCalls[K]['input'] : never;
export type CallOutput<K extends CallName> = K extends HandlerName ? ApiOutput<K> : K extends keyof ShellCalls ? ShellCalls[K]['output'] : never;

export interface Client {
  call<K extends CallName>(name: K, args: CallInput<K>): Promise<CallOutput<K>>;
  onEvent(listener: (event: ServiceEvent) => void): () => void;
  readonly kind: Transport['kind'];
}

export function createClient(transport: Transport): Client {
  // One event stream for the whole window, shared by every listener: an EventSource per screen
  // would use up the browser's few connections to the loopback shell.
  const listeners = new Set<(event: ServiceEvent) => void>();
  let stopStream: (() => void) | null = null;
  const onEvent = (listener: (event: ServiceEvent) => void) => {
    listeners.add(listener);
    stopStream ??= transport.onEvent((event) => {
      for (const l of [...listeners]) l(event);
    });
    return () => {
      listeners.delete(listener);
      if (listeners.size === 0 && stopStream) {
        stopStream();
        stopStream = null;
      }
    };
  };
  return {
    kind: transport.kind,
    async call(name, args) {
      const result = await transport.call(name, args);
      if (!result.ok) throw new ApiCallError(result.error);
      // The one place the wire's value meets its type: the handler map (or the shell's own
      // table) guarantees the value's shape for this name.
      return result.value as CallOutput<typeof name>;
    },
    onEvent,
  };
}

/** The error as the UI shows it, whatever was thrown. */
export function asApiError(error: unknown): ApiError {
  if (error instanceof ApiCallError) return error.field === undefined ? { kind: error.kind, message: error.message } : { kind: error.kind, message: error.message, field: error.field };
  return { kind: 'internal', message: error instanceof Error ? error.message : String(error) };
}
