import { readFileSync } from 'node:fs';
import { connect } from 'node:net';
import { request } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_BODY_BYTES, startLocalServer } from '../../src-main/local/local-server';
import { assertLoopbackTarget, isLoopbackAddress } from '../helpers/loopback-only';
import { apiCall, corsHeaders, rawRequest, startShell, type RawResponse } from './support/local-shell';

// The loopback shell is a door into the machine that any web page the user visits can knock
// on (http://127.0.0.1:PORT is reachable from every tab). These tests knock the way such a
// page, a DNS-rebinding page, or another program on the machine would, against the real
// server and a real store, and check that nothing gets in and nothing is written.

let shell: Awaited<ReturnType<typeof startShell>>;
const packArgs = { name: 'Door test 2S', chemistry: 'lipo', cellsSeries: 2, capacityMah: 3000 };

beforeAll(async () => {
  shell = await startShell();
});
afterAll(async () => shell.close());

/** The shell's JSON answer; Node's own refusals (a request it cannot parse) come with no body. */
function refusal(r: RawResponse): { ok: boolean; error?: { kind: string; message: string } } {
  if (r.body === '' && r.status >= 400) return { ok: false };
  return JSON.parse(r.body) as { ok: boolean; error?: { kind: string; message: string } };
}

/** Sends a create that would add a pack, and checks it was refused with the status given and left no trace. */
async function expectRefusedCreate(status: number, headers: Record<string, string | null>, label: string, path = '/api/batteries.create'): Promise<RawResponse> {
  const before = await shell.sideEffects();
  const r = await rawRequest({
    port: shell.port,
    method: 'POST',
    path,
    headers: { 'content-type': 'application/json', 'x-rigbook-token': shell.server.token, ...headers },
    body: JSON.stringify(packArgs),
  });
  expect(r.status, `${label}: ${r.body}`).toBe(status);
  expect(refusal(r).ok, label).toBe(false);
  expect(corsHeaders(r), label).toEqual([]);
  expect(await shell.sideEffects(), label).toEqual(before);
  return r;
}

describe('the loopback shell listens on 127.0.0.1 only', () => {
  it('reports a 127.0.0.1 address', () => {
    expect(new URL(shell.server.url).hostname).toBe('127.0.0.1');
    expect(shell.server.openUrl.startsWith(`${shell.server.url}#token=`)).toBe(true);
  });

  it.skipIf(process.platform !== 'linux')('has exactly one listening socket on its port, bound to 127.0.0.1 (Linux /proc/net)', () => {
    // /proc/net/tcp lists local address:port in hex, address in host byte order; state 0A is LISTEN (proc(5)).
    const port = shell.port.toString(16).toUpperCase().padStart(4, '0');
    const listening = (file: string) =>
      readFileSync(file, 'utf8')
        .split('\n')
        .slice(1)
        .map((line) => line.trim().split(/\s+/))
        .filter((cols) => cols[1]?.endsWith(`:${port}`) && cols[3] === '0A')
        .map((cols) => cols[1]);
    expect(listening('/proc/net/tcp')).toEqual([`0100007F:${port}`]);
    let v6: string[] = [];
    try {
      v6 = listening('/proc/net/tcp6').filter((x): x is string => x !== undefined);
    } catch {
      // No IPv6 on this machine: nothing can listen there.
    }
    expect(v6).toEqual([]);
  });

  it('the listening socket itself reports 127.0.0.1 (server.address())', () => {
    expect(shell.server.listening).toEqual({ address: '127.0.0.1', family: 'IPv4', port: shell.port });
  });

  it.each(['0.0.0.0', '::', '::1', '127.0.0.2', 'localhost', '192.0.2.10'])('refuses to start when asked to listen on %s, before opening any socket', async (address) => {
    // 192.0.2.10 is in TEST-NET-1 (RFC 5737): documentation only, never routed; nothing connects to it here.
    await expect(startLocalServer({ host: shell.host, rendererDir: shell.temp.dir, bindAddress: address })).rejects.toThrow(`listens on 127.0.0.1 only (this computer); it will not listen on "${address}"`);
  });

  it('starts when asked for 127.0.0.1 explicitly', async () => {
    const server = await startLocalServer({ host: shell.host, rendererDir: shell.temp.dir, bindAddress: '127.0.0.1' });
    try {
      expect(server.listening.address).toBe('127.0.0.1');
    } finally {
      await server.close();
    }
  });

  it('refuses connections on the other loopback addresses (127.0.0.2, ::1), and tries nothing outside the loopback range', async () => {
    const others = ['127.0.0.2', '::1'];
    const outcomes: Record<string, string> = {};
    for (const address of others) {
      outcomes[address] = await new Promise<string>((resolve) => {
        const socket = connect({ host: assertLoopbackTarget(address), port: shell.port });
        socket.setTimeout(3000, () => {
          socket.destroy();
          resolve('timeout');
        });
        socket.once('connect', () => {
          socket.destroy();
          resolve('connected');
        });
        socket.once('error', (e: NodeJS.ErrnoException) => resolve(e.code ?? 'error'));
      });
    }
    for (const [address, outcome] of Object.entries(outcomes)) expect(outcome, `${address} (all: ${JSON.stringify(outcomes)})`).not.toBe('connected');
    // The control: the same connection code does reach the shell on its own address.
    const own = await new Promise<string>((resolve) => {
      const socket = connect({ host: '127.0.0.1', port: shell.port });
      socket.once('connect', () => {
        socket.destroy();
        resolve('connected');
      });
      socket.once('error', (e: NodeJS.ErrnoException) => resolve(e.code ?? 'error'));
    });
    expect(own).toBe('connected');
  });

  it('the test helpers refuse any target outside 127.0.0.0/8 and ::1 before connecting', async () => {
    for (const address of ['127.0.0.1', '127.255.255.254', '::1', '::ffff:127.0.0.1']) expect(isLoopbackAddress(address), address).toBe(true);
    // Documentation ranges (RFC 5737, RFC 3849), a private range, the unspecified addresses, a name.
    for (const address of ['192.0.2.1', '2001:db8::1', '10.0.0.1', '0.0.0.0', '::', 'localhost', '128.0.0.1', '::ffff:192.0.2.1']) expect(isLoopbackAddress(address), address).toBe(false);
    await expect(rawRequest({ port: shell.port, path: '/', address: '192.0.2.1' })).rejects.toThrow('outside that range');
  });
});

describe('an API call is served only with the token, our Host and our Origin', () => {
  it('serves the page’s own call (the control case)', async () => {
    const before = await shell.sideEffects();
    const r = await apiCall(shell.port, shell.server.token, 'batteries.create', packArgs, { origin: `http://127.0.0.1:${shell.port}` });
    expect(r.status).toBe(200);
    expect(refusal(r)).toMatchObject({ ok: true });
    expect(corsHeaders(r)).toEqual([]);
    expect((await shell.sideEffects()).packs).toBe(before.packs + 1);
    const viaLocalhost = await apiCall(shell.port, shell.server.token, 'store.info', {}, { host: `localhost:${shell.port}`, origin: `http://localhost:${shell.port}` });
    expect(viaLocalhost.status).toBe(200);
  });

  it.each([
    ['no token', { 'x-rigbook-token': null }],
    ['an empty token', { 'x-rigbook-token': '' }],
    ['a wrong token of the same length', { 'x-rigbook-token': 'WRONG' }],
    ['the token in another case', { 'x-rigbook-token': 'CASE' }],
    ['the token with one character more', { 'x-rigbook-token': 'LONGER' }],
    ['two token headers', { 'x-rigbook-token': 'TWICE' }],
  ])('refuses a call with %s (401)', async (label, headers) => {
    const token = shell.server.token;
    const given = headers['x-rigbook-token'];
    const value =
      given === 'WRONG'
        ? token.replace(/./g, (c) => (c === 'A' ? 'B' : 'A'))
        : given === 'CASE'
          ? token.toUpperCase() === token
            ? token.toLowerCase()
            : token.toUpperCase()
          : given === 'LONGER'
            ? `${token}x`
            : given === 'TWICE'
              ? `x, ${token}`
              : given;
    await expectRefusedCreate(401, { 'x-rigbook-token': value }, label);
  });

  it('does not take the token from the query string for a call', async () => {
    await expectRefusedCreate(401, { 'x-rigbook-token': null }, 'token in query', `/api/batteries.create?token=${shell.server.token}`);
  });

  it.each([
    ['another name on our port (DNS rebinding)', 'evil.example:PORT'],
    ['our address as a subdomain of another name', '127.0.0.1.evil:PORT'],
    ['localhost as a subdomain of another name', 'localhost.evil:PORT'],
    ['our address on another port', '127.0.0.1:OTHER'],
    ['our address without a port', '127.0.0.1'],
    ['an IPv6 loopback name', '[::1]:PORT'],
    ['a name with a trailing dot', 'localhost.:PORT'],
    ['userinfo in front of our address', 'evil@127.0.0.1:PORT'],
  ])('refuses a call whose Host is %s (421)', async (label, host) => {
    await expectRefusedCreate(421, { host: host.replace('PORT', String(shell.port)).replace('OTHER', String(shell.port + 1)) }, label);
  });

  it('refuses a call with no Host header at all (Node answers 400 before the shell sees it)', async () => {
    await expectRefusedCreate(400, { host: null }, 'no Host');
  });

  it.each([
    ['another site', 'http://evil.example'],
    ['our address on another port', 'http://127.0.0.1:OTHER'],
    ['an opaque origin (sandboxed frame, file page)', 'null'],
    ['https on our port', 'https://127.0.0.1:PORT'],
    ['a look-alike host', 'http://127.0.0.1.evil.example:PORT'],
    ['localhost as a subdomain', 'http://localhost.evil:PORT'],
    ['our origin with a path', 'http://127.0.0.1:PORT/'],
    ['garbage', 'not a url'],
  ])('refuses a call from %s (403)', async (label, origin) => {
    await expectRefusedCreate(403, { origin: origin.replace('PORT', String(shell.port)).replace('OTHER', String(shell.port + 1)) }, label);
  });

  it.each([
    ['text/plain (a form a page may post without asking)', 'text/plain'],
    ['a url-encoded form', 'application/x-www-form-urlencoded'],
    ['multipart form data', 'multipart/form-data; boundary=x'],
    ['no content type', null],
  ])('refuses a body sent as %s (415)', async (label, type) => {
    await expectRefusedCreate(415, { 'content-type': type }, label);
  });

  it.each(['/api/constructor', '/api/__proto__', '/api/toString', '/api/%2e%2e%2fbatteries.create', '/api/batteries.create%00', '/api/batteries.create/x'])('answers %s as an unknown operation, with no effect', async (path) => {
    const before = await shell.sideEffects();
    const r = await rawRequest({ port: shell.port, method: 'POST', path, headers: { 'content-type': 'application/json', 'x-rigbook-token': shell.server.token }, body: JSON.stringify(packArgs) });
    expect(r.status).toBe(200);
    expect(refusal(r)).toMatchObject({ ok: false, error: { kind: 'unknown-handler' } });
    expect(await shell.sideEffects()).toEqual(before);
  });
});

describe('methods, bodies and CORS', () => {
  it.each(['GET', 'PUT', 'DELETE', 'PATCH', 'OPTIONS'])('refuses %s on /api/<name> (405) and writes nothing', async (method) => {
    const before = await shell.sideEffects();
    const r = await rawRequest({ port: shell.port, method, path: '/api/batteries.create', headers: { 'content-type': 'application/json', 'x-rigbook-token': shell.server.token }, body: JSON.stringify(packArgs) });
    expect(r.status).toBe(405);
    expect(corsHeaders(r)).toEqual([]);
    expect(await shell.sideEffects()).toEqual(before);
  });

  it('answers a CORS preflight from another site without any access-control header', async () => {
    for (const origin of ['http://evil.example', `http://127.0.0.1:${shell.port + 1}`, 'null']) {
      const r = await rawRequest({
        port: shell.port,
        method: 'OPTIONS',
        path: '/api/batteries.create',
        headers: { origin, 'access-control-request-method': 'POST', 'access-control-request-headers': 'content-type, x-rigbook-token' },
      });
      expect(r.status, origin).toBeGreaterThanOrEqual(400);
      expect(corsHeaders(r), origin).toEqual([]);
    }
    // Not even our own origin gets one: the page never needs CORS.
    const own = await rawRequest({ port: shell.port, method: 'OPTIONS', path: '/api/batteries.create', headers: { origin: `http://127.0.0.1:${shell.port}`, 'access-control-request-method': 'POST' } });
    expect(corsHeaders(own)).toEqual([]);
  });

  it('refuses a body that is not JSON (400), naming the problem', async () => {
    const before = await shell.sideEffects();
    const r = await rawRequest({ port: shell.port, method: 'POST', path: '/api/batteries.create', headers: { 'content-type': 'application/json', 'x-rigbook-token': shell.server.token }, body: '{"name": "half' });
    expect(r.status).toBe(400);
    expect(refusal(r).error?.message).toMatch(/not valid JSON/);
    expect(await shell.sideEffects()).toEqual(before);
  });

  it(`refuses a body over ${MAX_BODY_BYTES} bytes and writes nothing`, async () => {
    const before = await shell.sideEffects();
    // Valid JSON all the way (a name padded with spaces), so only its size can be refused.
    const body = Buffer.concat([Buffer.from('{"name":"Big"'), Buffer.alloc(MAX_BODY_BYTES + 1, 0x20), Buffer.from(',"chemistry":"lipo","cellsSeries":2,"capacityMah":3000}')]);
    let outcome: string;
    try {
      const r = await rawRequest({ port: shell.port, method: 'POST', path: '/api/batteries.create', headers: { 'content-type': 'application/json', 'x-rigbook-token': shell.server.token }, body, timeoutMs: 60_000 });
      expect([400, 413]).toContain(r.status);
      expect(refusal(r).error?.message).toMatch(/too large/i);
      outcome = `HTTP ${r.status}`;
    } catch (error) {
      // The server may also cut the connection while the client is still sending.
      outcome = (error as NodeJS.ErrnoException).code ?? String(error);
      expect(['ECONNRESET', 'EPIPE']).toContain(outcome);
    }
    expect(await shell.sideEffects()).toEqual(before);
    // The shell still answers afterwards.
    expect((await apiCall(shell.port, shell.server.token, 'store.info', {})).status).toBe(200);
    console.log(`loopback body limit: ${MAX_BODY_BYTES + 1}+ bytes answered with ${outcome}`);
  });
});

describe('the change-event stream', () => {
  function openStream(path: string, headers: Record<string, string> = {}): Promise<{ status: number; headers: Record<string, unknown>; received: () => string; close: () => void }> {
    return new Promise((resolve, reject) => {
      const req = request({ host: '127.0.0.1', port: shell.port, path, headers: { host: `127.0.0.1:${shell.port}`, ...headers }, setHost: false, agent: false }, (res) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (c: string) => (text += c));
        res.on('error', () => {});
        resolve({ status: res.statusCode ?? 0, headers: res.headers, received: () => text, close: () => req.destroy() });
      });
      req.on('error', reject);
      req.end();
    });
  }

  it('needs the token, our Host and our Origin, and then carries the events', async () => {
    const refused = [
      await openStream('/api/events'),
      await openStream('/api/events?token='),
      await openStream(`/api/events?token=${shell.server.token.toUpperCase() === shell.server.token ? 'x' : shell.server.token.toUpperCase()}`),
      await openStream(`/api/events?token=${shell.server.token}`, { host: `evil.example:${shell.port}` }),
      await openStream(`/api/events?token=${shell.server.token}`, { origin: 'http://evil.example' }),
    ];
    expect(refused.map((s) => s.status)).toEqual([401, 401, 401, 421, 403]);
    const open = await openStream(`/api/events?token=${shell.server.token}`, { origin: `http://127.0.0.1:${shell.port}` });
    try {
      expect(open.status).toBe(200);
      expect(String(open.headers['content-type'])).toMatch(/^text\/event-stream/);
      expect(Object.keys(open.headers).filter((h) => h.startsWith('access-control-'))).toEqual([]);
      const r = await apiCall(shell.port, shell.server.token, 'batteries.create', { ...packArgs, name: 'Event probe' });
      expect(refusal(r)).toMatchObject({ ok: true });
      const deadline = Date.now() + 5000;
      while (!open.received().includes('records-changed') && Date.now() < deadline) await new Promise((res) => setTimeout(res, 20));
      expect(open.received()).toContain('"records-changed"');
      for (const s of refused) expect(s.received()).not.toContain('records-changed');
    } finally {
      open.close();
      for (const s of refused) s.close();
    }
  });
});
