// Finds a Chromium (or Chrome) for the end-to-end tests without ever downloading one:
// RIGBOOK_CHROMIUM (or CHROMIUM_PATH), then the usual program names on PATH, then the usual
// install folders on macOS and Windows, then a browser Playwright installed earlier. Everything it
// looks at comes from the environment it is given, so a machine without a browser can be
// simulated by handing it an empty PATH and HOME.
import { accessSync, constants, existsSync, statSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';

export const CHROMIUM_FLAGS = ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];

const NAMES_ON_PATH = ['chromium', 'chromium-browser', 'google-chrome-stable', 'google-chrome', 'chrome'];

function isProgram(file, platform) {
  try {
    if (!statSync(file).isFile()) return false;
    if (platform !== 'win32') accessSync(file, constants.X_OK);
    return true;
  } catch {
    return false;
  }
}

/** The first `name` on the PATH of `env` that is a program, or null (PATHEXT on Windows). */
export function onPath(name, env = process.env, platform = process.platform) {
  const pathText = env.PATH ?? env.Path ?? '';
  const separator = platform === 'win32' ? ';' : ':';
  const extensions = platform === 'win32' ? ['', ...(env.PATHEXT ?? '.EXE;.CMD;.BAT').split(';').filter(Boolean)] : [''];
  for (const dir of pathText.split(separator)) {
    if (!dir) continue;
    for (const ext of extensions) {
      const file = path.join(dir, name + ext);
      if (isProgram(file, platform)) return file;
    }
  }
  return null;
}

/** Fixed install places that are not on PATH: app bundles on macOS, Program Files on Windows. */
function installFolders(env, platform) {
  if (platform === 'darwin') {
    const roots = ['/Applications', ...(env.HOME ? [path.join(env.HOME, 'Applications')] : [])];
    return roots.flatMap((root) => [path.join(root, 'Chromium.app', 'Contents', 'MacOS', 'Chromium'), path.join(root, 'Google Chrome.app', 'Contents', 'MacOS', 'Google Chrome')]);
  }
  if (platform === 'win32') {
    const roots = [env.ProgramFiles, env['ProgramFiles(x86)'], env.LOCALAPPDATA].filter(Boolean);
    return roots.flatMap((root) => [path.win32.join(root, 'Google', 'Chrome', 'Application', 'chrome.exe'), path.win32.join(root, 'Chromium', 'Application', 'chrome.exe')]);
  }
  return [];
}

/** Playwright's own browser, when `npx playwright install` was run on this machine earlier. */
function playwrightBrowser(env) {
  // playwright-core reads its browser folder from the process environment; a simulated
  // environment with a HOME or PLAYWRIGHT_BROWSERS_PATH of its own is honoured by asking only
  // when they agree with this process's.
  if (env !== process.env && (env.HOME !== process.env.HOME || env.PLAYWRIGHT_BROWSERS_PATH !== process.env.PLAYWRIGHT_BROWSERS_PATH)) return { path: null, note: "Playwright's own browser (not looked for in a simulated environment)" };
  try {
    const require = createRequire(import.meta.url);
    const { chromium } = require('playwright-core');
    const found = chromium.executablePath();
    if (found && existsSync(found)) return { path: found };
    return { path: null, note: `Playwright's own browser (${found})` };
  } catch {
    return { path: null, note: "Playwright's own browser (none)" };
  }
}

export function findBrowser(env = process.env, platform = process.platform) {
  const tried = [];
  for (const name of ['RIGBOOK_CHROMIUM', 'CHROMIUM_PATH']) {
    const value = env[name];
    if (value) {
      if (isProgram(value, platform)) return { path: value, tried };
      tried.push(`${name}=${value} (no such program)`);
    }
  }
  for (const name of NAMES_ON_PATH) {
    const found = onPath(name, env, platform);
    if (found) return { path: found, tried };
  }
  tried.push(`${NAMES_ON_PATH.join(', ')} on PATH`);
  for (const file of installFolders(env, platform)) {
    if (isProgram(file, platform)) return { path: file, tried };
    tried.push(file);
  }
  const own = playwrightBrowser(env);
  if (own.path) return { path: own.path, tried };
  tried.push(own.note);
  return { path: null, tried };
}
