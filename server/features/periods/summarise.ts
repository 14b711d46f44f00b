import type { DataSource, EntityManager } from 'typeorm';
import type { PeriodSummary } from '../../contracts/periods.js';
import { inParallel } from '../../db/in-parallel.js';
import { oilOnHand } from '../../domain/oil-collection.js';
import { compilePeriod } from '../../domain/period/period-summary.js';
import { reportTimeliness } from '../../domain/report-timeliness.js';
import { oilBalanceInput } from '../oil-log/oil-on-hand.repository.js';
import { loadPeriodInput, type PeriodRecord } from './period-input.repository.js';
import { periodCounts } from './periods.repository.js';

type Db = DataSource | EntityManager;

export const summaryCautions = [
  'This summary is a record-keeping aid. The permit and the control authority decide how values are computed and reported: confirm with them before you report.',
  'Daily discharges, averages and non-detects follow the definitions of 40 CFR 122.2 and the permit settings stated here; a permit may define them differently.',
];

/** Oil collected and shipped in the period and on hand at its end, follow-ups open at the site, and results the lab checks flagged. */
async function periodTotals(db: Db, period: PeriodRecord) {
  const totals = await periodCounts(db, period);
  const balance = await oilBalanceInput(db, period.siteId, period.endsOn);
  return {
    oil: {
      collectedLitres: totals.collectedLitres,
      shippedLitres: totals.shippedLitres,
      onHandAtEndLitres: balance ? oilOnHand(balance).litres : null,
    },
    openFollowUps: totals.openFollowUps,
    labFlagCount: totals.labFlagCount,
  };
}

/** The summary of one period, compiled now from the records (nothing is written): a draft. */
export async function summarise(db: Db, period: PeriodRecord, now = new Date()): Promise<PeriodSummary> {
  const [input, totals] = await inParallel(
    db,
    () => loadPeriodInput(db, period),
    () => periodTotals(db, period),
  );
  const core = compilePeriod(input);
  const timeliness = reportTimeliness(period.dueOn, period.submittedOn, period.today, period.lateReportDays, period.permitKind);
  return {
    periodId: period.id,
    permitId: period.permitId,
    siteId: period.siteId,
    status: period.status,
    period: { start: period.startsOn, end: period.endsOn, due: period.dueOn },
    compiledAt: now.toISOString(),
    ...core,
    ...totals,
    reportTimeliness: timeliness,
    cautions: summaryCautions,
    revision: period.revision,
    signature: null,
    amendment: null,
  };
}
