import { IsNull, type DataSource, type EntityManager } from 'typeorm';
import type { PeriodListItem, PeriodStatus, PeriodSummary } from '../../contracts/periods.js';
import { SIGNED_COPY_DOCUMENT, type GeneratorStatus, type ManifestRule } from '../../domain/manifest-deadlines.js';
import type { ReportingPeriod as PeriodDates } from '../../domain/reporting-periods.js';
import { Site } from '../../kernel/sites/site.entity.js';
import { FollowUp } from '../follow-ups/follow-up.entity.js';
import { Permit } from '../permits/permit.entity.js';
import { Shipment } from '../shipments/shipment.entity.js';
import type { PeriodRecord } from './period-input.repository.js';
import { ReportingPeriod } from './reporting-period.entity.js';

type Db = DataSource | EntityManager;

interface PeriodRow {
  id: string;
  permit_id: string;
  site_id: string;
  time_zone: string;
  starts_on: string;
  ends_on: string;
  due_on: string;
  status: PeriodStatus;
  compiled_at: Date | null;
  submitted_on: string | null;
  permit_kind: PeriodRecord['permitKind'];
  permit_number: string;
  late_report_days: number;
  non_detect_policy: PeriodRecord['settings']['nonDetectPolicy'];
  mass_loading_factor: string;
  daily_max_applies_to_each_grab: boolean;
  snc_window: PeriodRecord['settings']['sncWindow'];
  monitoring_counts: PeriodRecord['settings']['monitoringCounts'];
  revision: number;
  today: string;
}

// Raw SQL: a period comes with the permit settings in force on its first day and the site's today in one read.
const periodSelect = `SELECT rp.id, rp.permit_id, p.site_id, s.time_zone, rp.starts_on::text, rp.ends_on::text, rp.due_on::text, rp.status, rp.compiled_at,
    rp.submitted_on::text, p.kind AS permit_kind, p.number AS permit_number, ps.late_report_days, ps.non_detect_policy, ps.mass_loading_factor,
    ps.daily_max_applies_to_each_grab, ps.snc_window, ps.monitoring_counts, rp.revision, (now() AT TIME ZONE s.time_zone)::date::text AS today
  FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id JOIN site s ON s.id = p.site_id
  CROSS JOIN LATERAL permit_settings_on(p.id, rp.starts_on) ps`;
const record = (row: PeriodRow): PeriodRecord => ({
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
  revision: row.revision,
  today: row.today,
  settings: {
    kind: row.permit_kind,
    nonDetectPolicy: row.non_detect_policy,
    massLoadingFactor: Number(row.mass_loading_factor),
    dailyMaxAppliesToEachGrab: row.daily_max_applies_to_each_grab,
    sncWindow: row.snc_window,
    monitoringCounts: row.monitoring_counts,
  },
});

export async function findPeriod(db: Db, id: string): Promise<PeriodRecord | null> {
  const [row]: PeriodRow[] = await db.query(`${periodSelect} WHERE rp.id = $1`, [id]);
  return row ? record(row) : null;
}

export async function listPeriods(db: Db, siteIds: string[], permitId?: string): Promise<PeriodListItem[]> {
  // With each period its last signature, if any: who signed, when, and the pack's hash.
  const rows: Array<PeriodRow & { signer_name: string | null; signed_at: Date | null; pack_sha256: string | null }> = await db.query(
    `SELECT q.*, sg.signer_name, sg.signed_at, sg.pack_sha256
       FROM (${periodSelect} WHERE p.site_id = ANY($1::uuid[]) AND ($2::uuid IS NULL OR rp.permit_id = $2)) q
       LEFT JOIN LATERAL (SELECT signer_name, signed_at, pack_sha256 FROM period_signature
                           WHERE period_id = q.id ORDER BY revision DESC LIMIT 1) sg ON true
      ORDER BY q.permit_number, q.starts_on DESC`,
    [siteIds, permitId ?? null],
  );
  // The list answers what a period is, not how its permit computes (that is in the summary).
  return rows.map((row) => {
    const { settings: _settings, ...period } = record(row);
    return {
      ...period,
      compiledAt: row.compiled_at?.toISOString() ?? null,
      lastSignature: row.signed_at
        ? { signerName: row.signer_name!, signedAt: row.signed_at.toISOString(), packSha256: row.pack_sha256 }
        : null,
    };
  });
}

/** What a permit's reporting calendar is worked out from. */
export async function findPermitCalendar(db: Db, permitId: string) {
  return db.getRepository(Permit).findOne({
    where: { id: permitId },
    select: { id: true, siteId: true, effectiveFrom: true, effectiveTo: true, reportingFrequency: true, reportDueDays: true },
  });
}

export async function allPermitIds(db: Db): Promise<string[]> {
  return (await db.getRepository(Permit).find({ select: { id: true } })).map((permit) => permit.id);
}

/** Adds the periods not there yet; those already there stay as they were reported. */
export async function insertMissingPeriods(db: Db, permitId: string, periods: PeriodDates[]): Promise<void> {
  await db
    .getRepository(ReportingPeriod)
    .createQueryBuilder()
    .insert()
    .values(periods.map((period) => ({ permitId, startsOn: period.startsOn, endsOn: period.endsOn, dueOn: period.dueOn })))
    .orIgnore()
    .execute();
}

/** Oil collected and shipped in the period, follow-ups open at the site, and results the lab checks flagged. */
export async function periodCounts(db: Db, period: PeriodRecord) {
  // Raw SQL: four aggregates over four tables in one round trip.
  const [totals]: Array<{ collected: string; shipped: string; open_follow_ups: number; lab_flags: number }> = await db.query(
    `SELECT (SELECT coalesce(sum(volume_litres), 0) FROM oil_log_entry WHERE site_id = $1 AND collected_on BETWEEN $2 AND $3) AS collected,
            (SELECT coalesce(sum(quantity_litres), 0) FROM shipment WHERE site_id = $1 AND shipped_on BETWEEN $2 AND $3) AS shipped,
            (SELECT count(*)::int FROM follow_up WHERE site_id = $1 AND status = 'open') AS open_follow_ups,
            (SELECT count(*)::int FROM lab_result r JOIN lab_sample s ON s.id = r.sample_id
              WHERE s.discharge_point_id IN (SELECT id FROM discharge_point WHERE site_id = $1)
                AND s.collected_on BETWEEN $2 AND $3 AND r.flag_codes <> '{}') AS lab_flags`,
    [period.siteId, period.startsOn, period.endsOn],
  );
  return {
    collectedLitres: Number(totals!.collected),
    shippedLitres: Number(totals!.shipped),
    openFollowUps: totals!.open_follow_ups,
    labFlagCount: totals!.lab_flags,
  };
}

export interface Awareness {
  at: Date;
  /** Where the moment came from, in words, shown on the follow-up. */
  source: string;
}

/**
 * When the site learned each certificate's results: its received day and time at the site, or,
 * without a time, the moment it was entered in Decant.
 */
export async function certificateAwareness(db: Db, certificateIds: string[]): Promise<Map<string, Awareness>> {
  if (certificateIds.length === 0) return new Map();
  // Raw SQL: the site's zone turns a local day and time into a moment.
  const rows: Array<{
    id: string;
    report_number: string;
    received_at: Date | null;
    received_local: string | null;
    created_at: Date;
    created_local: string;
  }> = await db.query(
    `SELECT c.id, c.report_number, c.created_at,
              ((c.received_on + c.received_time) AT TIME ZONE s.time_zone) AS received_at,
              to_char(c.received_on + c.received_time, 'YYYY-MM-DD HH24:MI') AS received_local,
              to_char(c.created_at AT TIME ZONE s.time_zone, 'YYYY-MM-DD HH24:MI') AS created_local
         FROM lab_certificate c JOIN site s ON s.id = c.site_id WHERE c.id = ANY($1::uuid[])`,
    [certificateIds],
  );
  return new Map(
    rows.map((row) => [
      row.id,
      row.received_at
        ? { at: row.received_at, source: `certificate ${row.report_number} received ${row.received_local} (site time)` }
        : {
            at: row.created_at,
            source: `certificate ${row.report_number} entered ${row.created_local} (site time; no time of receipt on it)`,
          },
    ]),
  );
}

/** Keeps the compiled summary; an open period becomes compiled, a later state stays. Answers the status. */
export async function saveCompiledSummary(manager: EntityManager, periodId: string, summary: PeriodSummary): Promise<string> {
  await manager
    .createQueryBuilder()
    .update(ReportingPeriod)
    .set({ status: () => `CASE WHEN status = 'open' THEN 'compiled' ELSE status END`, compiledAt: new Date(summary.compiledAt), summary })
    .where('id = :periodId', { periodId })
    .execute();
  return (await manager.findOneOrFail(ReportingPeriod, { where: { id: periodId }, select: { status: true } })).status;
}

/** Shipments of the site whose signed copy is not back, with the site's generator status and rule. */
export async function shipmentsAwaitingSignedCopy(
  db: Db,
  siteId: string,
): Promise<Array<{ id: string; documentNumber: string; shippedOn: string; generatorStatus: GeneratorStatus; manifestRule: ManifestRule }>> {
  const site = await db.getRepository(Site).findOneByOrFail({ id: siteId });
  const shipments = await db.getRepository(Shipment).find({
    where: { siteId, signedCopyReceivedOn: IsNull(), documentKind: SIGNED_COPY_DOCUMENT },
    select: { id: true, documentNumber: true, shippedOn: true },
  });
  return shipments.map((shipment) => ({ ...shipment, generatorStatus: site.generatorStatus, manifestRule: site.manifestRule }));
}

export async function saveSubmissionDate(manager: EntityManager, periodId: string, submittedOn: string): Promise<void> {
  await manager.update(ReportingPeriod, { id: periodId }, { submittedOn });
}

/** The site's periods whose span holds any of the days, with what a summary needs. */
export async function periodsCovering(db: Db, siteId: string, days: string[]): Promise<PeriodRecord[]> {
  const rows: PeriodRow[] = await db.query(
    `${periodSelect} WHERE p.site_id = $1 AND EXISTS (SELECT 1 FROM unnest($2::date[]) d WHERE d BETWEEN rp.starts_on AND rp.ends_on)`,
    [siteId, days],
  );
  return rows.map(record);
}

/** The site's open follow-ups now: read again after a compile has opened new ones. */
export async function openFollowUpCount(db: Db, siteId: string): Promise<number> {
  return db.getRepository(FollowUp).count({ where: { siteId, status: 'open' } });
}
