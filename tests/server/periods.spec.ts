import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PeriodSummary } from '../../server/contracts/periods.js';
import { demoIds } from '../fixtures/lab.js';
import { ensureAllPeriods } from '../../server/features/periods/periods.service.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

describe('periods, summaries and follow-ups', () => {
  let t: TestApp;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  let coordinator: string;
  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
    coordinator = await t.sessionFor('coordinator@decant.test');
  });
  afterAll(() => t.close());

  it('compiles a fresh permit fed through the API to the hand-worked values of 40 CFR 122.2', async () => {
    // A monthly NPDES-style permit at a new point, with hand-worked grabs in March 2026.
    const point = await request(t.app)
      .post(`/api/sites/${ids.north}/discharge-points`)
      .set('cookie', coordinator)
      .send({ code: 'OF-HW', name: 'Hand-worked outfall', receiving: 'surface-water' })
      .expect(201);
    const permit = await request(t.app)
      .post('/api/permits')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        kind: 'npdes',
        number: 'HW-0001',
        issuingAuthority: 'State agency',
        effectiveFrom: '2026-03-01',
        effectiveTo: '2026-03-31',
        reportingFrequency: 'monthly',
        reportDueDays: 28,
        nonDetectPolicy: 'half-mdl',
      })
      .expect(201);
    for (const [statistic, value] of [
      ['daily-maximum', 20],
      ['monthly-average', 10],
    ] as const) {
      await request(t.app)
        .post(`/api/permits/${permit.body.id}/limits`)
        .set('cookie', coordinator)
        .send({
          dischargePointId: point.body.id,
          parameterId: ids.hem,
          statistic,
          value,
          unit: 'mg/L',
          frequencyCount: 1,
          frequencyPer: 'week',
          sampleType: 'grab',
        })
        .expect(201);
    }
    const sample = (collectedAt: string, value: string, qualifier: '<' | null = null) => ({
      dischargePointId: point.body.id,
      collectedAt,
      collectedBy: 'HW',
      sampleType: 'grab',
      preservationConfirmed: true,
      temperatureOnReceiptC: 4,
      results: [{ parameterId: ids.hem, method: '1664B', qualifier, value, mdl: 1.4, ml: 5, unit: 'mg/L', analysedAt: null }],
    });
    // Mar 3: 8 and 12 → daily 10. Mar 10: 24 (over 20). Mar 17: <5.0 → half MDL 0.7. Mar 24 23:30 local: 6.
    // Monthly average = (10 + 24 + 0.7 + 6) / 4 = 10.175 > 10.
    const samples = [
      sample('2026-03-03T08:00', '8'),
      sample('2026-03-03T14:00', '12'),
      sample('2026-03-10T09:00', '24'),
      sample('2026-03-17T09:00', '5.0', '<'),
      sample('2026-03-24T23:30', '6'),
    ];
    await request(t.app)
      .post('/api/lab-certificates')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        labName: 'HW Lab',
        labAccreditationNumber: 'HW',
        reportNumber: `HW-${Date.now()}`,
        receivedOn: '2026-03-26',
        samples,
      })
      .expect(201);

    const periods = await request(t.app).get(`/api/periods?permitId=${permit.body.id}`).set('cookie', coordinator).expect(200);
    expect(
      periods.body.items.map((p: { permitNumber: string; startsOn: string; endsOn: string; dueOn: string }) => [
        p.permitNumber,
        p.startsOn,
        p.endsOn,
        p.dueOn,
      ]),
    ).toEqual([['HW-0001', '2026-03-01', '2026-03-31', '2026-04-28']]);
    const summary = await request(t.app).get(`/api/periods/${periods.body.items[0].id}/summary`).set('cookie', coordinator).expect(200);
    const byStatistic = Object.fromEntries(summary.body.rows.map((r: { statistic: string }) => [r.statistic, r]));
    expect(byStatistic['daily-maximum']).toMatchObject({
      computedValue: 24,
      exceeded: true,
      // Four sampling days: the two grabs of Mar 3 are one sampling event (the permit's default
      // setting; common practice, no published source).
      samplesTaken: 4,
      limitValue: 20,
      unit: 'mg/L',
    });
    expect(byStatistic['monthly-average'].computedValue).toBeCloseTo(10.175, 10);
    expect(byStatistic['monthly-average'].exceeded).toBe(true);
    expect(byStatistic['daily-maximum'].dailyValues.map((d: { day: string }) => d.day)).toEqual([
      '2026-03-03',
      '2026-03-10',
      '2026-03-17',
      '2026-03-24',
    ]);
    expect(summary.body.nonDetectPolicy).toBe('half-mdl');
    expect(summary.body.significantNoncompliance).toBeNull();
    expect(summary.body.cautions[0]).toMatch(/permit and the control authority decide/);
    // The answer has exactly the documented shape (the schema behind /api/openapi.json).
    expect(PeriodSummary.strict().safeParse(summary.body).error).toBeUndefined();

    // Compiling opens the 122.41(l)(6) reports once, however often it runs.
    const compiled = await request(t.app).post(`/api/periods/${periods.body.items[0].id}/compile`).set('cookie', coordinator).expect(200);
    // The compiled figures count the follow-ups this compile has just opened.
    const [{ open }] = await t.dataSource.query(`SELECT count(*)::int AS open FROM follow_up WHERE site_id = $1 AND status = 'open'`, [
      compiled.body.siteId,
    ]);
    expect(open).toBeGreaterThan(0);
    expect(compiled.body.openFollowUps).toBe(open);
    const count = async () =>
      (await t.dataSource.query(`SELECT count(*)::int AS n FROM follow_up WHERE kind IN ('report-within-24-hours', 'written-report')`))[0]
        .n;
    const first = await count();
    expect(first).toBe(2);
    await request(t.app).post(`/api/periods/${periods.body.items[0].id}/compile`).set('cookie', coordinator).expect(200);
    expect(await count()).toBe(first);
  });

  it("compiles a mass limit (lb/day) from the day's concentration and flow, as worked by hand", async () => {
    // A pretreatment permit with an oil and grease loading limit of 20 lb/day at a new point, April 2026.
    const point = await request(t.app)
      .post(`/api/sites/${ids.north}/discharge-points`)
      .set('cookie', coordinator)
      .send({ code: 'OF-MASS', name: 'Loading outfall', receiving: 'sewer' })
      .expect(201);
    const permit = await request(t.app)
      .post('/api/permits')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        kind: 'pretreatment',
        number: 'HW-MASS',
        issuingAuthority: 'Control authority',
        effectiveFrom: '2026-04-01',
        effectiveTo: '2026-04-30',
        reportingFrequency: 'monthly',
        reportDueDays: 28,
        nonDetectPolicy: 'zero',
      })
      .expect(201);
    const limit = (body: Record<string, unknown>) =>
      request(t.app)
        .post(`/api/permits/${permit.body.id}/limits`)
        .set('cookie', coordinator)
        .send({
          dischargePointId: point.body.id,
          parameterId: ids.hem,
          statistic: 'daily-maximum',
          value: 20,
          unit: 'lb/day',
          frequencyCount: 1,
          frequencyPer: 'week',
          sampleType: 'grab',
          ...body,
        });
    const noPh = await limit({ parameterId: ids.ph, value: 10 }).expect(400);
    expect(noPh.body.error.fields.unit).toMatch(/not measured as a concentration/);
    const noInstant = await limit({ statistic: 'instantaneous-maximum' }).expect(400);
    expect(noInstant.body.error.fields.statistic).toMatch(/daily maximum or a monthly average/);
    await limit({}).expect(201);

    for (const [day, value] of [
      ['2026-04-07', 0.05],
      ['2026-04-14', 50000],
    ] as const) {
      await request(t.app)
        .post('/api/flow-readings')
        .set('cookie', coordinator)
        .send({ dischargePointId: point.body.id, day, value, unit: day === '2026-04-07' ? 'MGD' : 'gal/day' })
        .expect(201);
    }
    const sample = (collectedAt: string, value: string) => ({
      dischargePointId: point.body.id,
      collectedAt,
      collectedBy: 'HW',
      sampleType: 'grab',
      preservationConfirmed: true,
      temperatureOnReceiptC: 4,
      results: [{ parameterId: ids.hem, method: '1664B', qualifier: null, value, mdl: 1.4, ml: 5, unit: 'mg/L', analysedAt: null }],
    });
    // Apr 7: 0.05 MGD × 40 mg/L × 8.34 = 16.68 lb/day. Apr 14: 50,000 gal/day = 0.05 MGD × 60 mg/L × 8.34 = 25.02 lb/day, over 20 by 25.1 %.
    // Apr 21: 30 mg/L with no flow reading: no loading can be worked out.
    await request(t.app)
      .post('/api/lab-certificates')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        labName: 'HW Lab',
        labAccreditationNumber: 'HW',
        reportNumber: `HW-M-${Date.now()}`,
        receivedOn: '2026-04-24',
        samples: [sample('2026-04-07T09:00', '40'), sample('2026-04-14T09:00', '60'), sample('2026-04-21T09:00', '30')],
      })
      .expect(201);

    const periods = await request(t.app).get(`/api/periods?permitId=${permit.body.id}`).set('cookie', coordinator).expect(200);
    const summary = await request(t.app).get(`/api/periods/${periods.body.items[0].id}/summary`).set('cookie', coordinator).expect(200);
    const [row] = summary.body.rows;
    expect(row).toMatchObject({
      unit: 'lb/day',
      limitValue: 20,
      exceeded: true,
      samplesTaken: 3,
      daysWithoutFlow: ['2026-04-21'],
      shownValue: '25.0',
    });
    expect(row.computedValue).toBeCloseTo(25.02, 10);
    expect(row.dailyValues.map((d: { value: number }) => d.value)).toEqual([expect.closeTo(16.68, 10), expect.closeTo(25.02, 10)]);
    expect(row.exceedances).toEqual([expect.objectContaining({ date: '2026-04-14', percentOver: 25.1 })]);

    // The same sample is also over a 50 mg/L concentration limit: one violation, so one notice and one repeat sample (40 CFR 403.12(g)(2)).
    await limit({ unit: 'mg/L', value: 50 }).expect(201);
    await request(t.app).post(`/api/periods/${periods.body.items[0].id}/compile`).set('cookie', coordinator).expect(200);
    const opened = await t.dataSource.query(
      `SELECT kind FROM follow_up WHERE source_entity = 'exceedance' AND title LIKE '%OF-MASS, 2026-04-14%' ORDER BY kind`,
    );
    expect(opened.map((f: { kind: string }) => f.kind)).toEqual(['notify-control-authority', 'repeat-sampling']);
  });

  it('lists periods without writing any: they are created with the permit, and by the hourly tick as the calendar turns', async () => {
    // A permit that reached the database without the API (say, restored), so it has no periods yet.
    const [permit] = await t.dataSource.query(
      `INSERT INTO permit (site_id, kind, number, issuing_authority, effective_from, reporting_frequency, report_due_days)
       VALUES ($1, 'pretreatment', 'TICK-1', 'Control authority', '2026-01-01', 'quarterly', 30) RETURNING id`,
      [ids.north],
    );
    await t.dataSource.query(
      `INSERT INTO permit_settings (permit_id, applies_from, non_detect_policy, mass_loading_factor, snc_window) VALUES ($1, '2026-01-01', 'zero', 8.34, 'calendar-halves')`,
      [permit.id],
    );
    const count = async () =>
      (await t.dataSource.query('SELECT count(*)::int AS n FROM reporting_period WHERE permit_id = $1', [permit.id]))[0].n;
    const auditor = await t.sessionFor('auditor@decant.test');
    const listed = await request(t.app).get(`/api/periods?permitId=${permit.id}`).set('cookie', auditor).expect(200);
    expect(listed.body.items).toEqual([]);
    expect(await count()).toBe(0);
    await ensureAllPeriods(t.dataSource);
    // Quarters from 2026-01-01 up to the one running today: at least the four of 2026 (this runs in December 2026 or later).
    expect(await count()).toBeGreaterThanOrEqual(4);
  });

  it('closes a follow-up with a note, in the trail, once', async () => {
    const [open] = await t.dataSource.query(`SELECT id FROM follow_up WHERE site_id = $1 AND status = 'open' LIMIT 1`, [ids.north]);
    const closed = await request(t.app)
      .post(`/api/follow-ups/${open.id}/close`)
      .set('cookie', coordinator)
      .send({ note: 'Phoned the pretreatment office' })
      .expect(200);
    expect(['done', 'done-late']).toContain(closed.body.status);
    await request(t.app).post(`/api/follow-ups/${open.id}/close`).set('cookie', coordinator).send({ note: 'Again' }).expect(409);
    // The seed's 'create' is there too; the close is recorded once, by the coordinator.
    const entries = await t.dataSource.query(`SELECT action, actor_email FROM trail_entry WHERE entity_id = $1 AND action <> 'create'`, [
      open.id,
    ]);
    expect(entries).toEqual([{ action: 'close', actor_email: 'coordinator@decant.test' }]);
    const refused = await request(t.app).post(`/api/follow-ups/${open.id}/close`).set('cookie', coordinator).send({ note: '' }).expect(400);
    expect(refused.body.error.fields).toHaveProperty('note');
  });

  it('shows the demo its significant-noncompliance verdicts: technical review met, chronic not', async () => {
    const periods = await request(t.app).get(`/api/periods?siteId=${ids.north}`).set('cookie', coordinator).expect(200);
    const verdicts = [];
    for (const period of periods.body.items) {
      const summary = await request(t.app).get(`/api/periods/${period.id}/summary`).set('cookie', coordinator).expect(200);
      verdicts.push(
        ...(summary.body.significantNoncompliance ?? []).filter((v: { parameterName: string }) =>
          v.parameterName.startsWith('Oil and grease'),
        ),
      );
    }
    expect(verdicts.some((v) => v.technicalReview === true && v.chronic === false)).toBe(true);
  });

  it('keeps periods to those who may read them, and compiling to the coordinator', async () => {
    const operator = await t.sessionFor('operator@decant.test');
    await request(t.app).get('/api/periods').set('cookie', operator).expect(403);
    const auditor = await t.sessionFor('auditor@decant.test');
    const [period] = (await request(t.app).get(`/api/periods?siteId=${ids.north}`).set('cookie', auditor).expect(200)).body.items;
    await request(t.app).get(`/api/periods/${period.id}/summary`).set('cookie', auditor).expect(200);
    await request(t.app).post(`/api/periods/${period.id}/compile`).set('cookie', auditor).expect(403);
    const east = await t.sessionFor('coordinator.east@decant.test');
    await request(t.app).get(`/api/periods/${period.id}/summary`).set('cookie', east).expect(404);
    await request(t.app).get(`/api/periods?siteId=${ids.north}`).set('cookie', east).expect(403);
    const mine = await request(t.app).get('/api/periods').set('cookie', east).expect(200);
    expect(mine.body.items.every((p: { siteId: string }) => p.siteId === ids.east)).toBe(true);
    await request(t.app).get('/api/follow-ups').set('cookie', auditor).expect(200);
    const [someFollowUp] = await t.dataSource.query(`SELECT id FROM follow_up WHERE status = 'open' LIMIT 1`);
    await request(t.app)
      .post(`/api/follow-ups/${someFollowUp.id}/close`)
      .set('cookie', auditor)
      .send({ note: 'Not mine to close' })
      .expect(403);
  });
});

describe('report submission and closing with a file', () => {
  let t: TestApp;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
  });
  afterAll(() => t.close());

  it('records when a report was sent and judges its lateness by the permit setting', async () => {
    const coordinator = await t.sessionFor('coordinator@decant.test');
    const [period] = await t.dataSource.query(
      `SELECT rp.id, rp.due_on::text AS due_on, rp.ends_on::text AS ends_on FROM reporting_period rp WHERE rp.permit_id = $1 AND rp.due_on < now() - interval '60 days' ORDER BY rp.starts_on LIMIT 1`,
      [ids.northPermit],
    );
    const due = new Date(`${period.due_on}T00:00:00Z`);
    const late = new Date(due.getTime() + 46 * 86_400_000).toISOString().slice(0, 10);
    const summary = await request(t.app)
      .put(`/api/periods/${period.id}/submission`)
      .set('cookie', coordinator)
      .send({ submittedOn: late })
      .expect(200);
    expect(summary.body.reportTimeliness).toMatchObject({
      submittedOn: late,
      daysLate: 46,
      lateReportDays: 45,
      significantNoncompliance: true,
    });
    const refused = await request(t.app)
      .put(`/api/periods/${period.id}/submission`)
      .set('cookie', coordinator)
      .send({ submittedOn: '2000-01-01' })
      .expect(400);
    expect(refused.body.error.fields).toHaveProperty('submittedOn');
  });

  it('closes a follow-up with a note and a PDF of the notice sent', async () => {
    const coordinator = await t.sessionFor('coordinator@decant.test');
    const [open] = await t.dataSource.query(`SELECT id FROM follow_up WHERE site_id = $1 AND status = 'open' LIMIT 1`, [ids.north]);
    const pdf = Buffer.from('%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n');
    const closed = await request(t.app)
      .post(`/api/follow-ups/${open.id}/close`)
      .set('cookie', coordinator)
      .field('note', 'Notice e-mailed, copy attached')
      .attach('file', pdf, 'notice.pdf')
      .expect(200);
    expect(closed.body.hasClosingFile).toBe(true);
    const file = await request(t.app).get(`/api/follow-ups/${open.id}/file`).set('cookie', coordinator).expect(200);
    expect(file.headers['content-type']).toBe('application/pdf');
  });
});
