import path from 'node:path';
import { isAppUrl } from './url-policy';
import { resolveRequestPath, type ResolvedAppFile } from '../shell-common/static-path';

export type { ResolvedAppFile };

/**
 * Maps a request on our origin to a file under `rootDir`, refusing anything that could reach
 * outside it. Only the origin is checked here; the path rules are the loopback
 * shell's too (local/static-path.ts).
 */
export function resolveAppFile(rootDir: string, requestUrl: string, pathApi: path.PlatformPath = path): ResolvedAppFile {
  let url: URL;
  try {
    url = new URL(requestUrl);
  } catch {
    return { ok: false, status: 400, reason: 'request URL does not parse' };
  }
  if (!isAppUrl(url.href)) return { ok: false, status: 403, reason: 'request is not on the app origin' };

  return resolveRequestPath(rootDir, url.pathname, pathApi);
}
