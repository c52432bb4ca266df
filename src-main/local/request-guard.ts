import { timingSafeEqual } from 'node:crypto';

// The loopback shell is a door into the machine: any web page the user visits can aim
// requests at 127.0.0.1. Three checks close it: the Host header must name our loopback
// address (defeats DNS rebinding), a browser's Origin must be our own (defeats cross-site
// posts), and every API call must carry the token printed at start (defeats everything else).

export function allowedHosts(port: number): string[] {
  return [`127.0.0.1:${port}`, `localhost:${port}`];
}

export function hostAllowed(host: string | undefined, port: number): boolean {
  return host !== undefined && allowedHosts(port).includes(host.toLowerCase());
}

/** No Origin (a non-browser client) is allowed; a present one must be exactly ours. */
export function originAllowed(origin: string | undefined, port: number): boolean {
  if (origin === undefined) return true;
  let parsed: URL;
  try {
    parsed = new URL(origin);
  } catch {
    return false;
  }
  return parsed.protocol === 'http:' && allowedHosts(port).includes(parsed.host) && parsed.origin === origin.toLowerCase();
}

export function tokenMatches(given: string | undefined | null, token: string): boolean {
  if (typeof given !== 'string') return false;
  const a = Buffer.from(given);
  const b = Buffer.from(token);
  return a.length === b.length && timingSafeEqual(a, b);
}
