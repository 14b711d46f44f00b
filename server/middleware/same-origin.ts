import type { RequestHandler } from 'express';
import { AppError } from '../errors/app-error.js';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses a state-changing request that a browser sent from another origin. Browsers send
 * `Origin` on every cross-site POST/PUT/PATCH/DELETE, and `Sec-Fetch-Site` on all of them; the
 * session cookie is also SameSite=Lax. Requests without either header come from non-browser
 * clients, which cannot carry a victim's cookie.
 */
export function sameOrigin(appUrl: string): RequestHandler {
  const allowed = new URL(appUrl).origin;
  return (req, _res, next) => {
    if (safeMethods.has(req.method)) return next();
    const origin = req.get('origin');
    const fetchSite = req.get('sec-fetch-site');
    // Compared with APP_URL only: the Host header is the client's to choose.
    const originOk = !origin || origin === allowed;
    const siteOk = !fetchSite || fetchSite === 'same-origin' || fetchSite === 'none';
    if (originOk && siteOk) return next();
    next(new AppError(403, 'cross_site', 'Cross-site requests are refused'));
  };
}
