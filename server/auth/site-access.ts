import type { CurrentUser } from './current-user.js';
import { forbidden, notFound } from '../errors/app-error.js';

/** A record of a site the user may not see answers as if it did not exist. */
export function assertSiteVisible(user: CurrentUser, siteId: string | null | undefined, what = 'Record'): void {
  if (!siteId || !user.siteIds.includes(siteId)) throw notFound(what);
}

/** A filter or a new record naming a site the user may not see is refused outright. */
export function assertSiteAllowed(user: CurrentUser, siteId: string): void {
  if (!user.siteIds.includes(siteId)) throw forbidden('You do not have access to this site');
}
