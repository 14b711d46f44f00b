import { resolve } from 'node:path';
import type { DataSource } from 'typeorm';
import { createDataSource } from '../../server/db/data-source.js';
import { prepareDatabase } from '../../server/db/prepare.js';
import { findPeriod } from '../../server/features/periods/periods.repository.js';
import { periodPackPdf } from '../../reports/period-pack-pdf.js';
import { periodPackXlsx } from '../../reports/period-pack-xlsx.js';
import { loadPackInput } from '../../server/features/reports/period-pack.repository.js';
import { summarise } from '../../server/features/periods/summarise.js';
import { localDatabase } from '../../server/scripts/local-database.js';

// `npm run bench`: a site with 10 discharge points × 6 parameters sampled daily for 5 years;
// one year's summary against a plain SQL aggregate over the same rows (the floor), then the
// same with ten times the history. A measurement, not a test.
const POINTS = 10;
const PARAMETERS = 6;
const projectDir = resolve(import.meta.dirname, '../..');
const database = await localDatabase(projectDir, 'decant_bench_periods');
await prepareDatabase(database.url, { seed: false, reset: true });
const ds = await createDataSource(database.url).initialize();

async function setUp(db: DataSource): Promise<{ periodId: string; siteId: string }> {
  const [company] = await db.query(`INSERT INTO company (name) VALUES ('Bench Co') RETURNING id`);
  const [site] = await db.query(
    `INSERT INTO site (company_id, name, time_zone) VALUES ($1, 'Bench site', 'America/Chicago') RETURNING id`,
    [company.id],
  );
  const [user] = await db.query(
    `INSERT INTO app_user (email, name, role) VALUES ('bench@decant.test', 'Bench', 'coordinator') RETURNING id`,
  );
  const [permit] = await db.query(
    `INSERT INTO permit (site_id, kind, number, issuing_authority, effective_from, reporting_frequency, report_due_days)
     VALUES ($1, 'pretreatment', 'BENCH-1', 'Bench authority', '2000-01-01', 'semiannual', 30) RETURNING id`,
    [site.id],
  );
  await db.query(
    `INSERT INTO permit_settings (permit_id, applies_from, non_detect_policy, mass_loading_factor, snc_window) VALUES ($1, '2000-01-01', 'zero', 8.34, 'calendar-halves')`,
    [permit.id],
  );
  await db.query(
    `INSERT INTO parameter (site_id, code, name, default_unit, snc_review_factor)
    SELECT $1, 'bench-' || g, 'Bench parameter ' || g, 'mg/L', 1.2 FROM generate_series(1, ${PARAMETERS}) g`,
    [site.id],
  );
  await db.query(
    `INSERT INTO discharge_point (site_id, code, name, receiving) SELECT $1, 'BP-' || g, 'Bench point ' || g, 'sewer' FROM generate_series(1, ${POINTS}) g`,
    [site.id],
  );
  await db.query(
    `INSERT INTO permit_limit (permit_id, discharge_point_id, parameter_id, statistic, value, unit, frequency_count, frequency_per, sample_type)
     SELECT $1, d.id, p.id, s.statistic, 100, 'mg/L', 1, 'day', 'grab'
       FROM discharge_point d, parameter p, (VALUES ('daily-maximum'), ('monthly-average')) s(statistic) WHERE d.site_id = $2 AND p.site_id = $2`,
    [permit.id, site.id],
  );
  const [certificate] = await db.query(
    `INSERT INTO lab_certificate (site_id, lab_name, lab_accreditation_number, report_number, received_on, created_by) VALUES ($1, 'Bench', 'B', 'B-1', '2026-01-01', $2) RETURNING id`,
    [site.id, user.id],
  );
  const [period] = await db.query(
    `INSERT INTO reporting_period (permit_id, starts_on, ends_on, due_on) VALUES ($1, '2025-01-01', '2025-12-31', '2026-01-30') RETURNING id`,
    [permit.id],
  );
  return { periodId: period.id, siteId: site.id, certificateId: certificate.id } as never;
}

/** Daily samples at every point, each with a result for every parameter, over `years` ending 2025-12-31. */
async function addHistory(db: DataSource, siteId: string, certificateId: string, fromYear: number, toYear: number): Promise<void> {
  // Fixture rows, written as the app writes (decant.via_app): the database's watch on changes made
  // outside Decant would otherwise write a trail entry, hashed into the chain, for every row.
  await db.transaction(async (manager) => {
    await manager.query(`SET LOCAL decant.via_app = 'on'`);
    await manager.query(
      `WITH s AS (
       INSERT INTO lab_sample (certificate_id, discharge_point_id, collected_at, collected_on, collected_by, sample_type, preservation_confirmed)
       SELECT $2, d.id, day + time '09:00', day, 'bench', 'grab', true
         FROM discharge_point d, generate_series(make_date($3, 1, 1), make_date($4, 12, 31), interval '1 day') day
        WHERE d.site_id = $1
       RETURNING id)
     INSERT INTO lab_result (sample_id, parameter_id, method, value_reported, value, unit)
     SELECT s.id, p.id, '1664B', '42', 20 + random() * 60, 'mg/L' FROM s, parameter p WHERE p.site_id = $1`,
      [siteId, certificateId, fromYear, toYear],
    );
  });
  await db.query('ANALYZE lab_sample; ANALYZE lab_result');
}

/**
 * Median times of several measured calls, taken in turns (a, b, c, a, b, c, …) so that a busy
 * moment of the machine falls on all of them alike.
 */
async function timeInTurns(calls: Array<() => Promise<unknown>>, runs = 15): Promise<number[]> {
  for (const call of calls) await call();
  const times = calls.map(() => [] as number[]);
  for (let run = 0; run < runs; run++) {
    for (const [index, call] of calls.entries()) {
      const started = performance.now();
      await call();
      times[index]!.push(performance.now() - started);
    }
  }
  return times.map((list) => list.sort((a, b) => a - b)[Math.floor(runs / 2)]!);
}

const { periodId, siteId, certificateId } = (await setUp(ds)) as unknown as { periodId: string; siteId: string; certificateId: string };
const period = (await findPeriod(ds, periodId))!;
const floorSql = `SELECT s.discharge_point_id, r.parameter_id, date_trunc('month', s.collected_on) AS month, max(r.value), avg(r.value), count(*)
  FROM lab_sample s JOIN lab_result r ON r.sample_id = s.id JOIN discharge_point d ON d.id = s.discharge_point_id
 WHERE d.site_id = $1 AND s.collected_on BETWEEN '2025-01-01' AND '2025-12-31' GROUP BY 1, 2, 3`;

// The same rows aggregated to daily discharges (40 CFR 122.2), the figures the summary is built from.
const dailyFloorSql = `SELECT s.discharge_point_id, r.parameter_id, s.collected_on, avg(r.value), count(*)
  FROM lab_sample s JOIN lab_result r ON r.sample_id = s.id JOIN discharge_point d ON d.id = s.discharge_point_id
 WHERE d.site_id = $1 AND s.collected_on BETWEEN '2025-01-01' AND '2025-12-31' GROUP BY 1, 2, 3`;

const rows: Array<Record<string, string>> = [];
const verdicts: string[] = [];
for (const [label, from] of [
  ['5 years of history', 2021],
  ['50 years of history', 1976],
] as const) {
  await addHistory(ds, siteId, certificateId, from, from === 2021 ? 2025 : 2020);
  const [{ n }] = await ds.query('SELECT count(*)::int AS n FROM lab_result');
  const [summaryMs = NaN, floorMs = NaN, dailyFloorMs = NaN] = await timeInTurns([
    () => summarise(ds, period),
    () => ds.query(floorSql, [siteId]),
    () => ds.query(dailyFloorSql, [siteId]),
  ]);
  rows.push({
    history: label,
    'results in database': n.toLocaleString(),
    'summary (ms)': summaryMs.toFixed(1),
    'monthly aggregate (ms)': floorMs.toFixed(1),
    'ratio to monthly': (summaryMs / floorMs).toFixed(2),
    'daily aggregate (ms)': dailyFloorMs.toFixed(1),
    'ratio to daily': (summaryMs / dailyFloorMs).toFixed(2),
  });
  const met = (ok: boolean) => (ok ? 'met' : 'NOT met');
  verdicts.push(
    `${label}: under 300 ms ${met(summaryMs < 300)}; within 2× the daily aggregate ${met(summaryMs <= 2 * dailyFloorMs)}; within 2× the monthly aggregate ${met(summaryMs <= 2 * floorMs)}`,
  );
}
console.log(
  `\nPeriod summary: one year, ${POINTS} points × ${PARAMETERS} parameters sampled daily (${POINTS * PARAMETERS * 365} results in the period)`,
);
console.table(rows);
// The summary reports every daily discharge (40 CFR 122.2), so the aggregate that yields the same
// figures is the daily one; the monthly aggregate returns far fewer rows and is shown for scale.
console.log(`Target: the summary within 2× the floor and under 300 ms.\n${verdicts.join('\n')}`);
// The period pack of that site-year, every result of the year in its tables. Targets: the PDF
// under 2 s, the workbook under 1 s.
const packInput = await loadPackInput(ds, period, await summarise(ds, period), new Date());
const [pdfMs = NaN, xlsxMs = NaN] = await timeInTurns([() => periodPackPdf(packInput), () => periodPackXlsx(packInput)], 1);
console.log(
  `\nPeriod pack: ${packInput.samples.length.toLocaleString()} results, ${packInput.flows.length.toLocaleString()} flow readings\n` +
    `PDF ${(pdfMs / 1000).toFixed(2)} s (target under 2 s: ${pdfMs < 2000 ? 'met' : 'NOT met'}); ` +
    `XLSX ${(xlsxMs / 1000).toFixed(2)} s (target under 1 s: ${xlsxMs < 1000 ? 'met' : 'NOT met'})`,
);
await ds.destroy();
if (database.cluster?.startedHere) database.cluster.stop();
