import { resolve } from 'node:path';
import { createDataSource } from '../../server/db/data-source.js';
import { prepareDatabase } from '../../server/db/prepare.js';
import { findPeriod } from '../../server/features/periods/periods.repository.js';
import { summarise } from '../../server/features/periods/summarise.js';
import { localDatabase } from '../../server/scripts/local-database.js';
import { addHistory, PARAMETERS, POINTS, setUpBenchSite, timeInTurns } from './bench-site.js';

// `npm run bench`: a site with 10 discharge points × 6 parameters sampled daily for 5 years;
// one year's summary against a plain SQL aggregate over the same rows (the floor), then the
// same with ten times the history. A measurement, not a test.
const projectDir = resolve(import.meta.dirname, '../..');
const database = await localDatabase(projectDir, 'decant_bench_periods');
await prepareDatabase(database.url, { seed: false, reset: true });
const ds = await createDataSource(database.url).initialize();

const { periodId, siteId, certificateId } = await setUpBenchSite(ds);
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
await ds.destroy();
if (database.cluster?.startedHere) database.cluster.stop();
