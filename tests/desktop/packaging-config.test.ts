import { readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { computeDefaultAppDirectory, getConfig, validateConfiguration } from 'app-builder-lib/out/util/config/config';
import { DebugLogger } from 'builder-util';
import { build } from 'esbuild';
import { describe, expect, it } from 'vitest';

// electron-builder's own loader and schema validator (app-builder-lib 26) read the file, so a
// misspelt key fails here the same way it would fail at packaging time.
const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');

async function loadConfig() {
  const config = await getConfig(ROOT, null, null);
  await validateConfiguration(config, new DebugLogger(false));
  return config;
}

interface FileSetLike {
  from?: string;
  to?: string;
  filter?: string | string[];
}

describe('electron-builder.yml', () => {
  it('passes electron-builder 26 schema validation', async () => {
    await expect(loadConfig()).resolves.toBeTypeOf('object');
  });

  it('sets every fuse the security review asked for', async () => {
    // Fuse meanings per @electron/fuses and Electron's "fuses" tutorial (from memory).
    const config = await loadConfig();
    expect(config.electronFuses).toMatchObject({
      runAsNode: false,
      enableCookieEncryption: true,
      enableNodeOptionsEnvironmentVariable: false,
      enableNodeCliInspectArguments: false,
      enableEmbeddedAsarIntegrityValidation: true,
      onlyLoadAppFromAsar: true,
    });
  });

  it('names the product and its targets', async () => {
    const config = await loadConfig();
    expect(config.productName).toBe('Rigbook');
    expect(config.appId).toBe('app.rigbook.desktop');
    expect(config.linux?.target).toEqual(['AppImage', 'deb']);
    expect(config.win?.target).toEqual(['nsis']);
    expect(config.mac?.target).toEqual(['dmg']);
    expect(config.asar).toBe(true);
    expect(config.asarUnpack).toEqual(['**/*.node']);
  });

  it('packages app/ and finds the main bundle where app/package.json says it is', async () => {
    const config = await loadConfig();
    const appDir = await computeDefaultAppDirectory(ROOT, config.directories?.app);
    expect(appDir).toBe(join(ROOT, 'app'));

    const manifest: { name?: string; version?: string; main?: string; dependencies?: Record<string, string> } = JSON.parse(readFileSync(join(appDir, 'package.json'), 'utf8'));
    expect(manifest.name).toBe('rigbook');
    expect(manifest.version).toMatch(/^\d+\.\d+\.\d+$/);
    expect(manifest.main).toBe('dist-main/desktop-main.cjs');
    expect(manifest.dependencies?.['better-sqlite3']).toMatch(/^\^12\./);

    // FileSet `from` is resolved against the app directory (app-builder-lib fileMatcher).
    const sets = (Array.isArray(config.files) ? config.files : []).filter((f): f is FileSetLike => typeof f === 'object' && f !== null);
    const mainSet = sets.find((s) => s.to === 'dist-main');
    expect(mainSet && resolve(appDir, mainSet.from ?? '.')).toBe(join(ROOT, 'dist-main'));
    expect(mainSet?.filter).toEqual(expect.arrayContaining(['desktop-main.cjs', 'preload.cjs']));
    const rendererSet = sets.find((s) => s.to === 'dist-renderer');
    expect(rendererSet && resolve(appDir, rendererSet.from ?? '.')).toBe(join(ROOT, 'dist-renderer'));
  });
});

describe('preload bundle', () => {
  it('requires nothing but electron, as the sandboxed preload must', async () => {
    // A sandboxed preload gets a limited `require` (Electron "Process Sandboxing" docs, from memory).
    const result = await build({
      entryPoints: [join(ROOT, 'src-main/desktop/preload.ts')],
      bundle: true,
      write: false,
      platform: 'node',
      format: 'cjs',
      target: 'node20',
      external: ['electron'],
      logLevel: 'silent',
    });
    const code = result.outputFiles[0]?.text ?? '';
    const required = [...code.matchAll(/require\("([^"]+)"\)/g)].map((m) => m[1]);
    expect(required).toEqual(['electron']);
    expect(code).not.toMatch(/import\.meta|__filename|__dirname/);
  });
});
