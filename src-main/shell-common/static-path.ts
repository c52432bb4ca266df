import path from 'node:path';

// One resolver for both shells: the desktop's app:// protocol and the loopback HTTP shell map a
// request path to a file under the renderer folder by the same rules.

export type ResolvedAppFile = { ok: true; filePath: string } | { ok: false; status: 400 | 403; reason: string };

const ENTRY_FILE = 'index.html';

/**
 * The URL parser already folds `..` and `%2e%2e` segments; the checks below also cover what it
 * leaves alone (`%2f`, `%5c`, backslashes, drive letters, empty segments), so the answer does
 * not depend on one parser's details. `pathApi` lets tests run the Windows rules anywhere.
 */
export function resolveRequestPath(rootDir: string, rawPath: string, pathApi: path.PlatformPath = path): ResolvedAppFile {
  if (rawPath.includes('\\')) return { ok: false, status: 400, reason: 'backslash in path' };
  let decoded: string;
  try {
    decoded = decodeURIComponent(rawPath);
  } catch {
    return { ok: false, status: 400, reason: 'malformed percent-encoding in path' };
  }
  if (!decoded.startsWith('/')) return { ok: false, status: 400, reason: 'path is not absolute on the origin' };
  if (decoded.includes('\\') || decoded.includes('\0')) return { ok: false, status: 400, reason: 'forbidden character in path' };

  const segments = decoded === '/' ? [ENTRY_FILE] : decoded.slice(1).split('/');
  for (const segment of segments) {
    if (segment === '') return { ok: false, status: 400, reason: 'empty path segment' };
    if (segment === '.' || segment === '..') return { ok: false, status: 403, reason: 'dot segment in path' };
    if (segment.startsWith('.')) return { ok: false, status: 403, reason: 'hidden file in path' };
    if (segment.includes(':')) return { ok: false, status: 400, reason: 'colon in path' };
  }
  // Screens are addressed inside the single page, so a path without a file extension is a
  // reload of some screen: answer with the page itself.
  const last = segments[segments.length - 1] ?? ENTRY_FILE;
  const parts = last.includes('.') ? segments : [ENTRY_FILE];

  const root = pathApi.resolve(rootDir);
  const filePath = pathApi.resolve(root, ...parts);
  const relative = pathApi.relative(root, filePath);
  if (relative === '' || relative.startsWith('..') || pathApi.isAbsolute(relative)) {
    return { ok: false, status: 403, reason: 'path leaves the renderer folder' };
  }
  return { ok: true, filePath };
}
