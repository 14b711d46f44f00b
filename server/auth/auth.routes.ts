import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { SignInQuery } from '../contracts/auth.js';
import type { Config } from '../config/env.js';
import { demoPassword, demoPeople } from '../db/seed/demo-scenario.js';
import { validate } from '../middleware/validate.js';
import type { OidcRelyingParty } from './oidc.js';
import { provisionUser, SignInRefused } from './provision-user.js';
import { PENDING_SIGN_IN_MS, sessionCookieName } from './session.js';

/** Only same-app paths: never an absolute or protocol-relative URL (open redirect). */
function safeReturnPath(value: string | undefined): string {
  return value && value.startsWith('/') && !value.startsWith('//') && !value.startsWith('/\\') ? value : '/';
}

export function authRoutes(config: Config, dataSource: DataSource, oidc: OidcRelyingParty): Router {
  const router = Router();

  router.get('/options', (_req, res) => {
    res.json({
      demo: config.demo
        ? { password: demoPassword, accounts: demoPeople.map(({ email, name, role, duty }) => ({ email, name, role, duty })) }
        : null,
    });
  });

  router.get('/sign-in', validate({ query: SignInQuery }), async (req, res) => {
    // validate() has checked it; parsing again gives its typed value without a cast.
    const query = SignInQuery.parse(req.query);
    const { url, state, nonce, codeVerifier } = await oidc.authorizationUrl(query.loginHint, query.reauthenticate === '1');
    req.session.pendingSignIn = { state, nonce, codeVerifier, returnTo: safeReturnPath(query.returnTo) };
    // An anonymous visitor's session row lives only as long as a sign-in may take.
    if (!req.session.userId) req.session.cookie.maxAge = PENDING_SIGN_IN_MS;
    req.session.save((error) => (error ? res.status(500).end() : res.redirect(url.toString())));
  });

  router.get('/callback', async (req, res) => {
    const pending = req.session.pendingSignIn;
    delete req.session.pendingSignIn;
    const fail = (reason: string) => req.session.save(() => res.redirect(`/sign-in?error=${encodeURIComponent(reason)}`));
    if (!pending) return fail('no-sign-in-in-progress');
    let identity;
    try {
      identity = await oidc.exchange(new URL(req.originalUrl, config.appUrl), pending);
    } catch (error) {
      console.warn('Sign-in refused:', (error as Error).message);
      return fail('sign-in-failed');
    }
    let user;
    try {
      user = await provisionUser(dataSource, {
        issuer: String(identity.claims.iss),
        sub: String(identity.claims.sub),
        email: typeof identity.claims.email === 'string' ? identity.claims.email : undefined,
        emailVerified: identity.claims.email_verified === true,
        name: typeof identity.claims.name === 'string' ? identity.claims.name : undefined,
      });
    } catch (error) {
      if (error instanceof SignInRefused) return fail(error.reason);
      throw error;
    }
    // A new session id at sign-in, so a session fixed before it is worth nothing after.
    req.session.regenerate((error) => {
      if (error) return fail('session-error');
      req.session.userId = user.id;
      req.session.idToken = identity.idToken;
      req.session.signedInAt = Date.now();
      // The provider's auth_time (seconds) when it sent one: a re-authentication before a signature sets it anew.
      const authTime = typeof identity.claims.auth_time === 'number' ? identity.claims.auth_time * 1000 : Date.now();
      req.session.authenticatedAt = Math.min(authTime, Date.now());
      req.session.save(() => res.redirect(pending.returnTo));
    });
  });

  router.post('/sign-out', async (req, res) => {
    const idToken = req.session?.idToken;
    await new Promise<void>((resolve) => (req.session ? req.session.destroy(() => resolve()) : resolve()));
    res.clearCookie(sessionCookieName);
    let redirectTo = '/sign-in?signed-out=1';
    try {
      redirectTo = (await oidc.endSessionUrl(idToken, `${config.appUrl}/sign-in?signed-out=1`)) ?? redirectTo;
    } catch (error) {
      console.warn('Could not reach the identity provider to end its session:', (error as Error).message);
    }
    res.json({ redirectTo });
  });

  return router;
}
