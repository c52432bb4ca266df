import { mkdirSync, writeFileSync } from 'node:fs';
import { request } from 'node:http';
import path from 'node:path';
import { startLocalServer, type LocalServer } from '../../../src-main/local/local-server';
import type { ServiceEvent } from '../../../src-main/service/contract';
import { openServiceHost } from '../../../src-main/service/open-service-host';
import { assertLoopbackTarget } from '../../helpers/loopback-only';
import { tempDir } from '../../helpers/temp-dir';

export const INDEX_MARK = 'rigbook-index-page';
export const SECRET_MARK = 'rigbook-secret-outside-the-renderer';

/**
 * The real loopback shell on a real store: a renderer folder with a page and a script, and a
 * file beside (outside) it that no request may ever read.
 */
export async function startShell() {
  const temp = tempDir('rigbook-local-');
  const rendererDir = path.join(temp.dir, 'renderer');
  mkdirSync(path.join(rendererDir, 'assets'), { recursive: true });
  writeFileSync(path.join(rendererDir, 'index.html'), `<!doctype html><title>${INDEX_MARK}</title><script src="/assets/app.js"></script>`);
  writeFileSync(path.join(rendererDir, 'assets', 'app.js'), 'console.log("app");');
  writeFileSync(path.join(rendererDir, '.env'), SECRET_MARK);
  writeFileSync(path.join(temp.dir, 'secret.txt'), SECRET_MARK);
  const host = await openServiceHost({ dbPath: path.join(temp.dir, 'store.sqlite'), actor: 'loopback-test' });
  const events: ServiceEvent[] = [];
  host.subscribe((e) => events.push(e));
  const server: LocalServer = await startLocalServer({ host, rendererDir });
  const countPacks = async () =>
    (
      await host.ctx.db
        .selectFrom('batteries')
        .select((eb) => eb.fn.countAll<number>().as('n'))
        .executeTakeFirstOrThrow()
    ).n;
  const countHistory = async () =>
    (
      await host.ctx.db
        .selectFrom('history')
        .select((eb) => eb.fn.countAll<number>().as('n'))
        .executeTakeFirstOrThrow()
    ).n;
  return {
    server,
    host,
    events,
    temp,
    port: server.port,
    /** What a refused call must leave untouched. */
    sideEffects: async () => ({ packs: Number(await countPacks()), history: Number(await countHistory()), events: events.length }),
    close: async () => {
      await server.close();
      await host.close();
      temp.remove();
    },
  };
}

export interface RawResponse {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  body: string;
}

export interface RawRequest {
  port: number;
  method?: string;
  path: string;
  /** Sent exactly as given; `host: null` sends no Host header at all. */
  headers?: Record<string, string | null>;
  body?: string | Buffer;
  /** Where to connect: the shell's own address unless a test aims at another loopback address (nothing outside 127.0.0.0/8 and ::1). */
  address?: string;
  timeoutMs?: number;
}

/**
 * One HTTP/1.1 request with the path and headers exactly as given: no URL normalisation, no
 * Host filled in, so traversal and rebinding attempts reach the server as an attacker sends them.
 */
export function rawRequest(options: RawRequest): Promise<RawResponse> {
  const headers: Record<string, string> = { host: `127.0.0.1:${options.port}` };
  // A body always states its length, whatever the method, so no request bleeds into the next.
  if (options.body !== undefined) headers['content-length'] = String(Buffer.byteLength(options.body));
  for (const [k, v] of Object.entries(options.headers ?? {})) {
    if (v === null) delete headers[k];
    else headers[k] = v;
  }
  return new Promise((resolve, reject) => {
    const req = request(
      { host: assertLoopbackTarget(options.address ?? '127.0.0.1'), port: options.port, method: options.method ?? 'GET', path: options.path, headers, setHost: false, agent: false, timeout: options.timeoutMs ?? 10_000 },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks).toString('utf8') }));
        res.on('error', reject);
      },
    );
    req.on('timeout', () => req.destroy(new Error('timeout')));
    req.on('error', reject);
    if (options.body !== undefined) req.write(options.body);
    req.end();
  });
}

/** A call as the page makes it: POST with the token, our Host, JSON. */
export function apiCall(port: number, token: string, name: string, args: unknown, headers: Record<string, string | null> = {}): Promise<RawResponse> {
  return rawRequest({
    port,
    method: 'POST',
    path: `/api/${name}`,
    headers: { 'content-type': 'application/json', 'x-rigbook-token': token, ...headers },
    body: JSON.stringify(args),
  });
}

export const corsHeaders = (r: RawResponse): string[] => Object.keys(r.headers).filter((h) => h.toLowerCase().startsWith('access-control-'));
