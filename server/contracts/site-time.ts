// One way to write a date across the app: YYYY-MM-DD, and YYYY-MM-DD HH:MM (24-hour) for a moment,
// always in the time zone of the site the record belongs to, never the browser's. The same form
// the period pack and the trail's CSV use, so a screen and a printed page can be compared by eye.

const formats = new Map<string, Intl.DateTimeFormat>();
function formatIn(timeZone: string): Intl.DateTimeFormat {
  let format = formats.get(timeZone);
  if (!format) {
    // 'en-CA' gives numeric parts; the pieces are put together below so no locale decides the order.
    format = new Intl.DateTimeFormat('en-CA', {
      timeZone,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
    });
    formats.set(timeZone, format);
  }
  return format;
}

/** A moment (ISO text or Date) as "YYYY-MM-DD HH:MM" in a time zone. */
export function siteDateTime(at: string | Date, timeZone: string): string {
  const parts = formatIn(timeZone).formatToParts(typeof at === 'string' ? new Date(at) : at);
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? '';
  return `${part('year')}-${part('month')}-${part('day')} ${part('hour')}:${part('minute')}`;
}

/** A moment as the calendar day "YYYY-MM-DD" it fell on in a time zone. */
export function siteDate(at: string | Date, timeZone: string): string {
  return siteDateTime(at, timeZone).slice(0, 10);
}

/** A site-local date-time as the API sends it ("YYYY-MM-DDTHH:mm[:ss]") in the app's form. */
export function localDateTimeText(local: string): string {
  return local.replace('T', ' ').slice(0, 16);
}
