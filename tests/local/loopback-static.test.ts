import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiCall, corsHeaders, INDEX_MARK, rawRequest, SECRET_MARK, startShell, type RawResponse } from './support/local-shell';

// The renderer's files are served to anyone who can reach the port (the page needs no token
// to load), so the file mapping is the other half of the door: nothing outside the renderer
// folder, and no hidden file inside it, may ever be read. Paths are sent raw, as an attacker
// would send them, not as a browser would normalise them.

let shell: Awaited<ReturnType<typeof startShell>>;
beforeAll(async () => {
  shell = await startShell();
});
afterAll(async () => shell.close());

const get = (path: string, method = 'GET'): Promise<RawResponse> => rawRequest({ port: shell.port, method, path });

/** The Content-Security-Policy as directive → sources. */
function policy(r: RawResponse): Map<string, string[]> {
  const text = String(r.headers['content-security-policy'] ?? '');
  return new Map(
    text
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .filter((parts) => parts[0] !== '')
      .map(([name, ...sources]) => [name!, sources]),
  );
}

/** Headers every response carries, whatever it answers (after OWASP Secure Headers guidance, from memory). */
function expectHardened(r: RawResponse, label: string): void {
  const csp = policy(r);
  expect(csp.get('default-src'), label).toEqual(["'none'"]);
  for (const directive of ['script-src', 'style-src', 'connect-src']) {
    const sources = csp.get(directive) ?? csp.get('default-src') ?? [];
    expect(sources, `${label} ${directive}`).not.toContain("'unsafe-inline'");
    expect(sources, `${label} ${directive}`).not.toContain("'unsafe-eval'");
    expect(sources, `${label} ${directive}`).not.toContain('*');
    expect(
      sources.some((s) => s.startsWith('http') || s === 'data:' || s === 'blob:'),
      `${label} ${directive}: ${sources.join(' ')}`,
    ).toBe(false);
  }
  expect(csp.get('object-src'), label).toEqual(["'none'"]);
  expect(csp.get('base-uri'), label).toEqual(["'none'"]);
  expect(csp.get('frame-ancestors'), label).toEqual(["'none'"]);
  expect(r.headers['x-content-type-options'], label).toBe('nosniff');
  expect(r.headers['x-frame-options'], label).toBe('DENY');
  expect(r.headers['referrer-policy'], label).toBe('no-referrer');
  expect(corsHeaders(r), label).toEqual([]);
}

describe('static files of the loopback shell', () => {
  it('serves the page, its script and a screen path (the control cases)', async () => {
    const page = await get('/');
    expect(page.status).toBe(200);
    expect(page.body).toContain(INDEX_MARK);
    expect(String(page.headers['content-type'])).toMatch(/^text\/html/);
    const script = await get('/assets/app.js');
    expect(script.status).toBe(200);
    expect(String(script.headers['content-type'])).toMatch(/javascript/);
    expect((await get('/builds/b-12')).body).toContain(INDEX_MARK);
  });

  // Traversal spellings after CWE-22 / OWASP "Path Traversal" (from memory): dot-dot, encoded
  // dots and separators, double encoding, backslashes, NUL, absolute and drive paths, hidden files.
  it.each([
    '/../secret.txt',
    '/../../../../etc/passwd',
    '/assets/../../secret.txt',
    '/%2e%2e/secret.txt',
    '/%2E%2E/%2E%2E/etc/passwd',
    '/.%2e/secret.txt',
    '/..%2fsecret.txt',
    '/%2e%2e%2fsecret.txt',
    '/assets%2f..%2f..%2fsecret.txt',
    '/assets/..%2f..%2fsecret.txt',
    '/%252e%252e/secret.txt',
    '/..%5csecret.txt',
    '/..\\secret.txt',
    '/assets\\..\\..\\secret.txt',
    '//etc/passwd',
    '/%2fetc%2fpasswd',
    '/index.html%00.js',
    '/.env',
    '/%2eenv',
    '/assets/%2e%2e/.env',
    '/C:/Windows/win.ini',
    '/%E0%A4%A.js',
    'secret.txt',
    'http://127.0.0.1/../secret.txt',
  ])('never reads outside the renderer folder or a hidden file: %s', async (path) => {
    const r = await get(path);
    expect(r.body, path).not.toContain(SECRET_MARK);
    expect(r.body, path).not.toMatch(/root:.*:0:0:/);
    if (r.status === 200) expect(r.body, `${path} answered 200 with something other than the page`).toContain(INDEX_MARK);
    else expect([400, 403, 404], path).toContain(r.status);
  });

  it('answers only GET and HEAD for files', async () => {
    for (const method of ['POST', 'PUT', 'DELETE']) {
      const r = await rawRequest({ port: shell.port, method, path: '/index.html', headers: { 'content-type': 'text/plain' }, body: 'x' });
      expect(r.status, method).toBe(405);
    }
    expect((await get('/index.html', 'HEAD')).status).toBe(200);
  });

  it('refuses a file request under another Host or from another Origin (DNS rebinding reads the page too)', async () => {
    const rebound = await rawRequest({ port: shell.port, path: '/index.html', headers: { host: `evil.example:${shell.port}` } });
    expect(rebound.status).toBe(421);
    expect(rebound.body).not.toContain(INDEX_MARK);
    const foreign = await rawRequest({ port: shell.port, path: '/index.html', headers: { origin: 'http://evil.example' } });
    expect(foreign.status).toBe(403);
  });

  it('sends the security headers on pages, scripts, refusals, missing files and API answers', async () => {
    const samples: Array<[string, RawResponse]> = [
      ['page', await get('/')],
      ['script', await get('/assets/app.js')],
      ['missing file', await get('/assets/nothing.js')],
      ['traversal', await get('/..%2fsecret.txt')],
      ['wrong host', await rawRequest({ port: shell.port, path: '/', headers: { host: `evil.example:${shell.port}` } })],
      ['api answer', await apiCall(shell.port, shell.server.token, 'store.info', {})],
      ['api refusal', await apiCall(shell.port, 'nope', 'store.info', {})],
    ];
    for (const [label, r] of samples) expectHardened(r, label);
  });
});
