import { createHash } from 'node:crypto';
import ExcelJS from 'exceljs';
import JSZip from 'jszip';
import { PDFParse } from 'pdf-parse';
import { binary } from '../helpers/binary-body.js';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { certificationStatements } from '../../server/domain/period/certification.js';
import { demoIds } from '../fixtures/lab.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

async function textOf(pdf: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    return (await parser.getText()).text.replace(/\s+/g, ' ');
  } finally {
    await parser.destroy();
  }
}

describe('the period pack (PDF)', () => {
  let t: TestApp;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  let coordinator: string;
  let periodId: string;

  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
    coordinator = await t.sessionFor('coordinator@decant.test');
    const point = await request(t.app)
      .post(`/api/sites/${ids.north}/discharge-points`)
      .set('cookie', coordinator)
      .send({ code: 'OF-PK', name: 'Pack outfall', receiving: 'sewer' })
      .expect(201);
    const permit = await request(t.app)
      .post('/api/permits')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        kind: 'pretreatment',
        number: 'PK-0001',
        issuingAuthority: 'Basin Water Authority',
        effectiveFrom: '2026-03-01',
        reportingFrequency: 'monthly',
        reportDueDays: 28,
        nonDetectPolicy: 'zero',
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
          frequencyPer: 'month',
          sampleType: 'grab',
        })
        .expect(201);
    }
    const sample = (collectedAt: string, value: string) => ({
      dischargePointId: point.body.id,
      collectedAt,
      collectedBy: 'PK',
      sampleType: 'grab',
      preservationConfirmed: true,
      temperatureOnReceiptC: 4,
      results: [
        { parameterId: ids.hem, method: '1664B', qualifier: null, value, mdl: 1.4, ml: 5, unit: 'mg/L', analysedAt: '2026-03-20T10:00' },
      ],
    });
    await request(t.app)
      .post('/api/lab-certificates')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        labName: 'Pack Lab',
        labAccreditationNumber: 'PK',
        reportNumber: 'PK-REPORT-1',
        receivedOn: '2026-03-19',
        samples: [sample('2026-03-10T09:00', '24'), sample('2026-03-17T09:00', '3.2')],
      })
      .expect(201);
    const periods = await request(t.app).get(`/api/periods?permitId=${permit.body.id}`).set('cookie', coordinator).expect(200);
    periodId = periods.body.items.find((p: { startsOn: string }) => p.startsOn === '2026-03-01').id;
  });
  afterAll(() => t.close());

  const download = (path: string, cookie = coordinator) =>
    request(t.app)
      .get(path)
      .set('cookie', cookie)
      .buffer(true)
      .parse(binary as never);

  it('prints a draft marked as such on every page, with its facility block and every limit row', async () => {
    const draft = await download(`/api/periods/${periodId}/pack.pdf`).expect(200).expect('content-type', 'application/pdf');
    expect(draft.header['content-disposition']).toMatch(/decant-PK-0001-2026-03-01-2026-03-31-draft\.pdf/);
    const text = await textOf(draft.body);
    expect(text).toContain('Harlow Vale Precision Parts');
    expect(text).toContain('Tamsin Creek Works');
    expect(text).toContain('PK-0001');
    expect(text).toContain('Basin Water Authority');
    expect(text).toContain('OF-PK — Pack outfall');
    expect(text).toContain('DRAFT');
    expect(text).toContain('Not signed');
    // Daily maximum 24.0 over 20; monthly average of 24.0 and <ML (zero) = 12.0 over 10.
    expect(text).toMatch(/Daily maximum 20 mg\/L 24\.0 mg\/L 2 \/ 1 Over the limit/);
    expect(text).toMatch(/Monthly average 10 mg\/L 12\.0 mg\/L 2 \/ 1 Over the limit/);
    // EPA Method 1664 §12.3.1: the 3.2 mg/L result is reported as <5.0.
    expect(text).toContain('<5.0 mg/L');
    expect(text).toContain('PK-REPORT-1');
  });

  it('writes the workbook with numbers as numbers, days as dates, and record text that can never run as a formula', async () => {
    await request(t.app)
      .post('/api/shipments')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        shippedOn: '2026-03-12',
        documentKind: 'used-oil-bill-of-lading',
        documentNumber: 'BOL-PK-1',
        transporterName: 'Test Hauler',
        transporterEpaId: 'ILR000000001',
        receiverName: 'Test Recycler',
        receiverEpaId: 'ILD000000002',
        wasteDescription: '=HYPERLINK("http://example.invalid","click")',
        quantity: 100,
        quantityUnit: 'gal',
      })
      .expect(201);
    const response = await download(`/api/periods/${periodId}/pack.xlsx`).expect(200);
    expect(response.header['content-type']).toContain('spreadsheetml');
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(response.body);
    expect(workbook.worksheets.map((ws) => ws.name)).toEqual([
      'Summary',
      'Daily values',
      'Results',
      'Certificates',
      'Flows',
      'Shipments',
      'Follow-ups',
    ]);
    const { body: summary } = await request(t.app).get(`/api/periods/${periodId}/summary`).set('cookie', coordinator).expect(200);
    const rows = workbook.getWorksheet('Summary')!.getSheetValues().slice(2) as unknown[][];
    expect(rows.map((row) => [row[1], row[3], row[6], row[8], row[12]])).toEqual(
      summary.rows.map((row: { pointCode: string; statistic: string; limitValue: number; computedValue: number; exceeded: boolean }) => [
        row.pointCode,
        row.statistic,
        row.limitValue,
        row.computedValue,
        row.exceeded ? 'Over the limit' : 'Within the limit',
      ]),
    );
    expect(typeof rows[0]![6]).toBe('number');
    expect(rows[0]![4]).toBeInstanceOf(Date);
    expect(workbook.getWorksheet('Summary')!.views[0]).toMatchObject({ state: 'frozen', ySplit: 1 });
    // A shipment's text starting with "=" arrives as text, never as a formula.
    const shipments = workbook.getWorksheet('Shipments')!;
    const cell = shipments.getRow(2).getCell(4);
    expect(cell.type).toBe(ExcelJS.ValueType.String);
    expect(cell.value).toBe('\'=HYPERLINK("http://example.invalid","click")');
    workbook.eachSheet((ws) => ws.eachRow((row) => row.eachCell((c) => expect(c.type).not.toBe(ExcelJS.ValueType.Formula))));
  });

  it('keeps the signed pack: the same bytes on every download and after the live records move', async () => {
    const { body: compiled } = await request(t.app).post(`/api/periods/${periodId}/compile`).set('cookie', coordinator).expect(200);
    const signed = await request(t.app)
      .post(`/api/periods/${periodId}/sign`)
      .set('cookie', coordinator)
      .send({
        compiledAt: compiled.compiledAt,
        statementAccepted: true,
        acknowledged: true,
        signerName: 'Priya Raman',
        signerTitle: 'EHS coordinator',
      })
      .expect(200);
    const first = await download(`/api/periods/${periodId}/pack.pdf`).expect(200);
    expect(createHash('sha256').update(first.body).digest('hex')).toBe(signed.body.signature.packSha256);
    const firstWorkbook = await download(`/api/periods/${periodId}/pack.xlsx`).expect(200);
    expect(createHash('sha256').update(firstWorkbook.body).digest('hex')).toBe(signed.body.signature.packXlsxSha256);
    const text = await textOf(first.body);
    expect(text).not.toContain('DRAFT');
    expect(text).toContain('Signed by Priya Raman');
    expect(text).toContain(certificationStatements.pretreatment.text.slice(0, 120));
    expect(text).toContain('40 CFR 403.6(a)(2)(ii), as 40 CFR 403.12(l) requires');
    expect(text).toContain(signed.body.signature.sha256);

    // Unrelated live changes: a follow-up of the period closed, oil logged at the site.
    const [followUp] = await t.dataSource.query(
      `SELECT id FROM follow_up WHERE site_id = $1 AND status = 'open' AND title LIKE '%OF-PK%' LIMIT 1`,
      [ids.north],
    );
    if (followUp) {
      await request(t.app).post(`/api/follow-ups/${followUp.id}/close`).set('cookie', coordinator).send({ note: 'Called the authority' });
    }
    const again = await download(`/api/periods/${periodId}/pack.pdf`).expect(200);
    expect(Buffer.compare(again.body, first.body)).toBe(0);
    const revision = await download(`/api/periods/${periodId}/revisions/1/pack.pdf`).expect(200);
    expect(Buffer.compare(revision.body, first.body)).toBe(0);
    // The workbook lists the period's follow-ups; the one closed above must still read as signed.
    const workbookAgain = await download(`/api/periods/${periodId}/pack.xlsx`).expect(200);
    expect(Buffer.compare(workbookAgain.body, firstWorkbook.body)).toBe(0);
    const workbookRevision = await download(`/api/periods/${periodId}/revisions/1/pack.xlsx`).expect(200);
    expect(Buffer.compare(workbookRevision.body, firstWorkbook.body)).toBe(0);
  });

  it('bundles the period’s evidence in one ZIP whose manifest holds the SHA-256 of every file in it', async () => {
    const [demo] = await t.dataSource.query(
      `SELECT rp.id FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id WHERE p.number = 'TCU-IU-0417' AND rp.starts_on = '2026-01-01'`,
    );
    const response = await download(`/api/periods/${demo.id}/evidence.zip`).expect(200).expect('content-type', 'application/zip');
    const zip = await JSZip.loadAsync(response.body);
    const manifest = (await zip.file('manifest.csv')!.async('string'))
      .trim()
      .split('\r\n')
      .slice(1)
      .map((line) => line.split(',').map((field) => field.replace(/^"|"$/g, '')));
    const names = Object.keys(zip.files).filter((name) => !zip.files[name]!.dir && name !== 'manifest.csv');
    expect(manifest.map(([name]) => name).sort()).toEqual(names.sort());
    for (const [name, sha256, bytes] of manifest) {
      const content = await zip.file(name!)!.async('nodebuffer');
      expect(createHash('sha256').update(content).digest('hex'), name).toBe(sha256);
      expect(content.length).toBe(Number(bytes));
    }
    expect(names).toContain('period-pack.pdf');
    expect(names).toContain('period-pack.xlsx');
    expect(names).toContain('trail.csv');
    expect(names.filter((name) => name.startsWith('certificates/')).length).toBeGreaterThan(0);
  });

  it('answers 404 to someone who cannot see the period and 403 to a role without periods', async () => {
    await download(`/api/periods/${periodId}/pack.pdf`, await t.sessionFor('coordinator.east@decant.test')).expect(404);
    await download(`/api/periods/${periodId}/pack.pdf`, await t.sessionFor('operator@decant.test')).expect(403);
    await download(`/api/periods/${periodId}/evidence.zip`, await t.sessionFor('coordinator.east@decant.test')).expect(404);
    await download(`/api/periods/${periodId}/pack.xlsx`, await t.sessionFor('operator@decant.test')).expect(403);
  });
});
