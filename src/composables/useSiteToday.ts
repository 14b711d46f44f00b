import { computed } from 'vue';
import { useSessionStore } from '@/stores/session';

/** A calendar day (YYYY-MM-DD) in an IANA time zone: the 'en-CA' format writes dates that way. */
export function localDate(timeZone: string, at: Date = new Date()): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at);
}

/**
 * Today at the current site, in the site's time zone: every date a form offers by default is a
 * local date of the site, never the browser's UTC date.
 */
export function useSiteToday() {
  const session = useSessionStore();
  return computed(() => localDate(session.currentSite?.timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone));
}
