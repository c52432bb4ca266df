import { spawn, type ChildProcessWithoutNullStreams } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..', '..');

/**
 * Bundles a child script into one CommonJS file. Starting it with plain `node` takes a
 * fraction of a TypeScript loader's start, which is what lets a test kill fifty children.
 * better-sqlite3 stays outside the bundle (it is native) and is found through NODE_PATH.
 */
export async function bundleChild(entry: string, outDir: string, alsoExternal: readonly string[] = []): Promise<string> {
  const outfile = path.join(outDir, `${path.basename(entry, '.ts')}.cjs`);
  await build({
    entryPoints: [path.join(ROOT, entry)],
    outfile,
    bundle: true,
    platform: 'node',
    target: 'node20',
    format: 'cjs',
    external: ['better-sqlite3', ...alsoExternal],
    logLevel: 'error',
  });
  return outfile;
}

/** A running child whose stdout is read line by line; an unfinished last line is never reported. */
export class ChildLines {
  readonly lines: string[] = [];
  stderr = '';
  readonly exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  private rest = '';
  private waiters: Array<() => void> = [];
  readonly child: ChildProcessWithoutNullStreams;

  constructor(script: string, args: readonly string[], env: Readonly<Record<string, string>> = {}) {
    this.child = spawn(process.execPath, [script, ...args], {
      env: { ...process.env, NODE_PATH: path.join(ROOT, 'node_modules'), ...env },
      stdio: ['pipe', 'pipe', 'pipe'],
    });
    this.child.stdout.setEncoding('utf8');
    this.child.stdout.on('data', (chunk: string) => {
      const parts = (this.rest + chunk).split('\n');
      this.rest = parts.pop() ?? '';
      this.lines.push(...parts);
      for (const wake of this.waiters.splice(0)) wake();
    });
    this.child.stderr.setEncoding('utf8');
    this.child.stderr.on('data', (chunk: string) => {
      this.stderr += chunk;
    });
    this.exited = new Promise((resolve) => {
      this.child.once('exit', (code, signal) => {
        for (const wake of this.waiters.splice(0)) wake();
        resolve({ code, signal });
      });
    });
    // A child killed while the parent writes to it must not take the test down with EPIPE.
    this.child.stdin.on('error', () => {});
  }

  get running(): boolean {
    return this.child.exitCode === null && this.child.signalCode === null;
  }

  /** Resolves with the first line (from `from` on) that passes the test, or null when the child ends or time runs out. */
  async waitForLine(test: (line: string) => boolean, timeoutMs: number, from = 0): Promise<string | null> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const found = this.lines.slice(from).find(test);
      if (found !== undefined) return found;
      if (!this.running || Date.now() >= deadline) return null;
      await new Promise<void>((resolve) => {
        const timer = setTimeout(resolve, Math.max(1, deadline - Date.now()));
        this.waiters.push(() => {
          clearTimeout(timer);
          resolve();
        });
      });
    }
  }

  send(line: string): void {
    if (this.running) this.child.stdin.write(`${line}\n`);
  }

  async kill(signal: NodeJS.Signals = 'SIGKILL'): Promise<void> {
    if (this.running) this.child.kill(signal);
    await this.exited;
  }
}
