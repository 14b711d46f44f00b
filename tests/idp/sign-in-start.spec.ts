import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PENDING_SIGN_IN_MS } from '../../server/auth/session.js';
import { startLiveStack, type LiveStack } from '../helpers/live-stack.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

describe('starting a sign-in behind a TLS proxy', () => {
  let stack: LiveStack;
  let t: TestApp;
  beforeAll(async () => {
    stack = await startLiveStack();
    // The app as deployed: public address https, one proxy in front (TRUST_PROXY=1).
    t = await startTestApp({
      appUrl: 'https://decant.example.test',
      trustProxy: 1,
      oidc: { issuer: stack.idpUrl, clientId: 'decant-test', clientSecret: 'decant-test-secret', isLocalFake: true },
    });
  });
  afterAll(async () => {
    await t?.close();
    await stack?.close();
  });

  it('sets a Secure cookie on a forwarded https request', async () => {
    const response = await request(t.app).get('/api/auth/sign-in').set('x-forwarded-proto', 'https').expect(302);
    const cookie = response.headers['set-cookie']?.[0] ?? '';
    expect(cookie).toMatch(/^decant\.sid=/);
    expect(cookie).toMatch(/;\s*Secure/i);
  });

  it("keeps an anonymous visitor's half-done sign-in for minutes, not a session's 12 hours", async () => {
    const response = await request(t.app).get('/api/auth/sign-in').set('x-forwarded-proto', 'https').expect(302);
    const sid = /decant\.sid=s:([^.;]+)/.exec(decodeURIComponent(response.headers['set-cookie']![0]!))![1]!;
    const [row] = await t.dataSource.query('SELECT expire FROM session WHERE sid = $1', [sid]);
    // A few seconds of slack for the database's clock against this process's.
    expect(new Date(row.expire).getTime() - Date.now()).toBeLessThanOrEqual(PENDING_SIGN_IN_MS + 5_000);
  });

  it('answers 429 once one address starts more than 30 sign-ins in 5 minutes', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 31; i++) statuses.push((await request(t.app).get('/api/auth/sign-in').set('x-forwarded-proto', 'https')).status);
    expect(statuses.filter((status) => status === 429).length).toBeGreaterThan(0);
    expect(statuses.slice(0, 28).every((status) => status === 302)).toBe(true);
  });
});
