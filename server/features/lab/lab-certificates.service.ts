import type { DataSource, EntityManager } from 'typeorm';
import type { Response } from 'express';
import type {
  CertificateDetail,
  CertificateListQuery,
  CreateLabCertificateRequest,
  ResultListQuery,
  UpdateLabCertificateRequest,
} from '../../contracts/lab.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { CORRECTION_WINDOW_MS } from '../../contracts/permissions.js';
import { conflict, invalid, notFound } from '../../errors/app-error.js';
import { checkUpload, claimStoredFiles, sendStoredFile, storeFile, type Upload } from '../../kernel/files/stored-files.js';
import { closeResolvedFollowUps } from '../follow-ups/close-resolved.js';
import { exceedancesRepeatedBy } from '../periods/finding-ids.js';
import { closeTakenMissedSamples } from '../periods/missed-samples-taken.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { writeCertificateContent } from './certificate-content.js';
import { computeCertificateFlags, limitsInForce, type LimitsInForce } from './lab-flags.service.js';
import {
  findSiteZone,
  insertCertificateRecord,
  loadCertificate,
  pageCertificates,
  pageResults,
  reportNumberTaken,
  updateCertificateRecord,
} from './lab.repository.js';

/** A list narrowed to one of the user's sites, or all of them. */
function siteScope(user: CurrentUser, siteId: string | undefined): string[] {
  if (siteId) assertSiteAllowed(user, siteId);
  return siteId ? [siteId] : user.siteIds;
}

const duplicateReport = () =>
  conflict('This site already has a certificate of this lab with this report number', {
    reportNumber: 'Already recorded for this lab at this site',
  });

/**
 * A certificate with a later sample of the same point and parameter is the repeat sampling a
 * violation calls for (40 CFR 403.12(g)(2)): its follow-up closes by itself, naming the report.
 */
async function closeRepeatedExceedances(
  manager: EntityManager,
  user: CurrentUser,
  certificateId: string,
  request: CreateLabCertificateRequest,
) {
  const sourceIds = request.samples.flatMap((sample) =>
    sample.results.flatMap((result) =>
      exceedancesRepeatedBy(
        { dischargePointId: sample.dischargePointId, parameterId: result.parameterId },
        sample.collectedAt.slice(0, 10),
      ),
    ),
  );
  await closeResolvedFollowUps(manager, user, {
    siteId: request.siteId,
    kinds: ['repeat-sampling'],
    sourceEntity: 'exceedance',
    sourceIds: [...new Set(sourceIds)],
    resolvedBy: { entity: 'lab-certificate', id: certificateId },
    note: `the repeat sample's results arrived with certificate ${request.reportNumber}`,
  });
}

/** Lab certificates: written whole, in one transaction with their trail entry and their checks. */
export class LabCertificatesService {
  constructor(private readonly dataSource: DataSource) {}

  list(user: CurrentUser, query: CertificateListQuery) {
    return pageCertificates(this.dataSource, siteScope(user, query.siteId), query);
  }

  listResults(user: CurrentUser, query: ResultListQuery) {
    return pageResults(this.dataSource, siteScope(user, query.siteId), query);
  }

  get(user: CurrentUser, id: string): Promise<CertificateDetail> {
    return this.visible(this.dataSource, user, id);
  }

  /** The certificate's PDF, shown in the browser or (download) saved. */
  async sendFile(user: CurrentUser, id: string, download: boolean, res: Response): Promise<void> {
    const certificate = await this.visible(this.dataSource, user, id);
    if (!certificate.file) throw notFound('Certificate file');
    await sendStoredFile(this.dataSource.manager, certificate.file.id, res, !download);
  }

  async create(user: CurrentUser, request: CreateLabCertificateRequest, upload?: Upload): Promise<CertificateDetail> {
    assertSiteAllowed(user, request.siteId);
    const checkedFile = upload ? await checkUpload(upload, ['application/pdf']) : null;
    return this.dataSource.transaction(async (manager) => {
      const id = await this.insertCertificate(
        manager,
        user,
        request,
        upload && checkedFile ? { upload, mediaType: checkedFile.mediaType } : null,
      );
      const after = (await loadCertificate(manager, id))!;
      await recordTrail(manager, user, { action: 'create', entity: 'lab-certificate', entityId: id, siteId: request.siteId, after });
      return after;
    });
  }

  /** Also used by the spreadsheet import, inside its own single transaction. */
  async insertCertificate(
    manager: EntityManager,
    user: CurrentUser,
    request: CreateLabCertificateRequest,
    file: { upload: Upload; mediaType: string } | null,
    /** An import passes one lookup for all its certificates. */
    limits: LimitsInForce = limitsInForce(manager),
  ): Promise<string> {
    const site = await findSiteZone(manager, request.siteId);
    if (!site) throw notFound('Site');
    const stored = file
      ? await storeFile(manager, file.upload, file.mediaType, { userId: user.id, siteId: request.siteId, purpose: 'certificate' })
      : null;
    if (await reportNumberTaken(manager, request)) throw duplicateReport();
    const id = await insertCertificateRecord(manager, {
      siteId: request.siteId,
      labName: request.labName,
      labAccreditationNumber: request.labAccreditationNumber,
      reportNumber: request.reportNumber,
      receivedOn: request.receivedOn,
      receivedTime: request.receivedTime,
      fileId: stored?.id ?? null,
      createdBy: user.id,
    });
    if (stored)
      await claimStoredFiles(manager, [stored.id], {
        siteId: request.siteId,
        purpose: 'certificate',
        owner: { entity: 'lab-certificate', id },
        field: 'file',
      });
    await writeCertificateContent(manager, id, site, request, { replacing: false });
    await computeCertificateFlags(manager, id, { limits });
    await closeRepeatedExceedances(manager, user, id, request);
    await closeTakenMissedSamples(
      manager,
      user,
      request.siteId,
      request.samples.flatMap((sample) =>
        sample.results.map((result) => ({
          dischargePointId: sample.dischargePointId,
          parameterId: result.parameterId,
          day: sample.collectedAt.slice(0, 10),
        })),
      ),
      { entity: 'lab-certificate', id, note: `the missed sample was taken: its results arrived with certificate ${request.reportNumber}` },
    );
    return id;
  }

  async update(user: CurrentUser, id: string, request: UpdateLabCertificateRequest): Promise<CertificateDetail> {
    return this.dataSource.transaction(async (manager) => {
      const before = await this.visible(manager, user, id);
      if (!request.reason && Date.now() - new Date(before.enteredAt).getTime() > CORRECTION_WINDOW_MS) {
        throw invalid({ reason: 'Entered more than 24 hours ago: say why it is corrected' });
      }
      if (await reportNumberTaken(manager, { ...request, siteId: before.siteId }, id)) throw duplicateReport();
      await updateCertificateRecord(manager, id, {
        labName: request.labName,
        labAccreditationNumber: request.labAccreditationNumber,
        reportNumber: request.reportNumber,
        receivedOn: request.receivedOn,
        receivedTime: request.receivedTime,
      });
      await writeCertificateContent(manager, id, { id: before.siteId, timeZone: before.timeZone }, request);
      await computeCertificateFlags(manager, id);
      const after = (await loadCertificate(manager, id))!;
      await recordTrail(manager, user, {
        action: 'update',
        entity: 'lab-certificate',
        entityId: id,
        siteId: before.siteId,
        before,
        after: { ...after, reason: request.reason },
      });
      return after;
    });
  }

  async attachFile(user: CurrentUser, id: string, upload: Upload | undefined): Promise<CertificateDetail> {
    const { mediaType } = await checkUpload(upload, ['application/pdf']);
    return this.dataSource.transaction(async (manager) => {
      const before = await this.visible(manager, user, id);
      const stored = await storeFile(manager, upload!, mediaType, {
        userId: user.id,
        siteId: before.siteId,
        purpose: 'certificate',
        owner: { entity: 'lab-certificate', id },
      });
      await updateCertificateRecord(manager, id, { fileId: stored.id });
      const after = (await loadCertificate(manager, id))!;
      await recordTrail(manager, user, {
        action: 'attach-file',
        entity: 'lab-certificate',
        entityId: id,
        siteId: before.siteId,
        before: { file: before.file },
        after: { file: after.file },
      });
      return after;
    });
  }

  async visible(manager: EntityManager | DataSource, user: CurrentUser, id: string): Promise<CertificateDetail> {
    const certificate = await loadCertificate(manager, id);
    assertSiteVisible(user, certificate?.siteId, 'Lab certificate');
    return certificate!;
  }
}
