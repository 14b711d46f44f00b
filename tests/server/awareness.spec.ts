import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { certificateBody, demoIds } from '../fixtures/lab.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

/**
 * The 24 hours to notify the control authority run from when the site became aware of the
 * violation (40 CFR 403.12(g)(2)): for a monthly average (40 CFR 122.2), the receipt of the
 * certificate whose result took the month's average over the limit, not the month's first.
 */
describe('when the site became aware of a violation', () => {
  let t: TestApp;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  let coordinator: string;
  let periodId: string;
  let pointId: string;

  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
    coordinator = await t.sessionFor('coordinator@decant.test');
    const point = await request(t.app)
      .post(`/api/sites/${ids.north}/discharge-points`)
      .set('cookie', coordinator)
      .send({ code: 'OF-AW', name: 'Awareness outfall', receiving: 'sewer' })
      .expect(201);
    pointId = point.body.id;
    const permit = await request(t.app)
      .post('/api/permits')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        kind: 'pretreatment',
        number: 'AW-0001',
        issuingAuthority: 'Basin Water Authority',
        effectiveFrom: '2026-02-01',
        reportingFrequency: 'monthly',
        reportDueDays: 28,
        nonDetectPolicy: 'zero',
      })
      .expect(201);
    await request(t.app)
      .post(`/api/permits/${permit.body.id}/limits`)
      .set('cookie', coordinator)
      .send({
        dischargePointId: pointId,
        parameterId: ids.hem,
        statistic: 'monthly-average',
        value: 10,
        unit: 'mg/L',
        frequencyCount: 1,
        frequencyPer: 'month',
        sampleType: 'grab',
      })
      .expect(201);
    // 8, 9 then 16 mg/L: the average is 8, 8.5, then 11 — over 10 with the third certificate.
    for (const [day, value, received] of [
      ['03', '8', '2026-02-05'],
      ['10', '9', '2026-02-12'],
      ['17', '16', '2026-02-19'],
    ] as const) {
      const body = certificateBody(ids, { receivedOn: received, receivedTime: '15:45', reportNumber: `AW-${day}` });
      body.samples[0]!.dischargePointId = pointId;
      body.samples[0]!.collectedAt = `2026-02-${day}T09:30`;
      body.samples[0]!.results[0]!.value = value;
      body.samples[0]!.results[0]!.analysedAt = `2026-02-${day}T16:00`;
      await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(body).expect(201);
    }
    const periods = await request(t.app).get(`/api/periods?permitId=${permit.body.id}`).set('cookie', coordinator).expect(200);
    periodId = periods.body.items.find((p: { startsOn: string }) => p.startsOn === '2026-02-01').id;
  });
  afterAll(() => t.close());

  const notice = async () => {
    const list = await request(t.app)
      .get(`/api/follow-ups?siteId=${ids.north}&status=open&pageSize=100`)
      .set('cookie', coordinator)
      .expect(200);
    return list.body.items.find((f: { kind: string; title: string }) => f.kind === 'notify-control-authority' && f.title.includes('OF-AW'));
  };

  it('starts a monthly average’s 24 hours at the receipt of the certificate that took it over (40 CFR 403.12(g)(2))', async () => {
    await request(t.app).post(`/api/periods/${periodId}/compile`).set('cookie', coordinator).expect(200);
    const followUp = await notice();
    // 2026-02-19 15:45 in Chicago (UTC−6 in February) is 21:45 UTC.
    expect(followUp.awareAt).toBe('2026-02-19T21:45:00.000Z');
    expect(followUp.awareSource).toBe('certificate AW-17 received 2026-02-19 15:45 (site time)');
    expect(new Date(followUp.dueAt).getTime() - new Date(followUp.awareAt).getTime()).toBe(24 * 3600 * 1000);
  });

  it('lets a coordinator correct the awareness time with a reason, moving the deadline with it, in the trail', async () => {
    const followUp = await notice();
    const missing = await request(t.app)
      .post(`/api/follow-ups/${followUp.id}/aware-since`)
      .set('cookie', coordinator)
      .send({ awareAt: '2026-02-19T08:00' })
      .expect(400);
    expect(missing.body.error.fields).toHaveProperty('reason');
    expect((await notice()).awareAt).toBe(followUp.awareAt);

    const corrected = await request(t.app)
      .post(`/api/follow-ups/${followUp.id}/aware-since`)
      .set('cookie', coordinator)
      .send({ awareAt: '2026-02-19T08:00', reason: 'The lab e-mailed the report at 8 in the morning' })
      .expect(200);
    expect(corrected.body.awareAt).toBe('2026-02-19T14:00:00.000Z');
    expect(corrected.body.dueAt).toBe('2026-02-20T14:00:00.000Z');
    expect(corrected.body.awareSource).toContain('The lab e-mailed the report at 8 in the morning');
    const [entry] = await t.dataSource.query(
      `SELECT before, after FROM trail_entry WHERE entity = 'follow-up' AND entity_id = $1 AND action = 'update' ORDER BY chain_seq DESC LIMIT 1`,
      [followUp.id],
    );
    expect(entry.before.awareAt).toBe('2026-02-19T21:45:00.000Z');
    expect(entry.after.reason).toBe('The lab e-mailed the report at 8 in the morning');
  });
});
