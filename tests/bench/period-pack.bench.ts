import { resolve } from 'node:path';
import { periodPackPdf } from '../../reports/period-pack-pdf.js';
import { periodPackXlsx } from '../../reports/period-pack-xlsx.js';
import { createDataSource } from '../../server/db/data-source.js';
import { prepareDatabase } from '../../server/db/prepare.js';
import { findPeriod } from '../../server/features/periods/periods.repository.js';
import { summarise } from '../../server/features/periods/summarise.js';
import { loadPackInput } from '../../server/features/reports/period-pack.repository.js';
import { localDatabase } from '../../server/scripts/local-database.js';
import { addDailyFlows, addHistory, setUpBenchSite, timeInTurns } from './bench-site.js';

// `npm run bench`: the period pack of one busy site-year (10 points × 6 parameters sampled daily,
// flows daily), every result of the year in its tables. Targets: the PDF under 2 s, the workbook
// under 1 s. A measurement, not a test.
const projectDir = resolve(import.meta.dirname, '../..');
const database = await localDatabase(projectDir, 'decant_bench_pack');
await prepareDatabase(database.url, { seed: false, reset: true });
const ds = await createDataSource(database.url).initialize();
const { periodId, siteId, certificateId } = await setUpBenchSite(ds);
await addHistory(ds, siteId, certificateId, 2025, 2025);
await addDailyFlows(ds, siteId, 2025, 2025);
const period = (await findPeriod(ds, periodId))!;

const packInput = await loadPackInput(ds, period, await summarise(ds, period), new Date());
const runs = Number(process.env.BENCH_RUNS ?? 3);
const [pdfMs = NaN, xlsxMs = NaN] = await timeInTurns([() => periodPackPdf(packInput), () => periodPackXlsx(packInput)], runs);
const pdfBytes = (await periodPackPdf(packInput)).length;
console.log(
  `\nPeriod pack: ${packInput.samples.length.toLocaleString()} results, ${packInput.flows.length.toLocaleString()} flow readings ` +
    `(median of ${runs} after a warm-up; PDF ${(pdfBytes / 1e6).toFixed(1)} MB)\n` +
    `PDF ${(pdfMs / 1000).toFixed(2)} s (target under 2 s: ${pdfMs < 2000 ? 'met' : 'NOT met'}); ` +
    `XLSX ${(xlsxMs / 1000).toFixed(2)} s (target under 1 s: ${xlsxMs < 1000 ? 'met' : 'NOT met'})`,
);
await ds.destroy();
if (database.cluster?.startedHere) database.cluster.stop();
