import { createHash } from 'node:crypto';
import { DateTime } from 'luxon';
import type { DataSource, EntityManager } from 'typeorm';
import type { CurrentUser } from '../../auth/current-user.js';
import { daysLeft, manifestDeadlines } from '../../domain/manifest-deadlines.js';
import { violationObligations } from '../../domain/notification-deadlines.js';
import { findEquipment } from '../equipment/equipment.repository.js';
import { oilBalanceInput } from '../oil-log/oil-on-hand.repository.js';
import { oilOnHand } from '../../domain/oil-collection.js';
import type { PeriodListQuery, PeriodSummary, SubmissionRequest } from '../../contracts/periods.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { compilePeriod } from '../../domain/period/period-summary.js';
import { reportTimeliness } from '../../domain/report-timeliness.js';
import { reportingPeriods } from '../../domain/reporting-periods.js';
import { inParallel } from '../../db/in-parallel.js';
import { invalid, notFound } from '../../errors/app-error.js';
import { openFollowUp } from '../follow-ups/open-follow-up.js';
import { siteToday } from '../../kernel/site-today.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { loadPeriodInput, saveSubmissionDate, type PeriodRecord } from './period-input.repository.js';

type Db = DataSource | EntityManager;

/** The same id for the same finding at every compile, so its follow-ups open once. */
function stableId(...parts: string[]): string {
  const hex = createHash('sha256').update(parts.join('|')).digest('hex');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-4${hex.slice(13, 16)}-8${hex.slice(17, 20)}-${hex.slice(20, 32)}`;
}

export const summaryCautions = [
  'This summary is a record-keeping aid. The permit and the control authority decide how values are computed and reported: confirm with them before you report.',
  'Daily discharges, averages and non-detects follow the definitions of 40 CFR 122.2 and the permit settings stated here; a permit may define them differently.',
];

const periodSelect = `SELECT rp.id, rp.permit_id, p.site_id, s.time_zone, rp.starts_on::text, rp.ends_on::text, rp.due_on::text, rp.status, rp.compiled_at,
    rp.submitted_on::text, p.kind AS permit_kind, p.number AS permit_number, p.late_report_days, p.non_detect_policy, p.mass_loading_factor,
    p.daily_max_applies_to_each_grab, p.snc_window, (now() AT TIME ZONE s.time_zone)::date::text AS today
  FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id JOIN site s ON s.id = p.site_id`;
const record = (row: Record<string, any>): PeriodRecord => ({
  id: row.id,
  permitId: row.permit_id,
  siteId: row.site_id,
  timeZone: row.time_zone,
  startsOn: row.starts_on,
  endsOn: row.ends_on,
  dueOn: row.due_on,
  status: row.status,
  permitKind: row.permit_kind,
  permitNumber: row.permit_number,
  lateReportDays: row.late_report_days,
  submittedOn: row.submitted_on,
  today: row.today,
  settings: {
    kind: row.permit_kind,
    nonDetectPolicy: row.non_detect_policy,
    massLoadingFactor: Number(row.mass_loading_factor),
    dailyMaxAppliesToEachGrab: row.daily_max_applies_to_each_grab,
    sncWindow: row.snc_window,
  },
});

/** Creates the permit's periods up to the one running today; idempotent. */
export async function ensurePeriods(db: Db, permitId: string): Promise<void> {
  const [permit] = await db.query(
    'SELECT id, site_id, effective_from::text, effective_to::text, reporting_frequency, report_due_days FROM permit WHERE id = $1',
    [permitId],
  );
  if (!permit) return;
  const periods = reportingPeriods(
    {
      effectiveFrom: permit.effective_from,
      effectiveTo: permit.effective_to,
      reportingFrequency: permit.reporting_frequency,
      reportDueDays: permit.report_due_days,
    },
    await siteToday(db, permit.site_id),
  );
  if (periods.length === 0) return;
  await db.query(
    `INSERT INTO reporting_period (permit_id, starts_on, ends_on, due_on)
     SELECT $1, * FROM unnest($2::date[], $3::date[], $4::date[]) ON CONFLICT (permit_id, starts_on) DO NOTHING`,
    [permitId, periods.map((p) => p.startsOn), periods.map((p) => p.endsOn), periods.map((p) => p.dueOn)],
  );
}

/**
 * Every permit's periods up to today. Run when the app starts and every hour after, so a new
 * period exists once it begins without any read having to write.
 */
export async function ensureAllPeriods(db: Db): Promise<void> {
  for (const permit of await db.query('SELECT id FROM permit')) await ensurePeriods(db, permit.id);
}

export async function findPeriod(db: Db, id: string): Promise<PeriodRecord | null> {
  const [row] = await db.query(`${periodSelect} WHERE rp.id = $1`, [id]);
  return row ? record(row) : null;
}

export async function listPeriods(db: Db, siteIds: string[], permitId?: string) {
  const rows = await db.query(
    `${periodSelect} WHERE p.site_id = ANY($1::uuid[]) AND ($2::uuid IS NULL OR rp.permit_id = $2) ORDER BY p.number, rp.starts_on DESC`,
    [siteIds, permitId ?? null],
  );
  // The list answers what a period is, not how its permit computes (that is in the summary).
  return rows.map((row: Record<string, any>) => {
    const { settings: _settings, ...period } = record(row);
    return { ...period, compiledAt: row.compiled_at?.toISOString() ?? null };
  });
}

/** Oil collected and shipped in the period and on hand at its end, follow-ups open at the site, and results the lab checks flagged. */
async function periodTotals(db: Db, period: PeriodRecord) {
  const [totals] = await db.query(
    `SELECT (SELECT coalesce(sum(volume_litres), 0) FROM oil_log_entry WHERE site_id = $1 AND collected_on BETWEEN $2 AND $3) AS collected,
            (SELECT coalesce(sum(quantity_litres), 0) FROM shipment WHERE site_id = $1 AND shipped_on BETWEEN $2 AND $3) AS shipped,
            (SELECT count(*)::int FROM follow_up WHERE site_id = $1 AND status = 'open') AS open_follow_ups,
            (SELECT count(*)::int FROM lab_result r JOIN lab_sample s ON s.id = r.sample_id
              WHERE s.discharge_point_id IN (SELECT id FROM discharge_point WHERE site_id = $1)
                AND s.collected_on BETWEEN $2 AND $3 AND r.flag_codes <> '{}') AS lab_flags`,
    [period.siteId, period.startsOn, period.endsOn],
  );
  const balance = await oilBalanceInput(db, period.siteId, period.endsOn);
  return {
    oil: {
      collectedLitres: Number(totals.collected),
      shippedLitres: Number(totals.shipped),
      onHandAtEndLitres: balance ? oilOnHand(balance).litres : null,
    },
    openFollowUps: totals.open_follow_ups as number,
    labFlagCount: totals.lab_flags as number,
  };
}

/** The summary of one period, compiled now from the records (nothing is written). */
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
  };
}

/**
 * Saves the summary and opens the follow-ups the rules require. Opening is idempotent: each
 * follow-up is keyed by its kind and source, so recompiling opens nothing twice.
 */
export async function compileAndSave(dataSource: DataSource, user: CurrentUser, periodId: string): Promise<PeriodSummary> {
  return dataSource.transaction((manager) => compileWithin(manager, user, periodId));
}

/** The compile itself, inside the caller's transaction (the seed compiles the demo's periods). */
export async function compileWithin(
  manager: EntityManager,
  user: Pick<CurrentUser, 'id' | 'email'>,
  periodId: string,
): Promise<PeriodSummary> {
  const period = await findPeriod(manager, periodId);
  if (!period) throw notFound('Period');
  const summary = await summarise(manager, period);
  // The user became aware of a result when its certificate was entered: one read for all exceedances.
  const certificateIds = [
    ...new Set(summary.rows.flatMap((row) => row.exceedances.map((e) => e.certificateIds[0]).filter((id): id is string => Boolean(id)))),
  ];
  const enteredAt = new Map<string, Date>(
    certificateIds.length === 0
      ? []
      : (await manager.query('SELECT id, created_at FROM lab_certificate WHERE id = ANY($1::uuid[])', [certificateIds])).map(
          (row: { id: string; created_at: Date }) => [row.id, row.created_at],
        ),
  );
  for (const row of summary.rows) {
    for (const exceedance of row.exceedances) {
      const awareAt =
        enteredAt.get(exceedance.certificateIds[0] ?? '') ??
        new Date(`${exceedance.date.length === 7 ? `${exceedance.date}-28` : exceedance.date}T12:00:00Z`);
      for (const obligation of violationObligations(period.permitKind, row.statistic, awareAt)) {
        await openFollowUp(manager, {
          // Keyed by point, parameter and day (or month): one sample over a concentration and a
          // loading limit at once is one violation to report, not two.
          siteId: period.siteId,
          kind: obligation.kind,
          sourceEntity: 'exceedance',
          sourceId: stableId(row.dischargePointId, row.parameterId, exceedance.date),
          title: `${obligation.title}: ${row.parameter} at ${row.pointCode}, ${exceedance.date} (${obligation.source})`,
          dueAt: obligation.dueAt,
        });
      }
    }
    for (const missed of row.missedMonitoring) {
      await openFollowUp(manager, {
        siteId: period.siteId,
        kind: 'missed-sample',
        sourceEntity: 'missed-monitoring',
        sourceId: stableId(row.dischargePointId, row.parameterId, missed.unit),
        title: `Missed sample: ${row.parameter} at ${row.pointCode}, ${missed.unit} (${missed.taken} of ${missed.required})`,
        dueAt: DateTime.fromISO(period.dueOn, { zone: period.timeZone }).endOf('day').toJSDate(),
      });
    }
  }
  await openSiteDeadlines(manager, period);
  const [saved] = await manager.query(
    `UPDATE reporting_period SET status = CASE WHEN status = 'open' THEN 'compiled' ELSE status END,
    compiled_at = now(), summary = $2 WHERE id = $1 RETURNING status`,
    [periodId, JSON.stringify(summary)],
  );
  await recordTrail(manager, user, {
    action: 'compile',
    entity: 'reporting-period',
    entityId: periodId,
    siteId: period.siteId,
    after: { status: saved[0].status, exceeded: summary.rows.filter((r) => r.exceeded).length },
  });
  return { ...summary, status: saved[0].status };
}

/**
 * Deadlines that do not come from the results: signed copies not back (40 CFR 262.42), the
 * report due within 7 days, and upkeep checks past their interval. Each opens once.
 */
async function openSiteDeadlines(manager: EntityManager, period: PeriodRecord): Promise<void> {
  const today = period.today;
  const endOfDay = (day: string) => DateTime.fromISO(day, { zone: period.timeZone }).endOf('day').toJSDate();
  const shipments = await manager.query(
    `SELECT h.id, h.document_number, h.shipped_on::text AS shipped_on, s.generator_status, s.manifest_rule
       FROM shipment h JOIN site s ON s.id = h.site_id WHERE h.site_id = $1 AND h.signed_copy_received_on IS NULL`,
    [period.siteId],
  );
  for (const shipment of shipments) {
    for (const deadline of manifestDeadlines(shipment.generator_status, shipment.manifest_rule, shipment.shipped_on)) {
      if (daysLeft(deadline.dueOn, today) > 7) continue;
      await openFollowUp(manager, {
        siteId: period.siteId,
        kind: deadline.step,
        sourceEntity: 'shipment',
        sourceId: shipment.id,
        title: `${stepTitles[deadline.step]}: signed copy of ${shipment.document_number} not back (${deadline.source})`,
        dueAt: endOfDay(deadline.dueOn),
      });
    }
  }
  if (period.status !== 'signed' && daysLeft(period.dueOn, today) <= 7 && daysLeft(period.dueOn, today) >= 0) {
    await openFollowUp(manager, {
      siteId: period.siteId,
      kind: 'report-due',
      sourceEntity: 'reporting-period',
      sourceId: period.id,
      title: `Send the periodic report for ${period.startsOn} – ${period.endsOn}`,
      dueAt: endOfDay(period.dueOn),
    });
  }
  const equipment = await findEquipment(manager, { siteIds: [period.siteId] }, today);
  for (const item of equipment.filter((e) => e.upkeepOverdue && e.nextCheckDueOn)) {
    await openFollowUp(manager, {
      siteId: period.siteId,
      kind: 'upkeep-due',
      sourceEntity: 'equipment',
      sourceId: stableId(item.id, item.nextCheckDueOn!),
      title: `Upkeep check overdue: ${item.name}`,
      dueAt: endOfDay(item.nextCheckDueOn!),
    });
  }
}

const stepTitles: Record<string, string> = {
  'contact-transporter-and-facility': 'Contact the transporter and the receiving facility',
  'exception-report': 'File an exception report',
  'copy-with-note-of-non-receipt': 'Send a copy with a note that the signed copy was not received',
};

/** Reporting periods of the permits: listed, summarised on demand, compiled, their submission recorded. */
export class PeriodsService {
  constructor(private readonly dataSource: DataSource) {}

  async list(user: CurrentUser, { siteId, permitId }: PeriodListQuery) {
    if (siteId) assertSiteAllowed(user, siteId);
    return { items: await listPeriods(this.dataSource, siteId ? [siteId] : user.siteIds, permitId) };
  }

  async summary(user: CurrentUser, id: string): Promise<PeriodSummary> {
    return summarise(this.dataSource, await this.visiblePeriod(user, id));
  }

  async compile(user: CurrentUser, id: string): Promise<PeriodSummary> {
    const period = await this.visiblePeriod(user, id);
    return compileAndSave(this.dataSource, user, period.id);
  }

  /** Records when the periodic report went to the authority (signing and packs come later). */
  async recordSubmission(user: CurrentUser, id: string, request: SubmissionRequest): Promise<PeriodSummary> {
    const period = await this.visiblePeriod(user, id);
    if (request.submittedOn < period.endsOn) throw invalid({ submittedOn: 'Before the period ended' });
    if (request.submittedOn > period.today) throw invalid({ submittedOn: 'Cannot be in the future' });
    await this.dataSource.transaction(async (manager) => {
      await saveSubmissionDate(manager, period.id, request.submittedOn);
      await recordTrail(manager, user, {
        action: 'record-submission',
        entity: 'reporting-period',
        entityId: period.id,
        siteId: period.siteId,
        before: { submittedOn: period.submittedOn },
        after: request,
      });
    });
    return summarise(this.dataSource, (await findPeriod(this.dataSource, period.id))!);
  }

  private async visiblePeriod(user: CurrentUser, id: string): Promise<PeriodRecord> {
    const period = await findPeriod(this.dataSource, id);
    assertSiteVisible(user, period?.siteId, 'Period');
    return period!;
  }
}
