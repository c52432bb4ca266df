import type { CallResult, ServiceEvent } from '$service/contract';
import type { Transport } from './transport';

const TOKEN_KEY = 'rigbook.token';

/**
 * The token arrives once in the address fragment (never sent to a server, never logged);
 * it is kept for this tab so a reload still works, and removed from the address bar.
 */
export function takeToken(loc: Location = window.location, storage: Storage = window.sessionStorage): string | null {
  const match = /(?:^#|&)token=([A-Za-z0-9_-]+)/.exec(loc.hash);
  if (match?.[1]) {
    storage.setItem(TOKEN_KEY, match[1]);
    history.replaceState(null, '', loc.pathname + loc.search);
    return match[1];
  }
  return storage.getItem(TOKEN_KEY);
}

/** Forgets the tab's token: it belongs to an earlier start of the shell. */
export function dropToken(storage: Storage = window.sessionStorage): void {
  storage.removeItem(TOKEN_KEY);
}

/** The page is replaced once the token is refused: calls still in flight are abandoned, never answered. */
const abandoned = (): Promise<CallResult> => new Promise(() => undefined);

/**
 * `onRefused` runs once, on the first call the shell refuses for its token (an address from an
 * earlier start); from then on no call or event stream is attempted, and no call is answered.
 */
export function httpTransport(token: string | null, onRefused: () => void = () => undefined): Transport {
  let refused = false;
  const sources = new Set<EventSource>();
  const refuse = () => {
    if (refused) return;
    refused = true;
    for (const source of sources) source.close();
    sources.clear();
    onRefused();
  };
  return {
    kind: 'browser',
    async call(name, args) {
      if (refused) return abandoned();
      try {
        const res = await fetch(`/api/${encodeURIComponent(name)}`, {
          method: 'POST',
          headers: { 'content-type': 'application/json', 'x-rigbook-token': token ?? '' },
          body: JSON.stringify(args ?? {}),
        });
        if (res.status === 401) {
          refuse();
          return abandoned();
        }
        return (await res.json()) as CallResult;
      } catch {
        return { ok: false, error: { kind: 'internal', message: 'Rigbook is not answering. Is the local shell still running?' } };
      }
    },
    onEvent(listener: (event: ServiceEvent) => void) {
      if (refused) return () => undefined;
      const source = new EventSource(`/api/events?token=${encodeURIComponent(token ?? '')}`);
      sources.add(source);
      source.onmessage = (message) => listener(JSON.parse(String(message.data)) as ServiceEvent);
      return () => {
        sources.delete(source);
        source.close();
      };
    },
  };
}
