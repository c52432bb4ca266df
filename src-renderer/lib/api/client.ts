import type { ApiError, ServiceEvent } from '$service/contract';
import type { ApiInput, ApiOutput, HandlerName } from '$service/handlers';
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

export interface Client {
  call<K extends HandlerName>(name: K, args: ApiInput<K>): Promise<ApiOutput<K>>;
  /**
   * A call by a name the handler map does not type: the desktop shell's own `desktop.*` calls,
   * and handlers another part of the app may not have yet.
   */
  callUntyped(name: string, args: unknown): Promise<unknown>;
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
      // The service's handler map guarantees the value's shape for this name.
      return result.value as ApiOutput<typeof name>;
    },
    async callUntyped(name, args) {
      const result = await transport.call(name, args);
      if (!result.ok) throw new ApiCallError(result.error);
      return result.value;
    },
    onEvent,
  };
}

/** The error as the UI shows it, whatever was thrown. */
export function asApiError(error: unknown): ApiError {
  if (error instanceof ApiCallError) return error.field === undefined ? { kind: error.kind, message: error.message } : { kind: error.kind, message: error.message, field: error.field };
  return { kind: 'internal', message: error instanceof Error ? error.message : String(error) };
}
