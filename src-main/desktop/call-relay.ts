import type { CallResult, ServiceHost } from '../service/contract';

/** Names the desktop shell answers itself, before the service sees the call. */
export const SHELL_PREFIX = 'desktop.';

export type ShellHandler<C> = (context: C, args: unknown) => Promise<CallResult>;

/**
 * Routes one `rigbook:call`: `desktop.*` names to the shell's own handlers (things only the
 * window can do, like printing), everything else unchanged to the service. Whatever goes
 * wrong comes back as a plain ApiError, never as a thrown stack.
 */
export function createCallRelay<C>(host: Pick<ServiceHost, 'call'>, shellHandlers: Readonly<Record<string, ShellHandler<C>>>, onInternalError: (error: unknown) => void = () => {}) {
  return async function relay(context: C, name: unknown, args: unknown): Promise<CallResult> {
    if (typeof name !== 'string' || name === '') {
      return { ok: false, error: { kind: 'invalid', message: 'The handler name must be a non-empty string.', field: 'name' } };
    }
    try {
      if (name.startsWith(SHELL_PREFIX)) {
        const handler = Object.hasOwn(shellHandlers, name) ? shellHandlers[name] : undefined;
        if (!handler) return { ok: false, error: { kind: 'unknown-handler', message: `There is no desktop command named "${name}".` } };
        return await handler(context, args);
      }
      return await host.call(name, args);
    } catch (error) {
      onInternalError(error);
      return { ok: false, error: { kind: 'internal', message: `"${name}" failed inside the desktop shell.` } };
    }
  };
}
