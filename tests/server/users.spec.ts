import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

const notAdministrators = ['coordinator@decant.test', 'coordinator.east@decant.test', 'operator@decant.test', 'auditor@decant.test'];

describe('user administration routes', () => {
  let t: TestApp;
  let admin: string;
  let siteIds: string[];
  beforeAll(async () => {
    t = await startTestApp();
    admin = await t.sessionFor('admin@decant.test');
    siteIds = (await t.dataSource.query('SELECT id FROM site ORDER BY name')).map((row: { id: string }) => row.id);
  });
  afterAll(() => t.close());

  it('GET /api/users pages, sorts and searches for the administrator', async () => {
    const page = await request(t.app).get('/api/users?pageSize=2&sortBy=email').set('cookie', admin).expect(200);
    expect(page.body.items).toHaveLength(2);
    expect(page.body.total).toBeGreaterThanOrEqual(5);
    expect(page.body.items[0].email).toBe('admin@decant.test');
    const found = await request(t.app).get('/api/users?search=reyes').set('cookie', admin).expect(200);
    expect(found.body.items.map((u: { email: string }) => u.email)).toEqual(['coordinator.east@decant.test']);
  });

  for (const email of notAdministrators) {
    it(`answers 403 to ${email} on every user route, and changes nothing`, async () => {
      const cookie = await t.sessionFor(email);
      const [someone] = await t.dataSource.query(`SELECT id, role FROM app_user WHERE email = 'operator@decant.test'`);
      await request(t.app).get('/api/users').set('cookie', cookie).expect(403);
      await request(t.app).get(`/api/users/${someone.id}`).set('cookie', cookie).expect(403);
      await request(t.app).get('/api/users/site-options').set('cookie', cookie).expect(403);
      await request(t.app).post('/api/users').set('cookie', cookie).send({ email: 'x@decant.test', name: 'X', role: null }).expect(403);
      await request(t.app).patch(`/api/users/${someone.id}`).set('cookie', cookie).send({ role: 'administrator' }).expect(403);
      const [after] = await t.dataSource.query(`SELECT role FROM app_user WHERE id = $1`, [someone.id]);
      expect(after.role).toBe(someone.role);
    });
  }

  it('answers 401 without a session', async () => {
    await request(t.app).get('/api/users').expect(401);
    await request(t.app).post('/api/users').send({}).expect(401);
  });

  it('creates a person with role and sites, and records it in the trail in the same change', async () => {
    const trailBefore = await t.count('trail_entry');
    const response = await request(t.app)
      .post('/api/users')
      .set('cookie', admin)
      .send({ email: 'New.Person@Decant.test', name: 'New Person', role: 'operator', siteIds: [siteIds[0]] })
      .expect(201);
    expect(response.body).toMatchObject({ email: 'new.person@decant.test', role: 'operator', siteIds: [siteIds[0]], active: true });
    const [entry] = await t.dataSource.query(`SELECT * FROM trail_entry WHERE entity = 'user' AND entity_id = $1`, [response.body.id]);
    expect(entry).toMatchObject({ action: 'create', actor_email: 'admin@decant.test' });
    expect(entry.after.role).toBe('operator');
    expect(await t.count('trail_entry')).toBe(trailBefore + 1);
  });

  it('refuses a duplicate e-mail with 409 naming the field', async () => {
    const response = await request(t.app)
      .post('/api/users')
      .set('cookie', admin)
      .send({ email: 'operator@decant.test', name: 'Twin', role: null })
      .expect(409);
    expect(response.body.error.fields).toEqual({ email: 'already registered' });
  });

  it('changes a role and sites, keeping before and after in the trail', async () => {
    const [auditor] = await t.dataSource.query(`SELECT id FROM app_user WHERE email = 'auditor@decant.test'`);
    const created = await request(t.app)
      .post('/api/users')
      .set('cookie', admin)
      .send({ email: 'temp.auditor@decant.test', name: 'Temp', role: 'auditor', siteIds })
      .expect(201);
    const updated = await request(t.app)
      .patch(`/api/users/${created.body.id}`)
      .set('cookie', admin)
      .send({ role: 'coordinator', siteIds: [siteIds[1]] })
      .expect(200);
    expect(updated.body).toMatchObject({ role: 'coordinator', siteIds: [siteIds[1]] });
    const [entry] = await t.dataSource.query(`SELECT before, after FROM trail_entry WHERE entity_id = $1 AND action = 'update'`, [
      created.body.id,
    ]);
    expect(entry.before.role).toBe('auditor');
    expect(entry.after.role).toBe('coordinator');
    expect(auditor).toBeTruthy();
  });

  it('refuses an unknown site and writes nothing', async () => {
    const trailBefore = await t.count('trail_entry');
    const response = await request(t.app)
      .post('/api/users')
      .set('cookie', admin)
      .send({ email: 'ghost@decant.test', name: 'Ghost', role: 'operator', siteIds: ['00000000-0000-4000-8000-000000000000'] })
      .expect(400);
    expect(response.body.error.fields).toHaveProperty('siteIds');
    const rows = await t.dataSource.query(`SELECT 1 FROM app_user WHERE email = 'ghost@decant.test'`);
    expect(rows).toHaveLength(0);
    expect(await t.count('trail_entry')).toBe(trailBefore);
  });

  it('does not let the administrator remove their own administrator role', async () => {
    const [me] = await t.dataSource.query(`SELECT id FROM app_user WHERE email = 'admin@decant.test'`);
    const response = await request(t.app).patch(`/api/users/${me.id}`).set('cookie', admin).send({ role: 'auditor' }).expect(400);
    expect(response.body.error.fields).toHaveProperty('role');
  });

  it('ends the session of a person who is deactivated', async () => {
    const created = await request(t.app)
      .post('/api/users')
      .set('cookie', admin)
      .send({ email: 'leaver@decant.test', name: 'Leaver', role: 'operator', siteIds })
      .expect(201);
    const leaver = await t.sessionFor('leaver@decant.test');
    await request(t.app).get('/api/me').set('cookie', leaver).expect(200);
    await request(t.app).patch(`/api/users/${created.body.id}`).set('cookie', admin).send({ active: false }).expect(200);
    await request(t.app).get('/api/me').set('cookie', leaver).expect(401);
  });
});
