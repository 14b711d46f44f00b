import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startLiveStack, type LiveStack } from '../helpers/live-stack.js';
import { CookieJarClient } from '../helpers/cookie-jar-client.js';

const isCallback = (location: string) => location.includes('/api/auth/callback');

/** Signs in through the provider's login form and stops before the app's callback. */
async function signInUpToCallback(stack: LiveStack, client: CookieJarClient, email: string, password: string) {
  const { response: form, url: formUrl } = await client.follow(`${stack.appUrl}/api/auth/sign-in`);
  const action = /action="([^"]+)"/.exec(await form.text())?.[1];
  expect(action).toMatch(/^\/interaction\/.+\/login$/);
  const posted = await client.fetch(new URL(action!, formUrl).toString(), {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ email, password }).toString(),
  });
  return { posted, formUrl };
}

async function completeToCallback(stack: LiveStack, client: CookieJarClient, email: string) {
  const { posted, formUrl } = await signInUpToCallback(stack, client, email, 'decant-demo');
  expect(posted.status).toBe(303);
  const next = new URL(posted.headers.get('location')!, formUrl).toString();
  const { url: callbackUrl } = await client.follow(next, isCallback);
  expect(callbackUrl).toContain('code=');
  return callbackUrl;
}

async function me(stack: LiveStack, client: CookieJarClient) {
  return client.fetch(`${stack.appUrl}/api/me`);
}

describe('sign-in through OpenID Connect (code flow with PKCE)', () => {
  let stack: LiveStack;
  beforeAll(async () => {
    stack = await startLiveStack();
  });
  afterAll(() => stack.close());

  it('signs in with the right password and shows the role from Decant, not the token', async () => {
    const client = new CookieJarClient();
    const callbackUrl = await completeToCallback(stack, client, 'auditor@decant.test');
    const done = await client.fetch(callbackUrl);
    expect(done.status).toBe(302);
    expect(done.headers.get('location')).toBe('/');
    const setCookie = done.headers.getSetCookie().join('\n');
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=Lax/i);
    const response = await me(stack, client);
    expect(response.status).toBe(200);
    expect(((await response.json()) as { user: unknown }).user).toMatchObject({ email: 'auditor@decant.test', role: 'auditor' });
  });

  it('sends PKCE, state and nonce to the provider', async () => {
    const client = new CookieJarClient();
    const response = await client.fetch(`${stack.appUrl}/api/auth/sign-in`);
    const location = new URL(response.headers.get('location')!);
    expect(location.origin).toBe(stack.idpUrl);
    for (const parameter of ['code_challenge', 'state', 'nonce']) expect(location.searchParams.get(parameter)).toBeTruthy();
    expect(location.searchParams.get('code_challenge_method')).toBe('S256');
  });

  it('refuses a wrong password on the login form and starts no session', async () => {
    const client = new CookieJarClient();
    const { posted } = await signInUpToCallback(stack, client, 'coordinator@decant.test', 'wrong-password');
    expect(posted.status).toBe(401);
    expect(await posted.text()).toContain('do not match');
    expect((await me(stack, client)).status).toBe(401);
  });

  it('refuses a tampered state and starts no session', async () => {
    const client = new CookieJarClient();
    const callbackUrl = new URL(await completeToCallback(stack, client, 'operator@decant.test'));
    callbackUrl.searchParams.set('state', 'tampered');
    const response = await client.fetch(callbackUrl.toString());
    expect(response.headers.get('location')).toBe('/sign-in?error=sign-in-failed');
    expect((await me(stack, client)).status).toBe(401);
  });

  it('refuses a replayed code and starts no session', async () => {
    const client = new CookieJarClient();
    const callbackUrl = await completeToCallback(stack, client, 'operator@decant.test');
    const beforeCallback = client.snapshot();
    expect((await client.fetch(callbackUrl)).headers.get('location')).toBe('/');

    // Replay with the cookies from before the first use: the provider and the app both refuse.
    const replayer = new CookieJarClient();
    replayer.restore(beforeCallback);
    const replay = await replayer.fetch(callbackUrl);
    expect(replay.headers.get('location')).toMatch(/^\/sign-in\?error=/);
    expect((await me(stack, replayer)).status).toBe(401);
  });

  it('signs out of Decant and hands over to the provider to end its session', async () => {
    const client = new CookieJarClient();
    await client.fetch(await completeToCallback(stack, client, 'admin@decant.test'));
    expect((await me(stack, client)).status).toBe(200);
    const response = await client.fetch(`${stack.appUrl}/api/auth/sign-out`, { method: 'POST' });
    const { redirectTo } = (await response.json()) as { redirectTo: string };
    expect(redirectTo).toContain(`${stack.idpUrl}/session/end`);
    expect(redirectTo).toContain('id_token_hint=');
    expect((await me(stack, client)).status).toBe(401);
  });

  it('records each sign-in in the trail', async () => {
    const rows = await stack.dataSource.query(`SELECT count(*)::int AS n FROM trail_entry WHERE action IN ('sign-in', 'first-sign-in')`);
    expect(rows[0].n).toBeGreaterThanOrEqual(3);
  });
});
