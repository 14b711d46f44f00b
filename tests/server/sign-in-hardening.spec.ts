import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseTrustProxy } from '../../server/config/env.js';
import { provisionUser, SignInRefused } from '../../server/auth/provision-user.js';
import { SESSION_ABSOLUTE_MS } from '../../server/auth/session.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

describe('configuration that means what it says', () => {
  // Express reads a number as a hop count and a string as an address (expressjs.com, "Express behind proxies").
  it('reads TRUST_PROXY=1 as one proxy hop, not as the address "1"', () => {
    expect(parseTrustProxy('1')).toBe(1);
    expect(parseTrustProxy('true')).toBe(true);
    expect(parseTrustProxy('10.0.0.0/8, 127.0.0.1')).toBe('10.0.0.0/8, 127.0.0.1');
    expect(parseTrustProxy(undefined)).toBeUndefined();
  });
});

describe('who a first sign-in may become', () => {
  let t: TestApp;
  const run = Date.now();
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  const register = async (email: string) => {
    await t.dataSource.query(`INSERT INTO app_user (email, name, role) VALUES ($1, 'Registered person', 'operator')`, [email]);
  };
  const subjectOf = async (email: string) =>
    (await t.dataSource.query('SELECT subject FROM app_user WHERE email = $1', [email]))[0].subject;

  it('does not let an unverified e-mail claim a person an administrator registered', async () => {
    await register(`unverified-${run}@fixture.test`);
    await expect(
      provisionUser(t.dataSource, {
        issuer: 'https://idp.fixture',
        sub: 'attacker',
        email: `unverified-${run}@fixture.test`,
        emailVerified: false,
      }),
    ).rejects.toEqual(new SignInRefused('email-unverified'));
    expect(await subjectOf(`unverified-${run}@fixture.test`)).toBeNull();
  });

  it('binds a verified e-mail once, and never re-binds it to another subject', async () => {
    await register(`verified-${run}@fixture.test`);
    const user = await provisionUser(t.dataSource, {
      issuer: 'https://idp.fixture',
      sub: 'owner',
      email: `verified-${run}@fixture.test`,
      emailVerified: true,
    });
    expect(user.role).toBe('operator');
    await expect(
      provisionUser(t.dataSource, {
        issuer: 'https://idp.fixture',
        sub: 'someone-else',
        email: `verified-${run}@fixture.test`,
        emailVerified: true,
      }),
    ).rejects.toEqual(new SignInRefused('email-taken'));
    expect(await subjectOf(`verified-${run}@fixture.test`)).toBe('https://idp.fixture|owner');
  });
});

describe('sessions with an end', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('ends a session past its absolute lifetime, however recently it was used', async () => {
    const fresh = await t.sessionFor('auditor@decant.test');
    await request(t.app).get('/api/me').set('cookie', fresh).expect(200);
    const old = await t.sessionFor('auditor@decant.test', Date.now() - SESSION_ABSOLUTE_MS - 60_000);
    await request(t.app).get('/api/me').set('cookie', old).expect(401);
  });

  it('limits changes per session: the 301st write in a minute answers 429', async () => {
    const cookie = await t.sessionFor('auditor@decant.test');
    const statuses: number[] = [];
    for (let i = 0; i < 301; i++) {
      statuses.push((await request(t.app).patch('/api/me/preferences').set('cookie', cookie).send({ unitSystem: 'us' })).status);
    }
    expect(statuses.slice(0, 300).every((status) => status !== 429)).toBe(true);
    expect(statuses[300]).toBe(429);
  });
});
