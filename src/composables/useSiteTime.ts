import { siteDate, siteDateTime } from '@contracts/site-time.js';
import { useSessionStore } from '@/stores/session';

// The pure formatters live with the contracts, shared with the server's mails and notices.
export { localDateTimeText, siteDate, siteDateTime } from '@contracts/site-time.js';

const browserZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone;

/**
 * Formatters bound to a site's zone: the record's own site when it is known, else the site picked
 * in the shell. `null` or an absent moment reads as an empty string so templates stay short.
 */
export function useSiteTime() {
  const session = useSessionStore();
  const zoneOf = (siteId?: string | null) =>
    session.sites.find((site) => site.id === siteId)?.timeZone ?? session.currentSite?.timeZone ?? browserZone();
  return {
    dateTime: (at: string | Date | null | undefined, siteId?: string | null) => (at ? siteDateTime(at, zoneOf(siteId)) : ''),
    date: (at: string | Date | null | undefined, siteId?: string | null) => (at ? siteDate(at, zoneOf(siteId)) : ''),
    zoneOf,
  };
}
