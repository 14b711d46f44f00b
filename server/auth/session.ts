import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type pg from 'pg';
import type { Config } from '../config/env.js';

declare module 'express-session' {
  interface SessionData {
    userId?: string;
    idToken?: string;
    /** When the person signed in (ms since the epoch): the session ends SESSION_ABSOLUTE_MS after, however active. */
    signedInAt?: number;
    /** When the provider last authenticated the person (ms since the epoch; its `auth_time`): a signature needs a recent one. */
    authenticatedAt?: number;
    /** What the sign-in redirect must find again at the callback. */
    pendingSignIn?: { state: string; nonce: string; codeVerifier: string; returnTo: string };
  }
}

export const sessionCookieName = 'decant.sid';

/** A session ends after 12 idle hours (the cookie rolls with each request)… */
export const SESSION_IDLE_MS = 12 * 60 * 60 * 1000;
/** …and, however busy, 24 hours after sign-in: a stolen cookie is not good forever. */
export const SESSION_ABSOLUTE_MS = 24 * 60 * 60 * 1000;
/** A sign-in started but not finished is kept 10 minutes, not a whole session's life. */
export const PENDING_SIGN_IN_MS = 10 * 60 * 1000;
/** A signature needs an authentication no older than this; past it the provider asks again. */
export const RECENT_AUTHENTICATION_MS = 15 * 60 * 1000;

/** When the session's person was last authenticated by the provider (the sign-in time if it did not say). */
export function authenticatedAt(session: Partial<{ authenticatedAt: number; signedInAt: number }> | undefined): number {
  return session?.authenticatedAt ?? session?.signedInAt ?? 0;
}

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
      // Secure whenever the app's public address is https: then the cookie never travels in clear
      // (behind a TLS-terminating proxy, TRUST_PROXY lets Express see the request as https).
      secure: config.appUrl.startsWith('https:'),
      maxAge: SESSION_IDLE_MS,
    },
  });
}
