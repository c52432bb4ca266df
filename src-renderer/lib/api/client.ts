import type { ApiError, ServiceEvent } from '../../../src-main/service/contract';
import type { ApiInput, ApiOutput, HandlerName } from '../../../src-main/service/handlers';
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
  onEvent(listener: (event: ServiceEvent) => void): () => void;
  readonly kind: Transport['kind'];
}

export function createClient(transport: Transport): Client {
  return {
    kind: transport.kind,
    async call(name, args) {
      const result = await transport.call(name, args);
      if (!result.ok) throw new ApiCallError(result.error);
      // The service's handler map guarantees the value's shape for this name.
      return result.value as ApiOutput<typeof name>;
    },
    onEvent: (listener) => transport.onEvent(listener),
  };
}
