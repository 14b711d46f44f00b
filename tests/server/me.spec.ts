import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPeople } from '../../server/db/seed/demo-scenario.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

describe('GET /api/me', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('answers 401 JSON when signed out', async () => {
    const response = await request(t.app).get('/api/me').expect(401).expect('content-type', /json/);
    expect(response.body).toEqual({ error: { code: 'unauthenticated', message: 'Sign in first' } });
  });

  it('refuses a forged session cookie', async () => {
    const cookie = (await t.sessionFor('auditor@decant.test')).replace(/\.[^.]+$/, '.forged');
    await request(t.app).get('/api/me').set('cookie', cookie).expect(401);
  });

  for (const person of demoPeople) {
    it(`shows ${person.email} as ${person.role} with ${person.sites.length} site(s)`, async () => {
      const response = await request(t.app)
        .get('/api/me')
        .set('cookie', await t.sessionFor(person.email))
        .expect(200);
      expect(response.body.user).toMatchObject({ email: person.email, role: person.role, name: person.name });
      expect(response.body.sites).toHaveLength(person.sites.length);
      expect(response.body.permissions).toContain('sites.read');
    });
  }

  it('shows coordinator.east only the east site', async () => {
    const response = await request(t.app)
      .get('/api/me')
      .set('cookie', await t.sessionFor('coordinator.east@decant.test'));
    expect(response.body.sites.map((site: { name: string }) => site.name)).toEqual(['Orrin Flats Finishing']);
  });
});

describe('GET /api/sites/:id', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('hides a site the user has no access to', async () => {
    const [north] = await t.dataSource.query(`SELECT id FROM site WHERE name = 'Tamsin Creek Works'`);
    const east = await t.sessionFor('coordinator.east@decant.test');
    await request(t.app).get(`/api/sites/${north.id}`).set('cookie', east).expect(404);
    const coordinator = await t.sessionFor('coordinator@decant.test');
    const response = await request(t.app).get(`/api/sites/${north.id}`).set('cookie', coordinator).expect(200);
    expect(response.body.timeZone).toBe('America/Chicago');
  });
});
