import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds } from '../fixtures/lab.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

describe('set-up records', () => {
  let t: TestApp;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  let coordinator: string;
  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
    coordinator = await t.sessionFor('coordinator@decant.test');
  });
  afterAll(() => t.close());

  it('creates a site, gives its creator access, and deletes it while nothing refers to it', async () => {
    const created = await request(t.app)
      .post('/api/sites')
      .set('cookie', coordinator)
      .send({ name: 'Scratch Works', timeZone: 'America/Denver', retentionYears: 3, generatorStatus: 'very-small' })
      .expect(201);
    expect(created.body).toMatchObject({ name: 'Scratch Works', retentionYears: 3, companyName: 'Harlow Vale Precision Parts' });
    const fresh = await t.sessionFor('coordinator@decant.test');
    await request(t.app).get(`/api/sites/${created.body.id}`).set('cookie', fresh).expect(200);
    await request(t.app).delete(`/api/sites/${created.body.id}`).set('cookie', fresh).expect(204);
    const actions = await t.dataSource.query(`SELECT action FROM trail_entry WHERE entity = 'site' AND entity_id = $1 ORDER BY id`, [
      created.body.id,
    ]);
    expect(actions.map((a: { action: string }) => a.action)).toEqual(['create', 'delete']);
  });

  it('refuses to delete a site, point or parameter that records refer to (409)', async () => {
    const before = await t.count('site');
    const response = await request(t.app).delete(`/api/sites/${ids.north}`).set('cookie', coordinator).expect(409);
    expect(response.body.error.code).toBe('conflict');
    expect(await t.count('site')).toBe(before);
    await request(t.app).delete(`/api/sites/${ids.north}/discharge-points/${ids.northOutfall}`).set('cookie', coordinator).expect(409);
  });

  it('refuses a duplicate discharge point code with 409 on the code field', async () => {
    const response = await request(t.app)
      .post(`/api/sites/${ids.north}/discharge-points`)
      .set('cookie', coordinator)
      .send({ code: 'OF-001', name: 'Twin', receiving: 'sewer' })
      .expect(409);
    expect(response.body.error.fields).toHaveProperty('code');
  });

  it('changes only the fields a PATCH names (no defaults sneak back in)', async () => {
    const point = await request(t.app)
      .post(`/api/sites/${ids.east}/discharge-points`)
      .set('cookie', coordinator)
      .send({ code: 'IS-299', name: 'Spare tap', receiving: 'sewer', active: false })
      .expect(201);
    const renamed = await request(t.app)
      .patch(`/api/sites/${ids.east}/discharge-points/${point.body.id}`)
      .set('cookie', coordinator)
      .send({ name: 'Spare sampling tap' })
      .expect(200);
    expect(renamed.body).toMatchObject({ name: 'Spare sampling tap', active: false });
  });

  it('lets a site add its own parameter to the catalogue, and keeps the shared catalogue unchangeable', async () => {
    const created = await request(t.app)
      .post('/api/parameters')
      .set('cookie', coordinator)
      .send({ siteId: ids.north, code: 'zinc-total', name: 'Zinc, total', defaultUnit: 'mg/L' })
      .expect(201);
    expect(created.body).toMatchObject({ siteId: ids.north, sncReviewFactor: 1.2 });
    await request(t.app).patch(`/api/parameters/${ids.hem}`).set('cookie', coordinator).send({ name: 'Renamed' }).expect(403);
    const east = await t.sessionFor('coordinator.east@decant.test');
    const list = await request(t.app).get('/api/parameters').set('cookie', east).expect(200);
    expect(list.body.items.some((p: { code: string }) => p.code === 'zinc-total')).toBe(false);
  });

  it('records a permit and a limit, each in the trail', async () => {
    const permit = await request(t.app)
      .post('/api/permits')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        kind: 'npdes',
        number: 'IL0099999',
        issuingAuthority: 'State agency',
        effectiveFrom: '2026-01-01',
        reportingFrequency: 'monthly',
        reportDueDays: 28,
        nonDetectPolicy: 'half-mdl',
        massLoadingFactor: 8.3454,
      })
      .expect(201);
    expect(permit.body).toMatchObject({ kind: 'npdes', massLoadingFactor: 8.3454, lateReportDays: 45, sncWindow: 'calendar-halves' });
    const limit = await request(t.app)
      .post(`/api/permits/${permit.body.id}/limits`)
      .set('cookie', coordinator)
      .send({
        dischargePointId: ids.northOutfall,
        parameterId: ids.hem,
        statistic: 'daily-maximum',
        value: 15,
        unit: 'mg/L',
        frequencyCount: 1,
        frequencyPer: 'week',
        sampleType: 'grab',
      })
      .expect(201);
    expect(limit.body.value).toBe(15);
    const entries = await t.dataSource.query(`SELECT entity FROM trail_entry WHERE entity_id IN ($1, $2)`, [permit.body.id, limit.body.id]);
    expect(entries.map((e: { entity: string }) => e.entity).sort()).toEqual(['limit', 'permit']);
    const flagged = async () =>
      (await t.dataSource.query(`SELECT count(*)::int AS n FROM lab_result WHERE 'over-limit' = ANY(flag_codes)`))[0].n;
    const withStrictLimit = await flagged();
    // Entered by mistake: nothing compiled against it yet, so its limit and then the permit may go.
    await request(t.app).delete(`/api/permits/${permit.body.id}`).set('cookie', coordinator).expect(409);
    await request(t.app).delete(`/api/permits/${permit.body.id}/limits/${limit.body.id}`).set('cookie', coordinator).expect(204);
    expect(await flagged()).toBeLessThan(withStrictLimit);
    await request(t.app).delete(`/api/permits/${permit.body.id}`).set('cookie', coordinator).expect(204);
    expect(await t.dataSource.query('SELECT count(*)::int AS n FROM reporting_period WHERE permit_id = $1', [permit.body.id])).toEqual([
      { n: 0 },
    ]);
  });

  // 40 CFR 403.12(o): records of monitoring and reports are kept at least 3 years.
  it('refuses to delete a permit whose periods were compiled or sent, and says to end it instead (409, nothing changed)', async () => {
    const [{ submitted }] = await t.dataSource.query(
      `SELECT count(*)::int AS submitted FROM reporting_period WHERE permit_id = $1 AND submitted_on IS NOT NULL`,
      [ids.northPermit],
    );
    expect(submitted).toBeGreaterThan(0);
    const counts = async () =>
      t.dataSource.query(
        `SELECT (SELECT count(*)::int FROM permit) AS permits, (SELECT count(*)::int FROM reporting_period) AS periods,
                (SELECT count(*)::int FROM permit_limit) AS limits, (SELECT count(*)::int FROM trail_entry) AS trail`,
      );
    const before = await counts();
    const response = await request(t.app).delete(`/api/permits/${ids.northPermit}`).set('cookie', coordinator).expect(409);
    expect(response.body.error.message).toMatch(/effective-to date/);
    expect(response.body.error.fields).toHaveProperty('effectiveTo');
    const [limit] = await t.dataSource.query('SELECT id FROM permit_limit WHERE permit_id = $1 LIMIT 1', [ids.northPermit]);
    const limitResponse = await request(t.app)
      .delete(`/api/permits/${ids.northPermit}/limits/${limit.id}`)
      .set('cookie', coordinator)
      .expect(409);
    expect(limitResponse.body.error.message).toMatch(/kept/);
    expect(await counts()).toEqual(before);
  });

  it("keeps a permit's periods even against a direct delete: the foreign key restricts, it does not cascade", async () => {
    await expect(t.dataSource.query('DELETE FROM permit WHERE id = $1', [ids.northPermit])).rejects.toThrow(/foreign key/);
  });

  it('answers 409 naming the field when a site is renamed to a name the company already uses, changing nothing', async () => {
    const [east] = await t.dataSource.query('SELECT name FROM site WHERE id = $1', [ids.east]);
    const response = await request(t.app).patch(`/api/sites/${ids.north}`).set('cookie', coordinator).send({ name: east.name }).expect(409);
    expect(response.body.error.fields).toHaveProperty('name');
    expect((await t.dataSource.query('SELECT name FROM site WHERE id = $1', [ids.north]))[0].name).toBe('Tamsin Creek Works');
  });
});
