import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type pg from 'pg';
import type { Config } from '../config/env.js';

declare module 'express-session' {
  interface SessionData {
    userId?: string;
    idToken?: string;
    /** What the sign-in redirect must find again at the callback. */
    pendingSignIn?: { state: string; nonce: string; codeVerifier: string; returnTo: string };
  }
}

export const sessionCookieName = 'decant.sid';

/**
 * Sessions live in PostgreSQL (table `session`, created by a migration), so they survive a
 * restart and every app instance behind a load balancer shares them.
 */
export function sessionMiddleware(config: Config, pool: pg.Pool) {
  const PgStore = connectPgSimple(session);
  return session({
    name: sessionCookieName,
    secret: config.sessionSecret,
    store: new PgStore({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      // Secure whenever the request reached us over HTTPS (directly, or via a trusted proxy).
      secure: 'auto',
      maxAge: 12 * 60 * 60 * 1000,
    },
  });
}
