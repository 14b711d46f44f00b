import type { DataSource } from 'typeorm';
import type { ImportReport, ImportTemplateQuery } from '../../contracts/lab-import.js';
import type { SpreadsheetImportFields } from '../../contracts/imports.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed } from '../../auth/site-access.js';
import type { Download } from '../../http/download.js';
import { rowErrors, spreadsheetRows, xlsxType } from '../../kernel/spreadsheets/spreadsheet-rows.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { planImport } from './import-plan.js';
import { importTemplate } from './import-template.js';
import type { LabCertificatesService } from './lab-certificates.service.js';
import { limitsInForce } from './lab-flags.service.js';
import { firstActivePointCode, importLookups } from './lab.repository.js';

/** Spreadsheet import of lab results: template, dry run, then all certificates or none. */
export class LabImportService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly certificates: LabCertificatesService,
  ) {}

  async template(user: CurrentUser, { siteId, format }: ImportTemplateQuery): Promise<Download> {
    assertSiteAllowed(user, siteId);
    const pointCode = (await firstActivePointCode(this.dataSource, siteId)) ?? 'OF-001';
    return {
      bytes: await importTemplate(format, { pointCode }),
      mediaType: format === 'xlsx' ? xlsxType : 'text/csv; charset=utf-8',
      fileName: `decant-lab-results-template.${format}`,
    };
  }

  async import(
    user: CurrentUser,
    { siteId, commit }: SpreadsheetImportFields,
    file: Express.Multer.File | undefined,
  ): Promise<ImportReport> {
    assertSiteAllowed(user, siteId);
    const rows = await spreadsheetRows(file);
    const plan = await planImport(rows, await importLookups(this.dataSource, siteId));
    const report: ImportReport = {
      committed: false,
      rows: plan.rows,
      certificates: plan.requests.length,
      samples: plan.requests.reduce((n, r) => n + r.samples.length, 0),
      results: plan.requests.reduce((n, r) => n + r.samples.reduce((m, s) => m + s.results.length, 0), 0),
      errors: plan.errors,
    };
    if (commit !== 'true') return report;
    if (plan.errors.length > 0) throw rowErrors(report);
    // All certificates or none: one transaction, one trail entry per certificate.
    await this.dataSource.transaction(async (manager) => {
      const limits = limitsInForce(manager);
      for (const request of plan.requests) {
        const id = await this.certificates.insertCertificate(manager, user, request, null, limits);
        await recordTrail(manager, user, {
          action: 'import',
          entity: 'lab-certificate',
          entityId: id,
          siteId,
          after: { reportNumber: request.reportNumber, labName: request.labName, samples: request.samples.length },
        });
      }
    });
    return { ...report, committed: true };
  }
}
