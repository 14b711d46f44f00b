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
import { conflict, notFound } from '../../errors/app-error.js';
import { checkUpload, sendStoredFile, storeFile, type Upload } from '../../kernel/files/stored-files.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { writeCertificateContent } from './certificate-content.js';
import { computeCertificateFlags, limitsInForce, type LimitsInForce } from './lab-flags.service.js';
import { loadCertificate, pageCertificates, pageResults } from './lab.repository.js';

/** A list narrowed to one of the user's sites, or all of them. */
function siteScope(user: CurrentUser, siteId: string | undefined): string[] {
  if (siteId) assertSiteAllowed(user, siteId);
  return siteId ? [siteId] : user.siteIds;
}

const duplicateReport = () =>
  conflict('This lab already has a certificate with this report number', { reportNumber: 'Already recorded for this lab' });

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
    const [site] = await manager.query('SELECT id, time_zone FROM site WHERE id = $1', [request.siteId]);
    if (!site) throw notFound('Site');
    const stored = file ? await storeFile(manager, file.upload, file.mediaType, user.id) : null;
    const existing = await manager.query('SELECT 1 FROM lab_certificate WHERE lab_name = $1 AND report_number = $2', [
      request.labName,
      request.reportNumber,
    ]);
    if (existing.length > 0) throw duplicateReport();
    const [row] = await manager.query(
      `INSERT INTO lab_certificate (site_id, lab_name, lab_accreditation_number, report_number, received_on, file_id, created_by)
       VALUES ($1, $2, $3, $4, $5, $6, $7) RETURNING id`,
      [
        request.siteId,
        request.labName,
        request.labAccreditationNumber,
        request.reportNumber,
        request.receivedOn,
        stored?.id ?? null,
        user.id,
      ],
    );
    await writeCertificateContent(manager, row.id, { id: site.id, timeZone: site.time_zone }, request, { replacing: false });
    await computeCertificateFlags(manager, row.id, { limits });
    return row.id;
  }

  async update(user: CurrentUser, id: string, request: UpdateLabCertificateRequest): Promise<CertificateDetail> {
    return this.dataSource.transaction(async (manager) => {
      const before = await this.visible(manager, user, id);
      const clash = await manager.query('SELECT 1 FROM lab_certificate WHERE lab_name = $1 AND report_number = $2 AND id <> $3', [
        request.labName,
        request.reportNumber,
        id,
      ]);
      if (clash.length > 0) throw duplicateReport();
      await manager.query(
        `UPDATE lab_certificate SET lab_name = $2, lab_accreditation_number = $3, report_number = $4, received_on = $5, updated_at = now()
          WHERE id = $1`,
        [id, request.labName, request.labAccreditationNumber, request.reportNumber, request.receivedOn],
      );
      await writeCertificateContent(manager, id, { id: before.siteId, timeZone: before.timeZone }, request);
      await computeCertificateFlags(manager, id);
      const after = (await loadCertificate(manager, id))!;
      await recordTrail(manager, user, { action: 'update', entity: 'lab-certificate', entityId: id, siteId: before.siteId, before, after });
      return after;
    });
  }

  async attachFile(user: CurrentUser, id: string, upload: Upload | undefined): Promise<CertificateDetail> {
    const { mediaType } = await checkUpload(upload, ['application/pdf']);
    return this.dataSource.transaction(async (manager) => {
      const before = await this.visible(manager, user, id);
      const stored = await storeFile(manager, upload!, mediaType, user.id);
      await manager.query('UPDATE lab_certificate SET file_id = $2, updated_at = now() WHERE id = $1', [id, stored.id]);
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
