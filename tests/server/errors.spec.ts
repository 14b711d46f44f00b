import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

describe('API errors', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('answers an unknown /api route with 404 JSON', async () => {
    const response = await request(t.app).get('/api/no-such-thing').expect(404).expect('content-type', /json/);
    expect(response.body.error).toMatchObject({ code: 'not_found' });
  });

  it('answers malformed JSON with 400 in the one error shape', async () => {
    const admin = await t.sessionFor('admin@decant.test');
    const response = await request(t.app)
      .post('/api/users')
      .set('cookie', admin)
      .set('content-type', 'application/json')
      .send('{"email": ')
      .expect(400);
    expect(Object.keys(response.body)).toEqual(['error']);
    expect(response.body.error.code).toBe('invalid_json');
  });

  it('names every invalid field', async () => {
    const admin = await t.sessionFor('admin@decant.test');
    const response = await request(t.app)
      .post('/api/users')
      .set('cookie', admin)
      .send({ email: 'not-an-email', name: '', role: 'janitor', siteIds: ['x'] })
      .expect(400);
    expect(response.body.error.code).toBe('invalid_input');
    expect(Object.keys(response.body.error.fields).sort()).toEqual(['email', 'name', 'role', 'siteIds.0']);
  });

  it('names an invalid route parameter', async () => {
    const admin = await t.sessionFor('admin@decant.test');
    const response = await request(t.app).get('/api/users/not-a-uuid').set('cookie', admin).expect(400);
    expect(response.body.error.fields).toHaveProperty('params.id');
  });

  it('answers a wrong role with 403 JSON', async () => {
    const operator = await t.sessionFor('operator@decant.test');
    const response = await request(t.app).get('/api/trail').set('cookie', operator).expect(403);
    expect(response.body.error.code).toBe('forbidden');
  });
});

describe('cross-site requests', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('refuses a POST from another origin and writes nothing', async () => {
    const admin = await t.sessionFor('admin@decant.test');
    const before = await t.count('app_user');
    const response = await request(t.app)
      .post('/api/users')
      .set('cookie', admin)
      .set('origin', 'https://evil.example')
      .send({ email: 'mallory@evil.example', name: 'Mallory', role: 'administrator', siteIds: [] })
      .expect(403);
    expect(response.body.error.code).toBe('cross_site');
    expect(await t.count('app_user')).toBe(before);
  });

  it('refuses a request a browser marks as cross-site', async () => {
    const admin = await t.sessionFor('admin@decant.test');
    await request(t.app)
      .post('/api/users')
      .set('cookie', admin)
      .set('sec-fetch-site', 'cross-site')
      .send({ email: 'mallory@evil.example', name: 'Mallory', role: null })
      .expect(403);
  });

  it('lets the same origin through', async () => {
    const admin = await t.sessionFor('admin@decant.test');
    await request(t.app)
      .post('/api/users')
      .set('cookie', admin)
      .set('origin', t.config.appUrl)
      .set('sec-fetch-site', 'same-origin')
      .send({ email: 'same.origin@decant.test', name: 'Same Origin', role: null })
      .expect(201);
  });
});
