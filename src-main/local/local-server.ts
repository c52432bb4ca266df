import { randomBytes } from 'node:crypto';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { ServiceHost } from '../service/contract';
import { CONTENT_SECURITY_POLICY } from '../shell-common/content-security-policy';
import { hostAllowed, originAllowed, tokenMatches } from './request-guard';
import { readStatic } from './static-files';
import { pageCallRefusal } from '../service/page-call-policy';

export const TOKEN_HEADER = 'x-rigbook-token';
/** Large enough for a shop's whole fleet file; anything bigger is refused before parsing. */
export const MAX_BODY_BYTES = 64 * 1024 * 1024;
const LOOPBACK = '127.0.0.1';

export interface LocalServerOptions {
  host: ServiceHost;
  rendererDir: string;
  port?: number;
  token?: string;
  /** Only 127.0.0.1 is accepted: the shell serves this computer alone. Any other address is refused before listening. */
  bindAddress?: string;
}

export interface LocalServer {
  url: string;
  /** The address to open: the token rides in the fragment, which browsers never send to a server. */
  openUrl: string;
  token: string;
  port: number;
  /** What the listening socket itself reports (`server.address()`). */
  listening: { address: string; family: string; port: number };
  close(): Promise<void>;
}

const SECURITY_HEADERS = {
  'content-security-policy': CONTENT_SECURITY_POLICY,
  'x-content-type-options': 'nosniff',
  'referrer-policy': 'no-referrer',
  'x-frame-options': 'DENY',
  'cross-origin-opener-policy': 'same-origin',
  'cross-origin-resource-policy': 'same-origin',
};

function send(res: ServerResponse, status: number, type: string, body: string | Buffer, extra: Record<string, string> = {}): void {
  res.writeHead(status, { ...SECURITY_HEADERS, 'content-type': type, 'cache-control': 'no-store', ...extra });
  res.end(body);
}

function sendJson(res: ServerResponse, status: number, value: unknown): void {
  send(res, status, 'application/json; charset=utf-8', JSON.stringify(value));
}

function refuse(res: ServerResponse, status: number, message: string): void {
  sendJson(res, status, { ok: false, error: { kind: 'invalid', message } });
}

async function readBody(req: IncomingMessage): Promise<string> {
  const parts: Buffer[] = [];
  let size = 0;
  for await (const chunk of req) {
    const buf = chunk as Buffer;
    size += buf.length;
    if (size > MAX_BODY_BYTES) throw new Error('body too large');
    parts.push(buf);
  }
  return Buffer.concat(parts).toString('utf8');
}

/** Serves the renderer and the handler map on 127.0.0.1 only. */
export async function startLocalServer(options: LocalServerOptions): Promise<LocalServer> {
  if (options.bindAddress !== undefined && options.bindAddress !== LOOPBACK) {
    throw new Error(`The browser shell listens on ${LOOPBACK} only (this computer); it will not listen on "${options.bindAddress}".`);
  }
  const token = options.token ?? randomBytes(24).toString('base64url');
  let port = 0;
  const sockets = new Set<import('node:net').Socket>();
  const eventStreams = new Set<ServerResponse>();

  const unsubscribe = options.host.subscribe((event) => {
    const line = `data: ${JSON.stringify(event)}\n\n`;
    for (const res of eventStreams) res.write(line);
  });

  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    if (!hostAllowed(req.headers.host, port)) return refuse(res, 421, 'Host not allowed');
    if (!originAllowed(req.headers.origin, port)) return refuse(res, 403, 'Origin not allowed');
    const url = new URL(req.url ?? '/', `http://${LOOPBACK}:${port}`);

    if (url.pathname === '/api/events') {
      if (req.method !== 'GET') return refuse(res, 405, 'Use GET');
      if (!tokenMatches(url.searchParams.get('token'), token)) return refuse(res, 401, 'Missing or wrong token');
      res.writeHead(200, { ...SECURITY_HEADERS, 'content-type': 'text/event-stream', 'cache-control': 'no-store', connection: 'keep-alive' });
      res.write(': connected\n\n');
      eventStreams.add(res);
      req.on('close', () => eventStreams.delete(res));
      return;
    }

    if (url.pathname.startsWith('/api/')) {
      if (req.method !== 'POST') return refuse(res, 405, 'Use POST');
      const given = req.headers[TOKEN_HEADER];
      if (!tokenMatches(Array.isArray(given) ? given[0] : given, token)) return refuse(res, 401, 'Missing or wrong token');
      if (!String(req.headers['content-type'] ?? '').startsWith('application/json')) return refuse(res, 415, 'Send application/json');
      let args: unknown;
      try {
        const body = await readBody(req);
        args = body === '' ? undefined : (JSON.parse(body) as unknown);
      } catch (error) {
        const tooLarge = error instanceof Error && error.message === 'body too large';
        return refuse(res, tooLarge ? 413 : 400, tooLarge ? 'Request too large' : 'Body is not valid JSON');
      }
      const name = decodeURIComponent(url.pathname.slice('/api/'.length));
      const refused = pageCallRefusal('loopback', options.host.dbPath, name, args);
      const result = refused ? { ok: false as const, error: refused } : await options.host.call(name, args);
      return sendJson(res, 200, result);
    }

    if (req.method !== 'GET' && req.method !== 'HEAD') return refuse(res, 405, 'Use GET');
    const file = await readStatic(options.rendererDir, url.pathname);
    if (!file) return send(res, 404, 'text/plain; charset=utf-8', 'Not found');
    return send(res, 200, file.type, file.body);
  }

  const server: Server = createServer((req, res) => {
    handle(req, res).catch((error: unknown) => {
      process.stderr.write(`local shell error: ${error instanceof Error ? error.message : String(error)}\n`);
      if (!res.headersSent) refuse(res, 500, 'Internal error');
      else res.end();
    });
  });
  server.on('connection', (socket) => {
    sockets.add(socket);
    socket.on('close', () => sockets.delete(socket));
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, LOOPBACK, () => resolve());
  });
  const bound = server.address() as AddressInfo;
  port = bound.port;
  const url = `http://${LOOPBACK}:${port}/`;
  return {
    url,
    openUrl: `${url}#token=${token}`,
    token,
    port,
    listening: { address: bound.address, family: bound.family, port: bound.port },
    close: async () => {
      unsubscribe();
      for (const res of eventStreams) res.end();
      eventStreams.clear();
      for (const socket of sockets) socket.destroy();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
