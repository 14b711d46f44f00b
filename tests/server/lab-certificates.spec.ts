import { createHash } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { certificateBody, demoIds, tinyPdf, tinyPng } from '../fixtures/lab.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

describe('lab certificates', () => {
  let t: TestApp;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  let coordinator: string;
  const counts = async () => ({
    certificates: await t.count('lab_certificate'),
    samples: await t.count('lab_sample'),
    results: await t.count('lab_result'),
    files: await t.count('stored_file'),
  });

  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
    coordinator = await t.sessionFor('coordinator@decant.test');
  });
  afterAll(() => t.close());

  it('saves a certificate with a PDF, and the PDF comes back byte-identical with its SHA-256', async () => {
    const body = certificateBody(ids);
    const created = await request(t.app)
      .post('/api/lab-certificates')
      .set('cookie', coordinator)
      .field('certificate', JSON.stringify(body))
      .attach('file', tinyPdf, { filename: 'coa march.pdf', contentType: 'application/pdf' })
      .expect(201);
    const sha256 = createHash('sha256').update(tinyPdf).digest('hex');
    expect(created.body.file).toMatchObject({ sha256, sizeBytes: tinyPdf.length, fileName: 'coa march.pdf' });
    expect(created.body.samples[0].results[0]).toMatchObject({ valueReported: '22.4', valueShown: '22.4', flags: [] });

    const auditor = await t.sessionFor('auditor@decant.test');
    const download = await request(t.app)
      .get(`/api/lab-certificates/${created.body.id}/file?download=1`)
      .set('cookie', auditor)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(Buffer.compare(download.body, tinyPdf)).toBe(0);
    expect(download.headers['content-disposition']).toMatch(/^attachment; filename="coa march.pdf"/);
    expect(download.headers['content-type']).toBe('application/pdf');
    const inline = await request(t.app).get(`/api/lab-certificates/${created.body.id}/file`).set('cookie', auditor).expect(200);
    expect(inline.headers['content-disposition']).toMatch(/^inline/);
  });

  it("treats a report number typed with other case, full-width digits or a hidden character as the same (409), and another site's as none of its business", async () => {
    const first = certificateBody(ids);
    await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(first).expect(201);
    const twin = {
      ...certificateBody(ids),
      labName: ` ${first.labName.toUpperCase()}`,
      reportNumber: `\u200B${first.reportNumber.toLowerCase()}`,
    };
    const refused = await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(twin).expect(409);
    expect(refused.body.error.fields).toHaveProperty('reportNumber');
    const elsewhere = certificateBody(ids, { siteId: ids.east, reportNumber: first.reportNumber });
    (elsewhere.samples[0] as { dischargePointId: string }).dischargePointId = ids.eastOutfall;
    await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(elsewhere).expect(201);
  });

  it('records the creation and a later edit in the trail, with before and after', async () => {
    const created = await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(certificateBody(ids)).expect(201);
    const { siteId, samples, id, reportNumber, ...rest } = created.body;
    void rest;
    const edited = certificateBody(ids, { reportNumber });
    (edited.samples[0]!.results[0] as { value: string }).value = '31.0';
    const { siteId: _omit, ...update } = edited;
    void _omit;
    await request(t.app).put(`/api/lab-certificates/${id}`).set('cookie', coordinator).send(update).expect(200);
    const trail = await t.dataSource.query(`SELECT action, before, after FROM trail_entry WHERE entity_id = $1 ORDER BY id`, [id]);
    expect(trail.map((entry: { action: string }) => entry.action)).toEqual(['create', 'update']);
    expect(trail[1].before.samples[0].results[0].valueReported).toBe('22.4');
    expect(trail[1].after.samples[0].results[0].valueReported).toBe('31.0');
    expect(siteId).toBe(ids.north);
    expect(samples).toHaveLength(1);
  });

  it('flags a result analysed 30 days after collection (Method 1664 Rev. B §8.5)', async () => {
    const body = certificateBody(ids);
    body.samples[0]!.results[0]!.analysedAt = '2026-04-01T09:30';
    const created = await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(body).expect(201);
    const codes = created.body.samples[0].results[0].flags.map((flag: { code: string }) => flag.code);
    expect(codes).toContain('holding-time');
    expect(created.body.flags.map((flag: { code: string }) => flag.code)).toContain('holding-time');
    const listed = await request(t.app)
      .get(`/api/lab-certificates/results?flag=holding-time&siteId=${ids.north}`)
      .set('cookie', coordinator)
      .expect(200);
    expect(listed.body.items.some((row: { certificateId: string }) => row.certificateId === created.body.id)).toBe(true);
  });

  it('shows a detected oil and grease result below the ML as "<5.0" (EPA Method 1664 §12.3.1)', async () => {
    const body = certificateBody(ids);
    body.samples[0]!.results[0]!.value = '3.2';
    const created = await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(body).expect(201);
    const result = created.body.samples[0].results[0];
    expect(result).toMatchObject({ valueReported: '3.2', valueShown: '<5.0' });
    expect(result.flags.map((f: { code: string }) => f.code)).toContain('below-ml-as-number');
  });

  it('asks why a certificate entered more than 24 hours ago is corrected, and keeps the reason in the trail', async () => {
    const body = certificateBody(ids);
    const created = await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(body).expect(201);
    await t.dataSource.query(`UPDATE lab_certificate SET created_at = now() - interval '25 hours' WHERE id = $1`, [created.body.id]);
    const { siteId: _siteId, ...correction } = body;
    const refused = await request(t.app)
      .put(`/api/lab-certificates/${created.body.id}`)
      .set('cookie', coordinator)
      .send(correction)
      .expect(400);
    expect(refused.body.error.fields).toHaveProperty('reason');
    await request(t.app)
      .put(`/api/lab-certificates/${created.body.id}`)
      .set('cookie', coordinator)
      .send({ ...correction, reason: 'Lab reissued the report' })
      .expect(200);
    const [entry] = await t.dataSource.query(
      `SELECT after FROM trail_entry WHERE entity = 'lab-certificate' AND entity_id = $1 ORDER BY chain_seq DESC LIMIT 1`,
      [created.body.id],
    );
    expect(entry.after.reason).toBe('Lab reissued the report');
  });

  it('flags a result over the daily maximum at once, and re-flags when the limit changes', async () => {
    const body = certificateBody(ids);
    body.samples[0]!.results[0]!.value = '90';
    const created = await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(body).expect(201);
    expect(created.body.samples[0].results[0].flags).toEqual([]);
    const limits = await request(t.app).get(`/api/permits/${ids.northPermit}/limits`).set('cookie', coordinator).expect(200);
    const dailyMax = limits.body.items.find(
      (l: { statistic: string; parameterId: string }) => l.statistic === 'daily-maximum' && l.parameterId === ids.hem,
    );
    // A new version from the sample's day judges it; the flag follows the version in force that day.
    const version = await request(t.app)
      .patch(`/api/permits/${ids.northPermit}/limits/${dailyMax.id}`)
      .set('cookie', coordinator)
      .send({ value: 80, appliesFrom: '2026-03-02' })
      .expect(200);
    const after = await request(t.app).get(`/api/lab-certificates/${created.body.id}`).set('cookie', coordinator).expect(200);
    expect(after.body.samples[0].results[0].flags.map((f: { code: string }) => f.code)).toContain('over-limit');
    // Corrected from its own first day, the version changes in place.
    const corrected = await request(t.app)
      .patch(`/api/permits/${ids.northPermit}/limits/${version.body.id}`)
      .set('cookie', coordinator)
      .send({ value: 100, appliesFrom: '2026-03-02' })
      .expect(200);
    expect(corrected.body.id).toBe(version.body.id);
    const back = await request(t.app).get(`/api/lab-certificates/${created.body.id}`).set('cookie', coordinator).expect(200);
    expect(back.body.samples[0].results[0].flags.map((f: { code: string }) => f.code)).not.toContain('over-limit');
  });

  describe('refused uploads store nothing', () => {
    const cases: Array<[string, Buffer, string, number]> = [
      ['a PNG renamed .pdf', tinyPng, 'scan.pdf', 415],
      ['an empty file', Buffer.alloc(0), 'empty.pdf', 400],
      ['a path-traversal name', tinyPdf, '../../etc/passwd.pdf', 400],
      ['a name with a control character', tinyPdf, 'bad\u0001name.pdf', 400],
    ];
    for (const [what, content, filename, status] of cases) {
      it(`refuses ${what}`, async () => {
        const before = await counts();
        const response = await request(t.app)
          .post('/api/lab-certificates')
          .set('cookie', coordinator)
          .field('certificate', JSON.stringify(certificateBody(ids)))
          .attach('file', content, { filename, filepath: filename, contentType: 'application/pdf' } as {
            filename: string;
            contentType: string;
          })
          .expect(status);
        expect(response.body.error.fields).toHaveProperty('file');
        // In words a person understands, never a media type.
        expect(response.body.error.fields.file).not.toMatch(/application\//);
        if (status === 415) expect(response.body.error.fields.file).toBe('This file is not a PDF: choose a PDF');
        expect(await counts()).toEqual(before);
      });
    }

    it('refuses a file over 20 MB', async () => {
      const before = await counts();
      const big = Buffer.concat([tinyPdf, Buffer.alloc(20 * 1024 * 1024)]);
      const response = await request(t.app)
        .post('/api/lab-certificates')
        .set('cookie', coordinator)
        .field('certificate', JSON.stringify(certificateBody(ids)))
        .attach('file', big, { filename: 'big.pdf', contentType: 'application/pdf' })
        .expect(413);
      expect(response.body.error.fields).toHaveProperty('file');
      expect(await counts()).toEqual(before);
    });
  });

  describe('permissions', () => {
    for (const email of ['operator@decant.test', 'auditor@decant.test']) {
      it(`lets ${email} read but not create or change`, async () => {
        const cookie = await t.sessionFor(email);
        await request(t.app).get('/api/lab-certificates').set('cookie', cookie).expect(200);
        await request(t.app).post('/api/lab-certificates').set('cookie', cookie).send(certificateBody(ids)).expect(403);
        const [some] = await t.dataSource.query('SELECT id FROM lab_certificate LIMIT 1');
        await request(t.app).put(`/api/lab-certificates/${some.id}`).set('cookie', cookie).send({}).expect(403);
        await request(t.app).post(`/api/permits`).set('cookie', cookie).send({}).expect(403);
      });
    }

    it("keeps coordinator.east away from the other site's certificates", async () => {
      const east = await t.sessionFor('coordinator.east@decant.test');
      const [northCertificate] = await t.dataSource.query('SELECT id FROM lab_certificate WHERE site_id = $1 LIMIT 1', [ids.north]);
      await request(t.app).get(`/api/lab-certificates/${northCertificate.id}`).set('cookie', east).expect(404);
      await request(t.app).get(`/api/lab-certificates/${northCertificate.id}/file`).set('cookie', east).expect(404);
      await request(t.app).get(`/api/lab-certificates?siteId=${ids.north}`).set('cookie', east).expect(403);
      const list = await request(t.app).get('/api/lab-certificates?pageSize=200').set('cookie', east).expect(200);
      expect(list.body.items.every((c: { siteId: string }) => c.siteId === ids.east)).toBe(true);
      const before = await t.count('lab_certificate');
      await request(t.app).post('/api/lab-certificates').set('cookie', east).send(certificateBody(ids)).expect(403);
      expect(await t.count('lab_certificate')).toBe(before);
    });
  });
});
