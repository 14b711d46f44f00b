import { randomUUID } from 'node:crypto';
import ExcelJS from 'exceljs';
import JSZip from 'jszip';
import request from 'supertest';
import { MAX_IMPORT_ROWS } from '../../server/kernel/spreadsheets/spreadsheet-rows.js';
import { MAX_WORKBOOK_UNPACKED_BYTES } from '../../server/kernel/spreadsheets/workbook-guard.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { importColumns } from '../../server/contracts/lab-import.js';
import { LabCertificatesService } from '../../server/features/lab/lab-certificates.service.js';
import { LabImportService } from '../../server/features/lab/lab-import.service.js';
import { demoIds } from '../fixtures/lab.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';
import { binary } from '../helpers/binary-body.js';

const header = importColumns.map((column) => column.key).join(',');
function csvRow(report: string, overrides: Partial<Record<string, string>> = {}): string {
  const values: Record<string, string> = {
    lab_name: 'Import Lab',
    lab_accreditation_number: 'IMP-1',
    report_number: report,
    received_on: '2026-04-03',
    discharge_point_code: 'OF-001',
    collected_at: '2026-04-02 09:30',
    collected_by: 'Importer',
    sample_type: 'grab',
    preservation_confirmed: 'yes',
    temperature_on_receipt: '4',
    chain_of_custody_number: 'C-1',
    parameter_code: 'oil-grease-hem',
    method: '1664B',
    qualifier: '',
    value: '14.2',
    unit: 'mg/L',
    mdl: '1.4',
    ml: '5.0',
    analysed_at: '2026-04-04 10:00',
    ...overrides,
  };
  return importColumns.map((column) => values[column.key]).join(',');
}

describe('lab results import', () => {
  let t: TestApp;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  let coordinator: string;
  const counts = async () => [await t.count('lab_certificate'), await t.count('lab_sample'), await t.count('lab_result')];
  const post = (file: Buffer, name: string, commit: boolean) =>
    request(t.app)
      .post('/api/lab-certificates/import')
      .set('cookie', coordinator)
      .field('siteId', ids.north)
      .field('commit', String(commit))
      .attach('file', file, name);

  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
    coordinator = await t.sessionFor('coordinator@decant.test');
  });
  afterAll(() => t.close());

  it('runs as an import run whose progress its owner can read, and stops at its time limit writing nothing', async () => {
    const runId = randomUUID();
    // Before the demo permit's time, so the demo's verdicts other tests read stay as they are.
    const early = { received_on: '2024-05-03', collected_at: '2024-05-02 09:30', analysed_at: '2024-05-04 10:00' };
    const csv = Buffer.from(
      [
        header,
        csvRow('RUN-1', early),
        csvRow('RUN-1', { ...early, collected_at: '2024-05-02 14:00', value: '12.0' }),
        csvRow('RUN-2', early),
      ].join('\n'),
    );
    await request(t.app)
      .post('/api/lab-certificates/import')
      .set('cookie', coordinator)
      .field('siteId', ids.north)
      .field('commit', 'true')
      .field('runId', runId)
      .attach('file', csv, 'run.csv')
      .expect(201);
    const run = await request(t.app).get(`/api/import-runs/${runId}`).set('cookie', coordinator).expect(200);
    expect(run.body).toMatchObject({ status: 'done', rowsDone: 3, rowsTotal: 3, fileName: 'run.csv', message: null });
    expect(run.body.finishedAt).not.toBeNull();
    // Someone else's run is not theirs to read; the same id cannot start a second run.
    await request(t.app)
      .get(`/api/import-runs/${runId}`)
      .set('cookie', await t.sessionFor('auditor@decant.test'))
      .expect(404);
    await request(t.app)
      .post('/api/lab-certificates/import')
      .set('cookie', coordinator)
      .field('siteId', ids.north)
      .field('runId', runId)
      .attach('file', csv, 'run.csv')
      .expect(409);

    // Past its time limit, the run stops, the transaction rolls back, and the run says why.
    const before = await counts();
    const [user] = await t.dataSource.query(`SELECT id, email, name, role FROM app_user WHERE email = 'coordinator@decant.test'`);
    const imports = new LabImportService(t.dataSource, new LabCertificatesService(t.dataSource));
    const late = randomUUID();
    const stopped = imports.import(
      { ...user, siteIds: [ids.north] },
      { siteId: ids.north, commit: 'true', runId: late },
      {
        buffer: Buffer.from([header, csvRow('LATE-1', early)].join('\n')),
        originalname: 'late.csv',
        mimetype: 'text/csv',
        size: 100,
      } as Express.Multer.File,
      1,
    );
    await expect(stopped).rejects.toMatchObject({ status: 422, code: 'import_timed_out' });
    expect(await counts()).toEqual(before);
    const failed = await request(t.app).get(`/api/import-runs/${late}`).set('cookie', coordinator).expect(200);
    expect(failed.body.status).toBe('failed');
    expect(failed.body.message).toMatch(/took longer than/);
  });

  it('dry-runs without writing, then commits every row of a clean file', async () => {
    const file = Buffer.from(
      [
        header,
        csvRow('IMP-A'),
        csvRow('IMP-A', { parameter_code: 'ph', method: 'SM 4500-H+ B', value: '7.2', unit: 'SU', mdl: '', ml: '' }),
        csvRow('IMP-B', { collected_at: '2026-04-09 09:30' }),
      ].join('\n'),
    );
    const before = await counts();
    const dry = await post(file, 'results.csv', false).expect(200);
    expect(dry.body).toMatchObject({ committed: false, rows: 3, certificates: 2, samples: 2, results: 3, errors: [] });
    expect(await counts()).toEqual(before);
    const done = await post(file, 'results.csv', true).expect(201);
    expect(done.body.committed).toBe(true);
    expect(await counts()).toEqual([before[0]! + 2, before[1]! + 2, before[2]! + 3]);
  });

  it('writes nothing when one row is bad, and names that row and column', async () => {
    const file = Buffer.from(
      [header, csvRow('IMP-C'), csvRow('IMP-C', { parameter_code: 'ph', value: 'seven', unit: 'SU' }), csvRow('IMP-D')].join('\n'),
    );
    const before = await counts();
    const dry = await post(file, 'results.csv', false).expect(200);
    expect(dry.body.errors).toEqual([{ row: 3, column: 'value', message: 'Not a number' }]);
    const refused = await post(file, 'results.csv', true).expect(400);
    expect(refused.body.report.errors[0]).toMatchObject({ row: 3, column: 'value' });
    expect(await counts()).toEqual(before);
  });

  it('reports an unknown point code and a report number already recorded', async () => {
    const file = Buffer.from([header, csvRow('IMP-A'), csvRow('IMP-E', { discharge_point_code: 'OF-999' })].join('\n'));
    const dry = await post(file, 'results.csv', false).expect(200);
    expect(dry.body.errors).toEqual([
      { row: 2, column: 'report_number', message: 'This lab already has a certificate with this report number' },
      { row: 3, column: 'discharge_point_code', message: 'No discharge point “OF-999” at the site (see the Codes sheet)' },
    ]);
  });

  it('says after a commit which certificates raised findings: one without an analysis time cannot have its holding time checked (Method 1664 Rev. B §8.5)', async () => {
    const stamp = Date.now();
    const file = Buffer.from([header, csvRow(`FND-A-${stamp}`), csvRow(`FND-B-${stamp}`, { analysed_at: '' })].join('\n'));
    const done = await post(file, 'results.csv', true).expect(201);
    expect(done.body.withFindings.map((c: { reportNumber: string }) => c.reportNumber)).toContain(`FND-B-${stamp}`);
    expect(done.body.withFindings.map((c: { reportNumber: string }) => c.reportNumber)).not.toContain(`FND-A-${stamp}`);
  });

  it('names every problem of a row at once: a bad date does not hide an unknown parameter code', async () => {
    const file = Buffer.from([header, csvRow('IMP-F', { received_on: '2026-13-40', parameter_code: 'oil-and-stuff' })].join('\n'));
    const dry = await post(file, 'results.csv', false).expect(200);
    expect(dry.body.errors.map((error: { column: string }) => error.column).sort()).toEqual(['parameter_code', 'received_on']);
  });

  for (const format of ['xlsx', 'csv'] as const) {
    it(`downloads the ${format} template, whose example row the check refuses, and imports it once the row is the site's own`, async () => {
      const template = await request(t.app)
        .get(`/api/lab-certificates/import/template?siteId=${ids.north}&format=${format}`)
        .set('cookie', coordinator)
        .buffer(true)
        .parse(binary as never)
        .expect(200);
      expect(template.headers['content-disposition']).toContain(`.${format}`);
      const before = await counts();
      const example = await post(template.body, `template.${format}`, true).expect(400);
      expect(JSON.stringify(example.body)).toContain("This is the template's example row: delete it before importing");
      expect(await counts()).toEqual(before);

      let own: Buffer;
      if (format === 'xlsx') {
        const workbook = new ExcelJS.Workbook();
        await workbook.xlsx.load(template.body);
        const results = workbook.worksheets[0]!;
        expect(String(results.getRow(1).getCell(6).value)).toContain('collected_at [YYYY-MM-DD HH:mm');
        // The Codes sheet lists the site's points and the parameters an import can name.
        const codes = workbook.getWorksheet('Codes')!;
        const column = (n: number) => codes.getColumn(n).values.map(String);
        expect(column(1)).toContain('OF-001');
        expect(column(4)).toEqual(expect.arrayContaining(['oil-grease-hem', 'ph']));
        results.getRow(2).getCell(3).value = `TPL-${Date.now()}`;
        own = Buffer.from(await workbook.xlsx.writeBuffer());
      } else {
        own = Buffer.from(String(template.body).replace('EXAMPLE-DELETE-THIS-ROW', `TPL-${Date.now()}`));
      }
      const done = await post(own, `template.${format}`, true).expect(201);
      expect(done.body).toMatchObject({ committed: true, rows: 1, results: 1 });
      expect(await counts()).toEqual([before[0]! + 1, before[1]! + 1, before[2]! + 1]);
    });
  }

  it('refuses a file that is neither XLSX nor CSV', async () => {
    const response = await post(Buffer.from('%PDF-1.4\n%%EOF'), 'results.pdf', false).expect(415);
    expect(response.body.error.fields).toHaveProperty('file');
  });

  it('refuses a header that does not match the template', async () => {
    const response = await post(Buffer.from('a,b,c\n1,2,3'), 'results.csv', false).expect(400);
    expect(response.body.error.fields.file).toMatch(/Missing columns/);
  });

  it('stops reading at 20,000 rows and refuses the file, writing nothing', async () => {
    const rows = Array.from({ length: MAX_IMPORT_ROWS + 1 }, (_, index) => csvRow(`CAP-${index}`));
    const before = await counts();
    const response = await post(Buffer.from([header, ...rows].join('\n')), 'results.csv', true).expect(400);
    expect(response.body.error.fields.file).toMatch(/More than 20,000 rows/);
    expect(await counts()).toEqual(before);
  });

  it('refuses a cell longer than 1,000 characters, naming its row', async () => {
    const file = Buffer.from([header, csvRow('LONG-1', { lab_name: 'x'.repeat(1001) })].join('\n'));
    const response = await post(file, 'results.csv', false).expect(400);
    expect(response.body.error.fields.file).toMatch(/Row 2, lab_name/);
  });

  it('checks in the dry run what the commit checks: a negative MDL and a 30-digit value are row errors, not a 500 later', async () => {
    const file = Buffer.from(
      [header, csvRow('DRY-1', { mdl: '-1' }), csvRow('DRY-2', { value: '123456789012345678901234567890' })].join('\n'),
    );
    const dry = await post(file, 'results.csv', false).expect(200);
    expect(dry.body.errors.map((error: { row: number; column: string }) => [error.row, error.column])).toEqual([
      [2, 'mdl'],
      [3, 'value'],
    ]);
    await post(file, 'results.csv', true).expect(400);
  });

  const templateWorkbook = async () => {
    const workbook = new ExcelJS.Workbook();
    const sheet = workbook.addWorksheet('Results');
    sheet.addRow(importColumns.map((column) => column.key));
    return JSZip.loadAsync(Buffer.from(await workbook.xlsx.writeBuffer()));
  };

  it('refuses a workbook whose XML declares a document type (entity expansion), writing nothing', async () => {
    const zip = await templateWorkbook();
    const sheet = await zip.file('xl/worksheets/sheet1.xml')!.async('string');
    zip.file('xl/worksheets/sheet1.xml', sheet.replace('?>', '?><!DOCTYPE worksheet [<!ENTITY lol "lol">]>'));
    const file = await zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' });
    const response = await post(file, 'results.xlsx', false).expect(400);
    expect(response.body.error.fields.file).toMatch(/declares a document type/);
  });

  it('refuses a workbook that unpacks to more than 200 MB before reading it', async () => {
    const zip = await templateWorkbook();
    zip.file('xl/media/padding.bin', Buffer.alloc(MAX_WORKBOOK_UNPACKED_BYTES + 1));
    const file = await zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE', compressionOptions: { level: 9 } });
    expect(file.length).toBeLessThan(2 * 1024 * 1024);
    const response = await post(file, 'results.xlsx', false).expect(400);
    expect(response.body.error.fields.file).toMatch(/more than 200 MB/);
  });
});
