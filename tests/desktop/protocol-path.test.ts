import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { resolveAppFile } from '../../src-main/desktop/protocol-path';

// Path traversal cases after CWE-22 / OWASP "Path Traversal" (dot-dot, encoded dot-dot and
// separators, absolute paths, backslashes on Windows, drive letters) — from memory.
const ROOT = '/opt/rigbook/dist-renderer';

function served(url: string, root = ROOT, pathApi: path.PlatformPath = path.posix): string | null {
  const result = resolveAppFile(root, url, pathApi);
  return result.ok ? result.filePath : null;
}

describe('resolveAppFile on POSIX paths', () => {
  it('serves the entry page for the origin root', () => {
    expect(served('app://rigbook/')).toBe('/opt/rigbook/dist-renderer/index.html');
  });

  it('serves files under the renderer folder, decoding escapes', () => {
    expect(served('app://rigbook/index.html')).toBe('/opt/rigbook/dist-renderer/index.html');
    expect(served('app://rigbook/assets/index-4b1c.js')).toBe('/opt/rigbook/dist-renderer/assets/index-4b1c.js');
    expect(served('app://rigbook/assets/wheel%20icon.svg?v=2#x')).toBe('/opt/rigbook/dist-renderer/assets/wheel icon.svg');
  });

  it('answers an extension-less screen path with the page itself', () => {
    expect(served('app://rigbook/builds/b-12')).toBe('/opt/rigbook/dist-renderer/index.html');
  });

  it('never leaves the folder through dot segments the URL parser folds', () => {
    // The parser removes these before we see them; the result must still be inside ROOT.
    for (const url of ['app://rigbook/../../etc/passwd', 'app://rigbook/assets/../../../etc/passwd', 'app://rigbook/%2e%2e/%2E%2E/etc/passwd', 'app://rigbook/.%2e/.%2E/etc/passwd']) {
      const file = served(url);
      expect(file, url).not.toBeNull();
      expect(file!.startsWith(`${ROOT}/`), url).toBe(true);
      expect(file, url).not.toBe('/etc/passwd');
    }
  });

  it.each([
    ['encoded slash after dot-dot', 'app://rigbook/..%2f..%2fetc%2fpasswd'],
    ['encoded slash and dots', 'app://rigbook/%2e%2e%2f%2e%2e%2fetc%2fpasswd'],
    ['encoded dot-dot and slash inside one segment', 'app://rigbook/assets/%2e%2e%2fsecret'],
    ['backslash traversal', 'app://rigbook/..\\..\\etc\\passwd'],
    ['encoded backslash', 'app://rigbook/..%5c..%5cetc%5cpasswd'],
    ['absolute path via empty segment', 'app://rigbook//etc/passwd'],
    ['encoded absolute path', 'app://rigbook/%2fetc%2fpasswd'],
    ['NUL byte', 'app://rigbook/index.html%00.png'],
    ['malformed escape', 'app://rigbook/%E0%A4%A.js'],
    ['hidden file', 'app://rigbook/.env'],
    ['drive letter', 'app://rigbook/C:/Windows/win.ini'],
    ['other host', 'app://evil/index.html'],
    ['look-alike host', 'app://rigbook.evil/index.html'],
    ['userinfo trick', 'app://rigbook@evil/index.html'],
    ['file scheme', 'file:///opt/rigbook/dist-renderer/index.html'],
    ['not a URL', 'index.html'],
  ])('refuses %s', (_label, url) => {
    const result = resolveAppFile(ROOT, url, path.posix);
    expect(result.ok).toBe(false);
    if (!result.ok) expect([400, 403]).toContain(result.status);
  });
});

describe('resolveAppFile on Windows paths', () => {
  const WIN_ROOT = 'C:\\Program Files\\Rigbook\\resources\\app.asar\\dist-renderer';

  it('serves files under the folder', () => {
    expect(served('app://rigbook/assets/app.css', WIN_ROOT, path.win32)).toBe(`${WIN_ROOT}\\assets\\app.css`);
  });

  it.each([
    ['backslash traversal', 'app://rigbook/..\\..\\Windows\\win.ini'],
    ['encoded backslash', 'app://rigbook/assets%5c..%5c..%5csecret.txt'],
    ['drive-absolute segment', 'app://rigbook/C:%5cWindows%5cwin.ini'],
    ['drive-relative segment', 'app://rigbook/D:secret.txt'],
    ['UNC-like path', 'app://rigbook//server/share/file.txt'],
    ['alternate data stream', 'app://rigbook/index.html:stream'],
  ])('refuses %s', (_label, url) => {
    expect(resolveAppFile(WIN_ROOT, url, path.win32).ok).toBe(false);
  });
});
