import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { upkeepChecklists } from '../../server/contracts/upkeep-checklists.js';
import { openFollowUp, type FollowUpToOpen } from '../../server/features/follow-ups/open-follow-up.js';
import { exceedanceSourceId, missedMonitoringSourceId, upkeepDueSourceId } from '../../server/features/periods/finding-ids.js';
import { certificateBody, demoIds } from '../fixtures/lab.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

/**
 * Follow-ups that keep themselves true: when the record that resolves one is entered in Decant,
 * it closes by itself with a note naming that record, in the trail; and not otherwise.
 */
describe('follow-ups closed by what resolves them', () => {
  let t: TestApp;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  let coordinator: string;
  let operator: string;

  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
    coordinator = await t.sessionFor('coordinator@decant.test');
    operator = await t.sessionFor('operator@decant.test');
  });
  afterAll(() => t.close());

  const open = async (followUp: Omit<FollowUpToOpen, 'dueAt' | 'title'> & { title?: string }) => {
    await t.dataSource.transaction((manager) =>
      openFollowUp(manager, { title: `Test ${followUp.kind}`, dueAt: new Date(Date.now() + 5 * 86_400_000), ...followUp }),
    );
    const [row] = await t.dataSource.query(`SELECT id FROM follow_up WHERE kind = $1 AND source_entity = $2 AND source_id = $3`, [
      followUp.kind,
      followUp.sourceEntity,
      followUp.sourceId,
    ]);
    return row.id as string;
  };
  const state = async (id: string) =>
    (await t.dataSource.query(`SELECT status, closing_note, closed_by_entity, closed_by_id FROM follow_up WHERE id = $1`, [id]))[0];
  const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);

  it('closes the signed-copy follow-ups when the signed copy is recorded (40 CFR 262.42), and not on another change', async () => {
    const created = await request(t.app)
      .post('/api/shipments')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        shippedOn: daysAgo(50),
        documentKind: 'hazardous-waste-manifest',
        documentNumber: '100200300CLS',
        transporterName: 'Test Hauler',
        transporterEpaId: 'ILR000000001',
        receiverName: 'Test Recycler',
        receiverEpaId: 'ILD000000002',
        wasteDescription: 'Used oil',
        quantity: 220,
        quantityUnit: 'gal',
      })
      .expect(201);
    const followUp = await open({
      siteId: ids.north,
      kind: 'contact-transporter-and-facility',
      sourceEntity: 'shipment',
      sourceId: created.body.id,
    });
    await request(t.app)
      .patch(`/api/shipments/${created.body.id}`)
      .set('cookie', coordinator)
      .send({ wasteDescription: 'Used oil, drums' })
      .expect(200);
    expect((await state(followUp)).status).toBe('open');

    await request(t.app)
      .patch(`/api/shipments/${created.body.id}`)
      .set('cookie', coordinator)
      .send({ signedCopyReceivedOn: daysAgo(1) })
      .expect(200);
    const closed = await state(followUp);
    expect(closed.status).toBe('done');
    expect(closed.closing_note).toBe(`Closed by Decant: the signed copy of 100200300CLS was recorded as received on ${daysAgo(1)}`);
    expect(closed).toMatchObject({ closed_by_entity: 'shipment', closed_by_id: created.body.id });
    const [entry] = await t.dataSource.query(
      `SELECT actor_email, after FROM trail_entry WHERE entity = 'follow-up' AND entity_id = $1 AND action = 'close'`,
      [followUp],
    );
    expect(entry.actor_email).toBe('coordinator@decant.test');
    expect(entry.after.closedBy).toEqual({ entity: 'shipment', id: created.body.id });
  });

  it('closes an overdue upkeep check when the check of that equipment is done, not when another is', async () => {
    const list = await request(t.app).get(`/api/equipment?siteId=${ids.north}`).set('cookie', operator).expect(200);
    const [first, second] = list.body.items as Array<{ id: string; kind: keyof typeof upkeepChecklists }>;
    const followUp = await open({
      siteId: ids.north,
      kind: 'upkeep-due',
      sourceEntity: 'equipment',
      sourceId: upkeepDueSourceId(first!.id, daysAgo(20)),
    });
    const check = (equipment: { id: string; kind: keyof typeof upkeepChecklists }) =>
      request(t.app)
        .post('/api/upkeep-checks')
        .set('cookie', operator)
        .send({
          equipmentId: equipment.id,
          checkedOn: daysAgo(0),
          items: upkeepChecklists[equipment.kind].map((item) => ({ key: item.key, outcome: 'pass', note: '' })),
        })
        .expect(201);
    await check(second!);
    expect((await state(followUp)).status).toBe('open');
    const done = await check(first!);
    expect(await state(followUp)).toMatchObject({ status: 'done', closed_by_entity: 'upkeep-check', closed_by_id: done.body.id });
  });

  it('closes the repeat-sampling follow-up when a later sample of that point and parameter arrives (40 CFR 403.12(g)(2))', async () => {
    const row = { dischargePointId: ids.northOutfall, parameterId: ids.hem };
    const followUp = await open({
      siteId: ids.north,
      kind: 'repeat-sampling',
      sourceEntity: 'exceedance',
      sourceId: exceedanceSourceId(row, '2026-02-10'),
    });
    // Another parameter at the point is not the repeat sample.
    const ph = certificateBody(ids, { receivedOn: '2026-02-22' });
    ph.samples[0]!.collectedAt = '2026-02-20T09:30';
    Object.assign(ph.samples[0]!.results[0]!, {
      parameterId: ids.ph,
      method: 'SM 4500-H+ B',
      value: '7.1',
      unit: 'SU',
      mdl: null,
      ml: null,
      qcBatchCode: null,
      analysedAt: '2026-02-20T10:00',
    });
    await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(ph).expect(201);
    expect((await state(followUp)).status).toBe('open');

    const repeat = certificateBody(ids, { receivedOn: '2026-02-22', reportNumber: 'REPEAT-1' });
    repeat.samples[0]!.collectedAt = '2026-02-20T09:30';
    repeat.samples[0]!.results[0]!.analysedAt = '2026-02-21T10:00';
    const saved = await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(repeat).expect(201);
    expect(await state(followUp)).toMatchObject({
      status: 'done',
      closing_note: "Closed by Decant: the repeat sample's results arrived with certificate REPEAT-1",
      closed_by_entity: 'lab-certificate',
      closed_by_id: saved.body.id,
    });
  });

  it('leaves a follow-up open when the sample came before the violation', async () => {
    const row = { dischargePointId: ids.northOutfall, parameterId: ids.hem };
    const followUp = await open({
      siteId: ids.north,
      kind: 'repeat-sampling',
      sourceEntity: 'exceedance',
      sourceId: exceedanceSourceId(row, '2026-04-15'),
      title: `Test ${randomUUID()}`,
    });
    const earlier = certificateBody(ids, { receivedOn: '2026-04-12' });
    earlier.samples[0]!.collectedAt = '2026-04-10T09:30';
    earlier.samples[0]!.results[0]!.analysedAt = '2026-04-11T10:00';
    await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(earlier).expect(201);
    expect((await state(followUp)).status).toBe('open');
  });

  it('closes a missed-sample follow-up when a late certificate brings the month up to the permit count, not before', async () => {
    // A point of its own, so other tests' samples do not count: two oil-and-grease grabs a month.
    const [point] = await t.dataSource.query(
      `INSERT INTO discharge_point (site_id, code, name, receiving) VALUES ($1, $2, 'Missed-sample test point', 'sewer') RETURNING id`,
      [ids.north, `MS-${randomUUID().slice(0, 8)}`],
    );
    await t.dataSource.query(
      `INSERT INTO permit_limit (permit_id, discharge_point_id, parameter_id, statistic, value, unit, frequency_count, frequency_per,
         sample_type, applies_from, series_id)
       VALUES ($1, $2, $3, 'daily-maximum', 100, 'mg/L', 2, 'month', 'grab', '2026-01-01', gen_random_uuid())`,
      [ids.northPermit, point.id, ids.hem],
    );
    const followUp = await open({
      siteId: ids.north,
      kind: 'missed-sample',
      sourceEntity: 'missed-monitoring',
      sourceId: missedMonitoringSourceId({ dischargePointId: point.id, parameterId: ids.hem }, '2026-05'),
    });
    const sampleOn = async (day: string) => {
      const body = certificateBody(ids, { receivedOn: day });
      Object.assign(body.samples[0]!, { dischargePointId: point.id, collectedAt: `${day}T09:30` });
      body.samples[0]!.results[0]!.analysedAt = `${day}T15:00`;
      return (await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(body).expect(201)).body as {
        id: string;
        reportNumber: string;
      };
    };
    await sampleOn('2026-05-05');
    expect((await state(followUp)).status).toBe('open'); // 1 of 2
    await sampleOn('2026-06-03');
    expect((await state(followUp)).status).toBe('open'); // June's sample does not count for May
    const second = await sampleOn('2026-05-19');
    expect(await state(followUp)).toMatchObject({
      closing_note: `Closed by Decant: the missed sample was taken: its results arrived with certificate ${second.reportNumber}`,
      closed_by_entity: 'lab-certificate',
      closed_by_id: second.id,
    });
    expect(['done', 'done-late']).toContain((await state(followUp)).status);
  });
});
