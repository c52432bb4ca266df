// What crosses between a shell and the service. Shells know only this file: one generic
// call by handler name, a result that is either a value or a plain error, and a stream of
// change events. The typed view of each handler lives in handlers.ts.

/**
 * `disk-full`, `read-only` and `store-changed` are about the store file, not the input: the disk
 * is full, the file or its folder cannot be written, or the file was deleted or replaced while
 * the shell ran. Nothing was saved in each case, and the message says what to do.
 */
export const ERROR_KINDS = ['invalid', 'not-found', 'conflict', 'unknown-handler', 'internal', 'disk-full', 'read-only', 'store-changed'] as const;
export type ErrorKind = (typeof ERROR_KINDS)[number];

/** An error as the UI sees it: never a stack trace. `field` names the offending input. */
export interface ApiError {
  kind: ErrorKind;
  message: string;
  field?: string;
}

export type CallResult<T = unknown> = { ok: true; value: T } | { ok: false; error: ApiError };

export type ServiceEvent =
  /** Builds whose stored verdict was rewritten by a write. */
  | { type: 'verdicts-changed'; buildIds: string[] }
  /** Records of a kind were created, updated or archived. */
  | { type: 'records-changed'; kind: string; ids: string[] }
  /**
   * A long task got this far; `done` reaches `total` at the end. `kind` says what it works on
   * (`fleet` for imports and exports, `store` for a backup), `task` which step (`check`, `write`, `export`, `backup`).
   */
  | { type: 'progress'; kind: string; task: string; done: number; total: number };

export type EventListener = (event: ServiceEvent) => void;

/** The one surface a shell talks to. */
export interface ServiceHost {
  call(name: string, args: unknown): Promise<CallResult>;
  subscribe(listener: EventListener): () => void;
  close(): Promise<void>;
  readonly dbPath: string;
}

/** Thrown inside handlers; turned into an ApiError at the boundary. */
export class ServiceError extends Error {
  constructor(
    readonly kind: ErrorKind,
    message: string,
    readonly field?: string,
  ) {
    super(message);
    this.name = 'ServiceError';
  }
}
