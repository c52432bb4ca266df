import { afterEach } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

/** A fresh folder per test, removed afterwards: store tests use real files, never :memory:. */
export function tempDir(prefix = 'rigbook-test-'): { dir: string; file: (name: string) => string; remove: () => void } {
  const dir = mkdtempSync(path.join(tmpdir(), prefix));
  return { dir, file: (name) => path.join(dir, name), remove: () => rmSync(dir, { recursive: true, force: true }) };
}

/**
 * A maker of fresh folders for one test file, each removed after the test that made it.
 * Call once at the top of the file: `const temp = tempDirsPerTest();`.
 */
export function tempDirsPerTest(prefix?: string): () => ReturnType<typeof tempDir> {
  const made: ReturnType<typeof tempDir>[] = [];
  afterEach(() => made.splice(0).forEach((t) => t.remove()));
  return () => {
    const t = tempDir(prefix);
    made.push(t);
    return t;
  };
}
