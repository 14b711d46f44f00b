import express from 'express';
import { generateKeyPairSync } from 'node:crypto';
import { createRequire } from 'node:module';
import Provider, { type Configuration, type KoaContextWithOIDC } from 'oidc-provider';
import { checkCredentials, findAccountById } from './accounts.js';
import { memoryAdapterFactory } from './memory-adapter.js';
import { loginPage, logoutPage, signedOutPage } from './pages.js';

export interface IdentityProviderOptions {
  issuer: string;
  client: { clientId: string; clientSecret: string; appUrls: string[] };
}

const require = createRequire(import.meta.url);
const fontFile = (weight: number) => require.resolve(`@fontsource/noto-sans/files/noto-sans-latin-${weight}-normal.woff2`);

/**
 * A standards-following OpenID provider for local use and tests: authorization code flow with
 * PKCE, its own login page checking its own accounts, no consent step for its single client.
 */
export function createIdentityProvider(options: IdentityProviderOptions): express.Express {
  const { privateKey } = generateKeyPairSync('rsa', { modulusLength: 2048 });
  const signingKey = { ...privateKey.export({ format: 'jwk' }), use: 'sig', alg: 'RS256', kid: 'decant-fake' };
  const configuration: Configuration = {
    adapter: memoryAdapterFactory(),
    clients: [
      {
        client_id: options.client.clientId,
        client_secret: options.client.clientSecret,
        redirect_uris: options.client.appUrls.map((url) => `${url}/api/auth/callback`),
        post_logout_redirect_uris: options.client.appUrls.map((url) => `${url}/sign-in?signed-out=1`),
        grant_types: ['authorization_code'],
        response_types: ['code'],
        token_endpoint_auth_method: 'client_secret_basic',
      },
    ],
    jwks: { keys: [signingKey as never] },
    cookies: { keys: ['decant-fake-idp-cookie-key-1'] },
    claims: { openid: ['sub'], email: ['email', 'email_verified'], profile: ['name'] },
    // Put the scope's claims in the ID token, so the app needs no userinfo call.
    conformIdTokenClaims: false,
    pkce: { required: () => true },
    features: {
      devInteractions: { enabled: false },
      rpInitiatedLogout: {
        enabled: true,
        logoutSource: async (ctx: KoaContextWithOIDC, form: string) => {
          ctx.body = logoutPage(form);
        },
        postLogoutSuccessSource: async (ctx: KoaContextWithOIDC) => {
          ctx.body = signedOutPage();
        },
      },
    },
    interactions: { url: (_ctx, interaction) => `/interaction/${interaction.uid}` },
    findAccount: async (_ctx, id) => {
      const account = findAccountById(id);
      if (!account) return undefined;
      return {
        accountId: account.accountId,
        claims: async () => ({ sub: account.accountId, email: account.email, email_verified: true, name: account.name }),
      };
    },
    ttl: { Session: 8 * 3600, Interaction: 3600, Grant: 8 * 3600, AccessToken: 3600, IdToken: 3600, AuthorizationCode: 60 },
  };
  const provider = new Provider(options.issuer, configuration);
  provider.on('server_error', (_ctx, error) => console.error('identity provider error:', error));

  const app = express();
  app.disable('x-powered-by');
  app.get('/assets/noto-sans-:weight.woff2', (req, res) => {
    const weight = req.params.weight === '600' ? 600 : 400;
    res.sendFile(fontFile(weight), { maxAge: '1d' });
  });

  app.get('/interaction/:uid', async (req, res, next) => {
    try {
      const details = await provider.interactionDetails(req, res);
      if (details.prompt.name === 'login') {
        const hint = typeof details.params.login_hint === 'string' ? details.params.login_hint : undefined;
        return res.type('html').send(loginPage({ uid: details.uid, email: hint }));
      }
      await grantConsent(provider, req, res);
    } catch (error) {
      next(error);
    }
  });

  app.post('/interaction/:uid/login', express.urlencoded({ extended: false, limit: '10kb' }), async (req, res, next) => {
    try {
      const details = await provider.interactionDetails(req, res);
      const email = String(req.body?.email ?? '');
      const account = checkCredentials(email, String(req.body?.password ?? ''));
      if (!account) {
        return res
          .status(401)
          .type('html')
          .send(loginPage({ uid: details.uid, email, error: 'That e-mail and password do not match an account.' }));
      }
      await provider.interactionFinished(req, res, { login: { accountId: account.accountId } }, { mergeWithLastSubmission: false });
    } catch (error) {
      next(error);
    }
  });

  app.use(provider.callback());
  return app;
}

/** The only client is Decant itself, so consent is granted for whatever it asked. */
async function grantConsent(provider: Provider, req: express.Request, res: express.Response): Promise<void> {
  const details = await provider.interactionDetails(req, res);
  const accountId = details.session?.accountId;
  if (!accountId) throw new Error('No signed-in account at the consent step');
  const grant = details.grantId
    ? (await provider.Grant.find(details.grantId))!
    : new provider.Grant({ accountId, clientId: String(details.params.client_id) });
  const missing = details.prompt.details as { missingOIDCScope?: string[]; missingOIDCClaims?: string[] };
  if (missing.missingOIDCScope) grant.addOIDCScope(missing.missingOIDCScope.join(' '));
  if (missing.missingOIDCClaims) grant.addOIDCClaims(missing.missingOIDCClaims);
  const grantId = await grant.save();
  await provider.interactionFinished(req, res, { consent: { grantId } }, { mergeWithLastSubmission: true });
}
