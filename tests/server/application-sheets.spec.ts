import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openFollowUp } from '../../server/features/follow-ups/open-follow-up.js';
import { demoIds } from '../fixtures/lab.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

/**
 * Application sheets kept with history, tank checks kept as dated records and attached to a
 * follow-up, and the demo's findings on first start. Every figure is an estimate (the screens
 * and the sheet say so).
 */
describe('application sheets and kept tank checks', () => {
  let t: TestApp;
  let coordinator: string;
  let operator: string;
  let auditor: string;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  const equipmentNamed = async (name: string) =>
    (await t.dataSource.query(`SELECT id, site_id FROM equipment WHERE name = $1`, [name]))[0] as { id: string; site_id: string };

  beforeAll(async () => {
    t = await startTestApp();
    coordinator = await t.sessionFor('coordinator@decant.test');
    operator = await t.sessionFor('operator@decant.test');
    auditor = await t.sessionFor('auditor@decant.test');
    ids = await demoIds(t.dataSource);
  });
  afterAll(() => t.close());

  const history = (equipmentId: string, cookie = coordinator) =>
    request(t.app).get(`/api/tools/application-sheets?equipmentId=${equipmentId}`).set('cookie', cookie);

  it('gives each demo piece of equipment a sheet, with its surface and volume worked out', async () => {
    const all = await t.dataSource.query(
      `SELECT e.name, count(s.id)::int AS sheets FROM equipment e LEFT JOIN application_sheet s ON s.equipment_id = e.id GROUP BY e.name`,
    );
    const demo = all.filter((row: { name: string }) => /skimmer|separator/i.test(row.name) && !/test/i.test(row.name));
    expect(demo.length).toBeGreaterThanOrEqual(5);
    expect(demo.every((row: { sheets: number }) => row.sheets >= 1)).toBe(true);
    const separator = await equipmentNamed('Coalescing separator OWS-1');
    const { body } = await history(separator.id, auditor).expect(200);
    // 4 ft × 3 ft = 12 ft²; 3 ft of liquid: 36 ft³ = 269 US gal (1 US gal = 231 in³, NIST Handbook 44, Appendix C).
    expect(body.current.computed).toMatchObject({ surfaceArea: '12 ft²', workingVolume: '269 US gal' });
    expect(body.caution).toContain('qualified engineer');
    expect(body.caution).toContain('confined-space');
  });

  it('appends a new version with a reason, keeps the old one, and writes both to the trail', async () => {
    const drum = await equipmentNamed('Drum skimmer, parts washer');
    const before = (await history(drum.id).expect(200)).body;
    const content = { ...before.current.content, estimatedOilLoad: 6 };
    const noReason = await request(t.app)
      .post('/api/tools/application-sheets')
      .set('cookie', operator)
      .send({ equipmentId: drum.id, content })
      .expect(400);
    expect(noReason.body.error.fields.reason).toMatch(/Say what changed/);
    const saved = await request(t.app)
      .post('/api/tools/application-sheets')
      .set('cookie', operator)
      .send({ equipmentId: drum.id, content, reason: 'Weighed a week of skimmings' })
      .expect(201);
    expect(saved.body.versions).toHaveLength(before.versions.length + 1);
    expect(saved.body.current).toMatchObject({ version: before.current.version + 1, reason: 'Weighed a week of skimmings' });
    expect(saved.body.versions[1].content.estimatedOilLoad).toBe(before.current.content.estimatedOilLoad);
    const [trail] = await t.dataSource.query(
      `SELECT action, before, after FROM trail_entry WHERE entity = 'application-sheet' AND entity_id = $1`,
      [saved.body.current.id],
    );
    expect(trail.action).toBe('revise');
    expect(trail.before.content.estimatedOilLoad).toBe(before.current.content.estimatedOilLoad);
    // Kept: the app's role may not change a version in place (and the table's trigger refuses it too).
    await expect(t.dataSource.query(`UPDATE application_sheet SET reason = 'x' WHERE id = $1`, [saved.body.current.id])).rejects.toThrow(
      /permission denied|kept/,
    );
  });

  it('refuses impossible input with the fields named, and saves nothing', async () => {
    const drum = await equipmentNamed('Drum skimmer, parts washer');
    const before = (await history(drum.id).expect(200)).body;
    const bad = await request(t.app)
      .post('/api/tools/application-sheets')
      .set('cookie', coordinator)
      .send({
        equipmentId: drum.id,
        reason: 'Trying',
        content: {
          ...before.current.content,
          length: -2,
          waterTemperatureMax: 230,
          oilSpecificGravity: 1.05,
          flowMode: 'continuous',
          flowIn: 0,
        },
      })
      .expect(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(
      expect.arrayContaining(['content.length', 'content.waterTemperatureMax', 'content.oilSpecificGravity', 'content.flowIn']),
    );
    expect(bad.body.error.fields['content.oilSpecificGravity']).toContain('does not float');
    expect((await history(drum.id).expect(200)).body.versions).toHaveLength(before.versions.length);
    // The auditor reads the sheet but does not write it.
    await request(t.app)
      .post('/api/tools/application-sheets')
      .set('cookie', auditor)
      .send({ equipmentId: drum.id, reason: 'Trying', content: before.current.content })
      .expect(403);
  });

  it('prints the sheet as a PDF for a vendor or an engineer', async () => {
    const tube = await equipmentNamed('Tube skimmer, wash-line sump');
    const { body } = await history(tube.id).expect(200);
    const pdf = await request(t.app)
      .get(`/api/tools/application-sheets/${body.current.id}/sheet.pdf`)
      .set('cookie', auditor)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect(pdf.headers['content-disposition']).toContain('application-sheet-Tube-skimmer-wash-line-sump-v1.pdf');
    expect((pdf.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
  });

  it('starts a tank check from an exceedance follow-up at the equipment of its point, saves it and keeps it as evidence', async () => {
    const followUpId = await t.dataSource.transaction(async (manager) => {
      await openFollowUp(manager, {
        siteId: ids.north,
        kind: 'repeat-sampling',
        sourceEntity: 'exceedance',
        sourceId: '00000000-0000-4000-8000-00000000aa14',
        title: 'Repeat sampling: oil and grease at OF-001 (test)',
        dueAt: new Date(Date.now() + 86_400_000 * 20),
        facts: { pointCode: 'OF-001', parameter: 'Oil and grease' } as never,
      });
      return (await manager.query(`SELECT id FROM follow_up WHERE source_id = '00000000-0000-4000-8000-00000000aa14'`))[0].id as string;
    });
    const start = await request(t.app).get(`/api/tools/tank-check/start?followUpId=${followUpId}`).set('cookie', coordinator).expect(200);
    expect(start.body.followUp.pointCode).toBe('OF-001');
    expect(start.body.equipment.map((e: { name: string }) => e.name)).toEqual(['Coalescing separator OWS-1']);
    const separator = start.body.equipment[0];
    expect(separator.input).toMatchObject({ unitSystem: 'us', length: 4, width: 3, depth: 3, flow: 30, waterTemperature: 50 });

    const saved = await request(t.app)
      .post('/api/tools/tank-checks')
      .set('cookie', coordinator)
      .send({ siteId: ids.north, equipmentId: separator.id, followUpId, input: separator.input })
      .expect(201);
    // The demo separator fails: 36 ft³ at 30 gal/min stays about 9 min; a 150 µm droplet needs about 13 min at 50 °F.
    expect(saved.body.result.verdict).toBe('too-short');
    expect(saved.body.result.summary).toMatch(/^Oil of 150 µm needs 13 min to surface; water stays 9 min — too short/);
    expect(saved.body).toMatchObject({ followUpId, equipmentName: 'Coalescing separator OWS-1' });
    const onFollowUp = await request(t.app).get(`/api/tools/tank-checks?followUpId=${followUpId}`).set('cookie', auditor).expect(200);
    expect(onFollowUp.body.items.map((c: { id: string }) => c.id)).toEqual([saved.body.id]);
    const onEquipment = await request(t.app).get(`/api/tools/tank-checks?equipmentId=${separator.id}`).set('cookie', auditor).expect(200);
    expect(onEquipment.body.items.map((c: { id: string }) => c.id)).toContain(saved.body.id);

    // A check saved on its own is attached afterwards, once; the figures are the server's, not the client's.
    const loose = await request(t.app)
      .post('/api/tools/tank-checks')
      .set('cookie', operator)
      .send({ siteId: ids.north, equipmentId: separator.id, input: { ...separator.input, flow: 10 } })
      .expect(201);
    expect(loose.body.result.verdict).toBe('rises');
    const attached = await request(t.app)
      .post(`/api/tools/tank-checks/${loose.body.id}/attach`)
      .set('cookie', operator)
      .send({ followUpId })
      .expect(200);
    expect(attached.body.followUpTitle).toBe('Repeat sampling: oil and grease at OF-001 (test)');
    const other = await t.dataSource.query(`SELECT id FROM follow_up WHERE site_id = $1 AND id <> $2 LIMIT 1`, [ids.north, followUpId]);
    await request(t.app)
      .post(`/api/tools/tank-checks/${loose.body.id}/attach`)
      .set('cookie', operator)
      .send({ followUpId: other[0].id })
      .expect(409);
    const [trail] = await t.dataSource.query(
      `SELECT after FROM trail_entry WHERE entity = 'tank-check' AND entity_id = $1 AND action = 'attach'`,
      [loose.body.id],
    );
    expect(trail.after.followUpId).toBe(followUpId);
    await expect(t.dataSource.query(`UPDATE tank_check SET verdict = 'rises' WHERE id = $1`, [saved.body.id])).rejects.toThrow(
      /kept as it was run/,
    );
  });

  it('sizes the demo wash-line tube skimmer from its sheet: 120 L/day over 24 h needs 5 L/h, so 10 L/h by the 2× rule (common practice, no published source)', async () => {
    const { body } = await request(t.app).get(`/api/tools/skimmer-fit?siteId=${ids.east}`).set('cookie', coordinator).expect(200);
    const tube = body.items.find((i: { name: string }) => i.name === 'Tube skimmer, wash-line sump');
    expect(tube).toMatchObject({ sizedFrom: 'sheet', verdict: 'undersized', sheetVersion: 1 });
    expect(tube.sheetNeededLph).toBeCloseTo(5, 9);
    expect(tube.recommendedLph).toBeCloseTo(10, 9);
    // Rated 1 US gal/h = 3.785 L/h, below the 10 L/h recommended.
    expect(tube.ratedLph).toBeCloseTo(3.785411784, 9);
    expect(tube.notes.map((n: { topic: string }) => n.topic)).toEqual(expect.arrayContaining(['reach', 'placement']));
    const north = await request(t.app).get(`/api/tools/skimmer-fit?siteId=${ids.north}`).set('cookie', coordinator).expect(200);
    const drum = north.body.items.find((i: { name: string }) => i.name === 'Drum skimmer, parts washer');
    expect(drum.notes.map((n: { topic: string }) => n.topic)).toEqual(
      expect.arrayContaining(['level', 'materials', 'emulsion', 'turbulence']),
    );
  });
});
