import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds } from '../fixtures/lab.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

describe('flow readings', () => {
  let t: TestApp;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  let coordinator: string;
  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
    coordinator = await t.sessionFor('coordinator@decant.test');
  });
  afterAll(() => t.close());

  it('records one reading a point a day, the second replacing the first', async () => {
    await request(t.app)
      .post('/api/flow-readings')
      .set('cookie', coordinator)
      .send({ dischargePointId: ids.northOutfall, day: '2024-02-01', value: 0.03, unit: 'MGD' })
      .expect(201);
    await request(t.app)
      .post('/api/flow-readings')
      .set('cookie', coordinator)
      .send({ dischargePointId: ids.northOutfall, day: '2024-02-01', value: 31000, unit: 'gal/day' })
      .expect(201);
    const rows = await t.dataSource.query(`SELECT value, unit FROM flow_reading WHERE discharge_point_id = $1 AND day = '2024-02-01'`, [
      ids.northOutfall,
    ]);
    expect(rows.map((r: { value: string; unit: string }) => [Number(r.value), r.unit])).toEqual([[31000, 'gal/day']]);
  });

  it('refuses a negative flow, an unknown unit and a future day', async () => {
    for (const [body, field] of [
      [{ dischargePointId: ids.northOutfall, day: '2024-02-02', value: -1, unit: 'MGD' }, 'value'],
      [{ dischargePointId: ids.northOutfall, day: '2024-02-02', value: 1, unit: 'cfs' }, 'unit'],
      [{ dischargePointId: ids.northOutfall, day: '2999-01-01', value: 1, unit: 'MGD' }, 'day'],
    ] as const) {
      const response = await request(t.app).post('/api/flow-readings').set('cookie', coordinator).send(body).expect(400);
      expect(response.body.error.fields).toHaveProperty(field);
    }
  });

  it('imports a spreadsheet all or nothing, naming the bad row', async () => {
    const before = await t.count('flow_reading');
    const bad = Buffer.from('discharge_point_code,day,value,unit\nOF-001,2024-03-01,30000,gal/day\nOF-001,2024-03-02,lots,gal/day\n');
    const dry = await request(t.app)
      .post('/api/flow-readings/import')
      .set('cookie', coordinator)
      .field('siteId', ids.north)
      .field('commit', 'true')
      .attach('file', bad, 'flows.csv')
      .expect(400);
    expect(dry.body.report.errors[0]).toMatchObject({ row: 3, column: 'value' });
    expect(await t.count('flow_reading')).toBe(before);
    const good = Buffer.from('discharge_point_code,day,value,unit\nOF-001,2024-03-01,30000,gal/day\nOF-001,2024-03-02,0.031,MGD\n');
    const done = await request(t.app)
      .post('/api/flow-readings/import')
      .set('cookie', coordinator)
      .field('siteId', ids.north)
      .field('commit', 'true')
      .attach('file', good, 'flows.csv')
      .expect(201);
    expect(done.body).toMatchObject({ committed: true, readings: 2 });
    expect(await t.count('flow_reading')).toBe(before + 2);
  });

  it('lets the auditor read but not write', async () => {
    const auditor = await t.sessionFor('auditor@decant.test');
    await request(t.app).get(`/api/flow-readings?siteId=${ids.north}`).set('cookie', auditor).expect(200);
    await request(t.app).post('/api/flow-readings').set('cookie', auditor).send({}).expect(403);
  });
});
