import { describe, expect, it } from 'vitest';
import { localDateTimeText, siteDate, siteDateTime } from '../../src/composables/useSiteTime';

// US daylight time begins at 2:00 a.m. local on the second Sunday of March (15 U.S.C. 260a(a)):
// 2026-03-08 in Chicago, where standard time is UTC−6 and daylight time UTC−5.
describe('one date format in the site’s zone', () => {
  it('writes a moment as YYYY-MM-DD HH:MM on a 24-hour clock', () => {
    expect(siteDateTime('2026-07-01T17:05:00Z', 'America/Chicago')).toBe('2026-07-01 12:05');
    expect(siteDateTime('2026-07-01T17:05:00Z', 'UTC')).toBe('2026-07-01 17:05');
  });

  it('follows the change to daylight time (15 U.S.C. 260a)', () => {
    expect(siteDateTime('2026-03-08T07:59:00Z', 'America/Chicago')).toBe('2026-03-08 01:59');
    expect(siteDateTime('2026-03-08T08:00:00Z', 'America/Chicago')).toBe('2026-03-08 03:00');
  });

  it('gives the calendar day at the site, not in UTC', () => {
    expect(siteDate('2026-01-01T03:00:00Z', 'America/Chicago')).toBe('2025-12-31');
    expect(siteDateTime('2026-01-01T05:59:00Z', 'America/Chicago')).toBe('2025-12-31 23:59');
  });

  it('writes a site-local time from the API the same way', () => {
    expect(localDateTimeText('2026-05-04T09:30')).toBe('2026-05-04 09:30');
    expect(localDateTimeText('2026-05-04T09:30:15')).toBe('2026-05-04 09:30');
  });
});
