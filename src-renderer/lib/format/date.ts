// Dates in a fixed, unambiguous form (2025-03-14 09:05): shop records are read across locales.

const pad = (n: number): string => String(n).padStart(2, '0');

export function dateTime(iso: string, zone: 'local' | 'utc' = 'local'): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const [y, mo, da, h, mi] = zone === 'utc' ? [d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate(), d.getUTCHours(), d.getUTCMinutes()] : [d.getFullYear(), d.getMonth() + 1, d.getDate(), d.getHours(), d.getMinutes()];
  return `${y}-${pad(mo)}-${pad(da)} ${pad(h)}:${pad(mi)}`;
}

/**
 * A moment as the reader's own calendar and clock show it (the system's locale and time zone,
 * month by name so the day and month cannot be swapped), for timelines; the timezone-free
 * `dateTime` stays for printed sheets and files.
 */
export function localDateTime(iso: string, locale?: string, timeZone?: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short', ...(timeZone ? { timeZone } : {}) }).format(d);
}

/** The same moment with its time zone named, for a tooltip. */
export function localDateTimeLong(iso: string, locale?: string, timeZone?: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return new Intl.DateTimeFormat(locale, { dateStyle: 'full', timeStyle: 'long', ...(timeZone ? { timeZone } : {}) }).format(d);
}
