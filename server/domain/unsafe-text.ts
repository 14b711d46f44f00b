/**
 * Characters no record may hold: C0 controls other than tab, line feed and carriage return
 * (PostgreSQL text cannot store NUL at all), DEL, and the bidirectional overrides and isolates
 * that make text display in another order than it is stored (Unicode UAX #9).
 */
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const unsafeText = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F\u202A-\u202E\u2066-\u2069]/;

export function hasUnsafeText(text: string): boolean {
  return unsafeText.test(text);
}
