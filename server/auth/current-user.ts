import type { RequestHandler, Response } from 'express';
import type { DataSource } from 'typeorm';
import type { Role } from '../contracts/permissions.js';
import { unauthenticated } from '../errors/app-error.js';
import { SESSION_ABSOLUTE_MS } from './session.js';

export interface CurrentUser {
  id: string;
  email: string;
  name: string;
  role: Role | null;
  siteIds: string[];
}

/** Loads the signed-in user (with their sites) once per request into `res.locals.user`. */
export function loadCurrentUser(dataSource: DataSource): RequestHandler {
  return async (req, res, next) => {
    const userId = req.session?.userId;
    if (!userId) return next();
    // Past its absolute lifetime (or from before it was recorded) a session ends, however active.
    const signedInAt = req.session.signedInAt ?? 0;
    if (Date.now() - signedInAt > SESSION_ABSOLUTE_MS) {
      await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
      return next();
    }
    const rows: Array<{ id: string; email: string; name: string; role: Role | null; active: boolean; site_ids: string[] }> =
      await dataSource.query(
        `SELECT u.id, u.email, u.name, u.role, u.active,
                coalesce(array_agg(us.site_id) FILTER (WHERE us.site_id IS NOT NULL), '{}') AS site_ids
           FROM app_user u LEFT JOIN user_site us ON us.user_id = u.id
          WHERE u.id = $1 GROUP BY u.id`,
        [userId],
      );
    const row = rows[0];
    if (!row || !row.active) {
      // A removed or deactivated user loses their session at once.
      await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
      return next();
    }
    res.locals.user = { id: row.id, email: row.email, name: row.name, role: row.role, siteIds: row.site_ids } satisfies CurrentUser;
    next();
  };
}

export function currentUser(res: Response): CurrentUser {
  const user = res.locals.user as CurrentUser | undefined;
  if (!user) throw unauthenticated();
  return user;
}
