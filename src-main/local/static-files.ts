import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { contentTypeFor } from '../desktop/content-type';

/**
 * Maps a URL path to a file under the renderer folder, or null for anything that could
 * leave it. Paths without an extension are screens of the single page: they get index.html.
 */
export function resolveStaticPath(rootDir: string, urlPath: string): string | null {
  let decoded: string;
  try {
    decoded = decodeURIComponent(urlPath);
  } catch {
    return null;
  }
  if (!decoded.startsWith('/') || decoded.includes('\\') || decoded.includes('\0')) return null;
  const segments = decoded === '/' ? ['index.html'] : decoded.slice(1).split('/');
  if (segments.some((s) => s === '' || s.startsWith('.') || s.includes(':'))) return null;
  const last = segments[segments.length - 1] ?? 'index.html';
  const parts = last.includes('.') ? segments : ['index.html'];
  const root = path.resolve(rootDir);
  const filePath = path.resolve(root, ...parts);
  const rel = path.relative(root, filePath);
  if (rel === '' || rel.startsWith('..') || path.isAbsolute(rel)) return null;
  return filePath;
}

export async function readStatic(rootDir: string, urlPath: string): Promise<{ body: Buffer; type: string } | null> {
  const filePath = resolveStaticPath(rootDir, urlPath);
  if (!filePath) return null;
  try {
    return { body: await readFile(filePath), type: contentTypeFor(filePath) };
  } catch {
    return null;
  }
}
