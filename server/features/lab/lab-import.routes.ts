import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import type { ImportReport } from '../../contracts/lab-import.js';
import { currentUser } from '../../auth/current-user.js';
import { assertSiteAllowed } from '../../auth/site-access.js';
import { AppError, invalid } from '../../errors/app-error.js';
import { requirePermission } from '../../middleware/require-permission.js';
import { singleUpload } from '../../middleware/upload.js';
import { validate } from '../../middleware/validate.js';
import { recordTrail } from '../trail/trail.js';
import { limitsInForce } from './lab-flags.service.js';
import { importTemplate } from './import-template.js';
import { planImport } from './import-plan.js';
import { rowErrorsBody, spreadsheetRows, xlsxType } from '../imports/spreadsheet-rows.js';
import type { LabCertificatesService } from './lab-certificates.service.js';

const TemplateQuery = z.object({ siteId: z.uuid('Not a valid id'), format: z.enum(['xlsx', 'csv']).default('xlsx') });
const ImportFields = z.object({ siteId: z.uuid('Not a valid id'), commit: z.enum(['true', 'false']).default('false') });

/** Spreadsheet import of lab results at /api/lab-certificates/import: template, dry run, commit. */
export function labImportRoutes(dataSource: DataSource, service: LabCertificatesService): Router {
  const router = Router();

  router.get('/template', requirePermission('lab.read'), validate({ query: TemplateQuery }), async (_req, res) => {
    const { siteId, format } = res.locals.query as z.infer<typeof TemplateQuery>;
    assertSiteAllowed(currentUser(res), siteId);
    const [point] = await dataSource.query('SELECT code FROM discharge_point WHERE site_id = $1 AND active ORDER BY code LIMIT 1', [siteId]);
    const file = await importTemplate(format, { pointCode: point?.code ?? 'OF-001' });
    res.setHeader('Content-Type', format === 'xlsx' ? xlsxType : 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="decant-lab-results-template.${format}"`);
    res.end(file);
  });

  router.post('/', requirePermission('lab.write'), singleUpload(), validate({ body: ImportFields }), async (req, res) => {
    const user = currentUser(res);
    const { siteId, commit } = res.locals.body as z.infer<typeof ImportFields>;
    assertSiteAllowed(user, siteId);
    const rows = await spreadsheetRows(req.file);
    const lookups = {
      siteId,
      pointIds: new Map<string, string>((await dataSource.query('SELECT code, id FROM discharge_point WHERE site_id = $1', [siteId])).map((r: { code: string; id: string }) => [r.code, r.id])),
      parameterIds: new Map<string, string>(
        (await dataSource.query('SELECT code, id FROM parameter WHERE site_id IS NULL OR site_id = $1 ORDER BY site_id NULLS FIRST', [siteId])).map(
          (r: { code: string; id: string }) => [r.code, r.id],
        ),
      ),
      existingReports: new Set<string>((await dataSource.query('SELECT lab_name, report_number FROM lab_certificate')).map((r: { lab_name: string; report_number: string }) => `${r.lab_name}\u0000${r.report_number}`)),
    };
    const plan = await planImport(rows, lookups);
    const report: ImportReport = {
      committed: false,
      rows: plan.rows,
      certificates: plan.requests.length,
      samples: plan.requests.reduce((n, r) => n + r.samples.length, 0),
      results: plan.requests.reduce((n, r) => n + r.samples.reduce((m, s) => m + s.results.length, 0), 0),
      errors: plan.errors,
    };
    if (commit !== 'true') return res.json(report);
    if (plan.errors.length > 0) {
      return res.status(400).json(rowErrorsBody(report));
    }
    // All certificates or none: one transaction, one trail entry per certificate.
    await dataSource.transaction(async (manager) => {
      const limits = limitsInForce(manager);
      for (const request of plan.requests) {
        const id = await service.insertCertificate(manager, user, request, null, limits);
        await recordTrail(manager, user, { action: 'import', entity: 'lab-certificate', entityId: id, siteId, after: { reportNumber: request.reportNumber, labName: request.labName, samples: request.samples.length } });
      }
    });
    res.status(201).json({ ...report, committed: true });
  });

  return router;
}
