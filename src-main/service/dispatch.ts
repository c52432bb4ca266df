import { handlers, type HandlerName } from './handlers';
import { ServiceError, type ApiError, type CallResult } from './contract';
import type { ServiceContext } from './service-context';
import type { AnyHandler } from './define-handler';
import { validate } from './validate';
import { describeStorageError } from '../store/storage-errors';

export function isHandlerName(name: string): name is HandlerName {
  // Own keys only: "constructor" or "__proto__" must not reach a prototype's function.
  return Object.hasOwn(handlers, name);
}

/** Turns anything thrown into an error a person can act on; internals stay in the log. */
export function toApiError(error: unknown, log: (message: string) => void = (m) => process.stderr.write(`${m}\n`)): ApiError {
  if (error instanceof ServiceError) return error.field === undefined ? { kind: error.kind, message: error.message } : { kind: error.kind, message: error.message, field: error.field };
  const code = (error as { code?: unknown } | null)?.code;
  // better-sqlite3 reports extended codes: a write whose read went stale while another
  // process committed fails with SQLITE_BUSY_SNAPSHOT, which is the same story for the user.
  if (typeof code === 'string' && (code.startsWith('SQLITE_BUSY') || code.startsWith('SQLITE_LOCKED'))) {
    return { kind: 'conflict', message: 'The store is busy with another write. Nothing was saved; try again.' };
  }
  const storage = describeStorageError(error);
  if (storage) {
    // The person gets what to do; the log keeps what the disk or SQLite said.
    log(`store file: ${storage.code}: ${error instanceof Error ? error.message : String(error)}`);
    return { kind: storage.problem === 'in-use' ? 'conflict' : storage.problem, message: storage.message };
  }
  if (typeof code === 'string' && code.startsWith('SQLITE_CONSTRAINT')) {
    log(`constraint: ${String((error as Error).message)}`);
    return { kind: 'invalid', message: 'The change breaks a link between records (a referenced record is missing or still in use). Nothing was saved.' };
  }
  const server = typeof code === 'string' ? postgresProblem(code) : null;
  if (server) {
    log(`postgresql: ${code}: ${error instanceof Error ? error.message : String(error)}`);
    return server;
  }
  log(`internal error: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`);
  return { kind: 'internal', message: 'Something went wrong inside Rigbook. Nothing was saved. The details are in the log.' };
}

export async function dispatch(ctx: ServiceContext, name: string, args: unknown): Promise<CallResult> {
  if (typeof name !== 'string' || !isHandlerName(name)) {
    return { ok: false, error: { kind: 'unknown-handler', message: `No operation named "${String(name).slice(0, 80)}"` } };
  }
  const handler: AnyHandler = handlers[name];
  try {
    const input = validate(handler.input, args);
    return { ok: true, value: await handler.run(ctx, input) };
  } catch (error) {
    return { ok: false, error: toApiError(error) };
  }
}

/**
 * A PostgreSQL server's SQLSTATE (five characters, the class in the first two) in the words of
 * the SQLite cases above; null when the code is not one of them.
 */
function postgresProblem(code: string): ApiError | null {
  if (!/^[0-9A-Z]{5}$/.test(code)) return null;
  if (code === '40001' || code === '40P01' || code === '55P03') return { kind: 'conflict', message: 'The store is busy with another write. Nothing was saved; try again.' };
  if (code.startsWith('23')) return { kind: 'invalid', message: 'The change breaks a link between records (a referenced record is missing or still in use). Nothing was saved.' };
  if (code === '53100') return { kind: 'disk-full', message: 'The disk holding the records on the PostgreSQL server is full. Nothing was saved. Ask whoever keeps the server to free some space.' };
  if (code === '25006' || code === '42501') {
    return { kind: 'read-only', message: 'The PostgreSQL store cannot be written with this connection (a read-only server or a user without write rights). Nothing was saved.' };
  }
  if (code.startsWith('08') || code.startsWith('57P')) {
    return { kind: 'internal', message: 'The connection to the PostgreSQL server was lost. Nothing was saved unless the history shows the change; try again when the server is back.' };
  }
  return null;
}
