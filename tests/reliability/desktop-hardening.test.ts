import { EventEmitter } from 'node:events';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { CONTENT_SECURITY_POLICY } from '../../src-main/shell-common/content-security-policy';
import { tempDir } from '../helpers/temp-dir';

// What tests/desktop does not cover yet: the content of the one CSP both shells send, the
// app:// protocol handler's answers (headers on every response, methods, traversal), the
// navigation guard and the permission handlers. Electron's protocol, shell and session are
// OS glue: replaced by recorders so the real modules run under Node.

const glue = vi.hoisted(() => ({
  handlers: new Map<string, (request: Request) => Promise<Response>>(),
  privileged: [] as unknown[],
  opened: [] as string[],
}));

vi.mock('electron', () => ({
  protocol: {
    registerSchemesAsPrivileged: (schemes: unknown[]) => glue.privileged.push(...schemes),
    handle: (scheme: string, handler: (request: Request) => Promise<Response>) => glue.handlers.set(scheme, handler),
  },
  shell: {
    openExternal: async (url: string) => {
      glue.opened.push(url);
    },
  },
}));

/** The policy as directive → sources. */
function directives(policy: string): Map<string, string[]> {
  return new Map(
    policy
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .filter((parts) => parts[0] !== '')
      .map(([name, ...sources]) => [name!, sources]),
  );
}

// Directive semantics per W3C Content Security Policy Level 3 (default-src fallback,
// 'unsafe-inline', 'unsafe-eval', frame-ancestors, base-uri, form-action), from memory.
describe('the content security policy both shells send', () => {
  const csp = directives(CONTENT_SECURITY_POLICY);

  it('denies by default and allows scripts only from our own origin', () => {
    expect(csp.get('default-src')).toEqual(["'none'"]);
    expect(csp.get('script-src')).toEqual(["'self'"]);
  });

  it('has no unsafe-inline, unsafe-eval, wildcard, remote host, data: or blob: source for code, styles or connections', () => {
    for (const directive of ['script-src', 'style-src', 'connect-src', 'font-src']) {
      const sources = csp.get(directive) ?? csp.get('default-src') ?? [];
      for (const forbidden of ["'unsafe-inline'", "'unsafe-eval'", "'unsafe-hashes'", "'wasm-unsafe-eval'", '*', 'data:', 'blob:', 'http:', 'https:']) {
        expect(sources, `${directive} allows ${forbidden}`).not.toContain(forbidden);
      }
      expect(
        sources.every((s) => s === "'self'" || s === "'none'"),
        `${directive}: ${sources.join(' ')}`,
      ).toBe(true);
    }
    // Images may be inline data (chart exports), never remote.
    expect(csp.get('img-src')?.every((s) => s === "'self'" || s === 'data:')).toBe(true);
  });

  it('closes the doors a missing directive would leave open (plugins, base, forms, framing)', () => {
    expect(csp.get('object-src')).toEqual(["'none'"]);
    expect(csp.get('base-uri')).toEqual(["'none'"]);
    expect(csp.get('form-action')).toEqual(["'none'"]);
    expect(csp.get('frame-ancestors')).toEqual(["'none'"]);
  });
});

describe('the app:// protocol handler', () => {
  const temp = tempDir('rigbook-app-protocol-');
  const rendererDir = path.join(temp.dir, 'dist-renderer');
  let serve: (request: Request) => Promise<Response>;

  beforeAll(async () => {
    mkdirSync(path.join(rendererDir, 'assets'), { recursive: true });
    writeFileSync(path.join(rendererDir, 'index.html'), '<!doctype html><title>page</title>');
    writeFileSync(path.join(rendererDir, 'assets', 'app.js'), 'export {};');
    writeFileSync(path.join(temp.dir, 'secret.txt'), 'outside-the-renderer');
    const { handleAppProtocol, registerAppScheme } = await import('../../src-main/desktop/app-protocol');
    registerAppScheme();
    handleAppProtocol(rendererDir);
    serve = glue.handlers.get('app')!;
  });
  afterAll(() => temp.remove());

  it('registers app:// as a standard, secure scheme', () => {
    expect(glue.privileged).toContainEqual(expect.objectContaining({ scheme: 'app', privileges: expect.objectContaining({ standard: true, secure: true }) }));
    expect(serve).toBeTypeOf('function');
  });

  it.each([
    ['the page', 'GET', 'app://rigbook/index.html', 200],
    ['a script', 'GET', 'app://rigbook/assets/app.js', 200],
    ['a screen path', 'GET', 'app://rigbook/builds/b-1', 200],
    ['a missing file', 'GET', 'app://rigbook/assets/none.js', 404],
    ['an encoded traversal', 'GET', 'app://rigbook/..%2fsecret.txt', 403],
    ['a backslash traversal', 'GET', 'app://rigbook/..%5csecret.txt', 400],
    ['a hidden file', 'GET', 'app://rigbook/.env', 403],
    ['another host', 'GET', 'app://evil/index.html', 403],
    ['a POST', 'POST', 'app://rigbook/index.html', 405],
    ['a PUT', 'PUT', 'app://rigbook/index.html', 405],
  ])('answers %s with %s %s → %i, carrying the CSP and nosniff', async (_label, method, url, status) => {
    const response = await serve(new Request(url, { method }));
    expect(response.status).toBe(status);
    expect(response.headers.get('content-security-policy')).toBe(CONTENT_SECURITY_POLICY);
    expect(response.headers.get('x-content-type-options')).toBe('nosniff');
    expect(response.headers.get('access-control-allow-origin')).toBeNull();
    expect(await response.text()).not.toContain('outside-the-renderer');
  });

  it('answers HEAD without a body', async () => {
    const response = await serve(new Request('app://rigbook/index.html', { method: 'HEAD' }));
    expect(response.status).toBe(200);
    expect(await response.text()).toBe('');
  });
});

/** The parts of a WebContents the guard touches, recording what it does. */
class FakeContents extends EventEmitter {
  openHandler: ((details: { url: string }) => { action: string }) | null = null;
  setWindowOpenHandler(handler: (details: { url: string }) => { action: string }): void {
    this.openHandler = handler;
  }
  /** Emits a cancellable event and tells whether the guard cancelled it. */
  fire(name: string, url?: string): boolean {
    let prevented = false;
    this.emit(name, { url, preventDefault: () => (prevented = true) });
    return prevented;
  }
}

// Electron security checklist: "limit navigation", "limit creation of new windows", "do not
// use openExternal with untrusted content", "handle session permission requests" (from memory).
describe('the navigation guard and the permission handlers', () => {
  let contents: FakeContents;
  beforeEach(async () => {
    glue.opened.length = 0;
    contents = new FakeContents();
    const { guardWebContents } = await import('../../src-main/desktop/navigation-guard');
    guardWebContents(contents as never);
  });

  it('lets the window move within our origin only', () => {
    expect(contents.fire('will-navigate', 'app://rigbook/index.html#/builds')).toBe(false);
    for (const url of ['https://example.org/', 'file:///etc/passwd', 'app://rigbook.evil/', 'http://127.0.0.1:1234/', 'javascript:alert(1)']) {
      expect(contents.fire('will-navigate', url), url).toBe(true);
      expect(contents.fire('will-redirect', url), url).toBe(true);
    }
  });

  it('sends only plain https links to the system browser', async () => {
    contents.fire('will-navigate', 'https://example.org/manual.pdf');
    contents.fire('will-navigate', 'file:///etc/passwd');
    contents.fire('will-navigate', 'smb://share/x');
    contents.fire('will-navigate', 'https://user:pw@example.org/');
    await Promise.resolve();
    expect(glue.opened).toEqual(['https://example.org/manual.pdf']);
  });

  it('never opens a new window and never attaches a webview', () => {
    for (const url of ['app://rigbook/index.html', 'https://example.org/', 'about:blank']) expect(contents.openHandler?.({ url })).toEqual({ action: 'deny' });
    expect(contents.fire('will-attach-webview')).toBe(true);
  });

  it('refuses every permission request and check', async () => {
    const recorded: { request?: (c: unknown, p: string, cb: (granted: boolean) => void) => void; check?: () => boolean; device?: () => boolean } = {};
    const session = {
      setPermissionRequestHandler: (h: typeof recorded.request) => (recorded.request = h),
      setPermissionCheckHandler: (h: typeof recorded.check) => (recorded.check = h),
      setDevicePermissionHandler: (h: typeof recorded.device) => (recorded.device = h),
    };
    const { denyAllPermissions } = await import('../../src-main/desktop/navigation-guard');
    denyAllPermissions(session as never);
    for (const permission of ['media', 'geolocation', 'notifications', 'clipboard-read', 'openExternal', 'fileSystem']) {
      let granted: boolean | null = null;
      recorded.request?.(null, permission, (g) => (granted = g));
      expect(granted, permission).toBe(false);
    }
    expect(recorded.check?.()).toBe(false);
    expect(recorded.device?.()).toBe(false);
  });
});
