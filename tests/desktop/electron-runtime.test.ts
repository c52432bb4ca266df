import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

// Runs the built desktop shell in the real Electron runtime. Needs `npm run build`, the
// downloaded Electron binary and a display (or xvfb-run on Linux).
const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
const DESKTOP_MAIN = join(ROOT, 'dist-main', 'desktop-main.cjs');

function electronBinary(): string | null {
  try {
    const binary: unknown = createRequire(join(ROOT, 'package.json'))('electron');
    return typeof binary === 'string' && existsSync(binary) ? binary : null;
  } catch {
    // The electron package throws when its binary was never downloaded.
    return null;
  }
}

const binary = electronBinary();
const hasElectronBinary = binary !== null;
const reason = hasElectronBinary ? '' : ' (skipped: Electron runtime not downloaded on this machine)';

describe('desktop shell in Electron', () => {
  it.skipIf(!hasElectronBinary)(`loads app://rigbook/ with only window.rigbook exposed and refuses outside navigation${reason}`, async () => {
    expect(existsSync(DESKTOP_MAIN), 'run npm run build first').toBe(true);
    const { _electron } = await import('@playwright/test');
    const dataDir = mkdtempSync(join(tmpdir(), 'rigbook-desktop-'));
    const app = await _electron.launch({
      executablePath: binary ?? undefined,
      args: [DESKTOP_MAIN, '--db', join(dataDir, 'rigbook.sqlite')],
    });
    try {
      const page = await app.firstWindow();
      await page.waitForLoadState('domcontentloaded');
      expect(page.url()).toMatch(/^app:\/\/rigbook\//);

      const surface = await page.evaluate(() => {
        const bridge = (window as unknown as { rigbook?: Record<string, unknown> }).rigbook;
        return {
          keys: bridge ? Object.keys(bridge).sort() : null,
          hasRequire: 'require' in window,
          hasProcess: 'process' in window,
        };
      });
      expect(surface).toEqual({ keys: ['call', 'onEvent'], hasRequire: false, hasProcess: false });

      const unknown = await page.evaluate(() => (window as unknown as { rigbook: { call(n: string, a: unknown): Promise<unknown> } }).rigbook.call('desktop.noSuchThing', {}));
      expect(unknown).toMatchObject({ ok: false, error: { kind: 'unknown-handler' } });

      await page.evaluate(() => {
        window.location.href = 'file:///etc/hostname';
      });
      await page.waitForTimeout(200);
      expect(page.url()).toMatch(/^app:\/\/rigbook\//);

      const csp = await page.evaluate(async () => (await fetch('/index.html')).headers.get('content-security-policy'));
      expect(csp).toContain("default-src 'none'");
    } finally {
      await app.close();
      rmSync(dataDir, { recursive: true, force: true });
    }
  });
});
