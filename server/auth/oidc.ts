import * as client from 'openid-client';
import type { Config } from '../config/env.js';

/**
 * The relying party's view of the identity provider. Discovery is lazy (the provider may
 * start after the app) and retried on the next sign-in if it fails.
 */
export class OidcRelyingParty {
  private configuration?: Promise<client.Configuration>;

  constructor(private readonly config: Config) {}

  get redirectUri(): string {
    return `${this.config.appUrl}/api/auth/callback`;
  }

  async discover(): Promise<client.Configuration> {
    const { issuer, clientId, clientSecret, isLocalFake } = this.config.oidc;
    // Plain http is allowed only for the loopback fake provider, never for a configured issuer.
    const options = isLocalFake ? { execute: [client.allowInsecureRequests] } : undefined;
    this.configuration ??= client.discovery(new URL(issuer), clientId, clientSecret, client.ClientSecretBasic(clientSecret), options);
    try {
      return await this.configuration;
    } catch (error) {
      this.configuration = undefined;
      throw error;
    }
  }

  /** `reauthenticate`: the provider must ask for the credentials again (OpenID Connect `prompt=login`, `max_age=0`). */
  async authorizationUrl(loginHint?: string, reauthenticate = false) {
    const configuration = await this.discover();
    const codeVerifier = client.randomPKCECodeVerifier();
    const state = client.randomState();
    const nonce = client.randomNonce();
    const url = client.buildAuthorizationUrl(configuration, {
      redirect_uri: this.redirectUri,
      scope: 'openid email profile',
      code_challenge: await client.calculatePKCECodeChallenge(codeVerifier),
      code_challenge_method: 'S256',
      state,
      nonce,
      ...(loginHint ? { login_hint: loginHint } : {}),
      ...(reauthenticate ? { prompt: 'login', max_age: '0' } : {}),
    });
    return { url, state, nonce, codeVerifier };
  }

  async exchange(callbackUrl: URL, expected: { state: string; nonce: string; codeVerifier: string }) {
    const configuration = await this.discover();
    const tokens = await client.authorizationCodeGrant(configuration, callbackUrl, {
      pkceCodeVerifier: expected.codeVerifier,
      expectedState: expected.state,
      expectedNonce: expected.nonce,
      idTokenExpected: true,
    });
    const claims = tokens.claims();
    if (!claims) throw new Error('No ID token claims');
    return { claims, idToken: tokens.id_token };
  }

  async endSessionUrl(idToken: string | undefined, postLogoutRedirectUri: string): Promise<string | null> {
    const configuration = await this.discover();
    if (!configuration.serverMetadata().end_session_endpoint) return null;
    return client
      .buildEndSessionUrl(configuration, {
        post_logout_redirect_uri: postLogoutRedirectUri,
        ...(idToken ? { id_token_hint: idToken } : {}),
      })
      .toString();
  }
}
