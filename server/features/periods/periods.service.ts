import { DateTime } from 'luxon';
import type { DataSource, EntityManager } from 'typeorm';
import type { CurrentUser } from '../../auth/current-user.js';
import { daysLeft, manifestDeadlines } from '../../domain/manifest-deadlines.js';
import { violationObligations } from '../../domain/notification-deadlines.js';
import { findEquipment } from '../equipment/equipment.repository.js';
import type { AmendRequest, Exceedance, PeriodListQuery, PeriodSummary, SignRequest, SubmissionRequest } from '../../contracts/periods.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { reportingPeriods } from '../../domain/reporting-periods.js';
import { conflict, invalid, notFound } from '../../errors/app-error.js';
import { openFollowUp } from '../follow-ups/open-follow-up.js';
import { siteToday } from '../../kernel/site-today.js';
import { recordTrail, type Actor } from '../../kernel/trail/trail.js';
import type { PeriodRecord } from './period-input.repository.js';
import { exceedanceSourceId, missedMonitoringSourceId, upkeepDueSourceId } from './finding-ids.js';
import type { Response } from 'express';
import type { Download } from '../../http/download.js';
import { streamEvidenceBundle } from '../reports/evidence-bundle.js';
import { XLSX_MEDIA_TYPE, packFileName, periodPackDownload, periodPackXlsxDownload } from '../reports/period-pack.service.js';
import { storedPack } from './sign-off.repository.js';
import { PeriodSignOffService } from './sign-off.service.js';
import { summarise } from './summarise.js';
import {
  allPermitIds,
  certificateAwareness,
  findPeriod,
  findPermitCalendar,
  insertMissingPeriods,
  listPeriods,
  openFollowUpCount,
  saveCompiledSummary,
  saveSubmissionDate,
  shipmentsAwaitingSignedCopy,
} from './periods.repository.js';

type Db = DataSource | EntityManager;

/** Creates the permit's periods up to the one running today; idempotent. */
export async function ensurePeriods(db: Db, permitId: string): Promise<void> {
  const permit = await findPermitCalendar(db, permitId);
  if (!permit) return;
  const periods = reportingPeriods(permit, await siteToday(db, permit.siteId));
  if (periods.length > 0) await insertMissingPeriods(db, permitId, periods);
}

/**
 * Every permit's periods up to today. Run when the app starts and every hour after, so a new
 * period exists once it begins without any read having to write.
 */
export async function ensureAllPeriods(db: Db): Promise<void> {
  for (const permitId of await allPermitIds(db)) await ensurePeriods(db, permitId);
}

/**
 * Saves the summary and opens the follow-ups the rules require. Opening is idempotent: each
 * follow-up is keyed by its kind and source, so recompiling opens nothing twice.
 */
export async function compileAndSave(dataSource: DataSource, user: CurrentUser, periodId: string): Promise<PeriodSummary> {
  return dataSource.transaction((manager) => compileWithin(manager, user, periodId));
}

/** The compile itself, inside the caller's transaction (the seed compiles the demo's periods). */
export async function compileWithin(manager: EntityManager, user: Actor, periodId: string): Promise<PeriodSummary> {
  const period = await findPeriod(manager, periodId);
  if (!period) throw notFound('Period');
  if (period.status === 'signed') {
    throw conflict(
      `This period is signed (revision ${period.revision}): its figures are the signed snapshot. Open an amendment to compile it again.`,
    );
  }
  const summary = await summarise(manager, period);
  // The site became aware of a violation with the certificate that showed it (for an average, the
  // one that took it over): its time of receipt, else its entry. One read for all exceedances.
  const awareCertificate = (e: Exceedance) => e.awareCertificateIds?.[0] ?? e.certificateIds[0] ?? '';
  const awareness = await certificateAwareness(
    manager,
    [...new Set(summary.rows.flatMap((row) => row.exceedances.map(awareCertificate)))].filter(Boolean),
  );
  for (const row of summary.rows) {
    for (const exceedance of row.exceedances) {
      const aware = awareness.get(awareCertificate(exceedance)) ?? {
        at: new Date(`${exceedance.date.length === 7 ? `${exceedance.date}-28` : exceedance.date}T12:00:00Z`),
        source: 'the day of the result (no certificate found)',
      };
      const awareAt = aware.at;
      for (const obligation of violationObligations(period.permitKind, row.statistic, awareAt)) {
        await openFollowUp(manager, {
          // Keyed by point, parameter and day (or month): one sample over a concentration and a
          // loading limit at once is one violation to report, not two.
          siteId: period.siteId,
          kind: obligation.kind,
          sourceEntity: 'exceedance',
          sourceId: exceedanceSourceId(row, exceedance.date),
          title: `${obligation.title}: ${row.parameter} at ${row.pointCode}, ${exceedance.date} (${obligation.source})`,
          dueAt: obligation.dueAt,
          awareAt,
          awareSource: aware.source,
          facts: {
            permitId: period.permitId,
            permitNumber: period.permitNumber,
            pointCode: row.pointCode,
            parameter: row.parameter,
            statistic: row.statistic,
            date: exceedance.date,
            shownValue: exceedance.shownValue,
            limit: exceedance.limit,
            unit: row.unit,
            resultIds: exceedance.resultIds,
          },
        });
      }
    }
    for (const missed of row.missedMonitoring) {
      await openFollowUp(manager, {
        siteId: period.siteId,
        kind: 'missed-sample',
        sourceEntity: 'missed-monitoring',
        sourceId: missedMonitoringSourceId(row, missed.unit),
        title: `Missed sample: ${row.parameter} at ${row.pointCode}, ${missed.unit} (${missed.taken} of ${missed.required})`,
        dueAt: DateTime.fromISO(period.dueOn, { zone: period.timeZone }).endOf('day').toJSDate(),
      });
    }
  }
  await openSiteDeadlines(manager, period);
  // The figures saved and shown are those after this compile: it may just have opened follow-ups.
  summary.openFollowUps = await openFollowUpCount(manager, period.siteId);
  const status = await saveCompiledSummary(manager, periodId, summary);
  await recordTrail(manager, user, {
    action: 'compile',
    entity: 'reporting-period',
    entityId: periodId,
    siteId: period.siteId,
    after: { status, exceeded: summary.rows.filter((r) => r.exceeded).length },
  });
  return { ...summary, status };
}

/**
 * Deadlines that do not come from the results: signed copies not back (40 CFR 262.42), the
 * report due within 7 days, and upkeep checks past their interval. Each opens once.
 */
export async function openSiteDeadlines(manager: EntityManager, period: PeriodRecord): Promise<void> {
  const today = period.today;
  const endOfDay = (day: string) => DateTime.fromISO(day, { zone: period.timeZone }).endOf('day').toJSDate();
  for (const shipment of await shipmentsAwaitingSignedCopy(manager, period.siteId)) {
    for (const deadline of manifestDeadlines(shipment.generatorStatus, shipment.manifestRule, shipment.shippedOn)) {
      if (daysLeft(deadline.dueOn, today) > 7) continue;
      await openFollowUp(manager, {
        siteId: period.siteId,
        kind: deadline.step,
        sourceEntity: 'shipment',
        sourceId: shipment.id,
        title: `${stepTitles[deadline.step]}: signed copy of ${shipment.documentNumber} not back (${deadline.source})`,
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
      sourceId: upkeepDueSourceId(item.id, item.nextCheckDueOn!),
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

/** Reporting periods of the permits: listed, summarised, compiled, signed and amended, their submission recorded. */
export class PeriodsService {
  private readonly signOff: PeriodSignOffService;

  constructor(private readonly dataSource: DataSource) {
    this.signOff = new PeriodSignOffService(dataSource);
  }

  async list(user: CurrentUser, { siteId, permitId }: PeriodListQuery) {
    if (siteId) assertSiteAllowed(user, siteId);
    return { items: await listPeriods(this.dataSource, siteId ? [siteId] : user.siteIds, permitId) };
  }

  async summary(user: CurrentUser, id: string): Promise<PeriodSummary> {
    return this.signOff.view(await this.visiblePeriod(user, id));
  }

  async compile(user: CurrentUser, id: string): Promise<PeriodSummary> {
    const period = await this.visiblePeriod(user, id);
    const compiled = await compileAndSave(this.dataSource, user, period.id);
    return {
      ...(await this.signOff.view({ ...period, status: compiled.status as PeriodRecord['status'] })),
      compiledAt: compiled.compiledAt,
    };
  }

  async signOffChecklist(user: CurrentUser, id: string, authenticatedAt: number) {
    return this.signOff.checklist(user, await this.visiblePeriod(user, id), authenticatedAt);
  }

  async sign(user: CurrentUser, id: string, request: SignRequest, authenticatedAt: number): Promise<PeriodSummary> {
    return this.signOff.sign(user, await this.visiblePeriod(user, id), request, authenticatedAt);
  }

  async amend(user: CurrentUser, id: string, request: AmendRequest): Promise<PeriodSummary> {
    return this.signOff.amend(user, await this.visiblePeriod(user, id), request);
  }

  async revisions(user: CurrentUser, id: string) {
    return { items: await this.signOff.revisions(await this.visiblePeriod(user, id)) };
  }

  async revision(user: CurrentUser, id: string, revision: number): Promise<PeriodSummary> {
    return this.signOff.revision(await this.visiblePeriod(user, id), revision);
  }

  /**
   * The period pack as PDF: for a signed period (or an earlier revision) the file kept with its
   * signature, the same bytes every time; for a draft, built now and marked DRAFT on every page.
   */
  async packPdf(user: CurrentUser, id: string, revision?: number): Promise<Download> {
    const period = await this.visiblePeriod(user, id);
    const summary = await this.shownSummary(period, revision);
    const signed = summary.status === 'signed' && summary.signature;
    const kept = signed ? await storedPack(this.dataSource, period.id, summary.signature!.revision, 'pdf') : null;
    if (kept) return { bytes: kept, mediaType: 'application/pdf', fileName: packFileName(period, summary, 'pdf') };
    return periodPackDownload(this.dataSource, period, summary);
  }

  /** Every file of the period with a manifest of their SHA-256, streamed as one ZIP. */
  async bundle(user: CurrentUser, id: string, res: Response): Promise<void> {
    const period = await this.visiblePeriod(user, id);
    const summary = await this.signOff.view(period);
    const pdf = (await this.packPdf(user, id)).bytes;
    const xlsx = (await this.packXlsx(user, id)).bytes;
    await streamEvidenceBundle(this.dataSource, res, {
      period,
      summary,
      fileName: packFileName(period, summary, 'zip').replace(/^decant-/, 'decant-evidence-'),
      pdf: Buffer.from(pdf),
      xlsx: Buffer.from(xlsx),
    });
  }

  /** The period pack as a workbook: kept with the signature like the PDF, or built now for a draft. */
  async packXlsx(user: CurrentUser, id: string, revision?: number): Promise<Download> {
    const period = await this.visiblePeriod(user, id);
    const summary = await this.shownSummary(period, revision);
    const signed = summary.status === 'signed' && summary.signature;
    const kept = signed ? await storedPack(this.dataSource, period.id, summary.signature!.revision, 'xlsx') : null;
    if (kept) return { bytes: kept, mediaType: XLSX_MEDIA_TYPE, fileName: packFileName(period, summary, 'xlsx') };
    return periodPackXlsxDownload(this.dataSource, period, summary);
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
    return this.signOff.view((await findPeriod(this.dataSource, period.id))!);
  }

  /** What the period page shows: a given signed revision, or the period now (snapshot or draft). */
  private shownSummary(period: PeriodRecord, revision?: number): Promise<PeriodSummary> {
    return revision ? this.signOff.revision(period, revision) : this.signOff.view(period);
  }

  private async visiblePeriod(user: CurrentUser, id: string): Promise<PeriodRecord> {
    const period = await findPeriod(this.dataSource, id);
    assertSiteVisible(user, period?.siteId, 'Period');
    return period!;
  }
}
