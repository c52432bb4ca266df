import { describe, expect, it } from 'vitest';
import { secureWebPreferences } from '../../src-main/desktop/web-preferences';

// Expected values follow Electron's security checklist (electronjs.org/docs/latest/tutorial/security:
// "Do not enable Node.js integration for remote content", "Enable context isolation",
// "Enable process sandboxing", "Do not disable webSecurity", "Do not set
// allowRunningInsecureContent to true", "Do not enable experimental features",
// "Do not use enableBlinkFeatures", "Do not use <webview>") — from memory of that page.
describe('secureWebPreferences', () => {
  const prefs = secureWebPreferences('/opt/rigbook/dist-main/preload.cjs');

  it('isolates the page from Node and from the preload', () => {
    expect(prefs.contextIsolation).toBe(true);
    expect(prefs.sandbox).toBe(true);
    expect(prefs.nodeIntegration).toBe(false);
    expect(prefs.nodeIntegrationInWorker).toBe(false);
    expect(prefs.nodeIntegrationInSubFrames).toBe(false);
  });

  it('keeps web security on and insecure or experimental features off', () => {
    expect(prefs.webSecurity).toBe(true);
    expect(prefs.allowRunningInsecureContent).toBe(false);
    expect(prefs.experimentalFeatures).toBe(false);
    expect(prefs.enableBlinkFeatures).toBe('');
    expect(prefs.webviewTag).toBe(false);
    expect(prefs.navigateOnDragDrop).toBe(false);
  });

  it('uses the preload path it is given and nothing else loads code', () => {
    expect(prefs.preload).toBe('/opt/rigbook/dist-main/preload.cjs');
    expect(Object.keys(prefs)).not.toContain('additionalArguments');
    expect(Object.keys(prefs)).not.toContain('partition');
  });
});
