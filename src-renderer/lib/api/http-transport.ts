import type { CallResult, ServiceEvent } from '../../../src-main/service/contract';
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

export function httpTransport(token: string | null): Transport {
  return {
    kind: 'browser',
    async call(name, args) {
      try {
        const res = await fetch(`/api/${encodeURIComponent(name)}`, {
          method: 'POST',
          headers: { 'content-type': 'application/json', 'x-rigbook-token': token ?? '' },
          body: JSON.stringify(args ?? {}),
        });
        return (await res.json()) as CallResult;
      } catch {
        return { ok: false, error: { kind: 'internal', message: 'Rigbook is not answering. Is the local shell still running?' } };
      }
    },
    onEvent(listener: (event: ServiceEvent) => void) {
      const source = new EventSource(`/api/events?token=${encodeURIComponent(token ?? '')}`);
      source.onmessage = (message) => listener(JSON.parse(String(message.data)) as ServiceEvent);
      return () => source.close();
    },
  };
}
