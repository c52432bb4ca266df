import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

/** A fresh folder per test, removed afterwards: store tests use real files, never :memory:. */
export function tempDir(prefix = 'rigbook-test-'): { dir: string; file: (name: string) => string; remove: () => void } {
  const dir = mkdtempSync(path.join(tmpdir(), prefix));
  return { dir, file: (name) => path.join(dir, name), remove: () => rmSync(dir, { recursive: true, force: true }) };
}
