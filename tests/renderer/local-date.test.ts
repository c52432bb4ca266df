import { describe, expect, it } from 'vitest';
import { localDateTime } from '../../src-renderer/lib/format/date';

describe('history times in the reader’s calendar', () => {
  // Intl.DateTimeFormat (ECMA-402, with the CLDR data the runtime carries) is the outside reference.
  const iso = '2026-12-02T23:30:00Z';
  it('shows the local date and time, not the stored UTC instant', () => {
    expect(localDateTime(iso, 'en-GB', 'Asia/Tokyo')).toBe(new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'Asia/Tokyo' }).format(new Date(iso)));
    // 23:30 UTC is 08:30 the next day in Tokyo (UTC+9, no daylight saving: IANA tz database).
    expect(localDateTime(iso, 'en-GB', 'Asia/Tokyo')).toBe('3 Dec 2026, 08:30');
    expect(localDateTime(iso, 'de-DE', 'Europe/Berlin')).toBe('03.12.2026, 00:30');
  });
  it('gives back text it cannot read as a date', () => {
    expect(localDateTime('not a date')).toBe('not a date');
  });
});
