import type { CallResult, ServiceEvent } from '$service/contract';

/** How the renderer reaches the handler map: IPC in the desktop shell, HTTP on loopback. */
export interface Transport {
  call(name: string, args: unknown): Promise<CallResult>;
  onEvent(listener: (event: ServiceEvent) => void): () => void;
  readonly kind: 'desktop' | 'browser';
}
