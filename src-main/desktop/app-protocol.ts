import { readFile } from 'node:fs/promises';
import { protocol } from 'electron';
import { CONTENT_SECURITY_POLICY } from '../shell-common/content-security-policy';
import { contentTypeFor } from '../shell-common/content-type';
import { resolveAppFile } from './protocol-path';
import { APP_SCHEME } from './url-policy';

/** Must run before the app is ready: `app://` behaves like https (standard, secure origin). */
export function registerAppScheme(): void {
  protocol.registerSchemesAsPrivileged([{ scheme: APP_SCHEME, privileges: { standard: true, secure: true, supportFetchAPI: true, codeCache: true } }]);
}

const COMMON_HEADERS = {
  'Content-Security-Policy': CONTENT_SECURITY_POLICY,
  'X-Content-Type-Options': 'nosniff',
  'Cache-Control': 'no-store',
};

function plain(status: number, text: string): Response {
  return new Response(text, { status, headers: { ...COMMON_HEADERS, 'Content-Type': 'text/plain; charset=utf-8' } });
}

/** Serves dist-renderer on `app://rigbook/`, every response carrying the shared CSP. */
export function handleAppProtocol(rendererDir: string): void {
  protocol.handle(APP_SCHEME, async (request) => {
    if (request.method !== 'GET' && request.method !== 'HEAD') return plain(405, 'Method not allowed');
    const resolved = resolveAppFile(rendererDir, request.url);
    if (!resolved.ok) return plain(resolved.status, resolved.reason);
    try {
      const body = await readFile(resolved.filePath);
      return new Response(request.method === 'HEAD' ? null : body, {
        status: 200,
        headers: { ...COMMON_HEADERS, 'Content-Type': contentTypeFor(resolved.filePath) },
      });
    } catch {
      return plain(404, 'Not found');
    }
  });
}
