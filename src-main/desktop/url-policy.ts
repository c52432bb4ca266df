// Which URLs the desktop window may show and which links may leave for the system browser.
// Always decided on a parsed URL: a prefix check on the string lets look-alike hosts through
// (`app://rigbook.evil`, `app://rigbook@evil`).

export const APP_SCHEME = 'app';
export const APP_HOST = 'rigbook';
export const APP_ORIGIN = `${APP_SCHEME}://${APP_HOST}`;
export const APP_ENTRY_URL = `${APP_ORIGIN}/index.html`;

function parse(raw: string): URL | null {
  try {
    return new URL(raw);
  } catch {
    return null;
  }
}

/** True only for a URL on our own origin: scheme `app:`, host exactly `rigbook`, no user, password or port. */
export function isAppUrl(raw: string): boolean {
  const url = parse(raw);
  if (!url) return false;
  // Node leaves the host of a non-special scheme as written, Chromium lowercases a standard
  // scheme's host; requiring the exact lowercase host is right for both.
  return url.protocol === `${APP_SCHEME}:` && url.host === APP_HOST && url.hostname === APP_HOST && url.port === '' && url.username === '' && url.password === '';
}

/**
 * Links the user may open in the system browser: https only, with a real host and no
 * credentials in the URL (they hide the true host from the reader).
 * Returns the normalised URL to hand to the OS, or null.
 */
export function allowedExternalUrl(raw: string): string | null {
  const url = parse(raw);
  if (!url) return null;
  if (url.protocol !== 'https:') return null;
  if (url.username !== '' || url.password !== '') return null;
  if (url.hostname === '') return null;
  return url.href;
}

export function isAllowedExternal(raw: string): boolean {
  return allowedExternalUrl(raw) !== null;
}
