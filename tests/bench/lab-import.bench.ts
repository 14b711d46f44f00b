import ExcelJS from 'exceljs';
import { resolve } from 'node:path';
import request from 'supertest';
import { importColumns } from '../../server/contracts/lab-import.js';
import { prepareDatabase } from '../../server/db/prepare.js';
import { localDatabase } from '../../server/scripts/local-database.js';

// `npm run bench`: imports 10,000 lab result rows (CSV and XLSX) against a scratch database and
// prints time and memory. A measurement, not a test: nothing here passes or fails on speed.
const ROWS = 10_000;
const projectDir = resolve(import.meta.dirname, '../..');
const database = await localDatabase(projectDir, 'decant_bench');
process.env.DATABASE_URL = database.url;
await prepareDatabase(database.url, { seed: 'when-empty', reset: true });
// Imported only now: the test helpers read DATABASE_URL when they load.
const { startTestApp } = await import('../helpers/test-app.js');
const t = await startTestApp();
const [north] = await t.dataSource.query(`SELECT id FROM site WHERE name = 'Tamsin Creek Works'`);
const cookie = await t.sessionFor('coordinator@decant.test');

function row(index: number, prefix: string): string[] {
  // Four rows a certificate: two samples (08:30 and 10:30), each with an HEM and a pH result.
  const certificate = Math.floor(index / 4);
  const report = `${prefix}-${certificate}`;
  const day = String(1 + (certificate % 28)).padStart(2, '0');
  const hour = index % 4 < 2 ? '08' : '10';
  const values: Record<string, string> = {
    lab_name: 'Bench Lab',
    lab_accreditation_number: 'B-1',
    report_number: report,
    received_on: `2026-02-${day}`,
    discharge_point_code: 'OF-001',
    collected_at: `2026-01-${day} 09:30`,
    collected_by: 'Bench',
    sample_type: 'grab',
    preservation_confirmed: 'yes',
    temperature_on_receipt: '4',
    chain_of_custody_number: '',
    parameter_code: index % 2 ? 'ph' : 'oil-grease-hem',
    method: index % 2 ? 'SM 4500-H+ B' : '1664B',
    qualifier: '',
    value: index % 2 ? '7.1' : String(10 + (index % 40)),
    unit: index % 2 ? 'SU' : 'mg/L',
    mdl: '',
    ml: '',
    analysed_at: `2026-01-${day} 15:00`,
  };
  values.collected_at = `2026-01-${day} ${hour}:30`;
  return importColumns.map((column) => values[column.key]!);
}

async function measure(label: string, file: Buffer, name: string): Promise<void> {
  for (const commit of [false, true]) {
    const before = process.memoryUsage().rss;
    let peak = before;
    const timer = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 20);
    const started = performance.now();
    const response = await request(t.app)
      .post('/api/lab-certificates/import')
      .set('cookie', cookie)
      .field('siteId', north.id)
      .field('commit', String(commit))
      .attach('file', file, name);
    const seconds = (performance.now() - started) / 1000;
    clearInterval(timer);
    const firstError = (response.body.errors ?? response.body.report?.errors ?? [])[0];
    if (firstError) console.log('first error:', JSON.stringify(firstError));
    console.log(
      `${label} ${commit ? 'commit ' : 'dry run'}: ${response.status}, ${response.body.rows ?? response.body.report?.rows} rows, ` +
        `${response.body.errors?.length ?? response.body.report?.errors.length} errors, ${seconds.toFixed(2)} s, ` +
        `${Math.round(ROWS / seconds)} rows/s, RSS +${Math.round((peak - before) / 1e6)} MB (file ${Math.round(file.length / 1e3)} kB)`,
    );
  }
}

const csv = Buffer.from(
  [importColumns.map((c) => c.key).join(','), ...Array.from({ length: ROWS }, (_, i) => row(i, 'CSV').join(','))].join('\n'),
);
await measure('CSV ', csv, 'bench.csv');

const workbook = new ExcelJS.Workbook();
const sheet = workbook.addWorksheet('Results');
sheet.addRow(importColumns.map((c) => c.key));
for (let i = 0; i < ROWS; i++) sheet.addRow(row(i, 'XLSX'));
await measure('XLSX', Buffer.from(await workbook.xlsx.writeBuffer()), 'bench.xlsx');

await t.close();
if (database.cluster?.startedHere) database.cluster.stop();
