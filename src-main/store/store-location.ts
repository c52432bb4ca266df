// A store is either a SQLite file (the default, for one machine) or a PostgreSQL database named
// by a connection string (for a shop with several benches on one store). Everything that opens,
// names or copies a store asks here which of the two it has.

const POSTGRES_SCHEMES = ['postgres:', 'postgresql:'];

/** Whether `--db` / RIGBOOK_DB names a PostgreSQL database rather than a file. */
export function isPostgresUrl(location: string): boolean {
  const colon = location.indexOf(':');
  if (colon < 0) return false;
  return POSTGRES_SCHEMES.includes(location.slice(0, colon + 1).toLowerCase());
}

/**
 * The connection string as it may be shown, logged or put in an error message: the password
 * (in the user-info part or as a `password` parameter) replaced by `***`. A string that does
 * not parse is shown only by its scheme, since where its password sits cannot be known.
 */
export function redactUrl(location: string): string {
  if (!isPostgresUrl(location)) return location;
  let url: URL;
  try {
    url = new URL(location);
  } catch {
    return `${location.slice(0, location.indexOf(':') + 1)}//…`;
  }
  if (url.password !== '') url.password = '***';
  for (const key of [...url.searchParams.keys()]) if (key.toLowerCase() === 'password') url.searchParams.set(key, '***');
  return url.toString();
}

/** Removes every occurrence of the URL's password from a text (an error message from the driver). */
export function withoutSecret(text: string, location: string): string {
  if (!isPostgresUrl(location)) return text;
  let secrets: string[] = [];
  try {
    const url = new URL(location);
    secrets = [url.password, decodeURIComponent(url.password), ...[...url.searchParams.entries()].filter(([k]) => k.toLowerCase() === 'password').map(([, v]) => v)];
  } catch {
    return text.split(location).join(redactUrl(location));
  }
  let out = text.split(location).join(redactUrl(location));
  for (const secret of secrets) if (secret.length > 0) out = out.split(secret).join('***');
  return out;
}
