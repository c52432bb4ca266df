import { readFile } from 'node:fs/promises';
import { contentTypeFor } from '../shell-common/content-type';
import { resolveRequestPath } from '../shell-common/static-path';

export async function readStatic(rootDir: string, urlPath: string): Promise<{ body: Buffer; type: string } | null> {
  const resolved = resolveRequestPath(rootDir, urlPath);
  if (!resolved.ok) return null;
  try {
    return { body: await readFile(resolved.filePath), type: contentTypeFor(resolved.filePath) };
  } catch {
    return null;
  }
}
