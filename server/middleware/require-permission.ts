import type { RequestHandler } from 'express';
import { can, type Action } from '../contracts/permissions.js';
import { forbidden, unauthenticated } from '../errors/app-error.js';
import type { CurrentUser } from '../auth/current-user.js';

/** Every protected route names its action from the permission table; nothing else decides. */
export function requirePermission(action: Action): RequestHandler {
  return (_req, res, next) => {
    const user = res.locals.user as CurrentUser | undefined;
    if (!user) return next(unauthenticated());
    if (!can(user.role, action)) return next(forbidden());
    next();
  };
}

/** For routes any signed-in user may call (their own profile, their preferences). */
export function requireSignedIn(): RequestHandler {
  return (_req, res, next) => next(res.locals.user ? undefined : unauthenticated());
}
