import { describe, expect, it } from 'vitest';
import { allowedExternalUrl, APP_ENTRY_URL, APP_ORIGIN, isAllowedExternal, isAppUrl } from '../../src-main/desktop/url-policy';

// URL parsing per the WHATWG URL Standard (url.spec.whatwg.org): userinfo before '@', host
// after '//', dot segments folded. The look-alike cases are the ones a string prefix check
// would wrongly accept (Electron security checklist, "validate the sender of all IPC
// messages" and "limit navigation", from memory).
describe('isAppUrl', () => {
  it.each([APP_ENTRY_URL, `${APP_ORIGIN}/`, `${APP_ORIGIN}/assets/index-3f2a.js`, `${APP_ORIGIN}/?view=builds#b-12`, 'APP://rigbook/index.html'])('accepts our origin: %s', (url) => {
    expect(isAppUrl(url)).toBe(true);
  });

  it.each([
    ['host with a suffix', 'app://rigbook.evil/'],
    ['host as userinfo', 'app://rigbook@evil/'],
    ['host with user and password', 'app://rigbook:pw@rigbook/'],
    ['our name in the path', 'app://evil/rigbook'],
    ['file scheme', 'file:///opt/rigbook/dist-renderer/index.html'],
    ['https with our host', 'https://rigbook/'],
    ['http with our host', 'http://rigbook/index.html'],
    ['uppercase host (left as written by the parser for this scheme)', 'app://RIGBOOK/'],
    ['percent-encoded dot in host', 'app://rigbook%2eevil/'],
    ['percent-encoded letter in host', 'app://rig%62ook/'],
    ['explicit port', 'app://rigbook:80/'],
    ['trailing dot host', 'app://rigbook./'],
    ['host-less form', 'app:rigbook/index.html'],
    ['empty host', 'app:///rigbook/index.html'],
    ['prefix without separator', 'app://rigbookx/'],
    ['javascript url', 'javascript:alert(1)'],
    ['data url', 'data:text/html,<p>x</p>'],
    ['about blank', 'about:blank'],
    ['not a URL', 'rigbook'],
    ['empty string', ''],
  ])('refuses %s: %s', (_label, url) => {
    expect(isAppUrl(url)).toBe(false);
  });
});

describe('isAllowedExternal', () => {
  it('lets a plain https link out, normalised by the parser', () => {
    expect(allowedExternalUrl('https://Example.org/a/../manual.pdf')).toBe('https://example.org/manual.pdf');
    expect(isAllowedExternal('https://example.org/safety')).toBe(true);
  });

  it.each([
    ['plain http', 'http://example.org/'],
    ['file', 'file:///etc/passwd'],
    ['javascript', 'javascript:alert(1)'],
    ['credentials hiding the real host', 'https://example.org@evil.test/'],
    ['user and password', 'https://user:pw@example.org/'],
    ['our own scheme', 'app://rigbook/index.html'],
    ['custom OS handler', 'smb://share/folder'],
    ['garbage', 'https//example.org'],
    ['empty', ''],
  ])('keeps %s inside: %s', (_label, url) => {
    expect(isAllowedExternal(url)).toBe(false);
  });
});
