import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { certificationStatements } from '../../server/domain/period/certification.js';
import { demoIds } from '../fixtures/lab.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

/**
 * A period that is signed stands still: changing or ending its limit, or its results, leaves the
 * signed summary as it was; PostgreSQL itself refuses changes to what fed it; an amendment with a
 * reason reopens it, and signing again makes revision 2 with what changed.
 */
describe('sign-off, the lock and amendments', () => {
  let t: TestApp;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  let coordinator: string;
  let auditor: string;
  let permitId: string;
  let pointId: string;
  let limitId: string;
  let periodId: string;
  let resultId: string;

  const signer = { signerName: 'Dana Reyes', signerTitle: 'Plant manager', statementAccepted: true, acknowledged: true };

  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
    coordinator = await t.sessionFor('coordinator@decant.test');
    auditor = await t.sessionFor('auditor@decant.test');
    const point = await request(t.app)
      .post(`/api/sites/${ids.north}/discharge-points`)
      .set('cookie', coordinator)
      .send({ code: 'OF-SG', name: 'Signed outfall', receiving: 'sewer' })
      .expect(201);
    pointId = point.body.id;
    const permit = await request(t.app)
      .post('/api/permits')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        kind: 'pretreatment',
        number: 'SG-0001',
        issuingAuthority: 'Basin Water Authority',
        effectiveFrom: '2026-03-01',
        reportingFrequency: 'monthly',
        reportDueDays: 28,
        nonDetectPolicy: 'zero',
      })
      .expect(201);
    permitId = permit.body.id;
    const limit = await request(t.app)
      .post(`/api/permits/${permitId}/limits`)
      .set('cookie', coordinator)
      .send({
        dischargePointId: pointId,
        parameterId: ids.hem,
        statistic: 'daily-maximum',
        value: 20,
        unit: 'mg/L',
        frequencyCount: 1,
        frequencyPer: 'month',
        sampleType: 'grab',
      })
      .expect(201);
    limitId = limit.body.id;
    expect(limit.body.appliesFrom).toBe('2026-03-01');
    await request(t.app)
      .post('/api/lab-certificates')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        labName: 'Signed Lab',
        labAccreditationNumber: 'SG',
        reportNumber: `SG-${Date.now()}`,
        receivedOn: '2026-03-12',
        samples: [
          {
            dischargePointId: pointId,
            collectedAt: '2026-03-10T09:00',
            collectedBy: 'SG',
            sampleType: 'grab',
            preservationConfirmed: true,
            temperatureOnReceiptC: 4,
            results: [
              {
                parameterId: ids.hem,
                method: '1664B',
                qualifier: null,
                value: '24',
                mdl: 1.4,
                ml: 5,
                unit: 'mg/L',
                analysedAt: '2026-03-11T10:00',
              },
            ],
          },
        ],
      })
      .expect(201);
    const periods = await request(t.app).get(`/api/periods?permitId=${permitId}`).set('cookie', coordinator).expect(200);
    periodId = periods.body.items.find((p: { startsOn: string }) => p.startsOn === '2026-03-01').id;
    [{ id: resultId }] = await t.dataSource.query(
      `SELECT r.id FROM lab_result r JOIN lab_sample s ON s.id = r.sample_id WHERE s.discharge_point_id = $1`,
      [pointId],
    );
  });
  afterAll(() => t.close());

  const compile = async () => (await request(t.app).post(`/api/periods/${periodId}/compile`).set('cookie', coordinator).expect(200)).body;
  const sign = (compiledAt: string, extra: object = {}, cookie = coordinator) =>
    request(t.app)
      .post(`/api/periods/${periodId}/sign`)
      .set('cookie', cookie)
      .send({ ...signer, compiledAt, ...extra });

  it('refuses a sign-off that is not complete, and writes nothing', async () => {
    const { compiledAt } = await compile();
    const before = await t.count('period_signature');
    const checklist = await request(t.app).get(`/api/periods/${periodId}/sign-off`).set('cookie', coordinator).expect(200);
    // 40 CFR 403.12(l): a pretreatment report carries the certification of 403.6(a)(2)(ii).
    expect(checklist.body.statementSection).toBe('40 CFR 403.6(a)(2)(ii) (required by 40 CFR 403.12(l))');
    expect(checklist.body.statement).toBe(certificationStatements.pretreatment.text);
    expect(checklist.body.statement).toMatch(/^I certify under penalty of law/);
    expect(checklist.body.canSign).toBe(true);

    const noStatement = await sign(compiledAt, { statementAccepted: false }).expect(400);
    expect(noStatement.body.error.fields).toHaveProperty('statementAccepted');
    const noName = await sign(compiledAt, { signerName: '' }).expect(400);
    expect(noName.body.error.fields).toHaveProperty('signerName');
    await sign(compiledAt, {}, auditor).expect(403);
    const stale = await sign(compiledAt, { compiledAt: '2026-01-01T00:00:00.000Z' }).expect(409);
    expect(stale.body.error.fields).toHaveProperty('compiledAt');
    // Signed in 20 minutes ago: the provider must authenticate the signer again first.
    const longAgo = await t.sessionFor('coordinator@decant.test', Date.now() - 20 * 60 * 1000);
    const reauth = await sign(compiledAt, {}, longAgo).expect(401);
    expect(reauth.body.error.code).toBe('reauthentication_required');
    expect(reauth.body.signInUrl).toMatch(/^\/api\/auth\/sign-in\?reauthenticate=1&returnTo=/);
    expect(await t.count('period_signature')).toBe(before);

    // The running period is not over: it cannot be signed.
    const periods = await request(t.app).get(`/api/periods?permitId=${permitId}`).set('cookie', coordinator).expect(200);
    const running = periods.body.items.find(
      (p: { startsOn: string; endsOn: string; today: string }) => p.startsOn <= p.today && p.endsOn >= p.today,
    );
    const notOver = await request(t.app)
      .post(`/api/periods/${running.id}/sign`)
      .set('cookie', coordinator)
      .send({ ...signer, compiledAt })
      .expect(409);
    expect(notOver.body.error.message).toMatch(/can be signed once it is over/);
  });

  it('signs, and the signed summary stays byte-identical when its limit is changed and ended', async () => {
    const { compiledAt } = await compile();
    const signed = await sign(compiledAt).expect(200);
    expect(signed.body.status).toBe('signed');
    expect(signed.body.signature).toMatchObject({ revision: 1, signerName: 'Dana Reyes', signerTitle: 'Plant manager' });
    expect(signed.body.signature.sha256).toMatch(/^[0-9a-f]{64}$/);
    const [stored] = await t.dataSource.query('SELECT summary, inputs, trail_head_seq FROM period_signature WHERE period_id = $1', [
      periodId,
    ]);
    expect(stored.inputs.results.map((pair: string[]) => pair[0])).toContain(resultId);
    const shown = async () => (await request(t.app).get(`/api/periods/${periodId}/summary`).set('cookie', auditor).expect(200)).body;
    const first = await shown();
    expect(first.rows).toEqual(stored.summary.rows);
    expect(first.compiledAt).toBe(stored.summary.compiledAt);
    expect(first.rows[0]).toMatchObject({ computedValue: 24, exceeded: true, limitValue: 20 });

    // A new version from the running period on, then the limit ended: the signed period does not move.
    const changed = await request(t.app)
      .patch(`/api/permits/${permitId}/limits/${limitId}`)
      .set('cookie', coordinator)
      .send({ value: 30 })
      .expect(200);
    expect(changed.body.id).not.toBe(limitId);
    expect(changed.body.appliesFrom > '2026-03-31').toBe(true);
    await request(t.app)
      .delete(`/api/permits/${permitId}/limits/${changed.body.id}?endsOn=${changed.body.appliesFrom}`)
      .set('cookie', coordinator)
      .expect(204);
    const after = await shown();
    expect(JSON.stringify(after.rows)).toBe(JSON.stringify(first.rows));
    expect(JSON.stringify(after.significantNoncompliance)).toBe(JSON.stringify(first.significantNoncompliance));

    // New permit settings from the running period on leave the signed period computed as it was.
    const settings = await request(t.app)
      .patch(`/api/permits/${permitId}`)
      .set('cookie', coordinator)
      .send({ nonDetectPolicy: 'half-mdl' })
      .expect(200);
    expect(settings.body).toMatchObject({ nonDetectPolicy: 'half-mdl' });
    expect(settings.body.settingsFrom > '2026-03-31').toBe(true);
    expect((await shown()).nonDetectPolicy).toBe('zero');
    const settingsRefused = await request(t.app)
      .patch(`/api/permits/${permitId}`)
      .set('cookie', coordinator)
      .send({ nonDetectPolicy: 'ml', settingsFrom: '2026-03-01' })
      .expect(409);
    expect(settingsRefused.body.error.message).toMatch(/computed with these settings/);

    // A change that would judge the signed period differently is refused, naming the period.
    const refused = await request(t.app)
      .patch(`/api/permits/${permitId}/limits/${limitId}`)
      .set('cookie', coordinator)
      .send({ value: 50, appliesFrom: '2026-03-15' })
      .expect(409);
    expect(refused.body.error.message).toMatch(/2026-03-01 – 2026-03-31 of permit SG-0001 is signed/);
    await request(t.app).delete(`/api/permits/${permitId}/limits/${limitId}?endsOn=2026-03-20`).set('cookie', coordinator).expect(409);
    await request(t.app).post(`/api/periods/${periodId}/compile`).set('cookie', coordinator).expect(409);
    await sign(compiledAt).expect(409);
  });

  it('is locked by PostgreSQL for the application database user, whatever route is taken', async () => {
    // t.dataSource connects as the app's role, as the server does.
    await expect(t.dataSource.query(`UPDATE lab_result SET value = 2 WHERE id = $1`, [resultId])).rejects.toMatchObject({ code: 'DL409' });
    await expect(t.dataSource.query(`DELETE FROM lab_result WHERE id = $1`, [resultId])).rejects.toMatchObject({ code: 'DL409' });
    const [sample] = await t.dataSource.query(`SELECT certificate_id FROM lab_sample WHERE discharge_point_id = $1`, [pointId]);
    await expect(
      t.dataSource.query(
        `INSERT INTO lab_sample (certificate_id, discharge_point_id, collected_at, collected_on, collected_by, sample_type, preservation_confirmed)
         VALUES ($1, $2, '2026-03-20T09:00Z', '2026-03-20', 'x', 'grab', true)`,
        [sample.certificate_id, pointId],
      ),
    ).rejects.toMatchObject({ code: 'DL409' });
    await expect(t.dataSource.query(`UPDATE permit_limit SET value = 1 WHERE id = $1`, [limitId])).rejects.toMatchObject({ code: 'DL409' });
    await expect(
      t.dataSource.query(`UPDATE permit_settings SET mass_loading_factor = 8.3454 WHERE permit_id = $1 AND applies_from = '2026-03-01'`, [
        permitId,
      ]),
    ).rejects.toMatchObject({ code: 'DL409' });
    await expect(t.dataSource.query(`UPDATE period_signature SET signer_name = 'x' WHERE period_id = $1`, [periodId])).rejects.toThrow();
    const [{ value }] = await t.dataSource.query(`SELECT value FROM lab_result WHERE id = $1`, [resultId]);
    expect(Number(value)).toBe(24);
  });

  it('amends with a reason, records changes under the amendment, and signs revision 2 with what changed', async () => {
    const noReason = await request(t.app)
      .post(`/api/periods/${periodId}/amendments`)
      .set('cookie', coordinator)
      .send({ reason: ' ' })
      .expect(400);
    expect(noReason.body.error.fields).toHaveProperty('reason');
    await request(t.app).post(`/api/periods/${periodId}/amendments`).set('cookie', auditor).send({ reason: 'x' }).expect(403);
    const opened = await request(t.app)
      .post(`/api/periods/${periodId}/amendments`)
      .set('cookie', coordinator)
      .send({ reason: 'The lab reissued its certificate with a corrected value' })
      .expect(201);
    expect(opened.body.status).toBe('amended');
    expect(opened.body.amendment.reason).toBe('The lab reissued its certificate with a corrected value');

    // The period's inputs are open again, for this period only; the change names the amendment in the trail.
    const [certificate] = await t.dataSource.query(
      `SELECT c.id FROM lab_certificate c JOIN lab_sample s ON s.certificate_id = c.id WHERE s.discharge_point_id = $1`,
      [pointId],
    );
    const current = (await request(t.app).get(`/api/lab-certificates/${certificate.id}`).set('cookie', coordinator).expect(200)).body;
    const corrected = {
      labName: current.labName,
      labAccreditationNumber: current.labAccreditationNumber,
      reportNumber: current.reportNumber,
      receivedOn: current.receivedOn,
      reason: 'Reissued certificate',
      samples: [
        {
          dischargePointId: pointId,
          collectedAt: '2026-03-10T09:00',
          collectedBy: 'SG',
          sampleType: 'grab',
          preservationConfirmed: true,
          temperatureOnReceiptC: 4,
          results: [
            {
              parameterId: ids.hem,
              method: '1664B',
              qualifier: null,
              value: '18',
              mdl: 1.4,
              ml: 5,
              unit: 'mg/L',
              analysedAt: '2026-03-11T10:00',
            },
          ],
        },
      ],
    };
    const put = await request(t.app).put(`/api/lab-certificates/${certificate.id}`).set('cookie', coordinator).send(corrected);
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    const [tagged] = await t.dataSource.query(`SELECT count(*)::int AS n FROM trail_entry WHERE amendment_id = $1`, [
      opened.body.amendment.id,
    ]);
    expect(tagged.n).toBeGreaterThan(0);

    const { compiledAt } = await compile();
    const second = await sign(compiledAt).expect(200);
    expect(second.body.signature.revision).toBe(2);
    expect(second.body.signature.amendmentReason).toBe('The lab reissued its certificate with a corrected value');
    expect(second.body.rows[0]).toMatchObject({ computedValue: 18, exceeded: false });

    const revisions = await request(t.app).get(`/api/periods/${periodId}/revisions`).set('cookie', auditor).expect(200);
    expect(revisions.body.items.map((r: { revision: number }) => r.revision)).toEqual([2, 1]);
    const changes = revisions.body.items[0].changes;
    // Shown at Method 1664 §12.3's three significant figures.
    expect(changes.values).toEqual([expect.objectContaining({ before: '24.0', after: '18.0' })]);
    expect(changes.verdicts).toEqual([expect.objectContaining({ before: 'over the limit', after: 'within the limit' })]);
    expect(changes.exceedancesRemoved).toHaveLength(1);
    const earlier = await request(t.app).get(`/api/periods/${periodId}/revisions/1`).set('cookie', auditor).expect(200);
    expect(earlier.body.rows[0]).toMatchObject({ computedValue: 24, exceeded: true });
    await request(t.app).get(`/api/periods/${periodId}/revisions/9`).set('cookie', auditor).expect(404);
  });
});
