import type { WebPreferences } from 'electron';

/**
 * The window's webPreferences. Every security-relevant value is spelled out rather than left
 * to a default, so a change of default in a later Electron cannot loosen it unnoticed.
 */
export function secureWebPreferences(preloadPath: string) {
  return {
    preload: preloadPath,
    contextIsolation: true,
    sandbox: true,
    nodeIntegration: false,
    nodeIntegrationInWorker: false,
    nodeIntegrationInSubFrames: false,
    webSecurity: true,
    allowRunningInsecureContent: false,
    webviewTag: false,
    navigateOnDragDrop: false,
    experimentalFeatures: false,
    enableBlinkFeatures: '',
    safeDialogs: true,
    spellcheck: false,
  } as const satisfies WebPreferences;
}
