import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { test as base, expect } from '@playwright/test';
import { isLoopbackAddress } from '../helpers/loopback-only';
import { expectNoAxeViolations } from './axe-check';

/** A real loopback shell on its own store, started from the built bundle as a user would. */
export interface Shell {
  url: string;
  openUrl: string;
  token: string;
  dbPath: string;
  /** Calls the API as a second client would (another window, the command line). */
  api<T = unknown>(name: string, args: unknown): Promise<T>;
}

export async function startShell(extraArgs: string[] = []): Promise<{ shell: Shell; stop: () => Promise<void> }> {
  const dir = mkdtempSync(path.join(tmpdir(), 'rigbook-e2e-'));
  const dbPath = path.join(dir, 'store.sqlite');
  const token = `e2e${Math.random().toString(36).slice(2)}`;
  const child: ChildProcess = spawn(process.execPath, ['dist-main/local-main.cjs', '--db', dbPath, ...extraArgs], {
    env: { ...process.env, RIGBOOK_TOKEN: token },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const url = await new Promise<string>((resolve, reject) => {
    let out = '';
    const timer = setTimeout(() => reject(new Error(`shell did not start: ${out}`)), 20_000);
    child.stdout?.on('data', (d: Buffer) => {
      out += d.toString();
      const m = /serving on (http:\/\/127\.0\.0\.1:\d+\/)/.exec(out);
      if (m?.[1]) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    });
    child.stderr?.on('data', (d: Buffer) => (out += d.toString()));
    child.on('exit', (code) => reject(new Error(`shell exited with ${code}: ${out}`)));
  });
  const shell: Shell = {
    url,
    openUrl: `${url}#token=${token}`,
    token,
    dbPath,
    async api<T>(name: string, args: unknown): Promise<T> {
      const res = await fetch(`${url}api/${name}`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-rigbook-token': token }, body: JSON.stringify(args) });
      const body = (await res.json()) as { ok: boolean; value?: T; error?: { message: string } };
      if (!body.ok) throw new Error(`${name}: ${body.error?.message}`);
      return body.value as T;
    },
  };
  const stop = async () => {
    child.kill('SIGTERM');
    await new Promise((r) => setTimeout(r, 200));
    rmSync(dir, { recursive: true, force: true });
  };
  return { shell, stop };
}

export const test = base.extend<{ shell: Shell; consoleErrors: string[]; outsideRequests: string[]; axeFinalState: void }>({
  shell: async ({}, use) => {
    const { shell, stop } = await startShell();
    await use(shell);
    await stop();
  },
  // Every test fails on a console error or an uncaught exception in the page; a CSP violation
  // (an inline style or script the policy refuses) is reported as a console error too.
  consoleErrors: [
    async ({ page, shell }, use) => {
      void shell;
      const errors: string[] = [];
      page.on('console', (message) => {
        if (message.type() === 'error') errors.push(message.text());
      });
      page.on('pageerror', (error) => errors.push(`uncaught: ${error.message}`));
      await page.addInitScript(() => {
        document.addEventListener('securitypolicyviolation', (e) => console.error(`CSP violation: ${e.violatedDirective} ${e.blockedURI}`));
      });
      await use(errors);
      expect(errors, 'errors in the page console').toEqual([]);
    },
    { auto: true },
  ],
  // Tests send traffic to the loopback range only: any request the page makes elsewhere fails the test.
  outsideRequests: [
    async ({ context }, use) => {
      const outside: string[] = [];
      context.on('request', (request) => {
        const url = new URL(request.url());
        if (!/^(https?|wss?):$/.test(url.protocol)) return;
        if (!isLoopbackAddress(url.hostname.replace(/^\[|\]$/g, ''))) outside.push(request.url());
      });
      await use(outside);
      expect(outside, 'requests outside 127.0.0.0/8 and ::1').toEqual([]);
    },
    { auto: true },
  ],
  // Every test that passes also has the screen it ended on checked against the accessibility
  // rule set, so a screen added later is covered by the first test that reaches it. Pages that
  // never opened the app (about:blank) are not ours to judge.
  axeFinalState: [
    async ({ page, shell }, use, testInfo) => {
      await use();
      if (testInfo.status !== testInfo.expectedStatus || page.isClosed() || !page.url().startsWith(shell.url)) return;
      const hash = new URL(page.url()).hash.replace(/#token=.*/, '') || '#/';
      await expectNoAxeViolations(page, `end of "${testInfo.title}" (${hash})`);
    },
    { auto: true },
  ],
});

export { expect };

export const SCREENSHOT_DIR = path.resolve('tests/artifacts/screens');
