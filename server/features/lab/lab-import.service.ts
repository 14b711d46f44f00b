import type { DataSource } from 'typeorm';
import type { ImportReport, ImportTemplateQuery } from '../../contracts/lab-import.js';
import type { SpreadsheetImportFields } from '../../contracts/imports.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed } from '../../auth/site-access.js';
import type { Download } from '../../http/download.js';
import { rowErrors, spreadsheetRows, xlsxType } from '../../kernel/spreadsheets/spreadsheet-rows.js';
import { ImportRunTracker } from '../../kernel/imports/import-runs.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { planImport } from './import-plan.js';
import { importTemplate } from './import-template.js';
import type { LabCertificatesService } from './lab-certificates.service.js';
import { limitsInForce } from './lab-flags.service.js';
import { certificatesWithFindings, importLookups, templateCodes } from './lab.repository.js';

/** Spreadsheet import of lab results: template, dry run, then all certificates or none. */
export class LabImportService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly certificates: LabCertificatesService,
  ) {}

  async template(user: CurrentUser, { siteId, format }: ImportTemplateQuery): Promise<Download> {
    assertSiteAllowed(user, siteId);
    return {
      bytes: await importTemplate(format, await templateCodes(this.dataSource, siteId)),
      mediaType: format === 'xlsx' ? xlsxType : 'text/csv; charset=utf-8',
      fileName: `decant-lab-results-template.${format}`,
    };
  }

  /**
   * Runs as an import run (`runId`): progress through reading, checking and writing is visible
   * at /api/import-runs/:id while the request is open, and past the time limit the run stops
   * with nothing written.
   */
  async import(
    user: CurrentUser,
    { siteId, commit, runId }: SpreadsheetImportFields,
    file: Express.Multer.File | undefined,
    limitMs?: number,
  ): Promise<ImportReport> {
    assertSiteAllowed(user, siteId);
    const run = await ImportRunTracker.start(
      this.dataSource,
      {
        id: runId,
        siteId,
        userId: user.id,
        kind: commit === 'true' ? 'lab-results' : 'lab-results-check',
        fileName: file?.originalname ?? '',
      },
      limitMs,
    );
    return run.run(() => this.importAs(run, user, { siteId, commit }, file));
  }

  private async importAs(
    run: ImportRunTracker,
    user: CurrentUser,
    { siteId, commit }: Pick<SpreadsheetImportFields, 'siteId' | 'commit'>,
    file: Express.Multer.File | undefined,
  ): Promise<ImportReport> {
    const rows = await spreadsheetRows(file);
    let read = 0;
    // Rows are read as a stream: the run counts them as they come, checking the time as it goes.
    const counted = (async function* () {
      for await (const row of rows) {
        read += 1;
        await run.progress('reading', read, 0);
        yield row;
      }
    })();
    const plan = await planImport(counted, await importLookups(this.dataSource, siteId));
    await run.progress('checking', read, read, true);
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
    const resultCount = report.results;
    let written = 0;
    const ids: string[] = [];
    await this.dataSource.transaction(async (manager) => {
      await run.limitStatements(manager);
      const limits = limitsInForce(manager);
      for (const request of plan.requests) {
        await run.progress('writing', written, resultCount);
        written += request.samples.reduce((m, s) => m + s.results.length, 0);
        const id = await this.certificates.insertCertificate(manager, user, request, null, limits);
        ids.push(id);
        await recordTrail(manager, user, {
          action: 'import',
          entity: 'lab-certificate',
          entityId: id,
          siteId,
          after: { reportNumber: request.reportNumber, labName: request.labName, samples: request.samples.length },
        });
      }
    });
    return { ...report, committed: true, withFindings: await certificatesWithFindings(this.dataSource, ids) };
  }
}
